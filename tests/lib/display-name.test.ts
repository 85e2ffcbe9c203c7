import { describe, expect, it } from 'vitest';
import { nameSchema, normaliseName, visibleLength } from '@/lib/validation/display-name';

const schema = nameSchema({ what: 'the lubricant name' });

describe('nameSchema', () => {
  it('stores names in Unicode NFC', () => {
    // "e" + U+0301 COMBINING ACUTE ACCENT composes to U+00E9 under NFC (Unicode Standard Annex #15).
    const parsed = schema.parse('Cafe\u0301 paste');
    expect(parsed).toBe('Caf\u00e9 paste');
    expect(parsed.length).toBe(10);
  });

  it('refuses a name made only of zero-width, control or bidi-override characters', () => {
    // U+200B ZERO WIDTH SPACE, U+200D ZERO WIDTH JOINER, U+FEFF BOM, U+202E RIGHT-TO-LEFT OVERRIDE,
    // U+2066 LEFT-TO-RIGHT ISOLATE, U+0007 BEL, U+00AD SOFT HYPHEN (Unicode general categories Cf and Cc).
    for (const raw of ['\u200B\u200B', '\u200D', '\uFEFF', '\u202E\u202C', '\u2066\u2069', '\u0007\u0000', '\u00AD', ' \u200B \t']) {
      const result = schema.safeParse(raw);
      expect(result.success, JSON.stringify(raw)).toBe(false);
      expect(result.error?.issues[0]?.message).toBe('Enter the lubricant name.');
    }
  });

  it('removes control and bidi-override characters from a name that has visible ones', () => {
    expect(schema.parse('\u202EMoly\u0000 paste\u202C')).toBe('Moly paste');
  });

  it('counts only visible characters against the minimum', () => {
    const course = nameSchema({ what: 'the course name', min: 3 });
    expect(course.safeParse('A\u200BB\u200B').success).toBe(false);
    expect(course.safeParse('ABC').success).toBe(true);
    expect(visibleLength('A\u200BB')).toBe(2);
  });

  it('refuses a name over the maximum', () => {
    expect(nameSchema({ what: 'your name', max: 5 }).safeParse('Abcdef').success).toBe(false);
    expect(normaliseName('  Ann   Lee ')).toBe('Ann Lee');
  });
});
