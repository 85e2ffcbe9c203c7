import type { Migration } from '../lib/platform/migrator';

/**
 * The attempt numbers of a comparison (`lib/data/compare.ts`): each operator's complete runs in
 * (recorded_at, id) order. With the operator and status first and the primary key InnoDB appends,
 * the index holds that order and every column the query reads, so it is read from the index alone.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.addIndex('runs', ['operator_id', 'status', 'recorded_at'], { name: 'runs_operator_attempts' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.removeIndex('runs', 'runs_operator_attempts');
};
