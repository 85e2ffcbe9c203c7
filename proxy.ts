import { getToken } from 'next-auth/jwt';
import { NextResponse, type NextRequest } from 'next/server';
import { authSecret } from './lib/env';

/**
 * Optimistic redirect only: signed-out visitors of app pages go to /sign-in. The real checks sit in
 * lib/data, every server action and every route handler (API routes answer 401 themselves).
 */
export async function proxy(request: NextRequest) {
  const token = await getToken({ req: request, secret: authSecret() });
  if (!token) {
    const url = request.nextUrl.clone();
    url.pathname = '/sign-in';
    url.search = '';
    return NextResponse.redirect(url);
  }
  return NextResponse.next();
}

export const config = {
  // Public: sign-in, the invitation and reset links, the forgot-password form and the dev outbox.
  matcher: ['/((?!api|_next|fonts|favicon.ico|sign-in|welcome|reset|forgot-password|dev/outbox|icon.svg|robots.txt).*)'],
};
