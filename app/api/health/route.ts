import { NextResponse } from 'next/server';
import { databaseReachable } from '@/lib/data/health';

export const dynamic = 'force-dynamic';

// GET /api/health - 200 when the database answers, 503 when it does not (public: for load balancers)
export async function GET() {
  const ok = await databaseReachable();
  return NextResponse.json(
    ok ? { status: 'ok', database: 'reachable' } : { status: 'unavailable', database: 'unreachable', message: 'The database is not answering.' },
    { status: ok ? 200 : 503 },
  );
}
