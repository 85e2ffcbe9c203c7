import 'server-only';
import { getServerSession } from 'next-auth';
import { redirect } from 'next/navigation';
import { authOptions } from './auth';
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

export async function getSessionUser(): Promise<SessionUser | null> {
  const session = await getServerSession(authOptions);
  if (!session?.user?.id) return null;
  return {
    id: session.user.id,
    name: session.user.name ?? '',
    email: session.user.email ?? '',
    role: session.user.role,
    units: session.user.units,
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
