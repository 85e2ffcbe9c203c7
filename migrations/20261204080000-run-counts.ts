import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * The runs list's total without counting the runs on every request (`lib/data/run-counts.ts`):
 * how many runs there are per operator, cohort (0 = none), status and source, kept by triggers on
 * `runs` in the same transaction as each insert, delete and change of those columns, whatever code
 * path writes the row. Each key is spread over 8 slots (the run's id mod 8), so two transactions
 * storing runs at once for the same key (an upload holds its transaction for seconds) rarely wait
 * on the same counter row. Rows are touched in key order so two changes cannot deadlock on them.
 * Deleting a cohort sets its runs' cohort to NULL through the foreign key, which fires no trigger
 * on `runs`: a trigger on `cohorts` moves its counts to cohort 0 first.
 */
const KEY = (row: 'OLD' | 'NEW') => `${row}.operator_id, COALESCE(${row}.cohort_id, 0), ${row}.status, ${row}.source, ${row}.id % 8`;
const WHERE = (row: 'OLD' | 'NEW') => `(operator_id, cohort_id, status, source, slot) = (${KEY(row)})`;
const ADD = (row: 'NEW') => `INSERT INTO run_counts (operator_id, cohort_id, status, source, slot, n) VALUES (${KEY(row)}, 1) ON DUPLICATE KEY UPDATE n = n + 1`;
const TAKE = (row: 'OLD') => `UPDATE run_counts SET n = n - 1 WHERE ${WHERE(row)}`;

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('run_counts', {
    operator_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
    cohort_id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
    status: { type: DataTypes.STRING(16), primaryKey: true },
    source: { type: DataTypes.STRING(16), primaryKey: true },
    slot: { type: DataTypes.TINYINT.UNSIGNED, primaryKey: true },
    n: { type: DataTypes.INTEGER, allowNull: false },
  });
  const sql = (statement: string) => qi.sequelize.query(statement);
  await sql(`CREATE TRIGGER runs_count_insert AFTER INSERT ON runs FOR EACH ROW ${ADD('NEW')}`);
  await sql(`CREATE TRIGGER runs_count_delete AFTER DELETE ON runs FOR EACH ROW ${TAKE('OLD')}`);
  await sql(`CREATE TRIGGER runs_count_update AFTER UPDATE ON runs FOR EACH ROW
    BEGIN
      IF NOT (NEW.operator_id <=> OLD.operator_id AND NEW.cohort_id <=> OLD.cohort_id AND NEW.status <=> OLD.status AND NEW.source <=> OLD.source) THEN
        IF (${KEY('OLD')}) < (${KEY('NEW')}) THEN
          ${TAKE('OLD')}; ${ADD('NEW')};
        ELSE
          ${ADD('NEW')}; ${TAKE('OLD')};
        END IF;
      END IF;
    END`);
  await sql(`CREATE TRIGGER cohorts_run_counts BEFORE DELETE ON cohorts FOR EACH ROW
    BEGIN
      INSERT INTO run_counts (operator_id, cohort_id, status, source, slot, n)
        SELECT moved.operator_id, 0, moved.status, moved.source, moved.slot, moved.n FROM run_counts moved WHERE moved.cohort_id = OLD.id
        ON DUPLICATE KEY UPDATE n = run_counts.n + VALUES(n);
      DELETE FROM run_counts WHERE cohort_id = OLD.id;
    END`);
  // The runs already stored (the triggers count every change from here on).
  await sql(`INSERT INTO run_counts (operator_id, cohort_id, status, source, slot, n)
    SELECT operator_id, COALESCE(cohort_id, 0), status, source, id % 8, COUNT(*) FROM runs GROUP BY operator_id, COALESCE(cohort_id, 0), status, source, id % 8`);
};

export const down: Migration = async ({ context: qi }) => {
  for (const trigger of ['runs_count_insert', 'runs_count_delete', 'runs_count_update', 'cohorts_run_counts']) await qi.sequelize.query(`DROP TRIGGER IF EXISTS ${trigger}`);
  await qi.dropTable('run_counts');
};
