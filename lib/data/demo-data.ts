import 'server-only';
import { Op } from 'sequelize';
import { User } from '@/models';
import { DEMO_EMAIL_DOMAIN } from '@/lib/demo/notice';

/**
 * Whether the invented demo data is loaded: the demo seeder's accounts all use the reserved
 * DEMO_EMAIL_DOMAIN, so one of them existing means the demo school is in this database. The
 * signed-in layout then shows DEMO_NOTICE once, in its footer, instead of a note on every row.
 */
export async function demoDataLoaded(): Promise<boolean> {
  const found = await User.findOne({ attributes: ['id'], where: { email: { [Op.like]: `%@${DEMO_EMAIL_DOMAIN}` } } });
  return found !== null;
}
