import { getToken } from 'next-auth/jwt';
import { NextResponse, type NextRequest } from 'next/server';
import { pageContentSecurityPolicy } from './lib/http/content-security-policy';
import { authSecret, env } from './lib/platform/env';

/** Server actions carry form fields only; next.config.mjs sets the same limit for Next itself. */
export const SERVER_ACTION_BODY_LIMIT_BYTES = 1024 * 1024;

// Pages anyone may open: sign-in, the invitation and reset links, the forgot-password form, the check of a record of training and the dev outbox.
const PUBLIC_PAGES = /^\/(sign-in|welcome|reset|forgot-password|verify|review|dev\/outbox)(\/|$)/;

/**
 * For every page request: a Content-Security-Policy with a fresh nonce (Next reads it from the
 * request's header and puts it on its own scripts); 413 for a server-action body over the limit,
 * before Next reads it; and an optimistic redirect of signed-out visitors to /sign-in. The real
 * checks sit in lib/data, every server action and every route handler (API routes answer 401 themselves).
 */
export async function proxy(request: NextRequest) {
  if (request.headers.has('next-action') && (await actionBodyTooLarge(request))) {
    return NextResponse.json(
      { error: { code: 'too_large', message: `A form may send at most ${SERVER_ACTION_BODY_LIMIT_BYTES / 1024 / 1024} MB.` } },
      { status: 413, headers: { Connection: 'close' } },
    );
  }
  const nonce = btoa(String.fromCharCode(...crypto.getRandomValues(new Uint8Array(16))));
  const policy = pageContentSecurityPolicy(nonce, env.NODE_ENV === 'development');
  if (!PUBLIC_PAGES.test(request.nextUrl.pathname) && !(await getToken({ req: request, secret: authSecret() }))) {
    const url = request.nextUrl.clone();
    url.pathname = '/sign-in';
    url.search = '';
    return withPolicy(NextResponse.redirect(url), policy);
  }
  const headers = new Headers(request.headers);
  headers.set('x-nonce', nonce);
  headers.set('Content-Security-Policy', policy);
  return withPolicy(NextResponse.next({ request: { headers } }), policy);
}

function withPolicy(response: NextResponse, policy: string): NextResponse {
  response.headers.set('Content-Security-Policy', policy);
  return response;
}

/**
 * By Content-Length when sent; a chunked body is counted as it is read, and reading stops past the
 * limit. (Next hands the proxy its own copy of the body and replays the original to the page.)
 */
async function actionBodyTooLarge(request: NextRequest): Promise<boolean> {
  const declared = request.headers.get('content-length');
  if (declared !== null) return Number(declared) > SERVER_ACTION_BODY_LIMIT_BYTES;
  const reader = request.body?.getReader();
  if (!reader) return false;
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) return false;
    total += value.byteLength;
    if (total > SERVER_ACTION_BODY_LIMIT_BYTES) {
      await reader.cancel();
      return true;
    }
  }
}

export const config = {
  // Every page, but not route handlers (they check sessions and origins themselves, and their
  // bodies may be large) nor static files.
  matcher: ['/((?!api|_next/static|_next/image|fonts|favicon.ico|icon.svg|robots.txt).*)'],
};
