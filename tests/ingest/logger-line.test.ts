/**
 * The live logger line parser (lib/ingest/logger-line.ts): lines split across chunks, CRLF and CR
 * line ends, decimal commas, header and malformed lines, units through the ingest cell reader and
 * the joint's channel map. Expected loads are worked out here from the lines played:
 * - 1 kN = 1000 N (SI prefix, BIPM SI Brochure 9th ed. §3).
 * - 1 lbf = 4.4482216152605 N exactly (NIST SP 811 (2008) appendix B.8, from memory: 0.45359237 kg × 9.80665 m/s²).
 */
import { describe, expect, it } from 'vitest';
import { channelFieldIndexes, createLoggerLineParser, LOGGER_LINE_TRAINING_DEFAULTS, loggerLineFormatSchema, type LoggerLineFormat } from '@/lib/ingest/logger-line';
import { channelFieldsText, parseChannelFieldsText, parseLoggerLineFields } from '@/lib/joints/logger-line-input';
import { FOUR_STUD_JOINT } from './joints';

const CSV: LoggerLineFormat = LOGGER_LINE_TRAINING_DEFAULTS;

/** Feeds chunks one after another and collects everything. */
function play(format: LoggerLineFormat, chunks: string[], joint = FOUR_STUD_JOINT) {
  const parser = createLoggerLineParser(format, joint);
  const readings = [];
  const malformed = [];
  for (const chunk of chunks) {
    const out = parser.push(chunk);
    readings.push(...out.readings);
    malformed.push(...out.malformed);
  }
  const last = parser.end();
  return { readings: [...readings, ...last.readings], malformed: [...malformed, ...last.malformed], lines: parser.lineCount };
}

