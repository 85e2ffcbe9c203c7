import { DataTypes } from 'sequelize';
import type { Migration } from '../lib/platform/migrator';

export const up: Migration = async ({ context: qi }) => {
  const fk = (model: string, allowNull = false, onDelete = 'RESTRICT') => ({
    type: DataTypes.INTEGER.UNSIGNED,
    allowNull,
    references: { model, key: 'id' },
    onDelete,
  });

  await qi.createTable('runs', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    joint_id: fk('joints'),
    method_id: fk('methods'),
    lubricant_id: fk('lubricants'),
    operator_id: fk('users'),
    cohort_id: fk('cohorts', true, 'SET NULL'),
    target_load_n: { type: DataTypes.DOUBLE, allowNull: false },
    band_percent: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 10 },
    source: { type: DataTypes.ENUM('upload', 'manual', 'simulated', 'live'), allowNull: false },
    status: { type: DataTypes.ENUM('draft', 'recording', 'complete', 'set_aside'), allowNull: false },
    set_aside_reason: { type: DataTypes.STRING(400), allowNull: true },
    set_aside_by_id: fk('users', true, 'SET NULL'),
    recorded_at: { type: DataTypes.DATE, allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: true },
    // Per-run figures, stored when the run is saved and recomputed when it changes, so that
    // comparisons across thousands of runs aggregate in SQL.
    stud_count: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
    step_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    pass_count: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 0 },
    final_mean_n: { type: DataTypes.DOUBLE, allowNull: true },
    final_sd_n: { type: DataTypes.DOUBLE, allowNull: true },
    final_cv: { type: DataTypes.DOUBLE, allowNull: true },
    final_min_n: { type: DataTypes.DOUBLE, allowNull: true },
    final_max_n: { type: DataTypes.DOUBLE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  for (const column of ['method_id', 'lubricant_id', 'cohort_id', 'operator_id', 'joint_id']) {
    await qi.addIndex('runs', [column, 'recorded_at'], { name: `runs_${column.replace('_id', '')}_recorded` });
  }
  await qi.addIndex('runs', ['recorded_at'], { name: 'runs_recorded' });

  await qi.createTable('tightening_steps', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    run_id: fk('runs', false, 'CASCADE'),
    step_order: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    pass_number: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
    position: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
    applied_torque_nm: { type: DataTypes.DOUBLE, allowNull: true },
    applied_pressure_bar: { type: DataTypes.DOUBLE, allowNull: true },
    time_s: { type: DataTypes.DOUBLE, allowNull: true },
  });
  await qi.addIndex('tightening_steps', ['run_id', 'step_order'], { name: 'steps_run_order', unique: true });

  await qi.createTable('readings', {
    step_id: {
      type: DataTypes.INTEGER.UNSIGNED,
      primaryKey: true,
      references: { model: 'tightening_steps', key: 'id' },
      onDelete: 'CASCADE',
    },
    position: { type: DataTypes.SMALLINT.UNSIGNED, primaryKey: true },
    run_id: fk('runs', false, 'CASCADE'),
    load_n: { type: DataTypes.DOUBLE, allowNull: false },
  });
  await qi.addIndex('readings', ['run_id', 'step_id'], { name: 'readings_run_step' });

  await qi.createTable('uploads', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    run_id: fk('runs', true, 'CASCADE'),
    uploaded_by_id: fk('users'),
    file_name: { type: DataTypes.STRING(255), allowNull: false },
    sha256: { type: DataTypes.CHAR(64), allowNull: false },
    size_bytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    content_type: { type: DataTypes.STRING(120), allowNull: false },
    content: { type: DataTypes.BLOB('long'), allowNull: false },
    parse_report: { type: DataTypes.JSON, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('uploads', ['sha256'], { name: 'uploads_sha256', unique: true });

  await qi.createTable('run_comments', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    run_id: fk('runs', false, 'CASCADE'),
    author_id: fk('users'),
    body: { type: DataTypes.TEXT, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('run_comments', ['run_id'], { name: 'run_comments_run' });
};

export const down: Migration = async ({ context: qi }) => {
  await qi.dropTable('run_comments');
  await qi.dropTable('uploads');
  await qi.dropTable('readings');
  await qi.dropTable('tightening_steps');
  await qi.dropTable('runs');
};
