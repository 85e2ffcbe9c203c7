import { searchParamsObject, withRole } from '@/lib/http/api';
import { exportSelectionCsv, exportSelectionJson, parseExportQuery } from '@/lib/data/run-export';
import { ALL_ROLES } from '@/lib/auth/session';

export const runtime = 'nodejs';

function streamOf(chunks: AsyncGenerator<string>): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  return new ReadableStream({
    async pull(controller) {
      const next = await chunks.next();
      if (next.done) controller.close();
      else controller.enqueue(encoder.encode(next.value));
    },
    async cancel() {
      await chunks.return(undefined);
    },
  });
}

// GET /api/runs/export - the filtered selection (same filters as /api/runs) as CSV or JSON, one row per reading, SI or US units
export const GET = withRole(ALL_ROLES, async (request, user) => {
  const { options, query } = parseExportQuery(searchParamsObject(request));
  const units = options.units ?? user.units;
  const stamp = new Date().toISOString().slice(0, 10);
  // Read the first chunk before answering, so a database error becomes a proper error response.
  const chunks = options.format === 'json' ? exportSelectionJson(user, query, units) : exportSelectionCsv(user, query, units);
  const first = await chunks.next();
  async function* rest() {
    if (!first.done) yield first.value;
    yield* chunks;
  }
  const type = options.format === 'json' ? 'application/json; charset=utf-8' : 'text/csv; charset=utf-8';
  return new Response(streamOf(rest()), {
    headers: {
      'content-type': type,
      'content-disposition': `attachment; filename="evenload-runs-${stamp}.${options.format}"`,
      'cache-control': 'no-store',
    },
  });
});
