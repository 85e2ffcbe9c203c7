import { withRole } from '@/lib/http/api';
import { auditLogCsv } from '@/lib/data/audit-log';

export const runtime = 'nodejs';

// GET /api/admin/audit-log - the audit log (every change to runs, verdicts, criteria, outcomes, records of training and accounts) as CSV, admins only
export const GET = withRole(['admin'], async (_request, user) => {
  const stamp = new Date().toISOString().slice(0, 10);
  return new Response(await auditLogCsv(user), {
    headers: { 'content-type': 'text/csv; charset=utf-8', 'content-disposition': `attachment; filename="evenload-audit-log-${stamp}.csv"` },
  });
});
