/**
 * Live logger lines: the joint's line format (our own, generic delimited text: one line per moment,
 * one field for the time in seconds, one field per channel in the joint's channel order) and the
 * pure parser that turns a stream of text chunks into stream readings `{ t, stud, load }` (seconds,
 * position, newtons). Browser-safe: it runs in the Record page's serial worker and in
 * scripts/stream-bridge.ts.
 *
 * Channel k of a line (the k-th channel field) is the joint's channel k (`CHk`), placed on its stud
 * through the joint's channel map (`channel-map.ts`, default channel k = position k). Loads go
 * through the same cell reader as logger files (`readers/cells.ts`: the one unit conversion, the
 * joint's load limit, calibration for microstrain), so a streamed load is read exactly as the same
 * number in an uploaded file.
 */
import { z } from 'zod';
import { AppError, isAppError } from '@/lib/http/errors';
import { STREAM_NEGATIVE_FLOOR_SHARE } from '@/lib/record/stream-reading';
import type { StreamReading } from '@/lib/record/stream-reading';
import { positionOfChannel } from './channel-map';
import { createLoggerClock, type ClockRestart } from './logger-clock';
import { createCellReader, formatLoadN } from './readers/cells';
import type { JointForImport } from './readers/types';
import { quoteInput } from './text-limits';
import { LOAD_UNITS, type LoadUnit } from './units';

/** Field delimiters a logger line may use, by name (as stored on the joint). */
export const LINE_DELIMITERS = { comma: ',', semicolon: ';', tab: '\t', space: ' ' } as const;
/** A delimiter's name. */
export type LineDelimiter = keyof typeof LINE_DELIMITERS;

/** Baud rates offered on the joint form (common practice: the standard serial rates). */
export const BAUD_RATES = [1200, 2400, 4800, 9600, 19200, 38400, 57600, 115200, 230400] as const;

/** Longest line kept while waiting for its end (a logger line is far shorter). */
export const MAX_LOGGER_LINE_CHARS = 4096;

/** The joint's logger line format and serial speed. */
export const loggerLineFormatSchema = z
  .object({
    baudRate: z.number().int().min(300).max(4_000_000),
    delimiter: z.enum(Object.keys(LINE_DELIMITERS) as [LineDelimiter, ...LineDelimiter[]]),
    decimalComma: z.boolean(),
    /** 1-based field of the time in seconds. */
    timeField: z.number().int().min(1).max(500),
    /** 1-based fields of channel 1, 2, …; null = every other field in order. */
    channelFields: z.array(z.number().int().min(1).max(500)).min(1).max(500).nullable(),
    loadUnit: z.enum(LOAD_UNITS),
  })
  .refine((f) => !(f.decimalComma && f.delimiter === 'comma'), { message: 'Decimal commas need another delimiter than the comma.', path: ['decimalComma'] })
  .refine((f) => !f.channelFields?.includes(f.timeField), { message: 'The time field cannot also be a channel field.', path: ['channelFields'] })
  .refine((f) => !f.channelFields || new Set(f.channelFields).size === f.channelFields.length, { message: 'Each channel field once.', path: ['channelFields'] });

/** The joint's logger line format. */
export type LoggerLineFormat = z.output<typeof loggerLineFormatSchema>;

/** What a new joint starts from (shown as "training default: set your own"). */
export const LOGGER_LINE_TRAINING_DEFAULTS: LoggerLineFormat = { baudRate: 9600, delimiter: 'comma', decimalComma: false, timeField: 1, channelFields: null, loadUnit: 'kN' };

/** 0-based indexes of the channel fields (channel 1 first) for a joint of `studCount` studs. */
export function channelFieldIndexes(format: LoggerLineFormat, studCount: number): number[] {
  if (format.channelFields) return format.channelFields.map((f) => f - 1);
  const out: number[] = [];
  for (let field = 1; out.length < studCount; field++) if (field !== format.timeField) out.push(field - 1);
  return out;
}

/** A line that could not be read, with the reason in words. */
export interface MalformedLine {
  line: number;
  text: string;
  reason: string;
}

/** What one chunk (or the end) gave. */
export interface LineBatch {
  readings: StreamReading[];
  malformed: MalformedLine[];
  /** Restarts of the logger's clock in these lines; their readings were placed after the last one (lib/ingest/logger-clock.ts). */
  clockRestarts: ClockRestart[];
}

/** A parser for one connection: feed it chunks of text as they arrive. */
export interface LoggerLineParser {
  /** Reads every line completed by `text`; a partial last line waits for the next chunk. */
  push(text: string): LineBatch;
  /** Reads a last line that never got its line end (the connection closed). */
  end(): LineBatch;
  /** Lines seen so far (blank lines included). */
  readonly lineCount: number;
}

const HAS_LETTER = /\p{L}/u;

