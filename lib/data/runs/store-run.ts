import { QueryTypes, type Transaction } from 'sequelize';
import { AppError } from '../../http/errors';
import type { NormalisedRun } from '../../record/run-types';
import { Run, sequelize } from '../../../models';
import { storedRunFigures, type StoredRunFigures } from '../../record/run-figures';
import { float64BlobOfJson } from '../../record/float64-blob';
import { runPins } from '../joint-versions';
import type { RunSource, RunStatus } from '@/models/run';
import type { RunCheckReason } from '../../run-check/types';
import { checkBeforeStoring } from './check-before-storing';
import { claimHardwareUse } from './hardware-use';
import { refreshGasketFigures } from './gasket-figures';
import { storeRunAnalysis } from './stored-analysis';

export interface RunHeader {
  jointId: number;
  methodId: number;
  lubricantId: number;
  operatorId: number;
  cohortId: number | null;
  targetLoadN: number;
  bandPercent: number;
  source: RunSource;
  status: RunStatus;
  recordedAt: Date;
  notes?: string | null;
  hardwareSetId?: number | null;
  lubricantLotId?: number | null;
  gasketCondition?: 'new' | 'reused' | null;
  setAsideReason?: string | null;
  setAsideById?: number | null;
  /** Who put the run in (the signed-in person); the way in is `source`. */
  recordedById?: number | null;
  /** Simulate's idempotency key (sha256 of the normalised header, gasket and seed); unique. */
  simulationKey?: string | null;
}

/** Rows per multi-row INSERT: large enough to amortise round trips, small enough for max_allowed_packet. */
const READINGS_PER_INSERT = 5000;
/** Readings per bulk (binary protocol) chunk. */
const BULK_READINGS_PER_CHUNK = 20_000;

const sqlNumber = (value: number | null | undefined): string => {
  if (value === null || value === undefined) return 'NULL';
  if (!Number.isFinite(value)) throw new AppError('invalid_input', `A value is not a finite number (${value}).`);
  return String(value);
};

/**
 * Stores a normalised run (header, steps, readings and the per-run figures) inside the given
 * transaction, with multi-row INSERTs (no row-by-row writes). The caller owns the transaction, so
 * a failure anywhere leaves nothing behind. Returns the new run's id.
 *
 * A run stored as complete passes the run check first (lib/run-check, through
 * {@link checkBeforeStoring}): one that fails is stored as "needs review" with its reasons, in
 * the same INSERT. The live stream's run is checked when it is finished ({@link completeRecordedRun}).
 */
export async function storeRun(header: RunHeader, run: NormalisedRun, transaction: Transaction): Promise<number> {
  return (await storeRunWithStatus(header, run, transaction)).runId;
}

const asBuffer = (bytes: Uint8Array | null) => (bytes ? Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength) : null);

/** The run's stored figures with the float64 bytes of the same final loads and drift (what comparisons read). */
function figuresToStore(run: NormalisedRun): StoredRunFigures & { finalLoadsF64: Buffer | null; driftF64: Buffer | null } {
  const figures = storedRunFigures(run);
  return { ...figures, finalLoadsF64: asBuffer(float64BlobOfJson(figures.finalLoadsJson)), driftF64: asBuffer(float64BlobOfJson(figures.driftJson)) };
}

/** {@link storeRun}, also giving the status the run was stored with and the check's reasons. */
export async function storeRunWithStatus(header: RunHeader, run: NormalisedRun, transaction: Transaction): Promise<{ runId: number; status: RunStatus; reasons: RunCheckReason[] }> {
  if (run.steps.some((step) => step.loadsN.length !== run.studCount)) {
    throw new AppError('invalid_input', `Every step needs a load for each of the ${run.studCount} studs.`);
  }
  if (run.steps.some((step) => (step.covers ?? []).some((c) => !Number.isInteger(c.position) || c.position < 1 || c.position > run.studCount))) {
    throw new AppError('invalid_input', `A tensioner step covers a position outside 1–${run.studCount}.`);
  }
  const checked = header.status === 'complete' ? await checkBeforeStoring(header, run, transaction) : null;
  const pins = await runPins(header.jointId, transaction);
  const hardwareUseNumber = header.hardwareSetId ? await claimHardwareUse(header.hardwareSetId, transaction) : null;
  const { id: runId } = await Run.create(
    {
      ...header,
      ...pins,
      hardwareUseNumber,
      status: checked?.status ?? header.status,
      reviewReasons: checked?.reasonsJson ?? null,
      simulationKey: header.simulationKey ?? null,
      setAsideReason: header.setAsideReason ?? null,
      setAsideById: header.setAsideById ?? null,
      notes: header.notes ?? null,
      ...figuresToStore(run),
    },
    { transaction },
  );
  await appendSteps(runId, run, 0, transaction);
  await refreshGasketFigures(sequelize, { runIds: [runId] }, transaction);
  // The analysis the report's API serves, computed now and kept with the run (same transaction).
  await storeRunAnalysis(runId, run, transaction);
  return { runId, status: checked?.status ?? header.status, reasons: checked?.reasons ?? [] };
}

/** The driver connection a Sequelize transaction holds (mariadb's, with its binary bulk `batch`). */
interface BulkConnection {
  batch: (sql: string, values: unknown[][]) => Promise<unknown>;
}

function bulkConnectionOf(transaction: Transaction): BulkConnection | null {
  const connection = (transaction as unknown as { connection?: Partial<BulkConnection> }).connection;
  return connection && typeof connection.batch === 'function' ? (connection as BulkConnection) : null;
}

const finiteOrNull = (value: number | null | undefined): number | null => {
  if (value === null || value === undefined) return null;
  if (!Number.isFinite(value)) throw new AppError('invalid_input', `A value is not a finite number (${value}).`);
  return value;
};

