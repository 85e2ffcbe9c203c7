import { NextResponse } from 'next/server';
import { withRole } from '@/lib/http/api';
import { runParamsSchema } from '@/lib/data/run-params';
import { loadRun } from '@/lib/data/run-report';
import { ALL_ROLES } from '@/lib/auth/session';

// GET /api/runs/:id - the run's header, steps with every stud's load (N), and comments
export const GET = withRole<{ id: string }>(ALL_ROLES, async (_request, user, { params }) => {
  const { id } = runParamsSchema.parse(await params);
  return NextResponse.json(await loadRun(user, id));
});
