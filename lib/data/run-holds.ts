import 'server-only';
import { QueryTypes } from 'sequelize';
import type { UnitSystem } from '../calc/units';
import { parseHoldReadings, type HoldPoint } from '../record/hold-readings';
import { AppError } from '../http/errors';
import { RunHold, sequelize } from '@/models';
import type { Role } from '@/models/user';
import { assertRole, type SessionUser } from '../auth/session';
import { loadRun } from './run-report';

/** Who may add hold readings to a run they can see (on the run report). */
export const HOLD_ROLES: readonly Role[] = ['instructor', 'researcher', 'admin'];

/** A run's hold readings, one point per pass held after and time (loads in N, index 0 = position 1). */
export async function loadRunHolds(runId: number, studCount: number): Promise<HoldPoint[]> {
  const rows = await sequelize.query<{ after_pass: number; elapsed_s: number; position: number; load_n: number }>(
    'SELECT after_pass, elapsed_s, position, load_n FROM run_holds WHERE run_id = ? ORDER BY after_pass, elapsed_s, position',
    { type: QueryTypes.SELECT, replacements: [runId] },
  );
  const points: HoldPoint[] = [];
  for (const row of rows) {
    let point = points[points.length - 1];
    if (!point || point.afterPass !== row.after_pass || point.elapsedS !== row.elapsed_s) {
      point = { afterPass: row.after_pass, elapsedS: row.elapsed_s, loadsN: new Array<number>(studCount).fill(0) };
      points.push(point);
    }
    point.loadsN[row.position - 1] = row.load_n;
  }
  return points;
}

/**
 * Reads hold readings (typed or uploaded text, loads in the given units) for a run the user may see
 * and stores them in one transaction, replacing earlier holds after the same passes.
 * @throws AppError `forbidden` for a trainee, `not_found` for a run not theirs, `invalid_input` naming the line.
 */
export async function saveRunHolds(user: SessionUser | null, runId: number, text: string, units: UnitSystem): Promise<{ points: number }> {
  assertRole(user, HOLD_ROLES);
  const { run } = await loadRun(user, runId);
  const passCount = Math.max(0, ...run.steps.map((s) => s.pass));
  if (passCount === 0) throw new AppError('invalid_input', 'This run has no steps yet: hold readings follow a pass.', { field: 'holds' });
  const points = parseHoldReadings(text, { studCount: run.studCount, passCount, units });
  await sequelize.transaction(async (transaction) => {
    await RunHold.destroy({ where: { runId, afterPass: [...new Set(points.map((p) => p.afterPass))] }, transaction });
    await RunHold.bulkCreate(
      points.flatMap((p) => p.loadsN.map((loadN, i) => ({ runId, afterPass: p.afterPass, elapsedS: p.elapsedS, position: i + 1, loadN }))),
      { transaction },
    );
  });
  return { points: points.length };
}
