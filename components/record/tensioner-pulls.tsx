'use client';

import { useState } from 'react';
import { readNumber } from '@/lib/format/parse-number';
import { parseStudList } from '@/lib/record/manual-pulls';
import type { PlannedStep } from '@/lib/record/step-plan';

/**
 * The hand-entry grid's tensioner rows (a tensioner method only): each step names the studs its tool
 * set pulled, prefilled from the method's coverage, and under it a row of applied loads (the tool's
 * load while pressurised) for those studs. The step's own row then holds the loads after release.
 */
export function useTensionerPulls(steps: readonly PlannedStep[], studCount: number, enabled: boolean) {
  const [studs, setStuds] = useState<string[]>(() => steps.map((s) => s.positions.join(' ')));
  const [applied, setApplied] = useState<string[][]>(() => steps.map(() => Array.from({ length: studCount }, () => '')));
  const lists = studs.map((text) => parseStudList(text, studCount));
  const named = (row: number): number[] => {
    const list = lists[row];
    return list?.ok ? list.positions : [];
  };
  const problems = enabled
    ? lists.flatMap((list, i) => (list.ok ? [] : [`Step ${i + 1}, studs pulled: ${list.problem}.`]))
      .concat(applied.flatMap((row, i) => row.flatMap((text, j) => (readNumber(text).kind === 'invalid' ? [`Step ${i + 1}, applied load of stud ${j + 1}: "${text.trim()}" is not a number.`] : []))))
    : [];
  return {
    enabled,
    studs,
    applied,
    named,
    firstProblem: problems[0] ?? null,
    setStuds: (row: number, text: string) => setStuds((old) => old.map((v, i) => (i === row ? text : v))),
    setApplied: (row: number, stud: number, text: string) => setApplied((old) => old.map((r, i) => (i === row ? r.map((v, j) => (j === stud ? text : v)) : r))),
    /** The `pulls` of the grid's payload (lib/record/manual-entry-schema.ts): blank applied cells are null. */
    payload: enabled ? studs.map((text, i) => ({ studs: text, applied: applied[i]!.map((v) => (v.trim() === '' ? null : v)) })) : undefined,
  };
}

export type TensionerPulls = ReturnType<typeof useTensionerPulls>;

/** The step's "studs pulled" input, in place of the one tightened stud. */
export function StudsPulledInput({ pulls, row, order, invalid }: { pulls: TensionerPulls; row: number; order: number; invalid: boolean }) {
  const bad = invalid || pulls.studs[row]!.trim() === '' || pulls.named(row).length === 0;
  return (
    <input value={pulls.studs[row]} onChange={(e) => pulls.setStuds(row, e.target.value)} aria-label={`Step ${order}, studs pulled`} aria-invalid={bad || undefined} autoComplete="off"
      className="num w-28 rounded border border-rule bg-paper px-1 py-0.5 aria-[invalid=true]:border-danger" />
  );
}

/** The row of applied loads under a tensioner step: an input for each stud the step names. */
export function AppliedLoadsRow({ pulls, row, order, unit, studCount, invalidColumn }: { pulls: TensionerPulls; row: number; order: number; unit: string; studCount: number; invalidColumn: string | null }) {
  const named = pulls.named(row);
  return (
    <tr className="text-muted">
      <td />
      <td colSpan={2} className="px-2 py-0.5 text-xs">Applied, tool pressurised</td>
      {Array.from({ length: studCount }, (_, j) => (
        <td key={j} className="px-0.5 py-0.5">
          {named.includes(j + 1) || pulls.applied[row]![j]!.trim() !== '' ? (
            <input value={pulls.applied[row]![j]} inputMode="decimal" autoComplete="off" aria-label={`Step ${order}, stud ${j + 1}, applied, ${unit}`}
              aria-invalid={invalidColumn === `Applied ${j + 1}` || readNumber(pulls.applied[row]![j]!).kind === 'invalid' || undefined}
              onChange={(e) => pulls.setApplied(row, j, e.target.value)}
              className="num w-20 rounded border border-dashed border-rule bg-paper px-1 py-0.5 text-right aria-[invalid=true]:border-danger" />
          ) : null}
        </td>
      ))}
      <td /><td />
    </tr>
  );
}
