import { NextResponse } from 'next/server';
import { z } from 'zod';
import { searchParamsObject, withRole } from '@/lib/http/api';
import { runParamsSchema } from '@/lib/data/run-params';
import { loadRun } from '@/lib/data/run-report';
import { runToCsv } from '@/lib/ingest/export-csv';
import { nToLbf } from '@/lib/calc/units';
import { ALL_ROLES } from '@/lib/auth/session';

const querySchema = z.object({ format: z.enum(['csv', 'json']).default('csv'), units: z.enum(['si', 'us']).optional() }).strict();

// GET /api/runs/:id/export - one row per reading, CSV (formula-safe) or JSON, in SI or US units
export const GET = withRole<{ id: string }>(ALL_ROLES, async (request, user, { params }) => {
  const { id } = runParamsSchema.parse(await params);
  const query = querySchema.parse(searchParamsObject(request));
  const units = query.units ?? user.units;
  const { header, run } = await loadRun(user, id);
  if (query.format === 'json') {
    const rows = run.steps.flatMap((step) =>
      step.loadsN.map((loadN, index) => ({
        runId: id,
        step: step.order,
        pass: step.pass,
        tightenedPosition: step.position,
        position: index + 1,
        load: units === 'us' ? nToLbf(loadN) : loadN,
        timeS: step.timeS ?? null,
      })),
    );
    return NextResponse.json({ runId: id, loadUnit: units === 'us' ? 'lbf' : 'N', targetLoadN: header.targetLoadN, rows });
  }
  return new NextResponse(runToCsv(run, { runId: id }, units), {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="evenload-run-${id}-${units}.csv"`,
    },
  });
});
