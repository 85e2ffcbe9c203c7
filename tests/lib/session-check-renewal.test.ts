/**
 * The session check's in-process verdict (lib/data/session-store.ts, `checkSession`) is renewed in
 * the background once half of EVENLOAD_SESSION_CHECK_TTL_MS has passed: the request that notices is
 * answered from the verdict it holds (never past the TTL), one check runs for every request, and a
 * sign-out during that check wins over the older verdict it read. The database is a stand-in here
 * (the row the check reads is set by each test); times are passed in, nothing is timed. Expected
 * values follow the rule stated in session-store.ts (computed by hand).
 */
import { beforeEach, describe, expect, it, vi } from 'vitest';

const TTL = 1000;
const db = vi.hoisted(() => ({ revoked: false, loads: 0, gate: null as Promise<void> | null }));

vi.mock('@/lib/platform/env', () => ({
  env: { EVENLOAD_SESSION_CHECK_TTL_MS: 1000, EVENLOAD_SESSION_MAX_AGE_S: 43_200, EVENLOAD_SESSION_IDLE_S: 7200 },
}));
vi.mock('@/models', () => ({
  User: {},
  UserSession: {
    findByPk: async () => {
      db.loads += 1;
      if (db.gate) await db.gate;
      return {
        lastSeenAt: new Date(NOW),
        revokedAt: db.revoked ? new Date(NOW) : null,
        user: { id: 7, name: 'Ada', email: 'ada@example.test', role: 'trainee', preferredUnits: 'metric', isActive: true, sessionVersion: 1 },
      };
    },
    update: async () => [1],
  },
}));

const NOW = 1_800_000_000_000;
const { checkSession, revokeSession } = await import('@/lib/data/session-store');

let sid = 0;
const claims = () => ({ uid: 7, sid: `s${++sid}`, sv: 1, sat: NOW / 1000 });

beforeEach(() => {
  db.revoked = false;
  db.loads = 0;
  db.gate = null;
});

describe('checkSession renewal', () => {
  it('checks once, then answers from the verdict until half the TTL has passed', async () => {
    const c = claims();
    expect((await checkSession(c, NOW))?.id).toBe(7);
    expect((await checkSession(c, NOW + TTL / 2 - 1))?.id).toBe(7);
    expect(db.loads).toBe(1);
  });

  it('after half the TTL it answers from the held verdict at once and renews it in the background, once for many requests', async () => {
    const c = claims();
    await checkSession(c, NOW);
    let open!: () => void;
    db.gate = new Promise<void>((resolve) => (open = resolve));
    db.revoked = true; // signed out meanwhile; the renewal will read it
    const answers = await Promise.all([checkSession(c, NOW + 600), checkSession(c, NOW + 601), checkSession(c, NOW + 602)]);
    expect(answers.map((a) => a?.id)).toEqual([7, 7, 7]); // answered while the renewal waits
    expect(db.loads).toBe(2); // one renewal for the three
    open();
    await vi.waitFor(() => expect(checkSession(c, NOW + 700)).resolves.toBeNull());
    expect(db.loads).toBe(2);
  });

  it('never answers from a verdict past the TTL: the request waits for the check', async () => {
    const c = claims();
    await checkSession(c, NOW);
    db.revoked = true;
    expect(await checkSession(c, NOW + TTL)).toBeNull();
    expect(db.loads).toBe(2);
  });

  it('a sign-out during a renewal wins: the older verdict that renewal read is not kept', async () => {
    const c = claims();
    await checkSession(c, NOW);
    let open!: () => void;
    db.gate = new Promise<void>((resolve) => (open = resolve));
    await checkSession(c, NOW + 600); // starts the renewal (the row still reads as signed in)
    await revokeSession(c.sid, new Date(NOW + 650));
    open(); // the renewal now reads the row as it was before the sign-out: still signed in
    await new Promise((resolve) => setTimeout(resolve, 0));
    db.gate = null;
    db.revoked = true;
    expect(await checkSession(c, NOW + 700)).toBeNull(); // checked afresh, not the renewal's stale answer
    expect(db.loads).toBe(3);
  });
});
