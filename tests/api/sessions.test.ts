import { randomBytes } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { hashPassword } from '@/lib/auth/passwords';
import type { Role } from '@/models/user';
import { startAppServer, type AppServer } from '../support/app-server';
import { anonymous, sessionWithCookie, signInAs, signOut, type HttpSession } from '../support/http-session';
import { callServerAction } from '../support/server-action';

// Sessions that end (issue 13, "A session cannot be ended"; "/dev/outbox is readable without signing
// in"). Every account here is made for the test, so the demo accounts other tests sign in with are
// never deactivated or signed out. The server re-checks a session on every request
// (EVENLOAD_SESSION_CHECK_TTL_MS=0), so nothing here waits for a cache to expire.
const PASSWORD = 'session-test-password';
const tag = randomBytes(4).toString('hex');
const emailOf = (name: string) => `session-${name}-${tag}@test.evenload.test`;
let server: AppServer;
let shortServer: AppServer;
const ids: Record<string, number> = {};

async function makeAccount(name: string, role: Role): Promise<number> {
  const hash = await hashPassword(PASSWORD);
  const [id] = await sequelize.query('INSERT INTO users (name, email, password_hash, role, preferred_units, is_active, created_at, updated_at) VALUES (?,?,?,?,?,1,NOW(),NOW())', {
    type: QueryTypes.INSERT,
    replacements: [`Session ${name}`, emailOf(name), hash, role, 'si'],
  });
  ids[name] = Number(id);
  return Number(id);
}

const signInAsAccount = (name: string, baseUrl = server.baseUrl) => signInAs(baseUrl, emailOf(name), PASSWORD);
const roleOf = async (name: string) =>
  (await sequelize.query<{ role: Role }>('SELECT role FROM users WHERE id = ?', { type: QueryTypes.SELECT, replacements: [ids[name]] }))[0]!.role;

/** The state an admin's "Deactivate" (and "Change role") leaves: what lib/data/people.ts does, done here in SQL. */
async function deactivate(name: string, role?: Role) {
  await sequelize.query('UPDATE users SET is_active = 0, session_version = session_version + 1' + (role ? ', role = ?' : '') + ' WHERE id = ?', {
    replacements: role ? [role, ids[name]] : [ids[name]],
  });
}

beforeAll(async () => {
  const settings = { EVENLOAD_SESSION_CHECK_TTL_MS: '0', EVENLOAD_OUTBOX: '1' };
  server = await startAppServer(undefined, settings);
  // The same build with a 4 s absolute lifetime, for the renewal test.
  shortServer = await startAppServer(Number(process.env.EVENLOAD_TEST_PORT ?? 3100) + 8, { ...settings, EVENLOAD_SESSION_MAX_AGE_S: '4' });
  for (const [name, role] of [['admin', 'admin'], ['rogue', 'admin'], ['target', 'trainee'], ['trainee', 'trainee'], ['reader', 'trainee'], ['leaver', 'trainee'], ['copier', 'researcher'], ['idler', 'researcher'], ['renewer', 'researcher'], ['self', 'instructor']] as const) {
    await makeAccount(name, role);
  }
});

afterAll(async () => {
  await server?.stop();
  await shortServer?.stop();
  const all = Object.values(ids);
  if (all.length) {
    await sequelize.query('DELETE FROM runs WHERE operator_id IN (?)', { replacements: [all] });
    await sequelize.query('DELETE FROM users WHERE id IN (?)', { replacements: [all] });
  }
  await sequelize.query('DELETE FROM captured_mail WHERE subject LIKE ?', { replacements: [`%${tag}%`] });
  await sequelize.close();
});

describe('the development outbox', () => {
  const secret = `https://evenload.test/reset/${tag}-secret-link`;

  beforeAll(async () => {
    const insert = 'INSERT INTO captured_mail (envelope_to, subject, text_body, raw, received_at) VALUES (?,?,?,?,NOW())';
    await sequelize.query(insert, { replacements: [emailOf('reader'), `For the reader ${tag}`, 'Your results are ready.', 'raw'] });
    await sequelize.query(insert, { replacements: [emailOf('target'), `Reset for the target ${tag}`, `Choose a new password: ${secret}`, 'raw'] });
  });

  it('shows a visitor no mail and no addresses: a sign-in redirect', async () => {
    const response = await anonymous(server.baseUrl).get('/dev/outbox');
    const body = await response.text();
    expect([307, 404]).toContain(response.status);
    if (response.status === 307) expect(new URL(response.headers.get('location')!, server.baseUrl).pathname).toBe('/sign-in');
    expect(body).not.toContain(secret);
    expect(body).not.toContain(emailOf('target'));
    expect(body).not.toContain(emailOf('reader'));
  });

  it('shows a signed-in non-admin only the mail sent to their own address', async () => {
    const reader = await signInAsAccount('reader');
    const response = await reader.get('/dev/outbox');
    const body = await response.text();
    expect(response.status).toBe(200);
    expect(body).toContain(`For the reader ${tag}`);
    expect(body).not.toContain(`Reset for the target ${tag}`);
    expect(body).not.toContain(secret);
    expect(body).not.toContain(emailOf('target'));
  });

  it('shows an admin every captured message', async () => {
    const admin = await signInAsAccount('admin');
    const body = await (await admin.get('/dev/outbox')).text();
    expect(body).toContain(`For the reader ${tag}`);
    expect(body).toContain(`Reset for the target ${tag}`);
  });
});

