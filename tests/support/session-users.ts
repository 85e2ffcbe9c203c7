/** SessionUser objects for calling lib functions directly in integration tests. */
import { QueryTypes } from 'sequelize';
import { sequelize } from '@/lib/platform/db';
import type { SessionUser } from '@/lib/auth/session';

export async function sessionUserOf(email: string): Promise<SessionUser> {
  const [row] = await sequelize.query<{ id: number; name: string; role: SessionUser['role']; preferred_units: 'si' | 'us' }>('SELECT id, name, role, preferred_units FROM users WHERE email = ?', {
    type: QueryTypes.SELECT,
    replacements: [email],
  });
  if (!row) throw new Error(`no user ${email}`);
  return { id: Number(row.id), name: row.name, email, role: row.role, units: row.preferred_units };
}
