import 'server-only';
import { z } from 'zod';
import { User, sequelize } from '@/models';
import { ROLES, type Role } from '@/models/user';
import { AppError } from '../http/errors';
import { assertRole, type SessionUser } from '../auth/session';
import { endAllSessions } from './session-store';
import { writeAudit } from './audit-log';

export interface PersonRow {
  id: number;
  name: string;
  email: string;
  role: Role;
  isActive: boolean;
  pending: boolean;
  createdAt: string;
}

export async function listPeople(user: SessionUser | null): Promise<PersonRow[]> {
  assertRole(user, ['admin']);
  const rows = await User.findAll({ order: [['role', 'ASC'], ['name', 'ASC']] });
  return rows.map((u) => ({ id: u.id, name: u.name, email: u.email, role: u.role, isActive: Boolean(u.isActive), pending: u.passwordHash === null, createdAt: u.createdAt.toISOString() }));
}

const roleSchema = z.enum(ROLES, { error: 'Choose one of the roles: admin, instructor, researcher or trainee.' });

/**
 * Changes someone's role (admins only). Nobody raises their own role: an admin cannot change their
 * own role at all (another admin must), so the centre never loses its last admin by accident.
 * A change ends the person's sessions: they sign in again with the new role.
 */
export async function changeRole(user: SessionUser | null, userId: number, rawRole: unknown): Promise<void> {
  assertRole(user, ['admin']);
  const role = roleSchema.safeParse(rawRole);
  if (!role.success) throw new AppError('invalid_input', role.error.issues[0]?.message ?? 'Choose a role.', { fieldErrors: { role: [role.error.issues[0]?.message ?? 'Choose a role.'] } });
  if (userId === user.id) throw new AppError('forbidden', 'You cannot change your own role; another admin can.');
  await updateAccount(user, userId, (target) => (target.role === role.data ? null : { role: role.data }));
}

/**
 * Deactivates or reactivates an account (admins only; not their own). A deactivated account cannot
 * sign in, and its open sessions end.
 */
export async function setActive(user: SessionUser | null, userId: number, active: boolean): Promise<void> {
  assertRole(user, ['admin']);
  if (userId === user.id) throw new AppError('forbidden', 'You cannot deactivate your own account; another admin can.');
  await updateAccount(user, userId, (target) => (Boolean(target.isActive) === active ? null : { isActive: active }));
}

/** "Sign out everywhere" for an account, by an admin (their own included). */
export async function endSessionsOf(user: SessionUser | null, userId: number): Promise<void> {
  assertRole(user, ['admin']);
  await updateAccount(user, userId, () => ({}));
}

/** "Sign out everywhere" for the signed-in person: every session of theirs ends, this one too. */
export async function endOwnSessions(user: SessionUser | null): Promise<void> {
  if (!user) throw new AppError('unauthenticated', 'Sign in to continue.');
  await updateAccount(user, user.id, () => ({}));
}

/**
 * Applies a change to an account and ends all its sessions, in one transaction (the row is locked,
 * so two admins acting at once both take effect). A change of nothing (`null`) ends no session.
 */
async function updateAccount(actor: SessionUser, userId: number, change: (target: User) => Partial<Pick<User, 'role' | 'isActive'>> | null): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const target = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!target) throw new AppError('not_found', 'That account does not exist.');
    const values = change(target);
    if (!values) return;
    const before = { role: target.role, isActive: Boolean(target.isActive) };
    if (Object.keys(values).length) await target.update(values, { transaction });
    await endAllSessions(userId, transaction);
    const action = 'role' in values ? 'role' : 'isActive' in values ? (values.isActive ? 'reactivate' : 'deactivate') : 'end_sessions';
    await writeAudit(transaction, actor, { objectType: 'account', objectId: userId, action, before, after: { ...before, ...values } });
  });
}
