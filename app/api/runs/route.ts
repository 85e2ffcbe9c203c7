import { searchParamsObject, withRole } from '@/lib/http/api';
import { listRunsJson, runListQuerySchema } from '@/lib/data/runs';
import { ALL_ROLES } from '@/lib/auth/session';

// GET /api/runs - the runs the signed-in person may see, filtered, sorted and paged
export const GET = withRole(ALL_ROLES, async (request, user) => {
  const query = runListQuerySchema.parse(searchParamsObject(request));
  return new Response(await listRunsJson(user, query), { headers: { 'Content-Type': 'application/json' } });
});
