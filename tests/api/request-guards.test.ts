/**
 * Guards every request passes before it reaches the app's code, against the built app: route
 * handlers refuse cross-origin writes (the rule Next applies to server actions; Fetch standard's
 * Origin and Sec-Fetch-Site headers), signed-in answers are `private, no-store` (RFC 9111 §5.2.2),
 * pages carry a nonce-based CSP without 'unsafe-inline' scripts (CSP Level 3), and an oversize
 * server-action body is refused with 413 (RFC 9110 §15.5.14) whether or not it declares its length.
 */
import { request as httpRequest } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { SERVER_ACTION_BODY_LIMIT_BYTES } from '@/proxy';
import { FOUR_STUD_JOINT } from '../ingest/joints';
import type { AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { anonymous, DEMO_ACCOUNTS, signInAs, type HttpSession } from '../support/http-session';
import { createTestJoint, dropTestJoints, firstIds, goodFile, header, mappingFor, tableCounts, userId } from '../support/record-fixtures';

let server: AppServer;
let instructor: HttpSession;
let jointId: number;

beforeAll(async () => {
  server = sharedAppServer();
  instructor = await signInAs(server.baseUrl, DEMO_ACCOUNTS.instructor);
  jointId = await createTestJoint(4, 'origin');
});

afterAll(async () => {
  await dropTestJoints([jointId]);
  await sequelize.close();
});

async function upload(headers: Record<string, string>) {
  const bytes = goodFile('wide-step-column.csv');
  const form = new FormData();
  form.append('file', new Blob([new Uint8Array(bytes)], { type: 'text/csv' }), 'wide-step-column.csv');
  form.append('mapping', JSON.stringify(mappingFor(bytes, FOUR_STUD_JOINT)));
  form.append('header', JSON.stringify(header(jointId, await userId(DEMO_ACCOUNTS.instructor), await firstIds())));
  return fetch(`${server.baseUrl}/api/uploads`, { method: 'POST', headers: { cookie: instructor.cookie, ...headers }, body: form });
}

describe('route handlers accept writes from their own origin only', () => {
  const otherOrigin = () => `http://127.0.0.1:${Number(new URL(server.baseUrl).port) + 1}`;

  it('refuses a POST to /api/uploads from another origin (another port) with 403 and writes no row', async () => {
    const before = await tableCounts();
    const response = await upload({ origin: otherOrigin(), 'sec-fetch-site': 'same-site' });
    expect(response.status).toBe(403);
    expect(await tableCounts()).toEqual(before);
  });

  it('refuses one without Origin whose Sec-Fetch-Site says cross-site, and an opaque "null" origin', async () => {
    const before = await tableCounts();
    expect((await upload({ 'sec-fetch-site': 'cross-site' })).status).toBe(403);
    expect((await upload({ origin: 'null' })).status).toBe(403);
    expect(await tableCounts()).toEqual(before);
  });

  it('stores the same upload from the same origin', async () => {
    const before = await tableCounts();
    const response = await upload({ origin: server.baseUrl, 'sec-fetch-site': 'same-origin' });
    expect(response.status).toBe(201);
    expect((await tableCounts()).runs).toBe(before.runs + 1);
  });
});

describe('signed-in answers are never cached by others', () => {
  it.each(['/api/runs', '/api/runs/options'])('%s carries Cache-Control: private, no-store', async (route) => {
    const response = await instructor.get(route);
    expect(response.status).toBe(200);
    expect(response.headers.get('cache-control')).toBe('private, no-store');
  });

  it('so does the 401 a visitor gets', async () => {
    const response = await anonymous(server.baseUrl).get('/api/runs');
    expect(response.status).toBe(401);
    expect(response.headers.get('cache-control')).toBe('private, no-store');
  });
});

describe('Content-Security-Policy with a nonce', () => {
  async function policyOf(route: string, session = anonymous(server.baseUrl)) {
    const response = await session.get(route);
    const csp = response.headers.get('content-security-policy') ?? '';
    const scriptSrc = csp.split(';').map((part) => part.trim()).find((part) => part.startsWith('script-src')) ?? '';
    return { csp, scriptSrc, html: await response.text(), nonce: /'nonce-([^']+)'/.exec(scriptSrc)?.[1] };
  }

  it.each(['/sign-in', '/forgot-password'])("%s: script-src has a fresh nonce and no 'unsafe-inline', and every script tag carries it", async (route) => {
    const first = await policyOf(route);
    const second = await policyOf(route);
    expect(first.nonce).toMatch(/^[A-Za-z0-9+/=]{16,}$/);
    expect(second.nonce).not.toBe(first.nonce);
    expect(first.scriptSrc).not.toContain("'unsafe-inline'");
    expect(first.scriptSrc).not.toContain("'unsafe-eval'");
    const scripts = [...first.html.matchAll(/<script\b[^>]*>/g)].map((match) => match[0]);
    expect(scripts.length).toBeGreaterThan(0);
    for (const tag of scripts) expect(tag).toContain(`nonce="${first.nonce}"`);
  });

  it('a signed-in page too', async () => {
    const { nonce, scriptSrc, html } = await policyOf('/runs', instructor);
    expect(nonce).toBeDefined();
    expect(scriptSrc).not.toContain("'unsafe-inline'");
    expect(html).toContain(`nonce="${nonce}"`);
  });

  it("route handlers answer with a policy that lets nothing load: default-src 'none'", async () => {
    const response = await fetch(`${server.baseUrl}/api/ping`);
    expect(response.headers.get('content-security-policy')).toContain("default-src 'none'");
  });
});

describe('an oversize server-action body', () => {
  const twoMegabytes = 'a'.repeat(2 * 1024 * 1024);

  function postAction(body: string, chunked: boolean): Promise<number> {
    return new Promise((resolve, reject) => {
      const headers: Record<string, string> = { 'next-action': '0'.repeat(42), 'content-type': 'text/plain;charset=UTF-8', origin: server.baseUrl };
      if (!chunked) headers['content-length'] = String(Buffer.byteLength(body));
      const request = httpRequest(`${server.baseUrl}/sign-in`, { method: 'POST', headers }, (response) => {
        response.resume();
        resolve(response.statusCode ?? 0);
      });
      // The server may answer and close before the whole body is sent.
      request.on('error', (error: NodeJS.ErrnoException) => (error.code === 'EPIPE' || error.code === 'ECONNRESET' ? undefined : reject(error)));
      if (!chunked) return request.end(body);
      for (let offset = 0; offset < body.length; offset += 64 * 1024) request.write(body.slice(offset, offset + 64 * 1024));
      request.end();
    });
  }

  it(`answers 413 for 2 MB with Content-Length (the limit is ${SERVER_ACTION_BODY_LIMIT_BYTES} bytes)`, async () => {
    expect(await postAction(twoMegabytes, false)).toBe(413);
  });

  it('answers 413 for 2 MB sent chunked, without Content-Length', async () => {
    expect(await postAction(twoMegabytes, true)).toBe(413);
  });

  it('lets a small body through to Next (an unknown action is not a 413)', async () => {
    expect(await postAction('[]', false)).not.toBe(413);
    expect(await postAction('[]', true)).not.toBe(413);
  });
});
