/**
 * The shape limits checked before parsing (lib/ingest/text-limits.ts). Expected lines are counted
 * by hand from each invented text's construction; the limits are our own (see the module).
 */
import { describe, expect, it } from 'vitest';
import { AppError } from '@/lib/http/errors';
import { assertTextWithinLimits, MAX_BLANK_LINES_IN_A_ROW, MAX_LINE_CHARS, MAX_QUOTED_CELL_CHARS, quoteInput } from '@/lib/ingest/text-limits';

function refusal(text: string): AppError {
  try {
    assertTextWithinLimits(text);
  } catch (error) {
    if (error instanceof AppError) return error;
    throw error;
  }
  throw new Error('not refused');
}

const HEADER = 'Time (s),Stud 1,Stud 2\n';

describe('assertTextWithinLimits', () => {
  it('accepts a file at every limit', () => {
    const text = `${HEADER}${'1'.repeat(MAX_LINE_CHARS)}\n${'\n'.repeat(MAX_BLANK_LINES_IN_A_ROW)}0,"${'x'.repeat(MAX_QUOTED_CELL_CHARS - 1)}",1\r\n`;
    expect(() => assertTextWithinLimits(text)).not.toThrow();
  });

  it('names the line that is too long (CRLF and CR count as one line end each)', () => {
    const error = refusal(`${HEADER}0,1,2\r\n0,1,2\r3,${'9'.repeat(MAX_LINE_CHARS)}\n`);
    expect(error.details.row).toBe(4);
    expect(error.message).toMatch(/^Line 4: the line is longer than 16,384 characters \(it starts "3,9{38}…"\)/);
  });

  it('names the line where the blank run passes the limit', () => {
    const error = refusal(`${HEADER}0,1,2\n${'\n'.repeat(MAX_BLANK_LINES_IN_A_ROW + 5)}`);
    // Header line 1, data line 2, blank lines from line 3: the 1,001st blank is line 1003.
    expect(error.details.row).toBe(1003);
    expect(error.message).toContain('from line 3');
  });

  it('names the line where a quoted cell opens and never closes, across lines', () => {
    const error = refusal(`${HEADER}0,1,2\n0;"${'abc\n'.repeat(2000)}`);
    expect(error.details.row).toBe(3);
    expect(error.message).toMatch(/^Line 3: a quoted cell starts here/);
  });

  it('counts a doubled quote inside a quoted cell as part of the cell', () => {
    expect(() => assertTextWithinLimits(`${HEADER}0,"a""b",2\n0,"${'""'.repeat(100)}",1\n`)).not.toThrow();
  });
});

describe('quoteInput', () => {
  it('keeps short input whole and cuts long input to 40 characters with an ellipsis', () => {
    expect(quoteInput('  12,5x ')).toBe('"12,5x"');
    expect(quoteInput('y'.repeat(41))).toBe(`"${'y'.repeat(40)}…"`);
  });
});
