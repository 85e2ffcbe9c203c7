import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { Op } from 'sequelize';
import { z } from 'zod';
import { ReviewLink, SavedComparison, sequelize } from '@/models';
import { AppError } from '../http/errors';
import { appBaseUrl } from '../platform/env';
import type { SessionUser } from '../auth/session';
import { writeAudit } from './audit-log';
import { countEvents, isLocked } from './sign-in-throttle';
import { buildPackage, savedComparisonForReview, type SavedComparisonView } from './saved-comparisons';

/**
 * Review links: the author of a saved comparison hands a reviewer without an account a link that
 * opens it read-only, with its data package, until the link expires or is revoked. The token is 32
 * random bytes (256 bits, base64url); only its sha256 is stored. Every look-up by a visitor counts
 * against their address in the sign-in throttle's table (key `review:<address>`), as /verify does.
 */
export const REVIEW_LIMIT = { lookups: 60, lockMs: 15 * 60_000 } as const;
export const REVIEW_DAYS = { min: 1, max: 90, default: 30 } as const;

export const reviewLinkInputSchema = z.object({
  days: z.coerce.number().int().min(REVIEW_DAYS.min, `A link lasts at least ${REVIEW_DAYS.min} day.`).max(REVIEW_DAYS.max, `A link lasts at most ${REVIEW_DAYS.max} days.`).default(REVIEW_DAYS.default),
});

const tokenSha256 = (token: string) => createHash('sha256').update(token).digest('hex');
const TOKEN = /^[A-Za-z0-9_-]{43}$/;
const NOT_FOUND = 'This saved comparison does not exist, or it holds runs you may not see.';

export interface ReviewLinkDto {
  id: number;
  createdAt: string;
  expiresAt: string;
  state: 'active' | 'expired' | 'revoked';
}

/** The saved comparison row, only for its author (anyone else: not found, as for the page). */
async function authoredComparison(user: SessionUser, slug: string) {
  const row = /^[a-z0-9]{12}$/.test(slug) ? await SavedComparison.findOne({ where: { slug } }) : null;
  if (!row || row.createdById !== user.id) throw new AppError('not_found', NOT_FOUND);
  return row;
}

/** The author's review links of one saved comparison, newest first. */
export async function listReviewLinks(user: SessionUser, slug: string, now = new Date()): Promise<ReviewLinkDto[]> {
  const saved = await authoredComparison(user, slug);
  const rows = await ReviewLink.findAll({ where: { savedComparisonId: saved.id }, order: [['createdAt', 'DESC'], ['id', 'DESC']], limit: 50 });
  return rows.map((r) => ({ id: r.id, createdAt: r.createdAt.toISOString(), expiresAt: r.expiresAt.toISOString(), state: r.revokedAt ? 'revoked' : r.expiresAt <= now ? 'expired' : 'active' }));
}

/** Creates a review link (audited); the link with its token is returned once and never stored. */
export async function createReviewLink(user: SessionUser, slug: string, input: { days: number }, now = new Date()): Promise<{ id: number; link: string; expiresAt: string }> {
  const saved = await authoredComparison(user, slug);
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(now.getTime() + input.days * 86_400_000);
  const row = await sequelize.transaction(async (transaction) => {
    const created = await ReviewLink.create({ savedComparisonId: saved.id, tokenSha256: tokenSha256(token), createdById: user.id, createdAt: now, expiresAt, revokedAt: null }, { transaction });
    await writeAudit(transaction, user, { objectType: 'saved_comparison', objectId: saved.id, action: 'review_link', after: { link: created.id, expiresAt: expiresAt.toISOString() } });
    return created;
  });
  return { id: row.id, link: `${appBaseUrl()}/review/${token}`, expiresAt: expiresAt.toISOString() };
}

/** Revokes one review link of the author's saved comparison (audited); revoking twice changes nothing. */
export async function revokeReviewLink(user: SessionUser, slug: string, linkId: number, now = new Date()): Promise<void> {
  const saved = await authoredComparison(user, slug);
  await sequelize.transaction(async (transaction) => {
    const row = await ReviewLink.findOne({ where: { id: linkId, savedComparisonId: saved.id }, transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw new AppError('not_found', 'This review link does not exist.');
    if (row.revokedAt) return;
    await row.update({ revokedAt: now }, { transaction });
    await writeAudit(transaction, user, { objectType: 'saved_comparison', objectId: saved.id, action: 'review_revoke', after: { link: row.id } });
  });
}

export type ReviewAnswer<T> = { kind: 'found'; value: T } | { kind: 'rate_limited' };

/**
 * A visitor's look-up of a review link: counted against their address first (every look-up, found
 * or not), then the link must exist, be unrevoked and unexpired (read from the primary, so a
 * revocation holds at once); anything else is not found.
 */
async function openLink<T>(token: string, address: string, now: Date, open: (savedComparisonId: number, token: string) => Promise<T>): Promise<ReviewAnswer<T>> {
  const key = `review:${address}`.slice(0, 300);
  if (await isLocked([key], now)) return { kind: 'rate_limited' };
  await countEvents([{ key, lockAfter: (n) => (n >= REVIEW_LIMIT.lookups ? new Date(now.getTime() + REVIEW_LIMIT.lockMs) : null) }], now);
  const row = TOKEN.test(token) ? await ReviewLink.findOne({ where: { tokenSha256: tokenSha256(token), revokedAt: null, expiresAt: { [Op.gt]: now } }, useMaster: true }) : null;
  if (!row) throw new AppError('not_found', 'This review link does not exist, has expired or was withdrawn.');
  return { kind: 'found', value: await open(row.savedComparisonId, token) };
}

/** The saved comparison a review link opens, trainees pseudonymised. */
export async function reviewedComparison(token: string, address: string, now = new Date()): Promise<ReviewAnswer<SavedComparisonView>> {
  return openLink(token, address, now, async (id) => {
    const { runs: _runs, tables: _tables, ...view } = await savedComparisonForReview(id);
    return view;
  });
}

/** The data package of the saved comparison a review link opens, trainees pseudonymised. */
export async function reviewedPackage(token: string, address: string, now = new Date()): Promise<ReviewAnswer<{ fileName: string; bytes: Uint8Array }>> {
  return openLink(token, address, now, async (id) => buildPackage(await savedComparisonForReview(id)));
}
