import type { Migration } from '../lib/platform/migrator';

/**
 * The covering `runs_list` index (migration 20261204060000) gains `updated_at` at its end, so a
 * comparison's cache check (`fingerprintByAggregate` in lib/data/compare.ts: count, last change and
 * id sum of the chosen runs) is answered from the index alone, without reading the wide rows. The
 * runs list reads the same index as before (its order and columns come first).
 */
const BEFORE = ['recorded_at', 'id', 'status', 'source', 'stud_count', 'pass_count', 'target_load_n', 'final_mean_n', 'final_cv', 'joint_id', 'method_id', 'lubricant_id', 'operator_id', 'cohort_id'];

export const up: Migration = async ({ context: qi }) => {
  await qi.removeIndex('runs', 'runs_list');
  await qi.addIndex('runs', [...BEFORE, 'updated_at'], { name: 'runs_list' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeIndex('runs', 'runs_list');
  await qi.addIndex('runs', BEFORE, { name: 'runs_list' });
};
