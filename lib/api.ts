import 'server-only';
import { NextResponse, type NextRequest } from 'next/server';
import { ConnectionError, ConnectionAcquireTimeoutError } from 'sequelize';
import { ZodError } from 'zod';
import { AppError, httpStatusOf } from './errors';
import { assertRole, getSessionUser, type SessionUser } from './session';
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

export function isDatabaseDown(error: unknown): boolean {
  if (error instanceof ConnectionError || error instanceof ConnectionAcquireTimeoutError) return true;
  const name = (error as { name?: string } | null)?.name ?? '';
  return name.startsWith('SequelizeConnection') || name === 'SequelizeHostNotReachableError';
}

/**
 * The one wrapper for route handlers: authenticates, checks the role, and maps errors.
 * `withRole(['instructor'], async (request, user, { params }) => ...)`.
 */
export function withRole<P = Record<string, string>>(roles: readonly Role[], handler: Handler<P>) {
  return async (request: NextRequest, context: RouteContext<P>): Promise<Response> => {
    try {
      const user = await getSessionUser();
      assertRole(user, roles);
      return await handler(request, user, context);
    } catch (error) {
      return errorResponse(error);
    }
  };
}

/** Query-string parameters as a plain object for zod. */
export function searchParamsObject(request: NextRequest): Record<string, string> {
  return Object.fromEntries(request.nextUrl.searchParams.entries());
}
