/**
 * Excel workbooks (.xlsx) upload like CSV: the chosen sheet (by default the first that holds a table) is turned into
 * comma-separated text, row k of the sheet on line k, and parsed by the same `parseLoggerText`.
 * Read with `read-excel-file` (its `universal` build runs in the browser's worker and in Node).
 * Browser-safe.
 */
import readXlsxFile from 'read-excel-file/universal';
import { AppError } from '@/lib/http/errors';
import { assertTextFile } from './text-file';
import { quoteInput } from './text-limits';

/** Whether the bytes start like a zip archive (an .xlsx file is one): `PK\x03\x04`. */
export function isWorkbook(bytes: Uint8Array): boolean {
  return bytes.length >= 4 && bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04;
}

function csvCell(value: unknown): string {
  if (value === null || value === undefined) return '';
  const text = value instanceof Date ? value.toISOString() : String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** A file's text and, for a workbook, its sheets and the one read. */
export interface FileText {
  text: string;
  /** Sheet names of a workbook, in order; empty for a text file. */
  sheets: string[];
  /** The sheet read, or null for a text file. */
  sheet: string | null;
}

/**
 * The text of one sheet of an .xlsx workbook as CSV.
 * @param sheet the sheet's name; null or undefined = the first sheet with a table (a row of two or more cells).
 * @throws AppError('invalid_input') for a workbook that cannot be read or has no such sheet.
 */
export async function workbookText(bytes: Uint8Array, sheet?: string | null): Promise<FileText> {
  let sheets: Awaited<ReturnType<typeof readXlsxFile>>;
  try {
    const copy = new Uint8Array(bytes.length);
    copy.set(bytes);
    sheets = await readXlsxFile(copy.buffer);
  } catch (error) {
    throw new AppError('invalid_input', `The file looks like an Excel workbook (.xlsx) but could not be read (${String((error as Error)?.message ?? error).slice(0, 80)}). Save it again from the spreadsheet program, or export the sheet as CSV.`, { field: 'file' });
  }
  const names = sheets.map((s) => s.sheet);
  const isTable = (s: (typeof sheets)[number]) => s.data.some((row) => row.filter((c) => c !== null && c !== '').length >= 2);
  const chosen = sheet ? sheets.find((s) => s.sheet === sheet) : (sheets.find(isTable) ?? sheets[0]);
  if (!chosen) {
    throw new AppError('invalid_input', `The workbook has no sheet named ${quoteInput(sheet ?? '')}; its sheets are ${names.map((n) => quoteInput(n)).join(', ')}.`, { field: 'sheet' });
  }
  const text = chosen.data.map((row) => row.map(csvCell).join(',')).join('\n');
  return { text, sheets: names, sheet: chosen.sheet };
}

/**
 * The text of an uploaded file: a workbook's chosen sheet, or the checked UTF-8 text of a text file.
 * @throws AppError for a file over `limitBytes`, binary that is not a workbook, or invalid UTF-8.
 */
export async function uploadedFileText(bytes: Uint8Array, limitBytes: number, sheet?: string | null): Promise<FileText> {
  if (isWorkbook(bytes) && bytes.length <= limitBytes) return workbookText(bytes, sheet);
  return { text: assertTextFile(bytes, limitBytes), sheets: [], sheet: null };
}
