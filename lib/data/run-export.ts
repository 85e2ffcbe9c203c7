import 'server-only';
import { QueryTypes } from 'sequelize';
import { z } from 'zod';
import { sequelize } from '@/models';
import { csvRows, type CsvValue } from '@/lib/export/write-csv';
import { csvLoad } from '@/lib/export/load-resolution';
import { NEWTONS_PER_LBF, nmToTorque } from '@/lib/ingest/units';
import type { SessionUser } from '../auth/session';
import { operatorLabel } from './scope';
import { runListFilterSql, runListQuerySchema, selectRunRows } from './runs';

/** At most this many runs in one selection export; narrow the filters for more. */
export const EXPORT_MAX_RUNS = 5000;
const RUNS_PER_QUERY = 50;

export const exportFormatSchema = z.object({ format: z.enum(['csv', 'json']).default('csv'), units: z.enum(['si', 'us']).optional() }).strict();

/** Splits the query into the runs filters (validated like GET /api/runs) and the export options. */
export function parseExportQuery(params: Record<string, string>) {
  const { format, units, ...filters } = params;
  const options = exportFormatSchema.parse({ format, units });
  const query = runListQuerySchema.parse(filters);
  return { options, query };
}

interface RunMeta {
  id: number;
  recordedAt: string;
  joint: string;
  method: string;
  lubricant: string;
  operator: string;
  cohort: string;
  status: string;
  source: string;
  studCount: number;
  targetLoadN: number;
}

interface ReadingRow {
  run_id: number;
  step_order: number;
  pass_number: number;
  tightened: number;
  position: number;
  load_n: number;
  applied_torque_nm: number | null;
  applied_pressure_bar: number | null;
  time_s: number | null;
}

async function selectedRuns(user: SessionUser, query: z.infer<typeof runListQuerySchema>): Promise<RunMeta[]> {
  const filter = await runListFilterSql(user, query);
  const runs = await selectRunRows(filter, 'r.recorded_at ASC, r.id ASC', EXPORT_MAX_RUNS);
  return runs.map((r) => ({
    id: r.id,
    recordedAt: new Date(r.recorded_at).toISOString(),
    joint: r.joint_name,
    method: r.method_name,
    lubricant: r.lubricant_name,
    operator: operatorLabel(user, { id: r.operator_id, name: r.operator_name }),
    cohort: r.cohort_name ?? '',
    status: r.status,
    source: r.source,
    studCount: r.stud_count,
    targetLoadN: r.target_load_n,
  }));
}

async function* readingsOf(runIds: number[]): AsyncGenerator<ReadingRow[]> {
  for (let i = 0; i < runIds.length; i += RUNS_PER_QUERY) {
    const ids = runIds.slice(i, i + RUNS_PER_QUERY);
    yield await sequelize.query<ReadingRow>(
      `SELECT r.run_id, s.step_order, s.pass_number, s.position AS tightened, r.position, r.load_n, s.applied_torque_nm, s.applied_pressure_bar, s.time_s
       FROM readings r JOIN tightening_steps s ON s.id = r.step_id
       WHERE r.run_id IN (?) ORDER BY r.run_id, s.step_order, r.position`,
      { type: QueryTypes.SELECT, replacements: [ids] },
    );
  }
}

/**
 * The selected runs, one CSV row per reading (every stud after every step), in SI (N, N·m) or US
 * (lbf, ft-lb) units; text cells neutralised against formula injection. Researchers see operators
 * as pseudonyms. The step columns match the one-run export, so a one-run selection re-imports as
 * a step table. Streams: runs are read 50 at a time.
 */
export async function* exportSelectionCsv(user: SessionUser, query: z.infer<typeof runListQuerySchema>, units: 'si' | 'us'): AsyncGenerator<string> {
  const runs = await selectedRuns(user, query);
  const us = units === 'us';
  yield csvRows([['run_id', 'recorded_at', 'joint', 'method', 'lubricant', 'operator', 'cohort', 'status', 'step', 'pass', 'tightened_position', 'position', us ? 'load_lbf' : 'load_N', us ? 'applied_torque_ft-lb' : 'applied_torque_Nm', 'applied_pressure_bar', 'time_s']]);
  const meta = new Map(runs.map((r): [number, CsvValue[]] => [r.id, [r.id, r.recordedAt, r.joint, r.method, r.lubricant, r.operator, r.cohort, r.status]]));
  const orNull = (n: number | null) => (n === null ? null : Number(n));
  for await (const rows of readingsOf(runs.map((r) => r.id))) {
    yield csvRows(rows.map((row) => [
      ...meta.get(Number(row.run_id))!,
      Number(row.step_order), Number(row.pass_number), Number(row.tightened), Number(row.position),
      csvLoad(Number(row.load_n), units),
      row.applied_torque_nm == null ? null : nmToTorque(Number(row.applied_torque_nm), us ? 'ft-lb' : 'N·m'),
      orNull(row.applied_pressure_bar), orNull(row.time_s),
    ]));
  }
}

/** The same selection as JSON: `{ units, runs: [{ ...header, steps: [{ order, pass, position, loads }] }] }`, streamed run by run. */
export async function* exportSelectionJson(user: SessionUser, query: z.infer<typeof runListQuerySchema>, units: 'si' | 'us'): AsyncGenerator<string> {
  const runs = await selectedRuns(user, query);
  const us = units === 'us';
  const byId = new Map(runs.map((r) => [r.id, r]));
  yield `{"units":${JSON.stringify(us ? { load: 'lbf', torque: 'ft-lb', pressure: 'bar', time: 's' } : { load: 'N', torque: 'N·m', pressure: 'bar', time: 's' })},"runs":[`;
  let first = true;
  for await (const rows of readingsOf(runs.map((r) => r.id))) {
    const grouped = new Map<number, Map<number, { order: number; pass: number; position: number; appliedTorque: number | null; appliedPressureBar: number | null; timeS: number | null; loads: number[] }>>();
    for (const row of rows) {
      const runSteps = grouped.get(Number(row.run_id)) ?? new Map();
      grouped.set(Number(row.run_id), runSteps);
      const order = Number(row.step_order);
      let step = runSteps.get(order);
      if (!step) {
        step = {
          order,
          pass: Number(row.pass_number),
          position: Number(row.tightened),
          appliedTorque: row.applied_torque_nm == null ? null : nmToTorque(Number(row.applied_torque_nm), us ? 'ft-lb' : 'N·m'),
          appliedPressureBar: row.applied_pressure_bar == null ? null : Number(row.applied_pressure_bar),
          timeS: row.time_s == null ? null : Number(row.time_s),
          loads: [],
        };
        runSteps.set(order, step);
      }
      step.loads[Number(row.position) - 1] = us ? Number(row.load_n) / NEWTONS_PER_LBF : Number(row.load_n);
    }
    let chunk = '';
    for (const [runId, steps] of grouped) {
      const meta = byId.get(runId)!;
      chunk += `${first ? '' : ','}${JSON.stringify({ ...meta, targetLoad: us ? meta.targetLoadN / NEWTONS_PER_LBF : meta.targetLoadN, steps: [...steps.values()] })}`;
      first = false;
    }
    yield chunk;
  }
  yield ']}';
}
