import { request as httpRequest } from 'node:http';

/** A signed-in HTTP client for API tests: signs in through next-auth's credentials endpoint. */
export const DEMO_PASSWORD = 'even-load-demo';

export const DEMO_ACCOUNTS = {
  admin: 'sam.pellowe@demo.evenload.test',
  instructor: 'marta.ilvesaar@demo.evenload.test',
  researcher: 'lena.okoro-strand@demo.evenload.test',
  trainee: 'aino.varga@demo.evenload.test',
} as const;

function cookiesFrom(response: Response, jar: Map<string, string>) {
  for (const line of response.headers.getSetCookie()) {
    const [pair] = line.split(';');
    const index = pair!.indexOf('=');
    jar.set(pair!.slice(0, index), pair!.slice(index + 1));
  }
}

export interface HttpSession {
  cookie: string;
  get: (path: string) => Promise<Response>;
  send: (method: string, path: string, body?: unknown, headers?: Record<string, string>) => Promise<Response>;
}

export function anonymous(baseUrl: string): HttpSession {
  return sessionWithCookie(baseUrl, '');
}

/** A session that sends the given Cookie header (e.g. a renewed or copied session cookie). */
export function sessionWithCookie(baseUrl: string, cookie: string): HttpSession {
  return {
    cookie,
    get: (path) => fetch(`${baseUrl}${path}`, { headers: { cookie }, redirect: 'manual' }),
    send: (method, path, body, headers = {}) => {
      const raw = body === undefined || typeof body === 'string' || body instanceof FormData;
      return fetch(`${baseUrl}${path}`, {
        method,
        redirect: 'manual',
        headers: { cookie, ...(raw ? {} : { 'content-type': 'application/json' }), ...headers },
        body: body === undefined ? undefined : raw ? (body as string | FormData) : JSON.stringify(body),
      });
    },
  };
}

/** Where a sign-in comes from: extra headers (e.g. a forged X-Forwarded-For) and the local socket address (any 127.x on Linux). */
export interface RequestOrigin {
  headers?: Record<string, string>;
  localAddress?: string;
}

/** fetch, or node:http bound to a chosen local address (fetch cannot choose it). */
async function fetchFrom(from: RequestOrigin, url: string, init: { method?: string; headers?: Record<string, string>; body?: string } = {}): Promise<Response> {
  const headers = { ...init.headers, ...from.headers };
  if (!from.localAddress) return fetch(url, { ...init, headers, redirect: 'manual' });
  return new Promise((resolve, reject) => {
    const request = httpRequest(url, { method: init.method ?? 'GET', headers, localAddress: from.localAddress }, (response) => {
      const chunks: Buffer[] = [];
      response.on('data', (chunk: Buffer) => chunks.push(chunk));
      response.on('end', () => {
        const out = new Headers();
        for (const [name, value] of Object.entries(response.headers)) for (const one of [value ?? []].flat()) out.append(name, one);
        resolve(new Response(Buffer.concat(chunks), { status: response.statusCode, headers: out }));
      });
    });
    request.on('error', reject);
    request.end(init.body);
  });
}

/** Returns the response of the credentials callback and, when it worked, a session. */
export async function signIn(baseUrl: string, email: string, password = DEMO_PASSWORD, from: RequestOrigin = {}): Promise<{ ok: boolean; session: HttpSession; error: string | null }> {
  const jar = new Map<string, string>();
  const csrfResponse = await fetchFrom(from, `${baseUrl}/api/auth/csrf`);
  cookiesFrom(csrfResponse, jar);
  const { csrfToken } = (await csrfResponse.json()) as { csrfToken: string };
  const response = await fetchFrom(from, `${baseUrl}/api/auth/callback/credentials`, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: [...jar].map(([k, v]) => `${k}=${v}`).join('; ') },
    body: new URLSearchParams({ email, password, csrfToken, json: 'true' }).toString(),
  });
  cookiesFrom(response, jar);
  const cookie = [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  // With json=true next-auth answers { url } instead of redirecting; the error rides in that URL.
  const body = (await response.json().catch(() => ({}))) as { url?: string };
  const location = body.url ?? response.headers.get('location') ?? '';
  const error = new URL(location, baseUrl).searchParams.get('error');
  const ok = [...jar.keys()].some((key) => key.endsWith('next-auth.session-token'));
  return { ok, session: sessionWithCookie(baseUrl, cookie), error };
}

export async function signInAs(baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<HttpSession> {
  const result = await signIn(baseUrl, email, password);
  if (!result.ok) throw new Error(`sign-in as ${email} failed: ${result.error}`);
  return result.session;
}

/** Signs out through next-auth's endpoint as the browser does (with the CSRF token); returns the status. */
export async function signOut(baseUrl: string, session: HttpSession): Promise<number> {
  const { csrfToken } = (await (await session.get('/api/auth/csrf')).json()) as { csrfToken: string };
  const response = await session.send('POST', '/api/auth/signout', new URLSearchParams({ csrfToken, json: 'true' }).toString(), {
    'content-type': 'application/x-www-form-urlencoded',
    origin: baseUrl,
  });
  return response.status;
}
