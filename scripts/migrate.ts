/**
 * The one runner for migrations and seeders (umzug).
 *   tsx scripts/migrate.ts up        apply pending migrations
 *   tsx scripts/migrate.ts down      revert the last migration (down --to 0: all)
 *   tsx scripts/migrate.ts seed      apply pending seeders (demo data; idempotent)
 */
import { sequelize } from '../lib/platform/db';
import { createMigrator, createSeeder } from '../lib/platform/migrator';

async function main() {
  const [command, flag, value] = process.argv.slice(2);
  const migrator = createMigrator(sequelize);
  if (command === 'up') {
    const done = await migrator.up();
    console.log(`[migrate] applied ${done.length} migration(s)`);
  } else if (command === 'down') {
    const done = flag === '--to' ? await migrator.down({ to: value === '0' ? 0 : (value as string) }) : await migrator.down();
    console.log(`[migrate] reverted ${done.length} migration(s)`);
  } else if (command === 'seed') {
    const done = await createSeeder(sequelize).up();
    console.log(`[migrate] applied ${done.length} seeder(s)`);
  } else {
    console.error('usage: tsx scripts/migrate.ts up | down [--to 0] | seed');
    process.exitCode = 2;
  }
  await sequelize.close();
}

main().catch(async (error: unknown) => {
  console.error('[migrate] failed:', error instanceof Error ? error.message : error);
  await sequelize.close().catch(() => undefined);
  process.exit(1);
});
