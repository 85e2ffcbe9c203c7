import 'server-only';
import { decode } from 'next-auth/jwt';
import { cookies } from 'next/headers';
import { redirect } from 'next/navigation';
import { authSecret } from './env';
import { AppError } from './errors';
import type { Role } from '@/models/user';

/** The signed-in person as every data function receives it. */
export interface SessionUser {
  id: number;
  name: string;
  email: string;
  role: Role;
  units: 'si' | 'us';
}

/** next-auth's session cookie names (the __Secure- one behind https). */
const SESSION_COOKIES = ['__Secure-next-auth.session-token', 'next-auth.session-token'];

/**
 * The signed-in person, read from the session JWT (next-auth's own cookie, decoded and verified
 * with the signing secret). Reading the token directly, rather than through getServerSession, keeps
 * every request light: nothing but the cookie is needed, on any instance.
 */
export async function getSessionUser(): Promise<SessionUser | null> {
  const store = await cookies();
  const name = SESSION_COOKIES.find((cookie) => store.has(cookie));
  const value = name ? store.get(name)?.value : undefined;
  if (!value) return null;
  const token = await decode({ token: value, secret: authSecret() }).catch(() => null);
  if (!token?.uid || !token.role) return null;
  if (typeof token.exp === 'number' && token.exp * 1000 < Date.now()) return null;
  return {
    id: token.uid,
    name: token.name ?? '',
    email: token.email ?? '',
    role: token.role,
    units: token.units ?? 'si',
  };
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
