import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { jointGasketOf, type JointGasket } from '../../joints/gasket-input';
import { recordedGasket, storedGasketFigures, type StoredGasketFigures } from '../../record/run-gasket-figures';

/**
 * Fills the stored gasket figures of runs (`final_gasket_stress_mpa`, `gasket_min_seating_mpa`) from
 * their final loads and the gasket they were recorded with (`lib/record/run-gasket-figures.ts`).
 * Raw SQL only (no models), so the migration that back-fills existing runs calls this same code.
 * Reads and writes in batches of {@link BATCH} runs (keyset by id; one multi-row UPDATE per batch),
 * and writes only runs whose figures change.
 */
export interface GasketFigureScope {
  /** These runs only. */
  runIds?: readonly number[];
  /** Runs of this joint pinned to no version or to a version without a gasket snapshot (they follow the joint's current data). */
  unsnapshottedOfJoint?: number;
  /** Also set updated_at, so cached comparisons of the changed runs are recomputed. */
  touch?: boolean;
}

const BATCH = 1000;

interface Row {
  id: number;
  final_loads_json: string | null;
  snapshot_gasket: string | JointGasket | null;
  final_gasket_stress_mpa: number | null;
  gasket_min_seating_mpa: number | null;
  gasket_inner_mm: number | null;
  gasket_outer_mm: number | null;
  gasket_area_mm2: number | null;
  gasket_min_seating_mpa_joint: number | null;
  gasket_max_mpa: number | null;
}

const num = (v: unknown): number | null => (v === null || v === undefined ? null : Number(v));

function figuresOf(row: Row): StoredGasketFigures {
  const snapshot = typeof row.snapshot_gasket === 'string' ? (JSON.parse(row.snapshot_gasket) as JointGasket | null) : row.snapshot_gasket;
  const current = jointGasketOf({ gasketInnerMm: num(row.gasket_inner_mm), gasketOuterMm: num(row.gasket_outer_mm), gasketAreaMm2: num(row.gasket_area_mm2), gasketMinSeatingMpa: num(row.gasket_min_seating_mpa_joint), gasketMaxMpa: num(row.gasket_max_mpa) });
  const loads = row.final_loads_json ? (JSON.parse(row.final_loads_json) as number[]) : null;
  return storedGasketFigures(loads, recordedGasket(snapshot, current));
}

/** Recomputes the stored gasket figures of the runs in `scope`; returns how many runs changed. */
export async function refreshGasketFigures(db: Sequelize, scope: GasketFigureScope, transaction?: Transaction): Promise<number> {
  const where: string[] = [];
  const params: unknown[] = [];
  if (scope.runIds) {
    if (scope.runIds.length === 0) return 0;
    where.push('r.id IN (?)'), params.push(scope.runIds);
  }
  if (scope.unsnapshottedOfJoint !== undefined) {
    where.push("r.joint_id = ? AND (v.id IS NULL OR JSON_EXTRACT(v.snapshot, '$.gasket') IS NULL)"), params.push(scope.unsnapshottedOfJoint);
  }
  let changed = 0;
  for (let after = 0; ; ) {
    const rows = await db.query<Row>(
      `SELECT r.id, r.final_loads_json, JSON_EXTRACT(v.snapshot, '$.gasket') AS snapshot_gasket, r.final_gasket_stress_mpa, r.gasket_min_seating_mpa,
              j.gasket_inner_mm, j.gasket_outer_mm, j.gasket_area_mm2, j.gasket_min_seating_mpa AS gasket_min_seating_mpa_joint, j.gasket_max_mpa
       FROM runs r JOIN joints j ON j.id = r.joint_id LEFT JOIN joint_versions v ON v.id = r.joint_version_id
       WHERE r.id > ?${where.map((w) => ` AND ${w}`).join('')} ORDER BY r.id LIMIT ${BATCH}`,
      { type: QueryTypes.SELECT, replacements: [after, ...params], transaction },
    );
    if (rows.length === 0) return changed;
    after = Number(rows[rows.length - 1]!.id);
    const updates = rows.flatMap((row) => {
      const f = figuresOf(row);
      return f.finalGasketStressMpa === num(row.final_gasket_stress_mpa) && f.gasketMinSeatingMpa === num(row.gasket_min_seating_mpa) ? [] : [{ id: Number(row.id), ...f }];
    });
    if (updates.length > 0) {
      const cases = `CASE id ${updates.map(() => 'WHEN ? THEN ?').join(' ')} END`;
      const values = (pick: (u: (typeof updates)[number]) => number | null) => updates.flatMap((u) => [u.id, pick(u)]);
      await db.query(
        `UPDATE runs SET final_gasket_stress_mpa = ${cases}, gasket_min_seating_mpa = ${cases}${scope.touch ? ', updated_at = NOW()' : ''} WHERE id IN (?)`,
        { type: QueryTypes.UPDATE, replacements: [...values((u) => u.finalGasketStressMpa), ...values((u) => u.gasketMinSeatingMpa), updates.map((u) => u.id)], transaction },
      );
      changed += updates.length;
    }
    if (rows.length < BATCH) return changed;
  }
}
