import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * The runs list's version stamp (`lib/data/run-list-memo.ts`): every change that can alter a page of
 * the runs list raises it, in the same transaction as the change, whatever code path (or instance)
 * writes the row. Its value is the sum of 16 counters; a change raises the counter of its
 * connection's slot (CONNECTION_ID() mod 16), so one transaction only ever locks one counter row and
 * two transactions storing runs at once rarely wait on the same one. Counters only grow, so an equal
 * sum means no change was committed in between. What the list shows: the run's own listed columns,
 * and the names of its joint, method, lubricant, operator and cohort; a cohort's deletion sets its
 * runs' cohort to NULL through the foreign key, which fires no trigger on `runs`, so the `cohorts`
 * trigger covers it (joints, methods, lubricants and operators of stored runs cannot be deleted).
 */
const SLOTS = 16;
const BUMP = `UPDATE run_list_versions SET version = version + 1 WHERE slot = CONNECTION_ID() % ${SLOTS}`;
const LISTED = ['recorded_at', 'stud_count', 'source', 'status', 'pass_count', 'target_load_n', 'final_mean_n', 'final_cv', 'joint_id', 'method_id', 'lubricant_id', 'operator_id', 'cohort_id'];
const unchanged = (columns: string[]) => columns.map((c) => `NEW.${c} <=> OLD.${c}`).join(' AND ');
const NAMED = ['joints', 'methods', 'lubricants', 'users', 'cohorts'] as const;

const TRIGGERS = ['runs_list_insert', 'runs_list_delete', 'runs_list_update', ...NAMED.map((t) => `${t}_list_rename`), 'cohorts_list_delete'];

export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('run_list_versions', {
    slot: { type: DataTypes.TINYINT.UNSIGNED, primaryKey: true },
    version: { type: DataTypes.BIGINT.UNSIGNED, allowNull: false, defaultValue: 0 },
  });
  const sql = (statement: string) => qi.sequelize.query(statement);
  await sql(`INSERT INTO run_list_versions (slot, version) VALUES ${Array.from({ length: SLOTS }, (_, slot) => `(${slot}, 0)`).join(', ')}`);
  await sql(`CREATE TRIGGER runs_list_insert AFTER INSERT ON runs FOR EACH ROW ${BUMP}`);
  await sql(`CREATE TRIGGER runs_list_delete AFTER DELETE ON runs FOR EACH ROW ${BUMP}`);
  await sql(`CREATE TRIGGER runs_list_update AFTER UPDATE ON runs FOR EACH ROW IF NOT (${unchanged(LISTED)}) THEN ${BUMP}; END IF`);
  for (const table of NAMED) {
    const columns = table === 'cohorts' ? ['name', 'instructor_id'] : ['name'];
    await sql(`CREATE TRIGGER ${table}_list_rename AFTER UPDATE ON ${table} FOR EACH ROW IF NOT (${unchanged(columns)}) THEN ${BUMP}; END IF`);
  }
  await sql(`CREATE TRIGGER cohorts_list_delete AFTER DELETE ON cohorts FOR EACH ROW ${BUMP}`);
};

export const down: Migration = async ({ context: qi }) => {
  for (const trigger of TRIGGERS) await qi.sequelize.query(`DROP TRIGGER IF EXISTS ${trigger}`);
  await qi.dropTable('run_list_versions');
};
