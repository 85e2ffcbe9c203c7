import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SIGN_IN_LIMIT, signInKeys } from '@/lib/data/sign-in-throttle';
import { sequelize } from '@/lib/platform/db';
import { startAppServer, type AppServer } from '../support/app-server';
import { sharedAppServer } from '../support/shared-app-server';
import { DEMO_PASSWORD, signIn } from '../support/http-session';

let server: AppServer;
let behindProxy: AppServer;
let victim: string;

beforeAll(async () => {
  server = sharedAppServer();
  // The same build as it runs behind a load balancer on loopback: X-Forwarded-For from 127.x is believed.
  behindProxy = await startAppServer(Number(process.env.EVENLOAD_TEST_PORT ?? 3100) + 9, { EVENLOAD_TRUSTED_PROXIES: '127.0.0.0/8' });
  const [row] = await sequelize.query<{ email: string }>(
    "SELECT email FROM users WHERE role = 'trainee' ORDER BY id DESC LIMIT 1",
    { type: QueryTypes.SELECT },
  );
  victim = row!.email;
  await sequelize.query('DELETE FROM sign_in_attempts');
});

afterAll(async () => {
  await sequelize.query('DELETE FROM sign_in_attempts');
  await behindProxy?.stop();
  await sequelize.close();
});

describe('sign-in', () => {
  it('accepts the right password and puts id and role into the session', async () => {
    const result = await signIn(server.baseUrl, victim);
    expect(result.ok).toBe(true);
    const session = (await (await result.session.get('/api/auth/session')).json()) as { user: { id: number; role: string } };
    expect(session.user.role).toBe('trainee');
    expect(session.user.id).toBeGreaterThan(0);
  });

  it('gives one generic message for a wrong password and for an unknown account', async () => {
    const wrong = await signIn(server.baseUrl, victim, 'not-the-password');
    const unknown = await signIn(server.baseUrl, 'nobody@demo.evenload.test', 'whatever');
    expect(wrong.ok).toBe(false);
    expect(unknown.ok).toBe(false);
    expect(wrong.error).toBe('That e-mail and password do not match an account.');
    expect(unknown.error).toBe(wrong.error);
  });

  it(`refuses the account from one address after ${SIGN_IN_LIMIT.maxFailuresPerPair} failures from it, even with the right password`, async () => {
    await sequelize.query('DELETE FROM sign_in_attempts');
    for (let i = 0; i < SIGN_IN_LIMIT.maxFailuresPerPair; i += 1) await signIn(server.baseUrl, victim, `wrong-${i}`);
    const right = await signIn(server.baseUrl, victim, DEMO_PASSWORD);
    expect(right.ok).toBe(false);
    expect(right.error).toMatch(/Too many failed attempts/);
    const [row] = await sequelize.query<{ locked_until: Date }>('SELECT locked_until FROM sign_in_attempts WHERE attempt_key = ?', {
      type: QueryTypes.SELECT,
      replacements: [signInKeys(victim, '127.0.0.1').pair],
    });
    expect(new Date(row!.locked_until).getTime()).toBeGreaterThan(Date.now());
  });
});

