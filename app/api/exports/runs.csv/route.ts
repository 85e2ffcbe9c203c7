import { withRole, searchParamsObject } from '@/lib/api';
import { exportRunsCsv, runExportQuerySchema } from '@/lib/data/exports';

// GET /api/exports/runs.csv?key=..&cohortId=.. - pseudonymised readings of complete runs, one line per reading
export const GET = withRole(['researcher', 'admin'], async (request, user) => {
  const query = runExportQuerySchema.parse(searchParamsObject(request));
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
