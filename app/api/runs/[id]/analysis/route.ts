import { withRole } from '@/lib/http/api';
import { runParamsSchema } from '@/lib/data/run-params';
import { runAnalysisFor } from '@/lib/data/run-analysis';
import { ALL_ROLES } from '@/lib/auth/session';

// GET /api/runs/:id/analysis - final loads, figures, per-pass summary, drift and reach of one run,
// stored with the run and served with its ETag (304 when If-None-Match already names it)
export const GET = withRole<{ id: string }>(ALL_ROLES, async (request, user, { params }) => {
  const { id } = runParamsSchema.parse(await params);
  const { etag, bodyJson } = await runAnalysisFor(user, id, request.headers.get('if-none-match'));
  // private, no-cache: the browser may keep it but asks again (If-None-Match) before using it.
  const headers = { ETag: etag, 'Cache-Control': 'private, no-cache' };
  if (bodyJson === null) return new Response(null, { status: 304, headers });
  return new Response(bodyJson, { status: 200, headers: { ...headers, 'Content-Type': 'application/json' } });
});
