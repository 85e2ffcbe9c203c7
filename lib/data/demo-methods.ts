import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { buildDemoScenario } from '../demo/demo-scenario';
import { DEMO_EMAIL_DOMAIN } from '../demo/notice';

/**
 * Adds the demo methods that came after the first demo seed to a database seeded before them: the
 * invented "Tensioner on every stud" method, so the classroom's tensioning scene has a method to save
 * against. Only when the demo school is loaded (an account of DEMO_EMAIL_DOMAIN exists) and only when
 * no method of that name exists (a centre's own method of that name is left as it is). The methods of
 * the first seed are never added back, so one a centre deleted stays deleted.
 * Raw SQL on the caller's connection, so the seeder runs it. Idempotent.
 * @returns the names of the methods added.
 */
/** Keys of demo methods added to the demo library after its first seed (lib/demo/demo-library.ts). */
export const LATER_DEMO_METHODS: readonly string[] = ['tensioner-every-stud'];

export async function backfillDemoMethods(db: Sequelize, transaction: Transaction): Promise<string[]> {
  const select = <T extends object>(sql: string, replacements: unknown[]) => db.query<T>(sql, { type: QueryTypes.SELECT, replacements, transaction });
  const [demo] = await select<{ n: number }>('SELECT COUNT(*) AS n FROM users WHERE email LIKE ?', [`%@${DEMO_EMAIL_DOMAIN}`]);
  if (!Number(demo?.n)) return [];
  const added: string[] = [];
  for (const method of buildDemoScenario().methods.filter((m) => LATER_DEMO_METHODS.includes(m.key))) {
    const [known] = await select<{ n: number }>('SELECT COUNT(*) AS n FROM methods WHERE name = ? FOR UPDATE', [method.name]);
    if (Number(known?.n)) continue;
    await db.query('INSERT INTO methods (name, tool_kind, passes, check_passes, tensioner_coverage, notes, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, NOW(), NOW())', {
      replacements: [method.name, method.tool, JSON.stringify(method.passes), method.checkPasses, method.tensionerCoverage ?? 'one_stud', method.basis],
      transaction,
    });
    added.push(method.name);
  }
  return added;
}
