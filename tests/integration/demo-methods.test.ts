/**
 * A demo database seeded before the "Tensioner on every stud" method existed gets it from the
 * seeder's back-fill (lib/data/demo-methods.ts), as a fresh seed stores it (the test database is
 * freshly seeded, so its row is the reference); a second pass adds nothing, and a method of the
 * first seed that is gone is not added back. Everything happens in one transaction that is rolled
 * back, so tests running beside this one never see the methods change.
 */
import { QueryTypes, type Transaction } from 'sequelize';
import { afterAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { backfillDemoMethods } from '@/lib/data/demo-methods';

const NAME = 'Tensioner on every stud, two passes';
type MethodRow = { name: string; tool_kind: string; passes: unknown; check_passes: number; tensioner_coverage: string; notes: string };
const methodRow = async (name: string, transaction?: Transaction) =>
  (await sequelize.query<MethodRow>('SELECT name, tool_kind, passes, check_passes, tensioner_coverage, notes FROM methods WHERE name = ?', { type: QueryTypes.SELECT, replacements: [name], transaction }))[0];

afterAll(() => sequelize.close());

describe('the demo methods back-fill', () => {
  it('adds the 100 % tensioner method as a fresh seed stores it, once, and never a first-seed method that is gone', async () => {
    const seeded = await methodRow(NAME);
    expect(seeded).toMatchObject({ tool_kind: 'hydraulic_tensioner', tensioner_coverage: 'every_stud' });
    const [first] = await sequelize.query<{ id: number; name: string }>('SELECT id, name FROM methods WHERE name <> ? ORDER BY id LIMIT 1', { type: QueryTypes.SELECT, replacements: [NAME] });
    const transaction = await sequelize.transaction();
    try {
      // A database seeded before the method existed.
      await sequelize.query('DELETE FROM methods WHERE name = ?', { replacements: [NAME], transaction });
      expect(await methodRow(NAME, transaction)).toBeUndefined();
      expect(await backfillDemoMethods(sequelize, transaction)).toEqual([NAME]);
      expect(await methodRow(NAME, transaction)).toEqual(seeded);
      expect(await backfillDemoMethods(sequelize, transaction)).toEqual([]);
      // A method of the first seed that is gone under its name (renamed here, as good as deleted) is not added back.
      await sequelize.query('UPDATE methods SET name = ? WHERE id = ?', { replacements: [`${first!.name} (renamed by a test)`, first!.id], transaction });
      expect(await backfillDemoMethods(sequelize, transaction)).toEqual([]);
      expect(await methodRow(first!.name, transaction)).toBeUndefined();
    } finally {
      await transaction.rollback();
    }
    expect(await methodRow(NAME)).toEqual(seeded);
  });
});
