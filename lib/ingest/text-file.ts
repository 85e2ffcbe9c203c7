/**
 * Checking an uploaded file's bytes before anything parses them: size, text (no NUL bytes, not
 * UTF-16) and valid UTF-8. Pure and browser-safe (`TextDecoder`, no `Buffer`), so the upload
 * widget's web worker and the server run the same checks.
 */
import { AppError } from '@/lib/http/errors';
import { formatDecimals } from '@/lib/calc/units';

/** Bytes in one MB as used in size messages (1 MB = 1,048,576 bytes, as most upload limits are set). */
export const BYTES_PER_MB = 1024 * 1024;

function formatMb(bytes: number): string {
  const mb = bytes / BYTES_PER_MB;
  return `${formatDecimals(mb, Number.isInteger(mb) ? 0 : 1)} MB`;
}

/** Offset of the first byte that breaks UTF-8 (RFC 3629: no overlongs, no surrogates, ≤ U+10FFFF), or -1. */
function firstInvalidUtf8(bytes: Uint8Array): number {
  let i = 0;
  const n = bytes.length;
  while (i < n) {
    const b = bytes[i]!;
    if (b < 0x80) {
      i++;
      continue;
    }
    let need: number;
    let min: number;
    let cp: number;
    if (b >= 0xc2 && b <= 0xdf) [need, min, cp] = [1, 0x80, b & 0x1f];
    else if (b >= 0xe0 && b <= 0xef) [need, min, cp] = [2, 0x800, b & 0x0f];
    else if (b >= 0xf0 && b <= 0xf4) [need, min, cp] = [3, 0x10000, b & 0x07];
    else return i;
    for (let k = 1; k <= need; k++) {
      const c = bytes[i + k];
      if (c === undefined || (c & 0xc0) !== 0x80) return i;
      cp = (cp << 6) | (c & 0x3f);
    }
    if (cp < min || cp > 0x10ffff || (cp >= 0xd800 && cp <= 0xdfff)) return i;
    i += need + 1;
  }
  return -1;
}

function lineOfByte(bytes: Uint8Array, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset; i++) if (bytes[i] === 0x0a) line++;
  return line;
}

/**
 * Checks an uploaded file's bytes before parsing and returns its text (a leading byte-order mark is
 * kept so `inspectText` in `detect.ts` can report it). Uses `TextDecoder` with `fatal: true`; no `Buffer`.
 *
 * @param limitBytes the upload limit; the message states it in MB (1 MB = 1,048,576 bytes).
 * @throws AppError('too_large') over the limit; AppError('invalid_input') for an empty file, a file
 *   with NUL bytes (binary, or UTF-16 text) or invalid UTF-8 (the message names the line).
 */
export function assertTextFile(bytes: Uint8Array, limitBytes: number): string {
  if (bytes.length > limitBytes) {
    throw new AppError('too_large', `The file is ${formatMb(bytes.length)}; the limit is ${formatMb(limitBytes)}.`, {
      limitBytes,
      sizeBytes: bytes.length,
    });
  }
  if (bytes.length === 0) throw new AppError('invalid_input', 'The file is empty (0 bytes).', {});
  const utf16Bom = (bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff);
  const nul = bytes.indexOf(0);
  if (utf16Bom || nul >= 0) {
    const line = lineOfByte(bytes, Math.max(nul, 0));
    const message = utf16Bom
      ? 'The file is UTF-16 text, not UTF-8; save it as "CSV UTF-8" or plain UTF-8 text.'
      : `Line ${line}: the file is not a text file (it contains NUL bytes, byte ${nul + 1}). Upload the logger's CSV or text export.`;
    throw new AppError('invalid_input', message, utf16Bom ? {} : { row: line });
  }
  try {
    return new TextDecoder('utf-8', { fatal: true, ignoreBOM: true }).decode(bytes);
  } catch {
    const at = firstInvalidUtf8(bytes);
    const line = lineOfByte(bytes, Math.max(at, 0));
    throw new AppError(
      'invalid_input',
      `Line ${line}: the file is not valid UTF-8 text (byte ${at + 1}). Save it as "CSV UTF-8" or plain UTF-8 text.`,
      { row: line },
    );
  }
}
