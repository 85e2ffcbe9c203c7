import { describe, expect, it } from 'vitest';
import { isoDateSchema, isRealIsoDate } from '@/lib/validation/iso-date';

describe('isRealIsoDate', () => {
  it('accepts days that exist, including 29 February of a leap year', () => {
    // Gregorian calendar rules (common practice): 2024 is a leap year, 2026 is not.
    for (const day of ['2026-01-01', '2026-02-28', '2024-02-29', '2026-12-31']) expect(isRealIsoDate(day), day).toBe(true);
  });

  it('refuses days that do not exist and text that is not YYYY-MM-DD', () => {
    for (const text of ['9999-99-99', '2026-02-30', '2026-02-29', '2026-13-01', '2026-04-31', '2026-00-10', '2026-1-1', '20260101', '', '0000-01-01', '2026-01-01T00:00'])
      expect(isRealIsoDate(text), text).toBe(false);
  });

  it('gives the schema a message naming the form expected', () => {
    const result = isoDateSchema().safeParse('2026-02-30');
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.message).toBe('must be a real date like 2026-03-31');
  });
});
