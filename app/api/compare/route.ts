import { NextResponse } from 'next/server';
import { searchParamsObject, withRole } from '@/lib/http/api';
import { compareQuerySchema, compareRunsJson } from '@/lib/data/compare';

// GET /api/compare - groups of complete runs side by side: summaries, chart data, tests with readings, nut factors
export const GET = withRole(['instructor', 'researcher'], async (request, user) => {
  const query = compareQuerySchema.parse(searchParamsObject(request));
  return new NextResponse(await compareRunsJson(user, query), { headers: { 'content-type': 'application/json' } });
});
