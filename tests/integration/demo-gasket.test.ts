import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sequelize } from '@/lib/platform/db';
import { backfillDemoGaskets } from '@/lib/data/demo-gasket';
import { buildDemoScenario } from '@/lib/demo/demo-scenario';
import { demoGasketOf } from '@/lib/demo/demo-library';

// A database seeded before joints had gasket data: the demo joint has no contact ring and its runs no
// stored gasket figures. The demo seeder's back-fill (lib/data/demo-gasket.ts) gives the joint its
// invented ring and fills the runs' figures, which must equal those a fresh seed stored (the test
// database is freshly seeded, so its figures are the reference).
const demoJoint = buildDemoScenario().joints[0]!;
type JointRow = { id: number; gasket_inner_mm: number | null; gasket_outer_mm: number | null; gasket_min_seating_mpa: number | null; gasket_stress_source: string | null };
type RunRow = { id: number; final_gasket_stress_mpa: number | null; gasket_min_seating_mpa: number | null };
let original: JointRow;
let originalRuns: RunRow[];

const jointRow = async () =>
  (await sequelize.query<JointRow>('SELECT id, gasket_inner_mm, gasket_outer_mm, gasket_min_seating_mpa, gasket_stress_source FROM joints WHERE name = ?', { type: QueryTypes.SELECT, replacements: [demoJoint.name] }))[0]!;
const runRows = async (ids: number[]) =>
  sequelize.query<RunRow>('SELECT id, final_gasket_stress_mpa, gasket_min_seating_mpa FROM runs WHERE id IN (?) ORDER BY id', { type: QueryTypes.SELECT, replacements: [ids] });

beforeAll(async () => {
  original = await jointRow();
  originalRuns = await sequelize.query<RunRow>(
    'SELECT id, final_gasket_stress_mpa, gasket_min_seating_mpa FROM runs WHERE joint_id = ? AND final_gasket_stress_mpa IS NOT NULL ORDER BY id LIMIT 6',
    { type: QueryTypes.SELECT, replacements: [original.id] },
  );
});

afterAll(async () => {
  // Puts the demo joint and runs back as the fresh seed had them, whatever happened above.
  await sequelize.query('UPDATE joints SET gasket_inner_mm = ?, gasket_outer_mm = ? WHERE id = ?', { replacements: [original.gasket_inner_mm, original.gasket_outer_mm, original.id] });
  for (const run of originalRuns) await sequelize.query('UPDATE runs SET final_gasket_stress_mpa = ?, gasket_min_seating_mpa = ? WHERE id = ?', { replacements: [run.final_gasket_stress_mpa, run.gasket_min_seating_mpa, run.id] });
  await sequelize.close();
});

describe('the demo gasket back-fill', () => {
  it('gives a bare demo joint its invented ring and fills its runs’ gasket figures as a fresh seed stores them; a second run changes nothing', async () => {
    const gasket = demoGasketOf(demoJoint.key)!;
    // The fresh seed stored the demo ring (from lib/demo/demo-library.ts: 4.75 in and 5.875 in = 120.65 mm and 149.225 mm, 25.4 mm per inch exactly).
    expect(original).toMatchObject({ gasket_inner_mm: gasket.innerMm, gasket_outer_mm: gasket.outerMm, gasket_min_seating_mpa: 69, gasket_stress_source: 'training default: set your own' });
    expect(gasket.innerMm).toBeCloseTo(120.65, 9);
    expect(originalRuns.length).toBeGreaterThan(0);

    const ids = originalRuns.map((r) => r.id);
    await sequelize.query('UPDATE joints SET gasket_inner_mm = NULL, gasket_outer_mm = NULL WHERE id = ?', { replacements: [original.id] });
    await sequelize.query('UPDATE runs SET final_gasket_stress_mpa = NULL, gasket_min_seating_mpa = NULL WHERE id IN (?)', { replacements: [ids] });

    const first = await sequelize.transaction((t) => backfillDemoGaskets(sequelize, t));
    expect(first.joints).toBe(1);
    expect(first.runs).toBeGreaterThanOrEqual(ids.length);
    expect(await jointRow()).toMatchObject({ gasket_inner_mm: gasket.innerMm, gasket_outer_mm: gasket.outerMm });
    const refilled = await runRows(ids);
    refilled.forEach((run, i) => {
      expect(run.final_gasket_stress_mpa).toBeCloseTo(originalRuns[i]!.final_gasket_stress_mpa!, 9);
      expect(run.gasket_min_seating_mpa).toBe(69);
    });

    expect(await sequelize.transaction((t) => backfillDemoGaskets(sequelize, t))).toEqual({ joints: 0, runs: 0 });
  });

  it('leaves a demo joint whose gasket the centre set alone', async () => {
    await sequelize.query('UPDATE joints SET gasket_inner_mm = 100, gasket_outer_mm = 140 WHERE id = ?', { replacements: [original.id] });
    await sequelize.transaction((t) => backfillDemoGaskets(sequelize, t));
    expect(await jointRow()).toMatchObject({ gasket_inner_mm: 100, gasket_outer_mm: 140 });
  });
});
