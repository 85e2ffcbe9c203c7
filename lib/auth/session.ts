import 'server-only';
import { decode, type JWT } from 'next-auth/jwt';
import { cookies } from 'next/headers';
import { redirect } from 'next/navigation';
import { authSecret } from '../platform/env';
import { AppError } from '../http/errors';
import type { Role } from '@/models/user';
import { checkSession, type SessionAccount, type SessionClaims } from '../data/session-store';

/** The signed-in person as every data function receives it (name, role and units from the users row). */
export type SessionUser = SessionAccount;

/** next-auth's session cookie names (the __Secure- one behind https). */
const SESSION_COOKIES = ['__Secure-next-auth.session-token', 'next-auth.session-token'];

/** The sign-in claims of a decoded session token, or null for a token without them (e.g. one from before sessions were recorded). */
export function sessionClaimsOf(token: JWT | null | undefined): SessionClaims | null {
  if (!token) return null;
  const { uid, sid, sv, sat } = token;
  if (typeof uid !== 'number' || typeof sid !== 'string' || typeof sv !== 'number' || typeof sat !== 'number') return null;
  return { uid, sid, sv, sat };
}

/**
 * The signed-in person for pages, route handlers and server actions alike. The session JWT
 * (next-auth's own cookie) is decoded and verified with the signing secret, then the session is
 * checked against MariaDB through lib/data/session-store (absolute lifetime, idle timeout,
 * sign-out, deactivation, session version), which answers from a short in-process cache.
 */
export async function getSessionUser(): Promise<SessionUser | null> {
  const store = await cookies();
  const name = SESSION_COOKIES.find((cookie) => store.has(cookie));
  const value = name ? store.get(name)?.value : undefined;
  if (!value) return null;
  const token = await decodedToken(value);
  if (typeof token?.exp === 'number' && token.exp * 1000 < Date.now()) return null;
  const claims = sessionClaimsOf(token);
  return claims ? checkSession(claims) : null;
}

/**
 * Decoding a session token (key derivation, then decryption) costs more than the rest of a light
 * request, and a person sends the same token with every request until it is renewed: the decoded
 * claims are remembered per token text (at most DECODED_LIMIT, the oldest dropped first). This is
 * a pure function's memo, not session state: the expiry is checked on every request and whether
 * the session still stands is decided by checkSession.
 */
const DECODED_LIMIT = 5000;
const decoded = new Map<string, Promise<JWT | null>>();

function decodedToken(value: string): Promise<JWT | null> {
  const known = decoded.get(value);
  if (known) return known;
  const pending = decode({ token: value, secret: authSecret() }).catch(() => null);
  if (decoded.size >= DECODED_LIMIT) decoded.delete(decoded.keys().next().value as string);
  decoded.set(value, pending);
  return pending;
}

/** The one role check: throws 401 when signed out and 403 when the role is not allowed. */
export function assertRole(user: SessionUser | null, roles: readonly Role[]): asserts user is SessionUser {
  if (!user) throw new AppError('unauthenticated', 'Sign in to continue.');
  if (!roles.includes(user.role)) throw new AppError('forbidden', 'Your role does not allow this.');
}

/** For pages: sign-in redirect when signed out, the not-allowed page for a wrong role. */
export async function requirePageUser(roles: readonly Role[] = ALL_ROLES): Promise<SessionUser> {
  const user = await getSessionUser();
  if (!user) redirect('/sign-in');
  if (!roles.includes(user.role)) redirect('/?notice=not-allowed');
  return user;
}

export const ALL_ROLES: readonly Role[] = ['admin', 'instructor', 'researcher', 'trainee'];
