import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SIGN_IN_LIMIT } from '@/lib/rate-limit';
import { sequelize } from '@/lib/db';
import { startAppServer, type AppServer } from '../support/app-server';
import { DEMO_PASSWORD, signIn } from '../support/http-session';

let server: AppServer;
let victim: string;

beforeAll(async () => {
  server = await startAppServer();
  const [row] = await sequelize.query<{ email: string }>(
    "SELECT email FROM users WHERE role = 'trainee' ORDER BY id DESC LIMIT 1",
    { type: QueryTypes.SELECT },
  );
  victim = row!.email;
  await sequelize.query('DELETE FROM sign_in_attempts');
});

afterAll(async () => {
  await sequelize.query('DELETE FROM sign_in_attempts');
  await server?.stop();
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

  it(`refuses an account for a while after ${SIGN_IN_LIMIT.maxFailures} failures, even with the right password`, async () => {
    await sequelize.query('DELETE FROM sign_in_attempts');
    for (let i = 0; i < SIGN_IN_LIMIT.maxFailures; i += 1) await signIn(server.baseUrl, victim, `wrong-${i}`);
    const right = await signIn(server.baseUrl, victim, DEMO_PASSWORD);
    expect(right.ok).toBe(false);
    expect(right.error).toMatch(/Too many failed attempts/);
    const [row] = await sequelize.query<{ locked_until: Date }>('SELECT locked_until FROM sign_in_attempts WHERE attempt_key = ?', {
      type: QueryTypes.SELECT,
      replacements: [`email:${victim}`],
    });
    expect(new Date(row!.locked_until).getTime()).toBeGreaterThan(Date.now());
  });
});
