/**
 * A browser-like HTTP client for scale-check: keeps every cookie the app sets (the session and the
 * read-from-primary window), sends same-origin writes, and notes which instance answered (HAProxy's
 * X-Evenload-Instance header).
 */
import type { HttpSession } from '../../tests/support/http-session';

export const INSTANCE_HEADER = 'x-evenload-instance';

export class Browser implements HttpSession {
  private readonly jar = new Map<string, string>();
  /** The instance of each answer, in order. */
  readonly instances: string[] = [];

  constructor(readonly baseUrl: string) {}

  get cookie(): string {
    return [...this.jar].map(([name, value]) => `${name}=${value}`).join('; ');
  }

  /** Forgets every cookie (a client that drops them, e.g. a script guessing passwords). */
  clearCookies(): void {
    this.jar.clear();
  }

  private remember(response: Response): Response {
    for (const line of response.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const index = pair!.indexOf('=');
      const name = pair!.slice(0, index).trim();
      const value = pair!.slice(index + 1);
      if (/max-age=0|expires=thu, 01 jan 1970/i.test(line) || value === '') this.jar.delete(name);
      else this.jar.set(name, value);
    }
    this.instances.push(response.headers.get(INSTANCE_HEADER) ?? '?');
    return response;
  }

  /** The instance that answered the last request. */
  get lastInstance(): string {
    return this.instances[this.instances.length - 1] ?? '?';
  }

  async get(path: string): Promise<Response> {
    return this.remember(await fetch(`${this.baseUrl}${path}`, { headers: { cookie: this.cookie }, redirect: 'manual' }));
  }

  async send(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<Response> {
    const raw = body === undefined || typeof body === 'string' || body instanceof FormData;
    const response = await fetch(`${this.baseUrl}${path}`, {
      method,
      redirect: 'manual',
      headers: { cookie: this.cookie, origin: this.baseUrl, ...(raw ? {} : { 'content-type': 'application/json' }), ...headers },
      body: body === undefined ? undefined : raw ? (body as string | FormData) : JSON.stringify(body),
    });
    return this.remember(response);
  }

  /** Signs in through next-auth's credentials endpoint; returns whether a session cookie came back. */
  async signIn(email: string, password: string): Promise<boolean> {
    const csrf = (await (await this.get('/api/auth/csrf')).json()) as { csrfToken: string };
    const response = await this.send('POST', '/api/auth/callback/credentials', new URLSearchParams({ email, password, csrfToken: csrf.csrfToken, json: 'true' }).toString(), {
      'content-type': 'application/x-www-form-urlencoded',
    });
    await response.body?.cancel();
    return [...this.jar.keys()].some((key) => key.endsWith('next-auth.session-token'));
  }
}
