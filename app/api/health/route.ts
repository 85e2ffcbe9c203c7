import { NextResponse } from 'next/server';
import { databaseReachable, replicaLagMs, replicaReadState } from '@/lib/data/health';

export const dynamic = 'force-dynamic';

// GET /api/health - 200 when the database (the primary) answers, 503 when it does not (public: for load balancers)
export async function GET() {
  const ok = await databaseReachable();
  const reads = replicaReadState();
  const lag = replicaLagMs();
  const replica = lag === null ? {} : { replicaLagMs: lag };
  return NextResponse.json(
    ok ? { status: 'ok', database: 'reachable', reads, ...replica } : { status: 'unavailable', database: 'unreachable', reads, ...replica, message: 'The database is not answering.' },
    { status: ok ? 200 : 503 },
  );
}