describe('createLoggerLineParser', () => {
  it('reads a line split over three chunks once, in kN → N', () => {
    const { readings, malformed } = play(CSV, ['0.5,1', '0.2,2', '0.0,3.5,4\n']);
    expect(malformed).toEqual([]);
    // The chunks join to "0.5,10.2,20.0,3.5,4": 10.2 kN = 10 200 N, 20.0 kN = 20 000 N, 3.5 kN = 3 500 N, 4 kN = 4 000 N (1 kN = 1000 N).
    expect(readings).toEqual([
      { t: 0.5, stud: 1, load: 10_200 },
      { t: 0.5, stud: 2, load: 20_000 },
      { t: 0.5, stud: 3, load: 3_500 },
      { t: 0.5, stud: 4, load: 4_000 },
    ]);
  });

  it('takes CRLF, LF and lone CR line ends, also when CR and LF arrive in different chunks', () => {
    const { readings, malformed, lines } = play(CSV, ['1,1,1,1,1\r', '\n2,2,2,2,2\r\n3,3,3,3,3\r4,4,4,4,4\n']);
    expect(malformed).toEqual([]);
    expect(lines).toBe(4);
    expect(readings.map((r) => r.t)).toEqual([1, 1, 1, 1, 2, 2, 2, 2, 3, 3, 3, 3, 4, 4, 4, 4]);
  });

  it('reads a last line without a line end at the end of the connection', () => {
    const { readings } = play(CSV, ['1,1,2,3,4']);
    expect(readings.map((r) => r.load)).toEqual([1000, 2000, 3000, 4000]);
  });

  it('reads decimal commas with a semicolon delimiter, and refuses a decimal point there', () => {
    const format = { ...CSV, delimiter: 'semicolon' as const, decimalComma: true };
    const { readings, malformed } = play(format, ['1,5;10,25;0;0;0\n', '2,0;10.5;0;0;0\n']);
    // 10,25 kN = 10 250 N.
    expect(readings.slice(0, 4)).toEqual([
      { t: 1.5, stud: 1, load: 10_250 },
      { t: 1.5, stud: 2, load: 0 },
      { t: 1.5, stud: 3, load: 0 },
      { t: 1.5, stud: 4, load: 0 },
    ]);
    expect(malformed).toHaveLength(1);
    expect(malformed[0]!.line).toBe(2);
    expect(malformed[0]!.reason).toMatch(/decimal point/);
  });

  it('counts malformed lines with their reason and keeps reading the good ones', () => {
    const { readings, malformed } = play(CSV, ['time,a,b,c,d\n', '0,0,0,0,0\n', '1,2,3\n', '2,x,0,0,0\n', '-1,0,0,0,0\n', '3,999,0,0,0\n', '4,-20,0,0,0\n', '# note\n', '\n', '5,1,1,1,1\n']);
    // The header (line 1), the comment and the blank line are skipped, not malformed.
    expect(malformed.map((m) => m.line)).toEqual([3, 4, 5, 6, 7]);
    expect(malformed[0]!.reason).toMatch(/3 fields.*needs 5/);
    expect(malformed[1]!.reason).toMatch(/"x" is not a number/);
    expect(malformed[2]!.reason).toMatch(/negative time/);
    // 999 kN is above the joint's limit of 1.2 × 210.7 kN = 252.84 kN (tests/ingest/joints.ts).
    expect(malformed[3]!.reason).toMatch(/above the limit/);
    // −20 kN is below −5 % of the 80 kN target (−4 kN).
    expect(malformed[4]!.reason).toMatch(/negative beyond gauge noise/);
    expect(readings.map((r) => r.t)).toEqual([0, 0, 0, 0, 5, 5, 5, 5]);
  });

  it('converts lbf with the one ingest conversion', () => {
    const { readings } = play({ ...CSV, loadUnit: 'lbf' }, ['0,1000,0,0,0\n']);
    // 1000 lbf × 4.4482216152605 N/lbf = 4448.2216152605 N.
    expect(readings[0]!.load).toBeCloseTo(4448.2216152605, 9);
  });

  it('places channel fields on studs through the joint channel map, with space-separated fields', () => {
    const joint = { ...FOUR_STUD_JOINT, channelMap: [{ channel: 'CH1', position: 3 }, { channel: 'CH3', position: 1 }] };
    const format = { ...CSV, delimiter: 'space' as const, timeField: 5, channelFields: [1, 2, 3, 4] };
    const { readings } = play(format, ['1  2 3 4   7.25\n'], joint);
    expect(readings).toEqual([
      { t: 7.25, stud: 3, load: 1000 },
      { t: 7.25, stud: 2, load: 2000 },
      { t: 7.25, stud: 1, load: 3000 },
      { t: 7.25, stud: 4, load: 4000 },
    ]);
  });

  it('flags an endless line without a line end', () => {
    const { malformed } = play(CSV, ['1'.repeat(5000)]);
    expect(malformed).toHaveLength(1);
    expect(malformed[0]!.reason).toMatch(/without a line end/);
  });
});

describe('the line format on the joint', () => {
  it('takes every field but the time as channels by default', () => {
    expect(channelFieldIndexes({ ...CSV, timeField: 2 }, 3)).toEqual([0, 2, 3]);
  });

  it('refuses decimal commas with the comma delimiter, and the time field as a channel', () => {
    expect(loggerLineFormatSchema.safeParse({ ...CSV, decimalComma: true }).success).toBe(false);
    expect(loggerLineFormatSchema.safeParse({ ...CSV, channelFields: [1, 2] }).success).toBe(false);
  });

  it('reads channel fields as ranges and lists, and writes them back', () => {
    expect(parseChannelFieldsText('2-4, 7')).toEqual([2, 3, 4, 7]);
    expect(parseChannelFieldsText('')).toBeNull();
    expect(parseChannelFieldsText('2-x')).toMatch(/not a field number/);
    expect(channelFieldsText([2, 3, 4, 7, 9, 10])).toBe('2-4, 7, 9, 10');
  });

  it('marks the form fields that are wrong', () => {
    const { errors } = parseLoggerLineFields({ serialBaudRate: '9600', lineDelimiter: 'comma', lineDecimal: 'comma', lineTimeField: '1', lineChannelFields: '2-9', lineLoadUnit: 'kN' }, 4);
    expect(errors.lineChannelFields?.[0]).toMatch(/8 channel fields for 4 studs/);
    expect(errors.lineDecimal?.[0]).toMatch(/Decimal commas need another delimiter/);
  });
});
