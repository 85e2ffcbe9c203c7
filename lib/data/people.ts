import 'server-only';
import { z } from 'zod';
import { User } from '@/models';
import { ROLES, type Role } from '@/models/user';
import { AppError } from '../errors';
import { assertRole, type SessionUser } from '../session';

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
 */
export async function changeRole(user: SessionUser | null, userId: number, rawRole: unknown): Promise<void> {
  assertRole(user, ['admin']);
  const role = roleSchema.safeParse(rawRole);
  if (!role.success) throw new AppError('invalid_input', role.error.issues[0]?.message ?? 'Choose a role.', { fieldErrors: { role: [role.error.issues[0]?.message ?? 'Choose a role.'] } });
  if (userId === user.id) throw new AppError('forbidden', 'You cannot change your own role; another admin can.');
  const target = await User.findByPk(userId);
  if (!target) throw new AppError('not_found', 'That account does not exist.');
  await target.update({ role: role.data });
}

/** Deactivates or reactivates an account (admins only; not their own). A deactivated account cannot sign in. */
export async function setActive(user: SessionUser | null, userId: number, active: boolean): Promise<void> {
  assertRole(user, ['admin']);
  if (userId === user.id) throw new AppError('forbidden', 'You cannot deactivate your own account; another admin can.');
  const target = await User.findByPk(userId);
  if (!target) throw new AppError('not_found', 'That account does not exist.');
  await target.update({ isActive: active });
}
