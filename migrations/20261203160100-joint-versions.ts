import { DataTypes, QueryTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

/**
 * Runs pinned to what they were measured with: `joint_versions` keeps a snapshot of a joint and its
 * positions each time it changes (an edit, an accepted calibration); runs get `joint_version_id` and
 * `calibration_session_id`. A corrected calibration keeps its own record (`calibration_corrections`)
 * and every run it recomputes keeps its old figures beside the new (`run_figure_history`).
 * Existing joints get a first version from their current state, and their runs point at it.
 */
export const up: Migration = async ({ context: qi }) => {
  await qi.createTable('joint_versions', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    joint_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'joints', key: 'id' }, onDelete: 'CASCADE' },
    version_number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    snapshot: { type: DataTypes.JSON, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('joint_versions', ['joint_id', 'version_number'], { unique: true, name: 'joint_versions_joint_number' });
  await qi.addColumn('runs', 'joint_version_id', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'joint_versions', key: 'id' } });
  await qi.addColumn('runs', 'calibration_session_id', { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'calibration_sessions', key: 'id' } });
  await qi.createTable('calibration_corrections', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    session_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'calibration_sessions', key: 'id' }, onDelete: 'CASCADE' },
    corrected_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' } },
    reason: { type: DataTypes.STRING(400), allowNull: false },
    old_table_text: { type: DataTypes.TEXT, allowNull: false },
    runs_recomputed: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.createTable('run_figure_history', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    run_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
    correction_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'calibration_corrections', key: 'id' }, onDelete: 'CASCADE' },
    old_figures: { type: DataTypes.JSON, allowNull: false },
    new_figures: { type: DataTypes.JSON, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  const joints = await qi.sequelize.query<Record<string, unknown>>('SELECT * FROM joints', { type: QueryTypes.SELECT });
  for (const joint of joints) {
    const positions = await qi.sequelize.query<{ position: number; calibration_factor: number; note: string | null }>(
      'SELECT position, calibration_factor, note FROM joint_positions WHERE joint_id = ? ORDER BY position',
      { type: QueryTypes.SELECT, replacements: [joint.id] },
    );
    const snapshot = {
      name: joint.name, nominalSize: joint.nominal_size, pressureClass: joint.pressure_class, studCount: joint.stud_count,
      threadSystem: joint.thread_system, threadDiameter: joint.thread_diameter, threadPitch: joint.thread_pitch,
      studGrade: joint.stud_grade, nutGrade: joint.nut_grade, washer: joint.washer, gasketType: joint.gasket_type,
      targetLoadN: joint.target_load_n, bandPercent: joint.band_percent,
      positions: positions.map((p) => ({ position: Number(p.position), calibrationFactor: Number(p.calibration_factor), note: p.note })),
    };
    await qi.sequelize.query('INSERT INTO joint_versions (joint_id, version_number, snapshot, created_at) VALUES (?, 1, ?, NOW())', { replacements: [joint.id, JSON.stringify(snapshot)] });
    // Not LAST_INSERT_ID(): the next query may run on another pooled connection.
    await qi.sequelize.query('UPDATE runs SET joint_version_id = (SELECT id FROM joint_versions WHERE joint_id = ? AND version_number = 1) WHERE joint_id = ?', { replacements: [joint.id, joint.id] });
  }
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('run_figure_history');
  await qi.dropTable('calibration_corrections');
  await qi.removeColumn('runs', 'calibration_session_id');
  await qi.removeColumn('runs', 'joint_version_id');
  await qi.dropTable('joint_versions');
};
