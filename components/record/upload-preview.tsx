'use client';

import { formatForce } from '@/lib/calc/units';
import type { ColumnMapping } from '@/lib/ingest/shapes';
import type { ParsedFile } from './parse-messages';

function roleOf(header: string, m: ColumnMapping | null): string {
  if (!m) return '';
  const h = header.trim();
  const stud = m.studColumns.find((s) => s.column === h);
  if (stud) return `stud ${stud.position}`;
  const roles: Array<[keyof ColumnMapping, string]> = [['timeColumn', 'time'], ['stepColumn', 'step'], ['passColumn', 'pass'], ['positionColumn', 'stud position'], ['loadColumn', 'load'], ['torqueColumn', 'torque'], ['pressureColumn', 'pressure'], ['tightenedColumn', 'tightened stud']];
  return roles.find(([k]) => m[k] === h)?.[1] ?? 'not used';
}

/** The first rows of the file, each column labelled with the role the mapping gives it. */
export function PreviewTable({ headers, rows, mapping }: { headers: string[]; rows: Array<{ line: number; cells: string[] }>; mapping: ColumnMapping | null }) {
  return (
    <section aria-labelledby="preview-title" className="space-y-1">
      <h2 id="preview-title" className="font-semibold">First rows</h2>
      <div className="relative overflow-x-auto rounded-md border border-rule">
        <table className="w-full text-sm">
          <thead className="bg-paper text-left">
            <tr><th className="px-2 py-1 text-muted">Line</th>{headers.map((h, i) => <th key={`${h}-${i}`} className="px-2 py-1 font-medium">{h}<span className="block text-xs font-normal text-muted">{roleOf(h, mapping)}</span></th>)}</tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.line} className="border-t border-rule">
                <td className="num px-2 py-1 text-muted">{r.line}</td>
                {headers.map((_, i) => <td key={i} className="num px-2 py-1">{r.cells[i] ?? ''}</td>)}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

/** The sheet of a workbook to read. */
export function SheetChoice({ sheets, sheet, onChoose }: { sheets: string[]; sheet: string | null; onChoose: (sheet: string) => void }) {
  return (
    <label className="block text-sm">
      <span className="block">Sheet</span>
      <select className="mt-1 rounded-md border border-rule bg-paper px-2 py-1 text-sm text-ink" value={sheet ?? sheets[0]} onChange={(e) => onChoose(e.target.value)}>
        {sheets.map((s) => <option key={s} value={s}>{s}</option>)}
      </select>
    </label>
  );
}

/** The box that confirms a column mapping guessed with an assumption (a unit, gauge columns, a stud count that differs). */
export function MappingConfirm({ confirmed, onConfirmed }: { confirmed: boolean; onConfirmed: (confirmed: boolean) => void }) {
  return (
    <label className="flex items-center gap-2 rounded-md border border-caution p-2 text-sm">
      <input type="checkbox" checked={confirmed} onChange={(e) => onConfirmed(e.target.checked)} /> The column mapping above is right (part of it was guessed; see the notes above)
    </label>
  );
}

/** The steps derived from the loads of a file without step markers, with the box that confirms them. */
export function DerivedSteps({ derived, units, confirmed, onConfirmed }: { derived: ParsedFile['derived']; units: 'si' | 'us'; confirmed: boolean; onConfirmed: (confirmed: boolean) => void }) {
  return (
    <section aria-labelledby="derived-title" className="space-y-2">
      <h2 id="derived-title" className="font-semibold">Steps found in the loads ({derived.length})</h2>
      <p className="text-sm text-muted">The file has no step marker, so each time one stud&rsquo;s load rose clearly, or several rose together (a tensioner tool set), that is taken as a step on those studs; where a tool was released, the step reads the load left after release. Check them before saving.</p>
      <div className="relative max-h-72 overflow-auto rounded-md border border-rule">
        <table className="w-full text-sm">
          <thead className="sticky top-0 bg-panel text-left"><tr><th className="px-2 py-1">Step</th><th className="px-2 py-1">Pass</th><th className="px-2 py-1">Stud</th><th className="px-2 py-1">Lines</th><th className="px-2 py-1">Time</th><th className="px-2 py-1">Rise</th></tr></thead>
          <tbody>
            {derived.map((d) => (
              <tr key={d.order} className="border-t border-rule">
                <td className="num px-2 py-1">{d.order}</td><td className="num px-2 py-1">{d.pass}</td><td className="num px-2 py-1">{d.positions && d.positions.length > 1 ? d.positions.join(', ') : d.position}</td>
                <td className="num px-2 py-1">{d.firstLine}–{d.lastLine}</td><td className="num px-2 py-1">{d.timeS === null ? '—' : `${d.timeS} s`}</td>
                <td className="num px-2 py-1">{formatForce(d.riseN, units)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" checked={confirmed} onChange={(e) => onConfirmed(e.target.checked)} /> These {derived.length} steps are right
      </label>
    </section>
  );
}
