import 'server-only';
import { RunHold, sequelize } from '@/models';
import { parseHoldReadings } from '@/lib/record/hold-readings';
import { AppError } from '@/lib/http/errors';
import { loadToN } from '@/lib/ingest/units';
import { resolveRunHeader } from '@/lib/data/record';
import { manualEntrySchema } from '@/lib/record/manual-entry-schema';
import { planSteps } from '@/lib/record/step-plan';
import { stepOfPull } from '@/lib/record/manual-pulls';
import type { NormalisedRun } from '@/lib/record/run-types';
import type { SessionUser } from '@/lib/auth/session';
import { storeRunWithStatus } from './store-run';
import type { RunStatus } from '@/models/run';
import { formatDecimals } from '@/lib/calc/units';

const fmtKn = (n: number) => `${formatDecimals(n / 1000, 2, 0)} kN`;

/**
 * Saves a run typed into the grid (source 'manual', status complete) in one transaction. The step
 * order comes from the method's pass orders for the joint's stud count (see planSteps); every
 * entered row must give a load for every stud. Loads are converted to N here. A tensioner method's
 * rows may name several studs with their applied loads (`pulls`, lib/record/manual-pulls.ts); the
 * covers go to step_positions through storeRunWithStatus, as an uploaded run's do.
 *
 * @throws AppError('invalid_input') naming the row (step) and stud of the first bad cell, with
 *   `row` and `column` (`Stud N`) details; AppError('forbidden') for an operator this person may
 *   not record as.
 */
export async function saveManualRun(user: SessionUser, input: unknown): Promise<{ runId: number; stepCount: number; status: RunStatus }> {
  const parsed = manualEntrySchema.safeParse(input);
  if (!parsed.success) {
    const issue = parsed.error.issues[0];
    const [field = 'rows', row, column] = issue?.path ?? [];
    if (field === 'rows' && typeof row === 'number' && typeof column === 'number') {
      throw new AppError('invalid_input', `Row ${row + 1}, stud ${column + 1}: ${issue!.message}`, { row: row + 1, column: `Stud ${column + 1}` });
    }
    const stud = issue?.path[3];
    if (field === 'pulls' && typeof row === 'number' && typeof stud === 'number') {
      throw new AppError('invalid_input', `Row ${row + 1}, applied load of stud ${stud + 1}: ${issue!.message}`, { row: row + 1, column: `Applied ${stud + 1}` });
    }
    throw new AppError('invalid_input', issue?.message ?? 'The grid is not valid.', { field: String(field) });
  }
  const { header: headerInput, unit, rows, pulls } = parsed.data;
  if (unit === 'N' && parsed.data.holds?.trim()) throw new AppError('invalid_input', 'Hold readings are typed in kN or lbf: choose kN or lbf as the unit, or add the holds on the run report.', { field: 'holds' });
  const resolved = await resolveRunHeader(user, headerInput, 'manual', 'complete');
  const { joint, method } = resolved;
  if (pulls?.length && method.toolKind !== 'hydraulic_tensioner') {
    throw new AppError('invalid_input', `Only a tensioner step pulls several studs at once; the method "${method.name}" tightens one stud per step.`, { field: 'rows' });
  }
  const plan = planSteps(method, joint.studCount);
  if (plan.problem) throw new AppError('invalid_input', plan.problem, { field: 'methodId', fieldErrors: { methodId: [plan.problem] } });
  let last = rows.length;
  while (last > 0 && rows[last - 1]!.every((v) => v === null)) last--;
  if (last === 0) throw new AppError('invalid_input', 'Enter the loads of at least one step.', { field: 'rows', row: 1 });
  if (last > plan.steps.length) throw new AppError('invalid_input', `The method has ${plan.steps.length} steps but the grid has ${last} rows.`, { field: 'rows' });
  const run: NormalisedRun = { studCount: joint.studCount, targetLoadN: joint.targetLoadN, steps: [] };
  for (let r = 0; r < last; r++) {
    const row = rows[r]!;
    const step = plan.steps[r]!;
    const where = `Row ${r + 1} (pass ${step.pass}, stud ${step.position} tightened)`;
    if (row.length !== joint.studCount) throw new AppError('invalid_input', `${where}: expected ${joint.studCount} loads, got ${row.length}.`, { row: r + 1 });
    const loadsN = row.map((value, i) => {
      const stud = `Stud ${i + 1}`;
      if (value === null) throw new AppError('invalid_input', `${where}, stud ${i + 1}: the load is missing. Type the value the display shows (0 for a stud not yet loaded).`, { row: r + 1, column: stud });
      const n = loadToN(value, unit);
      if (n < 0) throw new AppError('invalid_input', `${where}, stud ${i + 1}: the load ${value} ${unit} is negative. A stud's load cannot be below zero: check the sign.`, { row: r + 1, column: stud });
      if (n > joint.maxStudLoadN) {
        throw new AppError('invalid_input', `${where}, stud ${i + 1}: the load ${value} ${unit} is above the limit of ${fmtKn(joint.maxStudLoadN)} (${joint.maxStudLoadSource}). Check the unit (${unit}).`, { row: r + 1, column: stud });
      }
      return n;
    });
    // A tensioner row names the studs it pulled, with their applied loads (stored as ingest stores them: step_positions).
    const pull = pulls?.[r];
    const pulled = pull ? stepOfPull(pull, loadsN, { studCount: joint.studCount, unit, where: `Row ${r + 1} (pass ${step.pass})`, row: r + 1, maxStudLoadN: joint.maxStudLoadN, maxStudLoadText: `${fmtKn(joint.maxStudLoadN)} (${joint.maxStudLoadSource})` }) : null;
    run.steps.push({ order: r + 1, pass: step.pass, position: pulled?.position ?? step.position, loadsN, ...(pulled?.covers ? { covers: pulled.covers } : {}) });
  }
  const holds = parsed.data.holds?.trim() ? manualHolds(parsed.data.holds, run, unit) : [];
  const { runId, status } = await sequelize.transaction(async (transaction) => {
    const stored = await storeRunWithStatus(resolved.header, run, transaction);
    const rows = holds.flatMap((p) => p.loadsN.map((loadN, i) => ({ runId: stored.runId, afterPass: p.afterPass, elapsedS: p.elapsedS, position: i + 1, loadN })));
    if (rows.length) await RunHold.bulkCreate(rows, { transaction });
    return stored;
  });
  return { runId, stepCount: run.steps.length, status };
}

/** The grid's hold readings, read before anything is stored (kN, or lbf when the grid is in lbf), after the grid's last pass by default. */
function manualHolds(text: string, run: NormalisedRun, unit: 'kN' | 'N' | 'lbf') {
  const passCount = Math.max(...run.steps.map((s) => s.pass));
  return parseHoldReadings(text, { studCount: run.studCount, passCount, units: unit === 'lbf' ? 'us' : 'si' });
}
