import { NextResponse } from 'next/server';
import { withRole } from '@/lib/http/api';
import { analyseRun } from '@/lib/analysis/analyse-run';
import { runParamsSchema } from '@/lib/data/run-params';
import { loadRun } from '@/lib/data/run-report';
import { ALL_ROLES } from '@/lib/auth/session';

// GET /api/runs/:id/analysis - final loads, figures, per-pass summary, drift and reach of one run
export const GET = withRole<{ id: string }>(ALL_ROLES, async (_request, user, { params }) => {
  const { id } = runParamsSchema.parse(await params);
  const { header, run } = await loadRun(user, id);
  return NextResponse.json(analyseRun(id, run, { bandPercent: header.bandPercent, passPercents: header.method.passPercents }));
});
