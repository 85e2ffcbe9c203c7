'use client';

import { INPUT_CLASS } from '../joints/form-controls';

export interface GridRow {
  direction: 'up' | 'down';
  loadCell: string;
  gauges: string[];
}

/** Empty grid: a starting zero, five loading levels, five unloading levels, the zero return. */
export function emptyGrid(studCount: number): GridRow[] {
  const row = (direction: 'up' | 'down'): GridRow => ({ direction, loadCell: '', gauges: Array.from({ length: studCount }, () => '') });
  return [...Array.from({ length: 6 }, () => row('up')), ...Array.from({ length: 6 }, () => row('down'))];
}

/** The grid as the table text the server reads (the same layout as an uploaded file); empty rows left out. */
export function gridText(rows: readonly GridRow[], studCount: number): string {
  const header = ['direction', 'load_cell_kN', ...Array.from({ length: studCount }, (_, i) => `p${i + 1}`)].join(';');
  const body = rows.filter((r) => r.loadCell.trim() !== '' || r.gauges.some((g) => g.trim() !== '')).map((r) => [r.direction, r.loadCell, ...r.gauges].join(';'));
  return [header, ...body].join('\n');
}

/** Reads a file in the documented layout into grid rows (the server checks it again). */
export function gridFromText(text: string, studCount: number): GridRow[] | null {
  const lines = text.split(/\r?\n/).filter((l) => l.trim() !== '');
  const first = lines.shift();
  if (!first) return null;
  const delimiter = first.includes('\t') ? '\t' : first.includes(';') ? ';' : ',';
  return lines.map((line) => {
    const cells = line.split(delimiter).map((c) => c.trim());
    return { direction: cells[0]?.toLowerCase() === 'down' ? 'down' : 'up', loadCell: cells[1] ?? '', gauges: Array.from({ length: studCount }, (_, i) => cells[i + 2] ?? '') };
  });
}

/** The hand-entry grid: one row per reading of the load cell, a column per position (kN). */
export function CalibrationGrid({ rows, studCount, onChange }: { rows: GridRow[]; studCount: number; onChange: (rows: GridRow[]) => void }) {
  const set = (index: number, patch: Partial<GridRow>) => onChange(rows.map((r, i) => (i === index ? { ...r, ...patch } : r)));
  const cell = `w-20 num font-mono ${INPUT_CLASS}`;
  return (
    <div className="overflow-x-auto">
      <table className="text-sm">
        <caption className="sr-only">Calibration readings: the load cell and each position&apos;s gauge, in kN</caption>
        <thead>
          <tr className="text-left text-muted">
            <th className="pr-2 font-medium">Direction</th>
            <th className="pr-2 font-medium">Load cell (kN)</th>
            {Array.from({ length: studCount }, (_, i) => (
              <th key={i} className="pr-2 font-medium">P{i + 1} (kN)</th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((row, r) => (
            <tr key={r}>
              <td className="pr-2">
                <select aria-label={`Row ${r + 1} direction`} value={row.direction} onChange={(e) => set(r, { direction: e.target.value === 'down' ? 'down' : 'up' })} className={INPUT_CLASS}>
                  <option value="up">Loading</option>
                  <option value="down">Unloading</option>
                </select>
              </td>
              <td className="pr-2">
                <input aria-label={`Row ${r + 1} load cell`} inputMode="decimal" value={row.loadCell} onChange={(e) => set(r, { loadCell: e.target.value })} className={cell} />
              </td>
              {row.gauges.map((g, p) => (
                <td key={p} className="pr-2">
                  <input aria-label={`Row ${r + 1} position ${p + 1}`} inputMode="decimal" value={g} onChange={(e) => set(r, { gauges: row.gauges.map((v, i) => (i === p ? e.target.value : v)) })} className={cell} />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      <button type="button" className="mt-2 text-sm underline decoration-rule underline-offset-4" onClick={() => onChange([...rows, { direction: 'down', loadCell: '', gauges: Array.from({ length: studCount }, () => '') }])}>
        Add a row
      </button>
    </div>
  );
}
