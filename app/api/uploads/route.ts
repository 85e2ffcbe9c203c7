import { NextResponse } from 'next/server';
import { z } from 'zod';
import { withRole } from '@/lib/http/api';
import { RECORD_ROLES } from '@/lib/data/record';
import { AppError } from '@/lib/http/errors';
import { splitMultipart, type FormPart } from '@/lib/http/multipart';
import { readBodyWithin } from '@/lib/http/read-body';
import { UPLOAD_FORM_OVERHEAD_BYTES, UPLOAD_LIMIT_BYTES } from '@/lib/record/limits';
import { storeUploadedRun, uploadTooLarge } from '@/lib/data/runs/upload-run';

export const runtime = 'nodejs';

function jsonField(form: Map<string, FormPart>, name: string): unknown {
  const part = form.get(name);
  if (!part || part.fileName !== null) throw new AppError('invalid_input', `The form has no "${name}" field.`, { field: name });
  try {
    return JSON.parse(Buffer.from(part.data).toString('utf8'));
  } catch {
    throw new AppError('invalid_input', `The "${name}" field is not valid JSON.`, { field: name });
  }
}

const ACCEPT_GUESS = z.enum(['0', '1']);

/** `acceptGuess`: absent, 0 or 1 (1 = store with the server's guess even when it is uncertain). */
function acceptGuessField(form: Map<string, FormPart>): boolean {
  const part = form.get('acceptGuess');
  if (!part) return false;
  const value = ACCEPT_GUESS.safeParse(Buffer.from(part.data).toString('utf8').trim());
  if (part.fileName !== null || !value.success) throw new AppError('invalid_input', 'The "acceptGuess" field is 0 or 1.', { field: 'acceptGuess' });
  return value.data === '1';
}

// POST /api/uploads - store a logger file (multipart: file, mapping (JSON or null = server's guess), header, acceptGuess) as a run; 422 with the guess when it is uncertain and neither a mapping nor acceptGuess=1 was sent; 409 for a file already uploaded (with runId when the caller may see that run)
export const POST = withRole(RECORD_ROLES, async (request, user) => {
  // The limit is counted while the body is read (chunked or not); an oversize body is never held whole.
  const body = await readBodyWithin(request, UPLOAD_LIMIT_BYTES + UPLOAD_FORM_OVERHEAD_BYTES, uploadTooLarge);
  const form = splitMultipart(body, request.headers.get('content-type') ?? '');
  const file = form.get('file');
  if (!file || file.fileName === null) throw new AppError('invalid_input', 'Choose a file to upload.', { field: 'file' });
  const result = await storeUploadedRun(user, {
    bytes: file.data,
    fileName: file.fileName || 'upload.csv',
    contentType: file.contentType,
    mapping: jsonField(form, 'mapping'),
    header: jsonField(form, 'header'),
    acceptGuess: acceptGuessField(form),
  });
  return NextResponse.json(result, { status: 201 });
});
