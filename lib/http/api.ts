import 'server-only';
import { NextResponse, type NextRequest } from 'next/server';
import { ZodError } from 'zod';
import { isDatabaseDown } from './database-down';
import { AppError, httpStatusOf } from './errors';
import { assertRole, getSessionUser, type SessionUser } from '../auth/session';
import type { Role } from '@/models/user';

export interface RouteContext<P = Record<string, string>> {
  params: Promise<P>;
}

type Handler<P> = (request: NextRequest, user: SessionUser, context: RouteContext<P>) => Promise<Response>;

/** Turns any thrown error into the JSON error body and status every client expects. */
export function errorResponse(error: unknown): NextResponse {
  if (error instanceof AppError) {
    return NextResponse.json({ error: { code: error.code, message: error.message, ...error.details } }, { status: httpStatusOf(error.code) });
  }
  if (error instanceof ZodError) {
    const first = error.issues[0];
    const field = first?.path.join('.') || undefined;
    const message = first ? `${field ? `${field}: ` : ''}${first.message}` : 'The request is not valid.';
    return NextResponse.json({ error: { code: 'invalid_input', message, field, issues: error.issues } }, { status: 422 });
  }
  if (isDatabaseDown(error)) {
    return NextResponse.json(
      { error: { code: 'unavailable', message: 'The database is not answering. Try again in a few seconds.' } },
      { status: 503, headers: { 'Retry-After': '5' } },
    );
  }
  console.error('[api] unexpected error', error);
  return NextResponse.json({ error: { code: 'internal', message: 'Something went wrong on our side. Try again.' } }, { status: 500 });
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * The rule Next applies to server actions, for route handlers that change data: a browser's request
 * must come from our own origin. The Origin header (sent by browsers on every POST, PUT, PATCH and
 * DELETE) must name the host the request was sent to; without it, Sec-Fetch-Site must not say
 * `cross-site` or `same-site` (another port or subdomain is another origin). A request with neither
 * comes from a program, not a browser page, and cannot carry a victim's cookie by itself.
 */
export function assertSameOrigin(request: Request): void {
  if (SAFE_METHODS.has(request.method)) return;
  const origin = request.headers.get('origin');
  if (origin !== null) {
    const host = request.headers.get('x-forwarded-host') ?? request.headers.get('host');
    let originHost: string | null = null;
    try {
      originHost = origin === 'null' ? null : new URL(origin).host;
    } catch {
      originHost = null;
    }
    if (!host || originHost !== host.split(',')[0]!.trim()) throw new AppError('forbidden', 'This request came from another site and was refused.');
    return;
  }
  const site = request.headers.get('sec-fetch-site');
  if (site === 'cross-site' || site === 'same-site') throw new AppError('forbidden', 'This request came from another site and was refused.');
}

/**
 * Signed-in answers are one person's data: no shared cache may keep them, nor the browser's disk
 * cache. A handler that serves an ETag may say `private, no-cache` instead (the browser keeps the
 * answer but revalidates it before each use); anything else becomes `private, no-store`.
 */
function privateNoStore(response: Response): Response {
  try {
    if (response.headers.get('Cache-Control') === 'private, no-cache' && response.headers.has('ETag')) return response;
    response.headers.set('Cache-Control', 'private, no-store');
  } catch {
    // a response with immutable headers (e.g. Response.redirect) carries no private data
  }
  return response;
}

/**
 * The one wrapper for route handlers: refuses cross-origin writes, authenticates, checks the role,
 * maps errors, and marks every answer `Cache-Control: private, no-store`.
 * `withRole(['instructor'], async (request, user, { params }) => ...)`.
 */
export function withRole<P = Record<string, string>>(roles: readonly Role[], handler: Handler<P>) {
  return async (request: NextRequest, context: RouteContext<P>): Promise<Response> => {
    try {
      assertSameOrigin(request);
      const user = await getSessionUser();
      assertRole(user, roles);
      return privateNoStore(await handler(request, user, context));
    } catch (error) {
      return privateNoStore(errorResponse(error));
    }
  };
}

/** Query-string parameters as a plain object for zod. */
export function searchParamsObject(request: NextRequest): Record<string, string> {
  return Object.fromEntries(request.nextUrl.searchParams.entries());
}
