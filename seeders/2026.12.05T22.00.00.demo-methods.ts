/**
 * Demo data: the demo methods added to the library after the first demo seed (the invented
 * "Tensioner on every stud" method, lib/demo/demo-library.ts), for databases seeded before them.
 * Idempotent; does nothing without the demo school (lib/data/demo-methods.ts).
 */
import type { Seeder } from '../lib/platform/migrator';
import { backfillDemoMethods, LATER_DEMO_METHODS } from '../lib/data/demo-methods';
import { buildDemoScenario } from '../lib/demo/demo-scenario';

export const up: Seeder = async ({ context: { sequelize } }) => {
  await sequelize.transaction((transaction) => backfillDemoMethods(sequelize, transaction));
};

/** Removes those methods again where no run uses them. */
export const down: Seeder = async ({ context: { sequelize } }) => {
  const names = buildDemoScenario().methods.filter((m) => LATER_DEMO_METHODS.includes(m.key)).map((m) => m.name);
  if (names.length) await sequelize.query('DELETE FROM methods WHERE name IN (?) AND id NOT IN (SELECT method_id FROM runs)', { replacements: [names] });
};
