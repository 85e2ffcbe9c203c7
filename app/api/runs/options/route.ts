import { NextResponse } from 'next/server';
import { withRole } from '@/lib/http/api';
import { runFilterOptions } from '@/lib/data/runs';
import { ALL_ROLES } from '@/lib/auth/session';

// GET /api/runs/options - choices for the runs filters (methods, lubricants, joints, cohorts, operators)
export const GET = withRole(ALL_ROLES, async (_request, user) => NextResponse.json(await runFilterOptions(user)));
