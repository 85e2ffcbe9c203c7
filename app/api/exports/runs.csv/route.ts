import type { NextRequest } from 'next/server';
import { withRole } from '@/lib/http/api';
import { exportRunsCsv, runExportQuerySchema } from '@/lib/data/exports';
import { AppError } from '@/lib/http/errors';

/** The export's form is a few short fields; anything longer is not ours. */
const MAX_BODY_BYTES = 16_384;

/**
 * The key and filters from the POST body (a form post or JSON), never from the address: a key in
 * a URL ends up in browser history, server logs and Referer headers.
 */
async function exportRequestBody(request: NextRequest): Promise<Record<string, unknown>> {
  if (request.nextUrl.searchParams.size > 0) {
    throw new AppError('invalid_input', 'Send the export key and the filters in the request body, not in the address.', { field: 'key' });
  }
  const text = await request.text();
  if (Buffer.byteLength(text) > MAX_BODY_BYTES) throw new AppError('too_large', 'The export request is too large.');
  if ((request.headers.get('content-type') ?? '').includes('application/json')) {
    try {
      const parsed: unknown = JSON.parse(text);
      if (parsed && typeof parsed === 'object' && !Array.isArray(parsed)) return parsed as Record<string, unknown>;
    } catch {
      // Answered below.
    }
    throw new AppError('invalid_input', 'The request body is not a JSON object.');
  }
  // Empty optional fields of the form are left out, as an absent filter.
  return Object.fromEntries([...new URLSearchParams(text).entries()].filter(([, value]) => value !== ''));
}

// POST /api/exports/runs.csv - body key=..&cohortId=.. (form or JSON): pseudonymised readings of complete runs, one line per reading
export const POST = withRole(['researcher', 'admin'], async (request, user) => {
  const query = runExportQuerySchema.parse(await exportRequestBody(request));
  const lines = exportRunsCsv(user, query);
  // Pull the first chunk (the header) here, so role and query errors still answer as JSON.
  const first = await lines.next();
  const encoder = new TextEncoder();
  const stream = new ReadableStream<Uint8Array>({
    start(controller) {
      if (!first.done) controller.enqueue(encoder.encode(first.value));
    },
    async pull(controller) {
      const next = await lines.next();
      if (next.done) controller.close();
      else controller.enqueue(encoder.encode(next.value));
    },
  });
  const name = `evenload-runs${query.cohortId ? `-cohort-${query.cohortId}` : ''}.csv`;
  return new Response(stream, {
    headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="${name}"`, 'cache-control': 'no-store' },
  });
});
