import { NextResponse, type NextRequest } from 'next/server';
import { z } from 'zod';
import { errorResponse, withRole, type RouteContext } from '@/lib/http/api';
import { authenticateStreamToken } from '@/lib/data/stream-tokens';
import { AppError } from '@/lib/http/errors';
import { readBodyWithin } from '@/lib/http/read-body';
import { STREAM_BODY_LIMIT_BYTES } from '@/lib/record/limits';
import { appendStreamReadings, appendStreamReadingsAsUser, streamStatus } from '@/lib/data/runs/live-stream';
import { RECORD_ROLES } from '@/lib/data/record';
import { ALL_ROLES } from '@/lib/auth/session';

export const runtime = 'nodejs';

const paramsSchema = z.object({ id: z.coerce.number().int().positive() });

// GET /api/runs/:id/stream - what a live recording has received so far (polled by the Record page)
export const GET = withRole<{ id: string }>(ALL_ROLES, async (_request, user, { params }) => {
  const { id } = paramsSchema.parse(await params);
  return NextResponse.json(await streamStatus(user, id));
});

const readStreamBody = async (request: NextRequest) => {
  const tooLarge = () => new AppError('too_large', `One request may carry at most ${STREAM_BODY_LIMIT_BYTES / 1024 / 1024} MB; send smaller batches.`);
  return new TextDecoder().decode(await readBodyWithin(request, STREAM_BODY_LIMIT_BYTES, tooLarge));
};

// POST /api/runs/:id/stream with a signed-in session (the Record page's "Connect logger"): same readings, the run must be visible
const postFromBrowser = withRole<{ id: string }>(RECORD_ROLES, async (request, user, { params }) => {
  const { id } = paramsSchema.parse(await params);
  return NextResponse.json(await appendStreamReadingsAsUser(user, id, await readStreamBody(request)));
});

// POST /api/runs/:id/stream - newline-delimited JSON readings; from a bridge with Authorization: Bearer <per-joint token>, else from the signed-in browser
export async function POST(request: NextRequest, context: RouteContext<{ id: string }>): Promise<Response> {
  if (!request.headers.get('authorization')) return postFromBrowser(request, context);
  try {
    const token = await authenticateStreamToken(request.headers.get('authorization'));
    const { id } = paramsSchema.parse(await context.params);
    return NextResponse.json(await appendStreamReadings(token.jointId, id, await readStreamBody(request)));
  } catch (error) {
    return errorResponse(error);
  }
}
