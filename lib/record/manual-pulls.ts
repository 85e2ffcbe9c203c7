/**
 * Hand-entry rows of a tensioner step that pulls several studs at once: the studs the row names
 * ("1 3 5 7") and each one's applied load (the tool's load while pressurised). The row's loads, read
 * after the tool is released, are the residual loads. Builds `NormalisedStep.covers` the way ingest
 * does (lib/ingest/derive-steps.ts), so the run is stored by the one path (store-run.ts →
 * step_positions). Pure and browser-safe: the grid checks the stud list as it is typed.
 */
import { AppError } from '@/lib/http/errors';
import { loadToN } from '@/lib/ingest/units';
import type { NormalisedStep } from './run-types';
import type { ManualUnit } from './manual-entry-schema';

export type StudListResult = { ok: true; positions: number[] } | { ok: false; problem: string };

/**
 * Reads the studs a row names: whole numbers separated by spaces, commas or semicolons, each a
 * position on the joint (1…studCount) and named once. Order as typed.
 */
export function parseStudList(text: string, studCount: number): StudListResult {
  const tokens = text.split(/[\s,;]+/).filter((t) => t !== '');
  if (tokens.length === 0) return { ok: false, problem: 'name the studs this step pulled, e.g. "1 3 5 7"' };
  const positions: number[] = [];
  for (const token of tokens) {
    if (!/^\d+$/.test(token)) return { ok: false, problem: `"${token}" is not a stud number; separate the numbers with spaces or commas` };
    const position = Number(token);
    if (position < 1 || position > studCount) return { ok: false, problem: `stud ${position} is not on this joint (studs 1 to ${studCount})` };
    if (positions.includes(position)) return { ok: false, problem: `stud ${position} is named twice` };
    positions.push(position);
  }
  return { ok: true, positions };
}

/** One row's pull as the grid sends it: the stud list and the applied loads by position (index 0 = stud 1), in the grid's unit. */
export interface ManualPull {
  studs: string;
  applied: (number | null)[];
}

export interface PullContext {
  studCount: number;
  unit: ManualUnit;
  /** "Row 3 (pass 1)", to start each message. */
  where: string;
  row: number;
  /** The largest believable stud load in N (the grid's own limit) and the same in words with its source, e.g. "412.5 kN (ASTM A193, Table 2)". */
  maxStudLoadN: number;
  maxStudLoadText: string;
}

/**
 * One row's step: the studs it names (the first is the step's position) and its covers, per named
 * stud the applied load (converted to N) and the residual load (the row's load for that stud, already
 * in N). A row that names one stud and no applied load is a plain one-stud step (covers null), as
 * before tensioner rows; a row of several studs needs every applied load.
 * @throws AppError('invalid_input') naming the row and the stud (details `row`, `column`).
 */
export function stepOfPull(pull: ManualPull, loadsN: readonly number[], ctx: PullContext): { position: number; covers: NormalisedStep['covers'] } {
  const list = parseStudList(pull.studs, ctx.studCount);
  if (list.ok && list.positions.length === 1 && pull.applied.every((v) => v === null)) return { position: list.positions[0]!, covers: null };
  const covers = coversOfPull(pull, loadsN, ctx);
  return { position: covers[0]!.position, covers };
}

function coversOfPull(pull: ManualPull, loadsN: readonly number[], ctx: PullContext): NonNullable<NormalisedStep['covers']> {
  const fail = (message: string, column: string): never => {
    throw new AppError('invalid_input', `${ctx.where}: ${message}`, { row: ctx.row, column });
  };
  const list = parseStudList(pull.studs, ctx.studCount);
  if (!list.ok) return fail(`${list.problem}.`, 'Studs');
  const stray = pull.applied.findIndex((v, i) => v !== null && !list.positions.includes(i + 1));
  if (stray >= 0) fail(`stud ${stray + 1} has an applied load but is not among the studs pulled (${list.positions.join(', ')}). Add it to the studs or clear the load.`, `Applied ${stray + 1}`);
  return list.positions.map((position) => {
    const column = `Applied ${position}`;
    const value = pull.applied[position - 1] ?? null;
    if (value === null) return fail(`stud ${position}: the applied load is missing. Type the load while the tool held the stud.`, column);
    const appliedN = loadToN(value, ctx.unit);
    if (appliedN < 0) return fail(`stud ${position}: the applied load ${value} ${ctx.unit} is negative. Check the sign.`, column);
    if (appliedN > ctx.maxStudLoadN) return fail(`stud ${position}: the applied load ${value} ${ctx.unit} is above the limit of ${ctx.maxStudLoadText}. Check the unit (${ctx.unit}).`, column);
    return { position, appliedN, residualN: loadsN[position - 1]! };
  });
}
