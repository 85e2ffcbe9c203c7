/**
 * The tables of a saved comparison's data package, one definition per table: the CSV file, and for
 * each column its name, Frictionless Table Schema type, description and unit. The same definitions
 * write the CSV header, the `datapackage.json` schema and the data hash, so they cannot drift apart.
 * Pure and browser-safe.
 */
import { csvRows, type CsvValue } from '../export/write-csv';

export type FieldType = 'integer' | 'number' | 'string' | 'datetime';

export interface TableField {
  name: string;
  type: FieldType;
  description: string;
  /** The unit of a number, or absent for counts, codes and text. */
  unit?: string;
}

export interface TableDefinition {
  /** The resource name in datapackage.json. */
  name: string;
  path: string;
  title: string;
  description: string;
  fields: readonly TableField[];
  primaryKey: readonly string[];
}

/** The runs table as packages frozen before the gasket columns had it (package layout 1). */
const RUNS_TABLE_WITHOUT_GASKET: TableDefinition = {
  name: 'runs',
  path: 'data/runs.csv',
  title: 'Runs',
  description: 'One row per run in the comparison, with the group it was compared in.',
  primaryKey: ['run_id'],
  fields: [
    { name: 'run_id', type: 'integer', description: 'The run number in the lab.' },
    { name: 'group_key', type: 'string', description: 'The key of the group the run was compared in.' },
    { name: 'group_label', type: 'string', description: 'The name of that group as shown in the comparison.' },
    { name: 'operator', type: 'string', description: 'The operator, as a pseudonym that holds within this package only.' },
    { name: 'joint_id', type: 'integer', description: 'The joint tightened.' },
    { name: 'method_id', type: 'integer', description: 'The tightening method used.' },
    { name: 'lubricant_id', type: 'integer', description: 'The lubricant on the threads and nut faces.' },
    { name: 'source', type: 'string', description: 'How the run came in: upload, manual (entered by hand), live or simulated.' },
    { name: 'status', type: 'string', description: 'complete or set_aside.' },
    { name: 'recorded_at', type: 'datetime', description: 'When the run was recorded (UTC).' },
    { name: 'stud_count', type: 'integer', description: 'Studs in the joint.' },
    { name: 'pass_count', type: 'integer', description: 'Passes in the run.' },
    { name: 'target_load_n', type: 'number', description: 'The target preload per stud.', unit: 'N' },
  ],
};

/** The runs table with each run's stored gasket figures, the values Compare used (package layout 2). */
export const RUNS_TABLE: TableDefinition = {
  ...RUNS_TABLE_WITHOUT_GASKET,
  fields: [
    ...RUNS_TABLE_WITHOUT_GASKET.fields,
    {
      name: 'final_gasket_stress_mpa',
      type: 'number',
      description: 'Average gasket stress after the final step: the sum of the final stud loads over the gasket contact area of the joint as recorded. Empty when the joint has no contact area.',
      unit: 'MPa',
    },
    {
      name: 'gasket_min_seating_mpa',
      type: 'number',
      description: 'The minimum seating stress of the joint’s gasket as recorded with the run. Empty when not given.',
      unit: 'MPa',
    },
  ],
};

export const FINAL_LOADS_TABLE: TableDefinition = {
  name: 'final_loads',
  path: 'data/final_loads.csv',
  title: 'Final loads',
  description: 'The final load of each stud of each run, as stored with the run when it was saved: the values the comparison used.',
  primaryKey: ['run_id', 'stud'],
  fields: [
    { name: 'run_id', type: 'integer', description: 'The run (see runs).' },
    { name: 'stud', type: 'integer', description: 'The stud position, 1-based.' },
    { name: 'final_load_n', type: 'number', description: 'The load on the stud at the end of the run.', unit: 'N' },
  ],
};

export const STEPS_TABLE: TableDefinition = {
  name: 'steps',
  path: 'data/steps.csv',
  title: 'Tightening steps',
  description: 'Every tightening step of the runs, in the order they were made.',
  primaryKey: ['step_id'],
  fields: [
    { name: 'step_id', type: 'integer', description: 'The step.' },
    { name: 'run_id', type: 'integer', description: 'The run (see runs).' },
    { name: 'step_order', type: 'integer', description: 'The step’s place in its run, 1-based.' },
    { name: 'pass_number', type: 'integer', description: 'The pass the step belongs to, 1-based.' },
    { name: 'position', type: 'integer', description: 'The stud tightened in this step, 1-based.' },
    { name: 'applied_torque_nm', type: 'number', description: 'The torque applied, where a torque tool was used.', unit: 'N·m' },
    { name: 'applied_pressure_bar', type: 'number', description: 'The tensioner pressure applied, where a tensioner was used.', unit: 'bar' },
    { name: 'time_s', type: 'number', description: 'Time of the step from the start of the run, where logged.', unit: 's' },
  ],
};

export const READINGS_TABLE: TableDefinition = {
  name: 'readings',
  path: 'data/readings.csv',
  title: 'Readings',
  description: 'The load on each stud read after each step.',
  primaryKey: ['step_id', 'position'],
  fields: [
    { name: 'step_id', type: 'integer', description: 'The step after which the loads were read (see steps).' },
    { name: 'run_id', type: 'integer', description: 'The run (see runs).' },
    { name: 'position', type: 'integer', description: 'The stud read, 1-based.' },
    { name: 'load_n', type: 'number', description: 'The load on the stud.', unit: 'N' },
  ],
};

/** The data tables in the order they are hashed and listed. */
export const DATA_TABLES = [RUNS_TABLE, FINAL_LOADS_TABLE, STEPS_TABLE, READINGS_TABLE] as const;

/**
 * The layout of the data tables a saved comparison was frozen with (`saved_comparisons.package_layout`):
 * 1 before the runs table had the gasket columns, 2 since. A package is built in its comparison's
 * layout, so its files still hash to the frozen sha256 when the data has not changed.
 */
export type PackageLayout = 1 | 2;
export const CURRENT_PACKAGE_LAYOUT: PackageLayout = 2;

/** The data tables of a layout, in the order they are hashed and listed. */
export function dataTablesOf(layout: PackageLayout): readonly TableDefinition[] {
  return layout === 1 ? [RUNS_TABLE_WITHOUT_GASKET, FINAL_LOADS_TABLE, STEPS_TABLE, READINGS_TABLE] : DATA_TABLES;
}

/** A table's CSV text: the header from its definition, then its rows (already in key order). */
export function tableCsv(table: TableDefinition, rows: readonly (readonly CsvValue[])[]): string {
  return csvRows([table.fields.map((f) => f.name), ...rows]);
}