describe('a deactivated account', () => {
  let before: HttpSession;

  beforeAll(async () => {
    before = await signInAsAccount('trainee');
    // The cookie works while the account is active (so the refusals below are the deactivation's doing).
    expect((await before.get('/api/runs')).status).toBe(200);
    expect((await before.get('/runs')).status).toBe(200);
    await deactivate('trainee');
  });

  it('is refused on an API route with its old cookie', async () => {
    expect((await before.get('/api/runs')).status).toBe(401);
  });

  it('is sent to sign-in from a page with its old cookie', async () => {
    const response = await before.get('/runs');
    expect(response.status).toBe(307);
    expect(new URL(response.headers.get('location')!, server.baseUrl).pathname).toBe('/sign-in');
  });

  it('cannot save a run through a server action with its old cookie', async () => {
    const [row] = await sequelize.query<{ joint: number; method: number; lubricant: number }>(
      'SELECT (SELECT id FROM joints ORDER BY id LIMIT 1) AS joint, (SELECT id FROM methods ORDER BY id LIMIT 1) AS method, (SELECT id FROM lubricants ORDER BY id LIMIT 1) AS lubricant',
      { type: QueryTypes.SELECT },
    );
    const form = new FormData();
    form.set('payload', JSON.stringify({
      header: { jointId: row!.joint, methodId: row!.method, lubricantId: row!.lubricant, operatorId: ids.trainee, cohortId: null, recordedAt: '2026-12-01T10:00', notes: null },
      gasket: 'medium',
      seed: 7,
    }));
    const response = await callServerAction(before, server.baseUrl, '/record', 'app/(lab)/record/actions.ts', 'saveSimulatedRunAction', [{ status: 'idle', message: null }, form]);
    const text = await response.text();
    expect(text).toContain('Sign in to continue.');
    const runs = await sequelize.query('SELECT id FROM runs WHERE operator_id = ?', { type: QueryTypes.SELECT, replacements: [ids.trainee] });
    expect(runs).toEqual([]);
  });
});

describe('an admin demoted to trainee and deactivated', () => {
  it('cannot change anyone’s role with the cookie from before', async () => {
    const rogue = await signInAsAccount('rogue');
    await deactivate('rogue', 'trainee');
    const form = new FormData();
    form.set('role', 'admin');
    const response = await callServerAction(rogue, server.baseUrl, '/people', 'app/(lab)/people/actions.ts', 'changeRoleAction', [ids.target, { status: 'idle', message: null }, form]);
    expect(await response.text()).toContain('Sign in to continue.');
    expect(await roleOf('target')).toBe('trainee');
  });
});

describe('sign-out', () => {
  it('revokes the session on the server: a copy of the cookie taken before is refused after', async () => {
    const copier = await signInAsAccount('copier');
    const copy: HttpSession = { ...copier };
    expect((await copy.get('/api/runs')).status).toBe(200);
    expect(await signOut(server.baseUrl, copier)).toBe(200);
    expect((await copy.get('/api/runs')).status).toBe(401);
    expect(await (await copy.get('/api/auth/session')).json()).toEqual({});
  });

  it('"sign out everywhere" ends every session of the person', async () => {
    const first = await signInAsAccount('self');
    const second = await signInAsAccount('self');
    const response = await callServerAction(first, server.baseUrl, '/', 'app/(lab)/actions.ts', 'signOutEverywhereAction', [{ status: 'idle', message: null }, new FormData()]);
    expect(await response.text()).toContain('Signed out everywhere');
    expect((await first.get('/api/runs')).status).toBe(401);
    expect((await second.get('/api/runs')).status).toBe(401);
  });

  it('an admin’s "sign out everywhere" on an account ends its sessions', async () => {
    const admin = await signInAsAccount('admin');
    const reader = await signInAsAccount('reader');
    const response = await callServerAction(admin, server.baseUrl, '/people', 'app/(lab)/people/actions.ts', 'endSessionsAction', [ids.reader, { status: 'idle', message: null }, new FormData()]);
    expect(await response.text()).toContain('Signed out everywhere');
    expect((await reader.get('/api/runs')).status).toBe(401);
    expect((await admin.get('/api/runs')).status).toBe(200);
  });
});

describe('session lifetime', () => {
  it('ends after the idle timeout (2 h without a request)', async () => {
    const idler = await signInAsAccount('idler');
    expect((await idler.get('/api/runs')).status).toBe(200);
    await sequelize.query('UPDATE user_sessions SET last_seen_at = NOW() - INTERVAL 121 MINUTE WHERE user_id = ?', { replacements: [ids.idler] });
    expect((await idler.get('/api/runs')).status).toBe(401);
  });

  it('is not extended by renewing through GET /api/auth/session: the absolute lifetime counts from sign-in', async () => {
    let session = await signInAsAccount('renewer', shortServer.baseUrl);
    const startedAt = Date.now();
    // Renew every half second for 5 s (the lifetime is 4 s), always carrying the newest cookie.
    while (Date.now() - startedAt < 5000) {
      const response = await session.get('/api/auth/session');
      const renewed = response.headers.getSetCookie().find((line) => line.includes('next-auth.session-token=') && !/Max-Age=0|Expires=Thu, 01 Jan 1970/i.test(line));
      if (renewed) session = withSessionCookie(session, renewed.split(';')[0]!);
      await new Promise((resolve) => setTimeout(resolve, 500));
    }
    expect((await session.get('/api/runs')).status).toBe(401);
    expect(await (await session.get('/api/auth/session')).json()).toEqual({});
  });
});

/** The same session with its session-token cookie replaced by a renewed one. */
function withSessionCookie(session: HttpSession, pair: string): HttpSession {
  const name = pair.slice(0, pair.indexOf('='));
  return sessionWithCookie(shortServer.baseUrl, session.cookie.split('; ').map((part) => (part.startsWith(`${name}=`) ? pair : part)).join('; '));
}
