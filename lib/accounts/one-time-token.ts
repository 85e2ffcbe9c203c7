import { createHash, randomBytes } from 'node:crypto';
import type { TokenPurpose } from '@/models/one-time-token';

/**
 * One-time link tokens: 32 random bytes (base64url) in the link, only their SHA-256 (hex) in the
 * database. An invitation link lasts 72 hours, a reset link 2 hours (ours; common practice is
 * "short" for resets and a few days for invitations).
 */
export const TOKEN_LIFETIME_MS: Record<TokenPurpose, number> = { invite: 72 * 3_600_000, reset: 2 * 3_600_000 };

export function newTokenValue(): string {
  return randomBytes(32).toString('base64url');
}

export function hashToken(value: string): string {
  return createHash('sha256').update(value, 'utf8').digest('hex');
}

export function tokenExpiry(purpose: TokenPurpose, now = new Date()): Date {
  return new Date(now.getTime() + TOKEN_LIFETIME_MS[purpose]);
}

export type TokenState = 'valid' | 'expired' | 'used' | 'unknown';

/** Where a stored token stands at `now`. A used token stays "used" even after it expires. */
export function tokenState(row: { expiresAt: Date; usedAt: Date | null } | null, now = new Date()): TokenState {
  if (!row) return 'unknown';
  if (row.usedAt) return 'used';
  if (row.expiresAt.getTime() <= now.getTime()) return 'expired';
  return 'valid';
}

/** The message a visitor sees for a link that cannot be used, with what to do. */
export const TOKEN_STATE_MESSAGE: Record<Exclude<TokenState, 'valid'>, string> = {
  unknown: 'This link is not valid. Check that you opened the whole link from the e-mail, or ask for a new one.',
  expired: 'This link has expired. Ask your instructor for a new invitation, or request a new password-reset link.',
  used: 'This link has already been used. Sign in with the password you set, or request a new password-reset link.',
};

/** A token value has the shape newTokenValue makes (43 base64url characters). */
export function looksLikeToken(value: string): boolean {
  return /^[A-Za-z0-9_-]{43}$/.test(value);
}
