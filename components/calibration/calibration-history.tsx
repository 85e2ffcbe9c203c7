'use client';

import { useMemo, useState } from 'react';
import { calibrationHistoryChart } from '@/lib/charts/calibration-history-chart';
import { formatDecimals } from '@/lib/calc/units';
import type { CalibrationSessionView } from '@/lib/data/calibration';
import { PlotFigure } from '../charts/plot-figure';
import { SelectField } from '../joints/form-controls';
import { CorrectionForm } from './correction-form';
import type { FormState } from '@/lib/http/form-state';

const pct = (v: number) => `${formatDecimals(v, 2)} %`;

/** Sessions of one joint, newest first, with a chart of one position's factor over the sessions. */
export function CalibrationHistory({ sessions, studCount, correctActions }: { sessions: CalibrationSessionView[]; studCount: number; correctActions: Record<number, (state: FormState, form: FormData) => Promise<FormState>> }) {
  const [position, setPosition] = useState('1');
  const chart = useMemo(() => {
    const p = Number(position);
    return calibrationHistoryChart(
      p,
      sessions.flatMap((s, i) => {
        const r = s.results.find((x) => x.position === p);
        return r ? [{ session: i + 1, performedOn: s.performedOn, factor: r.factor, lower: r.lower, upper: r.upper, accepted: r.accepted, drift: r.drift }] : [];
      }),
    );
  }, [sessions, position]);
  return (
    <div className="space-y-4">
      <SelectField label="Position" value={position} onChange={setPosition} className="max-w-xs">
        {Array.from({ length: studCount }, (_, i) => (
          <option key={i} value={String(i + 1)}>Position {i + 1}</option>
        ))}
      </SelectField>
      <PlotFigure {...chart} />
      <ol className="space-y-3" reversed>
        {[...sessions].reverse().map((s, i) => (
          <li key={s.id} className="rounded-card border border-rule bg-panel p-3 text-sm">
            <p className="font-medium">
              Session {sessions.length - i} · {s.performedOn} · {s.accepted ? 'accepted' : 'refused'} · next due {s.dueOn}
            </p>
            <p className="text-muted">
              Load cell certificate {s.loadCellCertificate}, dated {s.loadCellCertifiedOn}, due {s.loadCellDueOn}; full scale {formatDecimals(s.fullScaleKn, 1, 0)} kN
            </p>
            <table className="mt-2 text-left">
              <thead className="text-muted">
                <tr>
                  <th className="pr-3 font-medium">Position</th>
                  <th className="pr-3 font-medium">Factor</th>
                  <th className="pr-3 font-medium">95 % interval</th>
                  <th className="pr-3 font-medium">Linearity</th>
                  <th className="pr-3 font-medium">Hysteresis</th>
                  <th className="pr-3 font-medium">Zero return</th>
                  <th className="pr-3 font-medium">Result</th>
                </tr>
              </thead>
              <tbody className="num">
                {s.results.map((r) => (
                  <tr key={r.position}>
                    <td className="pr-3">{r.position}</td>
                    <td className="pr-3">{formatDecimals(r.factor, 4)}</td>
                    <td className="pr-3">{formatDecimals(r.lower, 4)} – {formatDecimals(r.upper, 4)}</td>
                    <td className="pr-3">{pct(r.linearityPercent)}</td>
                    <td className="pr-3">{pct(r.hysteresisPercent)}</td>
                    <td className="pr-3">{pct(r.zeroReturnPercent)}</td>
                    <td className="pr-3">
                      {r.accepted ? 'accepted' : `refused: ${r.refusals.join('; ')}`}
                      {r.drift ? <span className="ml-2 font-semibold text-caution">drift</span> : null}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            {correctActions[s.id] ? <CorrectionForm tableText={s.tableText} version={s.version} action={correctActions[s.id]!} /> : null}
          </li>
        ))}
      </ol>
    </div>
  );
}
