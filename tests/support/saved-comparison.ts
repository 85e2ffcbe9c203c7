import { compareQuerySchema } from '@/lib/data/compare';
import { freezeComparison } from '@/lib/data/saved-comparisons';
import { sequelize } from '@/lib/platform/db';
import { sessionUserFor } from '../integration/support';
import { DEMO_ACCOUNTS } from './http-session';

/**
 * Freezes a comparison of the demo's simulated runs by method as the demo researcher (several
 * methods with many runs each, so every headline test runs) and gives its slug and a cleanup.
 */
export async function freezeDemoComparison(title: string): Promise<{ slug: string; remove: () => Promise<void> }> {
  const query = compareQuerySchema.parse({ by: 'method', source: 'simulated' });
  const { slug } = await freezeComparison(await sessionUserFor(DEMO_ACCOUNTS.researcher), { title, query });
  return { slug, remove: async () => void (await sequelize.query('DELETE FROM saved_comparisons WHERE slug = ?', { replacements: [slug] })) };
}
