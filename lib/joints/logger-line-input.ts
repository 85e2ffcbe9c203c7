import { LOAD_UNITS } from '@/lib/ingest/units';
import { BAUD_RATES, LINE_DELIMITERS, LOGGER_LINE_TRAINING_DEFAULTS, loggerLineFormatSchema, type LoggerLineFormat } from '@/lib/ingest/logger-line';

/**
 * The logger line section of the joint form (live capture in the browser), as pure functions shared
 * by the form (`components/joints/logger-line-section.tsx`) and the server action. Form fields:
 * `serialBaudRate`, `lineDelimiter`, `lineDecimal` (`point` | `comma`), `lineTimeField`,
 * `lineChannelFields` (field numbers of channels 1, 2, …: `2-9` or `2, 3, 5`; empty = every other
 * field in order), `lineLoadUnit`.
 */

type FieldErrors = Record<string, string[] | undefined>;

/** The section's form fields. */
export const LOGGER_LINE_FIELDS = ['serialBaudRate', 'lineDelimiter', 'lineDecimal', 'lineTimeField', 'lineChannelFields', 'lineLoadUnit'] as const;

/** The delimiters as the form names them. */
export const DELIMITER_LABELS: Record<keyof typeof LINE_DELIMITERS, string> = { comma: 'Comma ,', semicolon: 'Semicolon ;', tab: 'Tab', space: 'Space' };
/** The delimiters in a sentence ("fields separated by semicolons"). */
export const DELIMITER_WORDS: Record<keyof typeof LINE_DELIMITERS, string> = { comma: 'commas', semicolon: 'semicolons', tab: 'tabs', space: 'spaces' };

/** `2-4, 7` → [2, 3, 4, 7]; empty → null; anything else → a message. */
export function parseChannelFieldsText(text: string): number[] | null | string {
  const trimmed = text.trim();
  if (trimmed === '') return null;
  const out: number[] = [];
  for (const part of trimmed.split(/[,;\s]+/).filter(Boolean)) {
    const range = /^(\d+)\s*[-–]\s*(\d+)$/.exec(part);
    if (range) {
      const [from, to] = [Number(range[1]), Number(range[2])];
      if (from < 1 || to < from || to - from > 500) return `"${part}" is not a range of field numbers (from 1, low to high).`;
      for (let f = from; f <= to; f++) out.push(f);
    } else if (/^\d+$/.test(part) && Number(part) >= 1) out.push(Number(part));
    else return `"${part}" is not a field number; give numbers from 1, separated by commas, or ranges such as 2-9.`;
  }
  return out;
}

/** [2, 3, 4, 7] → `2-4, 7`. */
export function channelFieldsText(fields: readonly number[] | null): string {
  if (!fields) return '';
  const parts: string[] = [];
  for (let i = 0; i < fields.length; ) {
    let j = i;
    while (j + 1 < fields.length && fields[j + 1] === fields[j]! + 1) j++;
    parts.push(j > i + 1 ? `${fields[i]}-${fields[j]}` : fields.slice(i, j + 1).join(', '));
    i = j + 1;
  }
  return parts.join(', ');
}

/** Reads the logger line fields of a submitted joint form, with a message per bad field. */
export function parseLoggerLineFields(values: Record<string, string | undefined>, studCount: number | null): { value: LoggerLineFormat; errors: FieldErrors } {
  const errors: FieldErrors = {};
  const channels = parseChannelFieldsText(values.lineChannelFields ?? '');
  if (typeof channels === 'string') errors.lineChannelFields = [channels];
  else if (channels && studCount !== null && channels.length > studCount) errors.lineChannelFields = [`${channels.length} channel fields for ${studCount} studs: give at most one field per stud.`];
  const candidate = {
    baudRate: Number(values.serialBaudRate ?? LOGGER_LINE_TRAINING_DEFAULTS.baudRate),
    delimiter: values.lineDelimiter ?? LOGGER_LINE_TRAINING_DEFAULTS.delimiter,
    decimalComma: values.lineDecimal === 'comma',
    timeField: Number((values.lineTimeField ?? '').trim() || LOGGER_LINE_TRAINING_DEFAULTS.timeField),
    channelFields: typeof channels === 'string' ? null : channels,
    loadUnit: values.lineLoadUnit ?? LOGGER_LINE_TRAINING_DEFAULTS.loadUnit,
  };
  const parsed = loggerLineFormatSchema.safeParse(candidate);
  if (parsed.success) return { value: parsed.data, errors };
  const FIELD: Record<string, string> = { baudRate: 'serialBaudRate', delimiter: 'lineDelimiter', decimalComma: 'lineDecimal', timeField: 'lineTimeField', channelFields: 'lineChannelFields', loadUnit: 'lineLoadUnit' };
  const MESSAGE: Record<string, string> = {
    baudRate: `Choose a baud rate from the list (${BAUD_RATES[0]} to ${BAUD_RATES[BAUD_RATES.length - 1]}).`,
    delimiter: 'Choose how the fields of a line are separated.',
    timeField: 'Give the field number of the time as a whole number from 1.',
    loadUnit: `Choose the load unit (${LOAD_UNITS.join(', ')}).`,
  };
  for (const issue of parsed.error.issues) {
    const key = String(issue.path[0] ?? 'channelFields');
    errors[FIELD[key] ?? 'lineChannelFields'] ??= [MESSAGE[key] ?? issue.message];
  }
  return { value: LOGGER_LINE_TRAINING_DEFAULTS, errors };
}

/** The form's text for a stored logger line format (a new joint starts from the training defaults). */
export function loggerLineFormValues(format: LoggerLineFormat | null): Record<string, string> {
  const f = format ?? LOGGER_LINE_TRAINING_DEFAULTS;
  return {
    serialBaudRate: String(f.baudRate),
    lineDelimiter: f.delimiter,
    lineDecimal: f.decimalComma ? 'comma' : 'point',
    lineTimeField: String(f.timeField),
    lineChannelFields: channelFieldsText(f.channelFields),
    lineLoadUnit: f.loadUnit,
  };
}

/** The stored columns' values as a format; a stored value the schema refuses falls back to the training default. */
export function loggerLineFromColumns(c: { serialBaudRate: number; lineDelimiter: string; lineDecimalComma: boolean; lineTimeField: number; lineChannelFields: string | null; lineLoadUnit: string }): LoggerLineFormat {
  const channels = c.lineChannelFields ? parseChannelFieldsText(c.lineChannelFields) : null;
  const parsed = loggerLineFormatSchema.safeParse({
    baudRate: Number(c.serialBaudRate),
    delimiter: c.lineDelimiter,
    decimalComma: Boolean(c.lineDecimalComma),
    timeField: Number(c.lineTimeField),
    channelFields: typeof channels === 'string' ? null : channels,
    loadUnit: c.lineLoadUnit,
  });
  return parsed.success ? parsed.data : LOGGER_LINE_TRAINING_DEFAULTS;
}

/** A format as the stored columns. */
export function loggerLineColumns(f: LoggerLineFormat) {
  return { serialBaudRate: f.baudRate, lineDelimiter: f.delimiter, lineDecimalComma: f.decimalComma, lineTimeField: f.timeField, lineChannelFields: f.channelFields ? f.channelFields.join(',') : null, lineLoadUnit: f.loadUnit };
}
