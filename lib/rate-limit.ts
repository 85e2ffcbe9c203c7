import 'server-only';
import { Op } from 'sequelize';
import { SignInAttempt, sequelize } from '@/models';

/**
 * Sign-in throttling, kept in MariaDB so every app instance behind a load balancer sees the same
 * counters. After `maxFailures` failures within `windowMs` for one account's e-mail, or
 * `maxFailuresPerAddress` from one client address (higher: a classroom shares one address), the key
 * is locked for `lockMs`.
 */
export const SIGN_IN_LIMIT = { maxFailures: 5, maxFailuresPerAddress: 50, windowMs: 15 * 60_000, lockMs: 15 * 60_000 } as const;

const limitFor = (key: string) => (key.startsWith('addr:') ? SIGN_IN_LIMIT.maxFailuresPerAddress : SIGN_IN_LIMIT.maxFailures);

export async function isLocked(keys: string[], now = new Date()): Promise<boolean> {
  const locked = await SignInAttempt.count({ where: { attemptKey: keys, lockedUntil: { [Op.gt]: now } } });
  return locked > 0;
}

export async function recordFailure(keys: string[], now = new Date()): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    for (const key of keys) {
      const row = await SignInAttempt.findByPk(key, { transaction, lock: transaction.LOCK.UPDATE });
      if (!row || now.getTime() - row.windowStartedAt.getTime() > SIGN_IN_LIMIT.windowMs) {
        await SignInAttempt.upsert({ attemptKey: key, failures: 1, windowStartedAt: now, lockedUntil: null }, { transaction });
        continue;
      }
      const failures = row.failures + 1;
      const lockedUntil = failures >= limitFor(key) ? new Date(now.getTime() + SIGN_IN_LIMIT.lockMs) : row.lockedUntil;
      await row.update({ failures, lockedUntil }, { transaction });
    }
  });
}

export async function clearFailures(keys: string[]): Promise<void> {
  await SignInAttempt.destroy({ where: { attemptKey: keys } });
}
