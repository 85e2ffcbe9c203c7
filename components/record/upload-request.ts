import type { ColumnMapping } from '@/lib/ingest/shapes';
import type { RunCheckReason } from '@/lib/run-check/types';
import type { HeaderErrors } from './run-header-fields';
import type { Progress } from './use-file-parse';

/** How an upload ended, as the panel shows it. */
export type UploadOutcome =
  | { kind: 'saved'; runId: number; stepCount: number; needsReview: boolean; reviewReasons: RunCheckReason[] }
  | { kind: 'duplicate'; runId: number | null; message: string }
  | { kind: 'error'; message: string };

/**
 * Sends the raw file, the confirmed mapping and the run header to `POST /api/uploads` (XHR, for
 * upload progress) and reports progress, then the outcome; field errors of the header go to
 * `onHeaderErrors` (cleared on success).
 */
export function sendUpload(
  { file, mapping, header }: { file: File; mapping: ColumnMapping; header: unknown },
  { onProgress, onOutcome, onHeaderErrors }: { onProgress: (p: Progress) => void; onOutcome: (o: UploadOutcome) => void; onHeaderErrors: (errors: HeaderErrors) => void },
): void {
  const form = new FormData();
  form.append('file', file);
  form.append('mapping', JSON.stringify(mapping));
  form.append('header', JSON.stringify(header));
  const xhr = new XMLHttpRequest();
  xhr.open('POST', '/api/uploads');
  xhr.responseType = 'json';
  onProgress({ label: 'Sending the file', fraction: 0 });
  xhr.upload.onprogress = (e) => {
    if (e.lengthComputable) onProgress({ label: e.loaded >= e.total ? 'Storing the run' : 'Sending the file', fraction: e.loaded / e.total });
  };
  xhr.upload.onload = () => onProgress({ label: 'Storing the run', fraction: 1 });
  xhr.onload = () => {
    onProgress(null);
    const body = (xhr.response ?? {}) as { runId?: number; stepCount?: number; status?: string; reviewReasons?: RunCheckReason[]; error?: { message?: string; runId?: number | null; fieldErrors?: HeaderErrors } };
    if (xhr.status === 201 && body.runId) {
      onOutcome({ kind: 'saved', runId: body.runId, stepCount: body.stepCount ?? 0, needsReview: body.status === 'needs_review', reviewReasons: body.reviewReasons ?? [] });
      onHeaderErrors({});
    } else if (xhr.status === 409) {
      onOutcome({ kind: 'duplicate', runId: body.error?.runId ?? null, message: body.error?.message ?? 'This file was uploaded before.' });
    } else {
      if (body.error?.fieldErrors) onHeaderErrors(body.error.fieldErrors);
      onOutcome({ kind: 'error', message: body.error?.message ?? `The server answered ${xhr.status}. Try again.` });
    }
  };
  xhr.onerror = () => {
    onProgress(null);
    onOutcome({ kind: 'error', message: 'The upload did not reach the server. Check the connection and try again.' });
  };
  xhr.send(form);
}
