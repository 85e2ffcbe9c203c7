import 'server-only';
import type { AppError } from '@/lib/http/errors';

/**
 * Reads a request body while counting its bytes, chunked or not: a declared Content-Length over
 * the limit is refused before reading, and the reading stops (the stream is cancelled) as soon as
 * the count passes the limit, so an oversize body is never held whole.
 *
 * @param tooLarge the error to throw (AppError('too_large', ...), answered 413).
 */
export async function readBodyWithin(request: Request, limitBytes: number, tooLarge: () => AppError): Promise<Uint8Array> {
  if (Number(request.headers.get('content-length') ?? '0') > limitBytes) throw tooLarge();
  if (!request.body) return new Uint8Array(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limitBytes) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge();
    }
    chunks.push(value);
  }
  const body = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    body.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return body;
}
