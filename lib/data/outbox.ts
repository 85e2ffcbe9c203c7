import 'server-only';
import { Op } from 'sequelize';
import { CapturedMail, sequelize } from '@/models';
import { AppError } from '../http/errors';
import type { SessionUser } from '../auth/session';

export interface CapturedMailRow {
  id: number;
  to: string;
  subject: string;
  text: string;
  receivedAt: string;
}

/**
 * The mail the local SMTP fake captured, newest first (development and the demo only; the page is a
 * 404 in production unless EVENLOAD_OUTBOX=1). The mail holds invitation and reset links, so it is
 * never open to visitors: an admin sees every message, anyone else only those sent to their own
 * address.
 */
export async function listCapturedMail(user: SessionUser | null, limit = 50): Promise<CapturedMailRow[]> {
  if (!user) throw new AppError('unauthenticated', 'Sign in to continue.');
  const own = sequelize.where(sequelize.fn('FIND_IN_SET', user.email.toLowerCase(), sequelize.col('envelope_to')), { [Op.gt]: 0 });
  const rows = await CapturedMail.findAll({ ...(user.role === 'admin' ? {} : { where: own }), order: [['id', 'DESC']], limit });
  return rows.map((m) => ({ id: m.id, to: m.envelopeTo, subject: m.subject ?? '(no subject)', text: m.textBody ?? '', receivedAt: m.receivedAt.toISOString() }));
}
