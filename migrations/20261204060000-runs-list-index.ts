import type { Migration } from '../lib/platform/migrator';

/**
 * A covering index for the runs list (`lib/data/runs.ts`, `selectRunRows`): its default order
 * (recorded_at, then id, named here so the index keeps that order before the other columns)
 * followed by every column the list shows or joins on, so a page is read from the index alone,
 * without a look-up into the wide rows (final loads and drift JSON).
 */
const COLUMNS = ['recorded_at', 'id', 'status', 'source', 'stud_count', 'pass_count', 'target_load_n', 'final_mean_n', 'final_cv', 'joint_id', 'method_id', 'lubricant_id', 'operator_id', 'cohort_id'];

export const up: Migration = async ({ context: qi }) => {
  await qi.addIndex('runs', COLUMNS, { name: 'runs_list' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeIndex('runs', 'runs_list');
};
