import 'server-only';
import { createHash } from 'node:crypto';
import { Op } from 'sequelize';
import { SignInAttempt, sequelize } from '@/models';

/**
 * Sign-in throttling, kept in MariaDB so every app instance behind a load balancer sees the same
 * counters. Three counters per failed sign-in, each in a window of `windowMs`:
 * - the account from this address (`pair:`): `maxFailuresPerPair` failures lock that pair for `lockMs`;
 * - the address (`addr:`): `maxFailuresPerAddress` (higher: a classroom shares one address) lock it;
 * - the account from anywhere (`email:`): from `accountBackoffAfter` failures on, a back-off that
 *   doubles with each failure (`accountBackoffBaseMs` up to `lockMs`). It holds back only addresses
 *   that have themselves failed for this account, so a stranger guessing from elsewhere cannot lock
 *   the owner out of an address that has not failed.
 * The address is the one the server saw (lib/http/client-address.ts), never the client's own header.
 */
export const SIGN_IN_LIMIT = {
  maxFailuresPerPair: 5,
  maxFailuresPerAddress: 50,
  accountBackoffAfter: 10,
  accountBackoffBaseMs: 60_000,
  windowMs: 15 * 60_000,
  lockMs: 15 * 60_000,
} as const;

export interface SignInKeys {
  pair: string;
  address: string;
  account: string;
}

/** The pair key is hashed: an e-mail (254) and an IPv6 address would not fit the 300-character key. */
export function signInKeys(email: string, address: string): SignInKeys {
  const pairHash = createHash('sha256').update(`${email}\n${address}`).digest('hex');
  return { pair: `pair:${pairHash}`, address: `addr:${address}`, account: `email:${email}` };
}

/**
 * Generic counters for other limits (e.g. password-reset mails, keyed `reset:<e-mail>`): after
 * `maxFailuresPerPair` events in the window (`maxFailuresPerAddress` for `addr:` keys) the key is
 * locked for `lockMs`.
 */
const genericLimit = (key: string) => (key.startsWith('addr:') ? SIGN_IN_LIMIT.maxFailuresPerAddress : SIGN_IN_LIMIT.maxFailuresPerPair);

export async function isLocked(keys: string[], now = new Date()): Promise<boolean> {
  const locked = await SignInAttempt.count({ where: { attemptKey: keys, lockedUntil: { [Op.gt]: now } }, useMaster: true });
  return locked > 0;
}

export async function recordFailure(keys: string[], now = new Date()): Promise<void> {
  await countEvents(keys.map((key) => ({ key, lockAfter: (failures: number) => (failures >= genericLimit(key) ? new Date(now.getTime() + SIGN_IN_LIMIT.lockMs) : null) })), now);
}

/**
 * One more event on each key inside one transaction; a key's window restarts once it has passed.
 * Also the counter of other per-address limits (the public verify page, lib/data/qualification/verify-record.ts).
 */
export async function countEvents(counters: Array<{ key: string; lockAfter: (failures: number) => Date | null }>, now: Date): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    for (const { key, lockAfter } of counters) {
      const row = await SignInAttempt.findByPk(key, { transaction, lock: transaction.LOCK.UPDATE });
      if (!row || now.getTime() - row.windowStartedAt.getTime() > SIGN_IN_LIMIT.windowMs) {
        await SignInAttempt.upsert({ attemptKey: key, failures: 1, windowStartedAt: now, lockedUntil: lockAfter(1) }, { transaction });
        continue;
      }
      const failures = row.failures + 1;
      await row.update({ failures, lockedUntil: lockAfter(failures) ?? row.lockedUntil }, { transaction });
    }
  });
}

/** Sign-in: locked when the pair or the address is locked, or the account is backing off and this address has failed for it. */
export async function isSignInLocked(keys: SignInKeys, now = new Date()): Promise<boolean> {
  // The primary, never a replica: a lagging replica would let a client that drops cookies guess on.
  const rows = await SignInAttempt.findAll({ where: { attemptKey: [keys.pair, keys.address, keys.account] }, useMaster: true });
  const live = (row: SignInAttempt) => now.getTime() - row.windowStartedAt.getTime() <= SIGN_IN_LIMIT.windowMs;
  const lockedNow = (row: SignInAttempt) => row.lockedUntil !== null && row.lockedUntil.getTime() > now.getTime();
  const byKey = new Map(rows.map((row) => [row.attemptKey, row]));
  const pair = byKey.get(keys.pair);
  const address = byKey.get(keys.address);
  const account = byKey.get(keys.account);
  if ((pair && lockedNow(pair)) || (address && lockedNow(address))) return true;
  const addressHasFailed = pair !== undefined && live(pair);
  return addressHasFailed && account !== undefined && lockedNow(account);
}

function lockAfter(key: keyof SignInKeys, failures: number, now: Date): Date | null {
  if (key === 'pair') return failures >= SIGN_IN_LIMIT.maxFailuresPerPair ? new Date(now.getTime() + SIGN_IN_LIMIT.lockMs) : null;
  if (key === 'address') return failures >= SIGN_IN_LIMIT.maxFailuresPerAddress ? new Date(now.getTime() + SIGN_IN_LIMIT.lockMs) : null;
  if (failures < SIGN_IN_LIMIT.accountBackoffAfter) return null;
  const backoff = SIGN_IN_LIMIT.accountBackoffBaseMs * 2 ** Math.min(failures - SIGN_IN_LIMIT.accountBackoffAfter, 20);
  return new Date(now.getTime() + Math.min(backoff, SIGN_IN_LIMIT.lockMs));
}

export async function recordSignInFailure(keys: SignInKeys, now = new Date()): Promise<void> {
  // A fixed order of keys, so two failures at once cannot deadlock on each other's rows.
  await countEvents((['account', 'address', 'pair'] as const).map((name) => ({ key: keys[name], lockAfter: (failures: number) => lockAfter(name, failures, now) })), now);
}

/** A successful sign-in clears its own pair only: the account's count keeps slowing a guesser elsewhere. */
export async function clearSignInFailures(keys: SignInKeys): Promise<void> {
  await SignInAttempt.destroy({ where: { attemptKey: keys.pair } });
}