/**
 * Creates the line parser for one connection. Lines end with LF, CRLF or CR (a CR at the end of a
 * chunk waits to see whether LF follows). Blank lines and lines starting with `#` are skipped; a
 * first line whose time field has letters is a header and is skipped. Every other line gives one
 * reading per channel field, or is malformed (too few fields, a field that is not a number, a
 * negative time, a load above the joint's limit or negative beyond gauge noise): malformed lines
 * are returned with their reason and never stop the stream. Times go through the connection's
 * logger clock (`logger-clock.ts`): a line whose time is not after the last one (or, on a new
 * connection, not after `lastStoredS`, the run's last stored time) is a restart of the logger's
 * clock, and its readings continue after the last one instead of replacing stored readings.
 *
 * @throws AppError('invalid_input') at once for a format the joint cannot use (a channel with no
 *   stud, microstrain without stress area).
 */
export function createLoggerLineParser(format: LoggerLineFormat, joint: JointForImport, options: { lastStoredS?: number | null } = {}): LoggerLineParser {
  const fields = channelFieldIndexes(format, joint.studCount);
  const positions = fields.map((_, k) => positionOfChannel(`CH${k + 1}`, joint.channelMap));
  positions.forEach((p, k) => {
    if (p === null || p < 1 || p > joint.studCount) throw new AppError('invalid_input', `Channel ${k + 1} of the line format has no stud on this joint (it has ${joint.studCount}); check the channel fields and the channel map.`, { field: 'channelFields' });
  });
  const width = Math.max(format.timeField, ...fields.map((f) => f + 1));
  const names = Array.from({ length: width }, (_, i) => (i === format.timeField - 1 ? 'time' : `field ${i + 1}`));
  const cells = createCellReader(names, format.loadUnit, joint, format.decimalComma);
  const floorN = -STREAM_NEGATIVE_FLOOR_SHARE * joint.targetLoadN;
  const timeIdx = format.timeField - 1;
  let buffer = '';
  let lineNo = 0;
  let sawData = false;
  const clock = createLoggerClock(options.lastStoredS ?? null);

  const readLine = (raw: string, out: LineBatch) => {
    lineNo++;
    const text = raw.trim();
    if (text === '' || text.startsWith('#')) return;
    const row = format.delimiter === 'space' ? text.split(/\s+/) : text.split(LINE_DELIMITERS[format.delimiter]).map((c) => c.trim());
    if (!sawData && HAS_LETTER.test(row[timeIdx] ?? '')) return;
    const bad = (reason: string) => out.malformed.push({ line: lineNo, text: text.slice(0, 80), reason });
    if (row.length < width) return void bad(`Line ${lineNo}: ${row.length} field${row.length === 1 ? '' : 's'}, the joint's line format needs ${width}.`);
    try {
      const t = cells.number(row, timeIdx, lineNo, true)!;
      if (t < 0) return void bad(`Line ${lineNo}, field time: ${quoteInput(row[timeIdx]!)} is a negative time.`);
      const readings: StreamReading[] = [];
      for (let k = 0; k < fields.length; k++) {
        const load = cells.load(row, fields[k]!, lineNo, positions[k]!);
        if (load < floorN) return void bad(`Line ${lineNo}, field ${fields[k]! + 1}: ${formatLoadN(load)} is negative beyond gauge noise; check the zero and the load unit (${format.loadUnit}).`);
        readings.push({ t, stud: positions[k]!, load });
      }
      sawData = true;
      const placed = clock.place(t, lineNo);
      for (const reading of readings) reading.t = placed;
      out.readings.push(...readings);
    } catch (error) {
      if (!isAppError(error)) throw error;
      bad(error.message);
    }
  };

  return {
    push(text) {
      const out: LineBatch = { readings: [], malformed: [], clockRestarts: [] };
      buffer += text;
      const re = /\r\n|\n|\r(?!$)/g;
      let start = 0;
      for (let m = re.exec(buffer); m; m = re.exec(buffer)) {
        readLine(buffer.slice(start, m.index), out);
        start = m.index + m[0].length;
      }
      buffer = buffer.slice(start);
      if (buffer.length > MAX_LOGGER_LINE_CHARS && !buffer.endsWith('\r')) {
        lineNo++;
        out.malformed.push({ line: lineNo, text: buffer.slice(0, 80), reason: `Line ${lineNo}: longer than ${MAX_LOGGER_LINE_CHARS} characters without a line end; check the baud rate.` });
        buffer = '';
      }
      out.clockRestarts = clock.takeRestarts();
      return out;
    },
    end() {
      const out: LineBatch = { readings: [], malformed: [], clockRestarts: [] };
      const rest = buffer.replace(/\r$/, '');
      buffer = '';
      if (rest.trim() !== '') readLine(rest, out);
      out.clockRestarts = clock.takeRestarts();
      return out;
    },
    get lineCount() {
      return lineNo;
    },
  };
}
