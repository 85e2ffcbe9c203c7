import { NextResponse } from 'next/server';

const BODY = { status: 'ok', service: 'evenload' } as const;

// GET /api/ping - constant JSON, no database: the baseline the load benchmark compares against
export function GET() {
  return NextResponse.json(BODY);
}
