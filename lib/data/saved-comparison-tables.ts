import 'server-only';
import { createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { CURRENT_PACKAGE_LAYOUT, dataTablesOf, FINAL_LOADS_TABLE, READINGS_TABLE, STEPS_TABLE, tableCsv, type PackageLayout } from '../saved-comparisons/data-tables';
import { sequelize } from '@/models';
import { pseudonymFor } from './pseudonym';

export const sha256Hex = (data: string | Uint8Array) => createHash('sha256').update(data).digest('hex');

/** One run of a saved comparison: its id and the key of the group it was compared in. */
export interface FrozenRun {
  id: number;
  group: string;
}

export interface DataTables {
  /** CSV text by path, in DATA_TABLES order. */
  files: Record<string, string>;
  /** sha256 of the lines "<sha256>  <path>\n" of the data files in DATA_TABLES order (sha256sum's format). */
  dataSha256: string;
}

const isoSeconds = (value: Date | string) => new Date(value).toISOString().replace(/\.\d{3}Z$/, 'Z');

/**
 * The data a saved comparison used, as the package's CSV tables, rows in key order, so the same
 * runs give the same bytes and the same hash. Operators are pseudonyms keyed by the saved
 * comparison (the same in every download of it, unrelated to other exports). `layout` is the one the
 * comparison was frozen with (layout 1 has no gasket columns).
 */
export async function dataTables(slug: string, runs: readonly FrozenRun[], groupLabels: ReadonlyMap<string, string>, layout: PackageLayout = CURRENT_PACKAGE_LAYOUT): Promise<DataTables> {
  const tables = dataTablesOf(layout);
  const runsTable = tables[0]!;
  const ids = runs.map((r) => r.id);
  const groupOf = new Map(runs.map((r) => [r.id, r.group]));
  const none = !ids.length;
  const runRows = none ? [] : await sequelize.query<{ id: number; operator_id: number; joint_id: number; method_id: number; lubricant_id: number; source: string; status: string; recorded_at: Date; stud_count: number; pass_count: number; target_load_n: number; final_loads_json: string | null; final_gasket_stress_mpa: number | null; gasket_min_seating_mpa: number | null }>(
    'SELECT id, operator_id, joint_id, method_id, lubricant_id, source, status, recorded_at, stud_count, pass_count, target_load_n, final_loads_json, final_gasket_stress_mpa, gasket_min_seating_mpa FROM runs WHERE id IN (?) ORDER BY id',
    { type: QueryTypes.SELECT, replacements: [ids] },
  );
  const steps = none ? [] : await sequelize.query<{ id: number; run_id: number; step_order: number; pass_number: number; position: number; applied_torque_nm: number | null; applied_pressure_bar: number | null; time_s: number | null }>(
    'SELECT id, run_id, step_order, pass_number, position, applied_torque_nm, applied_pressure_bar, time_s FROM tightening_steps WHERE run_id IN (?) ORDER BY id',
    { type: QueryTypes.SELECT, replacements: [ids] },
  );
  const readings = none ? [] : await sequelize.query<{ step_id: number; run_id: number; position: number; load_n: number }>(
    'SELECT step_id, run_id, position, load_n FROM readings WHERE run_id IN (?) ORDER BY step_id, position',
    { type: QueryTypes.SELECT, replacements: [ids] },
  );
  const operatorKey = `saved-comparison:${slug}`;
  const files: Record<string, string> = {
    [runsTable.path]: tableCsv(runsTable, runRows.map((r) => {
      const group = groupOf.get(r.id) ?? '';
      const row = [r.id, group, groupLabels.get(group) ?? group, pseudonymFor(r.operator_id, operatorKey), r.joint_id, r.method_id, r.lubricant_id, r.source, r.status, isoSeconds(r.recorded_at), r.stud_count, r.pass_count, r.target_load_n];
      return layout === 1 ? row : [...row, r.final_gasket_stress_mpa, r.gasket_min_seating_mpa];
    })),
    [FINAL_LOADS_TABLE.path]: tableCsv(FINAL_LOADS_TABLE, runRows.flatMap((r) => (r.final_loads_json ? (JSON.parse(r.final_loads_json) as number[]) : []).map((load, i) => [r.id, i + 1, load]))),
    [STEPS_TABLE.path]: tableCsv(STEPS_TABLE, steps.map((s) => [s.id, s.run_id, s.step_order, s.pass_number, s.position, s.applied_torque_nm, s.applied_pressure_bar, s.time_s])),
    [READINGS_TABLE.path]: tableCsv(READINGS_TABLE, readings.map((g) => [g.step_id, g.run_id, g.position, g.load_n])),
  };
  const lines = tables.map((t) => `${sha256Hex(files[t.path]!)}  ${t.path}\n`).join('');
  return { files, dataSha256: sha256Hex(lines) };
}

/**
 * A cheap stand-in for the data hash: sha256 of each run's id and last change (`runs.updated_at`,
 * which every write of a run's row, steps or readings moves; a missing run drops its line). Equal
 * fingerprints mean the data tables are as they were; a different one means they may have changed,
 * and the tables are rebuilt to tell.
 */
export async function runsFingerprint(ids: readonly number[]): Promise<string> {
  const rows = ids.length ? await sequelize.query<{ id: number; updated_at: Date }>('SELECT id, updated_at FROM runs WHERE id IN (?) ORDER BY id', { type: QueryTypes.SELECT, replacements: [ids] }) : [];
  return sha256Hex(rows.map((r) => `${r.id}:${new Date(r.updated_at).toISOString()}\n`).join(''));
}
