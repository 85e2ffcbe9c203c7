import 'server-only';
import { randomBytes } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { User, UserSession } from '@/models';
import type { Role, UnitSystem } from '@/models/user';
import { env } from '../platform/env';

/**
 * Server-side session state. The session token (next-auth's signed, encrypted JWT) carries only
 * who signed in and when: the user id, the session row id, the person's session version at sign-in
 * and the sign-in time. Whether the session still stands is decided here, from MariaDB:
 *
 * - the absolute lifetime counts from the sign-in time in the token (EVENLOAD_SESSION_MAX_AGE_S,
 *   12 h), so renewing the cookie never extends it;
 * - the `user_sessions` row must exist, not be revoked (sign-out), and have been seen within the
 *   idle timeout (EVENLOAD_SESSION_IDLE_S, 2 h);
 * - the account must be active and its `session_version` equal to the token's (a role change, a
 *   deactivation, a password reset or "sign out everywhere" raises it).
 *
 * Name, e-mail, role and units come from the users row, never from the token. Each instance keeps
 * its last answer per session for EVENLOAD_SESSION_CHECK_TTL_MS (at most 60 s), so a request costs
 * one map look-up and an ended session is refused on every instance within that time; the answer is
 * renewed in the background after half that time, so no request waits for the check under load.
 */

/** What the session token carries about the sign-in (set once at sign-in, copied on renewal). */
export interface SessionClaims {
  uid: number;
  /** The `user_sessions` row. */
  sid: string;
  /** The person's session version at sign-in. */
  sv: number;
  /** Sign-in time, seconds since the epoch. */
  sat: number;
}

/** The signed-in person as every data function receives it (read from the users row). */
export interface SessionAccount {
  id: number;
  name: string;
  email: string;
  role: Role;
  units: UnitSystem;
}

interface Verdict {
  checkedAt: number;
  account: SessionAccount | null;
  version: number;
}

const CACHE_LIMIT = 10_000;
const verdicts = new Map<string, Verdict>();
const inFlight = new Map<string, Promise<Verdict>>();
/** Sessions whose verdict was dropped (sign-out) while a check of them was running. */
const dropped = new Set<string>();

function forget(sid: string): void {
  verdicts.delete(sid);
  if (inFlight.has(sid)) dropped.add(sid);
}

/** The last-seen time is written at most this often per session (well inside the idle timeout). */
const touchEveryMs = () => Math.min(60_000, (env.EVENLOAD_SESSION_IDLE_S * 1000) / 10);

/** Opens the server-side record of a new sign-in; returns the claims for the token. */
export async function openSession(userId: number, sessionVersion: number, now = new Date()): Promise<SessionClaims> {
  const sid = randomBytes(16).toString('hex');
  await UserSession.create({ id: sid, userId, createdAt: now, lastSeenAt: now });
  // Housekeeping: this person's sessions past their absolute lifetime can go.
  const cutoff = new Date(now.getTime() - env.EVENLOAD_SESSION_MAX_AGE_S * 1000);
  await UserSession.destroy({ where: { userId, createdAt: { [Op.lt]: cutoff } } });
  return { uid: userId, sid, sv: sessionVersion, sat: Math.floor(now.getTime() / 1000) };
}

async function loadVerdict(sid: string, nowMs: number): Promise<Verdict> {
  // The primary, not a replica: a sign-out just written must be seen.
  const row = await UserSession.findByPk(sid, { include: [{ model: User, as: 'user' }], useMaster: true });
  const user = row?.user;
  const idle = row ? nowMs - row.lastSeenAt.getTime() : Infinity;
  if (!row || !user || row.revokedAt || !user.isActive || idle > env.EVENLOAD_SESSION_IDLE_S * 1000) {
    return { checkedAt: nowMs, account: null, version: user?.sessionVersion ?? -1 };
  }
  if (idle > touchEveryMs()) await UserSession.update({ lastSeenAt: new Date(nowMs) }, { where: { id: sid } });
  const account = { id: user.id, name: user.name, email: user.email, role: user.role, units: user.preferredUnits };
  return { checkedAt: nowMs, account, version: user.sessionVersion };
}

function remember(sid: string, verdict: Verdict) {
  verdicts.delete(sid);
  verdicts.set(sid, verdict);
  while (verdicts.size > CACHE_LIMIT) verdicts.delete(verdicts.keys().next().value as string);
}

/** Loads a session's verdict once however many requests ask at the same time. */
function refreshVerdict(sid: string, nowMs: number): Promise<Verdict> {
  let pending = inFlight.get(sid);
  if (!pending) {
    pending = loadVerdict(sid, nowMs)
      .then((verdict) => {
        // A sign-out while the check ran wins: its verdict was dropped, so this older one is not kept.
        if (!dropped.has(sid)) remember(sid, verdict);
        return verdict;
      })
      .finally(() => {
        inFlight.delete(sid);
        dropped.delete(sid);
      });
    inFlight.set(sid, pending);
  }
  return pending;
}

/**
 * The person behind a session token's claims, or null when the session has ended for any reason.
 * A verdict is used for at most EVENLOAD_SESSION_CHECK_TTL_MS; once half of that has passed, the
 * next request starts a fresh check in the background and is answered from the verdict it still
 * holds, so under load no request waits for the database check (the bound on how long an ended
 * session is still accepted stays the TTL).
 */
export async function checkSession(claims: SessionClaims, nowMs = Date.now()): Promise<SessionAccount | null> {
  if (nowMs >= (claims.sat + env.EVENLOAD_SESSION_MAX_AGE_S) * 1000) return null;
  const ttl = env.EVENLOAD_SESSION_CHECK_TTL_MS;
  let verdict = verdicts.get(claims.sid);
  if (!verdict || nowMs - verdict.checkedAt >= ttl) {
    verdict = await refreshVerdict(claims.sid, nowMs);
  } else if (nowMs - verdict.checkedAt >= ttl / 2) {
    refreshVerdict(claims.sid, nowMs).catch((error: unknown) => console.warn('evenload: a background session check failed', error));
  }
  const { account, version } = verdict;
  return account && account.id === claims.uid && version === claims.sv ? account : null;
}

/** Sign-out: the session's row is revoked, so the same cookie (or a copy of it) is refused. */
export async function revokeSession(sid: string, now = new Date()): Promise<void> {
  await UserSession.update({ revokedAt: now }, { where: { id: sid, revokedAt: null } });
  forget(sid);
}

/**
 * Ends every session of a person: raises their session version and revokes their rows. Called by
 * role changes, deactivation, password resets and "sign out everywhere", inside their transaction.
 */
export async function endAllSessions(userId: number, transaction?: Transaction, now = new Date()): Promise<void> {
  await User.increment({ sessionVersion: 1 }, { where: { id: userId }, transaction });
  await UserSession.update({ revokedAt: now }, { where: { userId, revokedAt: null }, transaction });
  for (const [sid, verdict] of verdicts) if (verdict.account?.id === userId) forget(sid);
}

/** The account a sign-in names, with what the password check and the token need; null when unknown. */
export async function findAccountForSignIn(email: string): Promise<{ id: number; name: string; email: string; role: Role; preferredUnits: UnitSystem; passwordHash: string | null; isActive: boolean; sessionVersion: number } | null> {
  const user = await User.findOne({ where: { email } });
  if (!user) return null;
  return { id: user.id, name: user.name, email: user.email, role: user.role, preferredUnits: user.preferredUnits, passwordHash: user.passwordHash, isActive: user.isActive, sessionVersion: user.sessionVersion };
}
