import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startAppServer, type AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';

const root = path.resolve(__dirname, '../..');
let server: AppServer;
let httpsServer: AppServer;

beforeAll(async () => {
  server = sharedAppServer();
  // The same build started as it would be behind TLS: cookies must then be Secure.
  httpsServer = await startAppServer(Number(process.env.EVENLOAD_TEST_PORT ?? 3100) + 7, { NEXTAUTH_URL: 'https://evenload.example.test' });
});

afterAll(async () => {
  await httpsServer?.stop();
});

describe('security headers', () => {
  it.each(['/sign-in', '/api/ping', '/api/runs'])('%s carries CSP with frame-ancestors, nosniff and a referrer policy', async (route) => {
    const response = await fetch(`${server.baseUrl}${route}`, { redirect: 'manual' });
    const csp = response.headers.get('content-security-policy') ?? '';
    // Pages: 'self' with a nonce (proxy.ts); route handlers: nothing may load at all (next.config.mjs).
    expect(csp).toContain(route.startsWith('/api') ? "default-src 'none'" : "default-src 'self'");
    expect(csp).toContain("frame-ancestors 'none'");
    if (!route.startsWith('/api')) expect(csp).toContain("object-src 'none'");
    expect(response.headers.get('x-content-type-options')).toBe('nosniff');
    expect(response.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
    expect(response.headers.get('x-powered-by')).toBeNull();
  });
});

describe('cookies in production behind https', () => {
  it('marks the sign-in cookies Secure and HttpOnly with the __Secure- / __Host- prefixes', async () => {
    const response = await fetch(`${httpsServer.baseUrl}/api/auth/csrf`);
    const cookies = response.headers.getSetCookie();
    expect(cookies.length).toBeGreaterThan(0);
    for (const cookie of cookies) {
      expect(cookie).toMatch(/^__(Secure|Host)-/);
      expect(cookie).toMatch(/;\s*Secure/i);
      expect(cookie).toMatch(/;\s*HttpOnly/i);
      expect(cookie).toMatch(/SameSite=Lax/i);
    }
  });
});

describe('the client bundle', () => {
  function files(dir: string): string[] {
    return readdirSync(dir).flatMap((name) => {
      const full = path.join(dir, name);
      return statSync(full).isDirectory() ? files(full) : [full];
    });
  }

  it('holds no secrets: not the signing secret, the database password, nor server-only names', () => {
    const staticDir = path.join(root, '.next/static');
    const texts = files(staticDir).filter((f) => /\.(js|css|json|txt)$/.test(f));
    expect(texts.length).toBeGreaterThan(5);
    const secret = process.env.NEXTAUTH_SECRET ?? readFileSync(path.join(root, '.data/nextauth-secret'), 'utf8');
    const forbidden = [secret, 'evenload-local-development-secret', process.env.DB_PASSWORD ?? 'evenload-local', 'password_hash', 'DB_PASSWORD', 'NEXTAUTH_SECRET', 'sequelize'];
    for (const file of texts) {
      const text = readFileSync(file, 'utf8');
      for (const needle of forbidden) expect(text.includes(needle), `${needle} found in ${path.relative(root, file)}`).toBe(false);
    }
  });
});