/**
 * Appends steps (and their readings) to an existing run, starting after `existingSteps` steps.
 * Used by storeRun and by the live stream. Rows go in with the driver's binary bulk protocol
 * (mariadb `batch`, one round trip per chunk) on the transaction's own connection; where that is
 * not available, with multi-row INSERT statements. Never row by row.
 */
export async function appendSteps(runId: number, run: NormalisedRun, existingSteps: number, transaction: Transaction): Promise<void> {
  const steps = run.steps.slice(existingSteps);
  const bulk = bulkConnectionOf(transaction);
  await insertSteps(runId, run.studCount, steps, bulk, transaction);
}

async function insertSteps(runId: number, studCount: number, steps: NormalisedRun['steps'], bulk: BulkConnection | null, transaction: Transaction): Promise<void> {
  const stepsPerChunk = Math.max(1, Math.floor((bulk ? BULK_READINGS_PER_CHUNK : READINGS_PER_INSERT) / studCount));
  for (let start = 0; start < steps.length; start += stepsPerChunk) {
    const chunk = steps.slice(start, start + stepsPerChunk);
    if (bulk) {
      await bulk.batch(
        'INSERT INTO tightening_steps (run_id, step_order, pass_number, position, applied_torque_nm, applied_pressure_bar, time_s) VALUES (?,?,?,?,?,?,?)',
        chunk.map((s) => [runId, s.order, s.pass, s.position, finiteOrNull(s.appliedTorqueNm), finiteOrNull(s.appliedPressureBar), finiteOrNull(s.timeS)]),
      );
    } else {
      const stepValues = chunk
        .map((s) => `(${runId},${sqlNumber(s.order)},${sqlNumber(s.pass)},${sqlNumber(s.position)},${sqlNumber(s.appliedTorqueNm)},${sqlNumber(s.appliedPressureBar)},${sqlNumber(s.timeS)})`)
        .join(',');
      await sequelize.query(
        `INSERT INTO tightening_steps (run_id, step_order, pass_number, position, applied_torque_nm, applied_pressure_bar, time_s) VALUES ${stepValues}`,
        { type: QueryTypes.INSERT, transaction },
      );
    }
    const first = chunk[0]!.order;
    const last = chunk[chunk.length - 1]!.order;
    const ids = await sequelize.query<{ id: number; step_order: number }>(
      'SELECT id, step_order FROM tightening_steps WHERE run_id = ? AND step_order BETWEEN ? AND ?',
      { type: QueryTypes.SELECT, transaction, replacements: [runId, first, last] },
    );
    const idByOrder = new Map(ids.map((row) => [Number(row.step_order), Number(row.id)]));
    if (bulk) {
      const rows: unknown[][] = [];
      for (const step of chunk) {
        const stepId = idByOrder.get(step.order);
        step.loadsN.forEach((load, index) => rows.push([stepId, index + 1, runId, finiteOrNull(load)]));
      }
      await bulk.batch('INSERT INTO readings (step_id, position, run_id, load_n) VALUES (?,?,?,?)', rows);
    } else {
      const readingValues: string[] = [];
      for (const step of chunk) {
        const stepId = idByOrder.get(step.order);
        step.loadsN.forEach((load, index) => readingValues.push(`(${stepId},${index + 1},${runId},${sqlNumber(load)})`));
      }
      await sequelize.query(`INSERT INTO readings (step_id, position, run_id, load_n) VALUES ${readingValues.join(',')}`, {
        type: QueryTypes.INSERT,
        transaction,
      });
    }
    await insertCovers(runId, chunk, idByOrder, transaction);
  }
}

/** The studs each multi-stud (tensioner) step covered, with applied and residual load: one multi-row INSERT per chunk. */
async function insertCovers(runId: number, chunk: NormalisedRun['steps'], idByOrder: Map<number, number>, transaction: Transaction): Promise<void> {
  const values: string[] = [];
  for (const step of chunk) {
    for (const cover of step.covers ?? []) {
      values.push(`(${idByOrder.get(step.order)},${sqlNumber(cover.position)},${runId},${sqlNumber(cover.appliedN)},${sqlNumber(cover.residualN)})`);
    }
  }
  if (values.length === 0) return;
  await sequelize.query(`INSERT INTO step_positions (step_id, position, run_id, applied_n, residual_n) VALUES ${values.join(',')}`, { type: QueryTypes.INSERT, transaction });
}

/**
 * Completes a recorded (live) run whose steps were just appended: recomputes its figures and runs
 * the same check as {@link storeRun}; the status becomes complete or needs review. Inside the
 * caller's transaction.
 */
export async function completeRecordedRun(runId: number, ids: { jointId: number; methodId: number; bandPercent: number }, run: NormalisedRun, transaction: Transaction): Promise<'complete' | 'needs_review'> {
  await refreshRunFigures(runId, run, transaction);
  const checked = await checkBeforeStoring(ids, run, transaction);
  await Run.update({ status: checked.status, reviewReasons: checked.reasonsJson }, { where: { id: runId }, transaction });
  return checked.status;
}

/**
 * Recomputes the stored per-run figures (gasket figures included) and the stored analysis after a run's readings changed
 * (a live run finished, a correction): every path that changes readings calls this.
 */
export async function refreshRunFigures(runId: number, run: NormalisedRun, transaction: Transaction): Promise<void> {
  const { studCount: _unchanged, ...figures } = figuresToStore(run);
  await Run.update(figures, { where: { id: runId }, transaction });
  await refreshGasketFigures(sequelize, { runIds: [runId] }, transaction);
  await storeRunAnalysis(runId, run, transaction);
}
