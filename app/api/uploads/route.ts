import { NextResponse } from 'next/server';
import { withRole } from '@/lib/api';
import { RECORD_ROLES } from '@/lib/data/record';
import { AppError } from '@/lib/errors';
import { readBodyWithin } from '@/lib/read-body';
import { UPLOAD_FORM_OVERHEAD_BYTES, UPLOAD_LIMIT_BYTES } from '@/lib/record/limits';
import { storeUploadedRun, uploadTooLarge } from '@/lib/runs/upload-run';

export const runtime = 'nodejs';

function jsonField(form: FormData, name: string): unknown {
  const value = form.get(name);
  if (typeof value !== 'string') throw new AppError('invalid_input', `The form has no "${name}" field.`, { field: name });
  try {
    return JSON.parse(value);
  } catch {
    throw new AppError('invalid_input', `The "${name}" field is not valid JSON.`, { field: name });
  }
}

// POST /api/uploads - store a logger file (multipart: file, mapping (JSON or null = server's guess), header) as a run; 409 with runId for a file already uploaded
export const POST = withRole(RECORD_ROLES, async (request, user) => {
  // The limit is counted while the body is read (chunked or not); an oversize body is never held whole.
  const body = await readBodyWithin(request, UPLOAD_LIMIT_BYTES + UPLOAD_FORM_OVERHEAD_BYTES, uploadTooLarge);
  const form = await new Response(body as BodyInit, { headers: { 'content-type': request.headers.get('content-type') ?? '' } }).formData().catch(() => {
    throw new AppError('invalid_input', 'Send the upload as multipart form data with the fields file, mapping and header.', { field: 'file' });
  });
  const file = form.get('file');
  if (!(file instanceof Blob)) throw new AppError('invalid_input', 'Choose a file to upload.', { field: 'file' });
  const result = await storeUploadedRun(user, {
    bytes: new Uint8Array(await file.arrayBuffer()),
    fileName: file instanceof File ? file.name : 'upload.csv',
    contentType: file.type,
    mapping: jsonField(form, 'mapping'),
    header: jsonField(form, 'header'),
  });
  return NextResponse.json(result, { status: 201 });
});
