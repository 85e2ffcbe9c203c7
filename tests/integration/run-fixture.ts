import { QueryTypes } from 'sequelize';
import { sequelize } from '@/lib/platform/db';
import type { NormalisedRun } from '@/lib/record/run-types';
import { storeRun } from '@/lib/data/runs/store-run';
import type { RunSource } from '@/models/run';

/**
 * Stores a complete 8-stud run in a cohort, recorded by `recordedById` (default: the cohort's
 * instructor, so it is a witnessed attempt) through `source` (default: by hand), tightened exactly as the demo's three-pass method
 * prescribes (cross order 1-5-3-7-2-6-4-8 three times, then one circular check pass), with the
 * given final loads. Earlier snapshots are the final loads scaled by the pass's % of target.
 */
export async function storeFixtureRun(opts: { operatorId: number; cohortId: number; finalLoadsN: number[]; recordedById?: number; source?: RunSource }): Promise<number> {
  const [cohort] = await sequelize.query<{ instructor_id: number }>('SELECT instructor_id FROM cohorts WHERE id = ?', { type: QueryTypes.SELECT, replacements: [opts.cohortId] });
  const [joint] = await sequelize.query<{ id: number; target_load_n: number }>("SELECT id, target_load_n FROM joints WHERE stud_count = 8 ORDER BY id LIMIT 1", { type: QueryTypes.SELECT });
  const [method] = await sequelize.query<{ id: number }>("SELECT id FROM methods WHERE name LIKE 'Three cross passes%' ORDER BY id LIMIT 1", { type: QueryTypes.SELECT });
  const [lubricant] = await sequelize.query<{ id: number }>('SELECT id FROM lubricants ORDER BY id LIMIT 1', { type: QueryTypes.SELECT });
  if (!joint || !method || !lubricant) throw new Error('the demo joint library is missing');
  const cross = [1, 5, 3, 7, 2, 6, 4, 8];
  const passes: { order: number[]; fraction: number }[] = [
    { order: cross, fraction: 0.3 },
    { order: cross, fraction: 0.6 },
    { order: cross, fraction: 1 },
    { order: [1, 2, 3, 4, 5, 6, 7, 8], fraction: 1 },
  ];
  const steps: NormalisedRun['steps'] = [];
  let order = 0;
  passes.forEach((pass, p) => {
    for (const position of pass.order) {
      order += 1;
      steps.push({ order, pass: p + 1, position, loadsN: opts.finalLoadsN.map((load) => load * pass.fraction) });
    }
  });
  const run: NormalisedRun = { studCount: 8, targetLoadN: Number(joint.target_load_n), steps };
  return sequelize.transaction((transaction) =>
    storeRun(
      {
        jointId: Number(joint.id), methodId: Number(method.id), lubricantId: Number(lubricant.id), operatorId: opts.operatorId, cohortId: opts.cohortId,
        targetLoadN: Number(joint.target_load_n), bandPercent: 10, source: opts.source ?? 'manual', status: 'complete', recordedById: opts.recordedById ?? (cohort ? Number(cohort.instructor_id) : null), recordedAt: new Date(), notes: 'Test fixture run (invented).',
      },
      run,
      transaction,
    ),
  );
}

export async function jointTarget(): Promise<number> {
  const [joint] = await sequelize.query<{ target_load_n: number }>('SELECT target_load_n FROM joints WHERE stud_count = 8 ORDER BY id LIMIT 1', { type: QueryTypes.SELECT });
  return Number(joint!.target_load_n);
}
