import { searchParamsObject, withRole } from '@/lib/http/api';
import { compareQuerySchema, compareRunsCached } from '@/lib/data/compare';

// GET /api/compare - groups of complete runs side by side: summaries, chart data, tests with readings, nut factors;
// with an ETag (304 when If-None-Match names it and the runs, names and software are unchanged)
export const GET = withRole(['instructor', 'researcher'], async (request, user) => {
  const query = compareQuerySchema.parse(searchParamsObject(request));
  const { etag, body } = await compareRunsCached(user, query, request.headers.get('if-none-match'));
  // private, no-cache: the browser may keep it but asks again (If-None-Match) before using it.
  const headers = { ETag: etag, 'Cache-Control': 'private, no-cache' };
  if (body === null) return new Response(null, { status: 304, headers });
  return new Response(body, { status: 200, headers: { ...headers, 'Content-Type': 'application/json' } });
});
