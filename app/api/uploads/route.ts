import { NextResponse } from 'next/server';
import { withRole } from '@/lib/api';
import { RECORD_ROLES } from '@/lib/data/record';
import { AppError } from '@/lib/errors';
import { BYTES_PER_MB } from '@/lib/ingest/detect';
import { UPLOAD_FORM_OVERHEAD_BYTES, UPLOAD_LIMIT_BYTES } from '@/lib/record/limits';
import { storeUploadedRun } from '@/lib/runs/upload-run';

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
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > UPLOAD_LIMIT_BYTES + UPLOAD_FORM_OVERHEAD_BYTES) {
    throw new AppError('too_large', `The file is larger than the upload limit of ${UPLOAD_LIMIT_BYTES / BYTES_PER_MB} MB. Split the log or export only this run.`, { field: 'file', limitBytes: UPLOAD_LIMIT_BYTES });
  }
  const form = await request.formData().catch(() => {
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
