/**
 * splitMultipart against bodies encoded by undici's own FormData serialiser (Node's Request), the
 * encoder a browser-like client uses, so the expected parts come from outside our code.
 */
import { describe, expect, it } from 'vitest';
import { AppError } from '@/lib/http/errors';
import { splitMultipart } from '@/lib/http/multipart';

async function encoded(form: FormData): Promise<{ body: Uint8Array; contentType: string }> {
  const request = new Request('http://localhost/', { method: 'POST', body: form });
  return { body: new Uint8Array(await request.arrayBuffer()), contentType: request.headers.get('content-type')! };
}

describe('splitMultipart', () => {
  it('returns each field and the file bytes unchanged, CRLFs and all', async () => {
    const file = new Uint8Array([0x41, 0x0d, 0x0a, 0x2d, 0x2d, 0x0d, 0x0a, 0x00, 0xff]);
    const form = new FormData();
    form.append('file', new Blob([file], { type: 'text/csv' }), 'run 7.csv');
    form.append('mapping', 'null');
    form.append('header', JSON.stringify({ jointId: 3, notes: 'ä, ok' }));
    const { body, contentType } = await encoded(form);
    const parts = splitMultipart(body, contentType);
    expect([...parts.keys()]).toEqual(['file', 'mapping', 'header']);
    expect(parts.get('file')).toMatchObject({ fileName: 'run 7.csv', contentType: 'text/csv' });
    expect([...parts.get('file')!.data]).toEqual([...file]);
    expect(Buffer.from(parts.get('header')!.data).toString('utf8')).toBe('{"jointId":3,"notes":"ä, ok"}');
    expect(parts.get('mapping')!.fileName).toBeNull();
  });

  it('refuses a body that is not multipart', () => {
    expect(() => splitMultipart(new TextEncoder().encode('{"file": 1}'), 'application/json')).toThrow(AppError);
    expect(() => splitMultipart(new TextEncoder().encode('--x\r\nContent-Disposition: form-data; name="a"\r\n\r\nno end'), 'multipart/form-data; boundary=x')).toThrow(/multipart/);
  });
});