describe('sign-in throttling keyed on the address the server sees', () => {
  const stranger = { localAddress: '127.0.0.2' };

  it('a forged X-Forwarded-For changes nothing: the pair is locked, and the count sits on the socket address', async () => {
    await sequelize.query('DELETE FROM sign_in_attempts');
    for (let i = 0; i < SIGN_IN_LIMIT.maxFailuresPerPair; i += 1) {
      await signIn(server.baseUrl, victim, `wrong-${i}`, { ...stranger, headers: { 'x-forwarded-for': `198.51.100.${i + 1}` } });
    }
    const right = await signIn(server.baseUrl, victim, DEMO_PASSWORD, { ...stranger, headers: { 'x-forwarded-for': '198.51.100.99' } });
    expect(right.ok).toBe(false);
    const keys = await sequelize.query<{ attempt_key: string; failures: number }>('SELECT attempt_key, failures FROM sign_in_attempts', { type: QueryTypes.SELECT });
    expect(keys).toContainEqual({ attempt_key: 'addr:127.0.0.2', failures: SIGN_IN_LIMIT.maxFailuresPerPair });
    expect(keys.some((row) => row.attempt_key.includes('198.51.100'))).toBe(false);
  });

  it(`a forged X-Forwarded-For cannot get past the per-address limit (${SIGN_IN_LIMIT.maxFailuresPerAddress} failures over many accounts)`, async () => {
    await sequelize.query('DELETE FROM sign_in_attempts');
    const from = (i: number) => ({ localAddress: '127.0.0.3', headers: { 'x-forwarded-for': `203.0.113.${i % 250}` } });
    for (let i = 0; i < SIGN_IN_LIMIT.maxFailuresPerAddress; i += 1) await signIn(server.baseUrl, `nobody-${i}@demo.evenload.test`, 'guess', from(i));
    const right = await signIn(server.baseUrl, victim, DEMO_PASSWORD, from(251));
    expect(right.ok).toBe(false);
    expect(right.error).toMatch(/Too many failed attempts/);
    // The owner's own address is not that one.
    expect((await signIn(server.baseUrl, victim)).ok).toBe(true);
  });

  it('a stranger cannot lock the owner out: the owner gets in from an address that has not failed', async () => {
    await sequelize.query('DELETE FROM sign_in_attempts');
    // A stranger with three addresses: five guesses from each until that pair locks, 12 tried. The
    // 11th (the first from the third address) is counted; the 12th, from an address that has now
    // failed, meets the account's back-off and is refused uncounted.
    const guesses = SIGN_IN_LIMIT.accountBackoffAfter + 2;
    const strangerAt = (i: number) => ({ localAddress: `127.0.0.${10 + Math.floor(i / SIGN_IN_LIMIT.maxFailuresPerPair)}` });
    for (let i = 0; i < guesses; i += 1) await signIn(server.baseUrl, victim, `wrong-${i}`, strangerAt(i));
    // The account is backing off ...
    const [account] = await sequelize.query<{ failures: number; locked_until: Date }>('SELECT failures, locked_until FROM sign_in_attempts WHERE attempt_key = ?', {
      type: QueryTypes.SELECT,
      replacements: [`email:${victim}`],
    });
    expect(Number(account!.failures)).toBe(SIGN_IN_LIMIT.accountBackoffAfter + 1);
    expect(new Date(account!.locked_until).getTime()).toBeGreaterThan(Date.now());
    // ... for the stranger's last address (one failure, its pair not locked), even with the right password ...
    expect((await signIn(server.baseUrl, victim, DEMO_PASSWORD, strangerAt(guesses - 1))).error).toMatch(/Too many failed attempts/);
    // ... and for another address that has failed for this account ...
    await signIn(server.baseUrl, victim, 'one-typo', { localAddress: '127.0.0.4' });
    expect((await signIn(server.baseUrl, victim, DEMO_PASSWORD, { localAddress: '127.0.0.4' })).ok).toBe(false);
    // ... but not for the owner at an address with no failure.
    const owner = await signIn(server.baseUrl, victim, DEMO_PASSWORD);
    expect(owner.error).toBeNull();
    expect(owner.ok).toBe(true);
  });

  it('behind a trusted proxy, each client is its own X-Forwarded-For address, and prepending to the header changes nothing', async () => {
    await sequelize.query('DELETE FROM sign_in_attempts');
    for (let i = 0; i < SIGN_IN_LIMIT.maxFailuresPerPair; i += 1) {
      await signIn(behindProxy.baseUrl, victim, `wrong-${i}`, { headers: { 'x-forwarded-for': '198.51.100.7' } });
    }
    const forged = await signIn(behindProxy.baseUrl, victim, DEMO_PASSWORD, { headers: { 'x-forwarded-for': '192.0.2.1, 198.51.100.7' } });
    expect(forged.ok).toBe(false);
    const owner = await signIn(behindProxy.baseUrl, victim, DEMO_PASSWORD, { headers: { 'x-forwarded-for': '203.0.113.9' } });
    expect(owner.ok).toBe(true);
    const keys = await sequelize.query<{ attempt_key: string }>('SELECT attempt_key FROM sign_in_attempts', { type: QueryTypes.SELECT });
    expect(keys.map((row) => row.attempt_key)).toContain('addr:198.51.100.7');
  });
});
