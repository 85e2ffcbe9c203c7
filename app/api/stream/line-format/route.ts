import { NextResponse, type NextRequest } from 'next/server';
import { errorResponse } from '@/lib/http/api';
import { authenticateStreamToken } from '@/lib/data/stream-tokens';
import { bridgeLineFormat } from '@/lib/data/runs/live-stream';

export const runtime = 'nodejs';

// GET /api/stream/line-format - the token's joint's logger line format and what the parser needs of the joint (for scripts/stream-bridge.ts); Authorization: Bearer <per-joint token>, no session
export async function GET(request: NextRequest): Promise<Response> {
  try {
    const token = await authenticateStreamToken(request.headers.get('authorization'));
    return NextResponse.json(await bridgeLineFormat(token.jointId), { headers: { 'Cache-Control': 'private, no-store' } });
  } catch (error) {
    return errorResponse(error);
  }
}
