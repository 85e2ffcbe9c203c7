'use client';

import { formatDecimals } from '@/lib/calc/units';
import type { RecordJoint } from '@/lib/data/record';
import type { ColumnMapping } from '@/lib/ingest/shapes';
import { LOAD_UNITS, TORQUE_UNITS } from '@/lib/ingest/units';

const CONTROL = 'mt-1 w-full rounded-md border border-rule bg-paper px-2 py-1 text-sm text-ink';

/** The column mapping of an uploaded file: shape, the column of each role, units, and the position of each stud column. */
export function MappingEditor({ headers, mapping, onChange, joint }: { headers: string[]; mapping: ColumnMapping; onChange: (m: ColumnMapping) => void; joint: RecordJoint }) {
  const set = (patch: Partial<ColumnMapping>) => onChange({ ...mapping, ...patch });
  const columnSelect = (key: 'timeColumn' | 'stepColumn' | 'passColumn' | 'positionColumn' | 'loadColumn' | 'torqueColumn' | 'pressureColumn' | 'tightenedColumn', label: string) => (
    <label className="text-sm">
      <span className="block">{label}</span>
      <select className={CONTROL} value={mapping[key] ?? ''} onChange={(e) => set({ [key]: e.target.value === '' ? null : e.target.value })}>
        <option value="">None</option>
        {headers.map((h) => <option key={h} value={h.trim()}>{h}</option>)}
      </select>
    </label>
  );
  const studOf = (h: string) => mapping.studColumns.find((s) => s.column === h.trim())?.position;
  function setStud(h: string, text: string) {
    const rest = mapping.studColumns.filter((s) => s.column !== h.trim());
    const n = Number(text);
    set({ studColumns: text.trim() === '' || !Number.isInteger(n) || n < 1 ? rest : [...rest, { column: h.trim(), position: n }].sort((a, b) => a.position - b.position) });
  }
  return (
    <section aria-labelledby="mapping-title" className="space-y-3">
      <h2 id="mapping-title" className="font-semibold">Column mapping</h2>
      <div className="grid gap-3 sm:grid-cols-3 lg:grid-cols-6">
        <label className="text-sm">
          <span className="block">Shape</span>
          <select className={CONTROL} value={mapping.shape} onChange={(e) => set({ shape: e.target.value as ColumnMapping['shape'] })}>
            <option value="wide">Wide (a column per stud)</option>
            <option value="long">Long (time, stud, load)</option>
            <option value="step_table">Step table (pass, step, stud, load)</option>
          </select>
        </label>
        {columnSelect('timeColumn', 'Time (s)')}
        {columnSelect('stepColumn', 'Step marker')}
        {columnSelect('passColumn', 'Pass')}
        {mapping.shape !== 'wide' ? columnSelect('positionColumn', 'Stud position') : null}
        {mapping.shape !== 'wide' ? columnSelect('loadColumn', 'Load') : null}
        {columnSelect('torqueColumn', 'Torque')}
        {columnSelect('tightenedColumn', 'Tightened stud')}
        <label className="text-sm">
          <span className="block">Load unit</span>
          <select className={CONTROL} value={mapping.loadUnit} onChange={(e) => set({ loadUnit: e.target.value as ColumnMapping['loadUnit'] })}>
            {LOAD_UNITS.map((u) => <option key={u} value={u}>{u === 'microstrain' ? 'microstrain (µε)' : u}</option>)}
          </select>
        </label>
        <label className="text-sm">
          <span className="block">Zero offsets</span>
          <select className={CONTROL} value={mapping.tare ?? 'auto'} onChange={(e) => set({ tare: e.target.value as ColumnMapping['tare'] })}>
            <option value="auto">Remove when the file starts at rest</option>
            <option value="off">Keep as read</option>
          </select>
        </label>
        <label className="text-sm">
          <span className="block">Torque unit</span>
          <select className={CONTROL} value={mapping.torqueUnit} onChange={(e) => set({ torqueUnit: e.target.value as ColumnMapping['torqueUnit'] })}>
            {TORQUE_UNITS.map((u) => <option key={u} value={u}>{u}</option>)}
          </select>
        </label>
      </div>
      {mapping.loadUnit === 'microstrain' ? (
        <p className="text-sm text-muted">Microstrain is turned into load with the joint&rsquo;s calibration factors ({joint.calibration.map((c) => formatDecimals(c, 3)).join(', ')}), the studs&rsquo; tensile stress area and E = 205 GPa.</p>
      ) : null}
      {mapping.shape === 'wide' ? (
        <fieldset className="text-sm">
          <legend className="mb-1">Stud columns: the position (1 to {joint.studCount}) each column measures; leave blank for other columns</legend>
          <div className="grid gap-2 sm:grid-cols-4 lg:grid-cols-8">
            {headers.map((h) => (
              <label key={h} className="block">
                <span className="block truncate text-muted" title={h}>{h}</span>
                <input inputMode="numeric" className={`${CONTROL} num`} value={studOf(h) ?? ''} onChange={(e) => setStud(h, e.target.value)} aria-label={`Stud position of column ${h}`} />
              </label>
            ))}
          </div>
        </fieldset>
      ) : null}
    </section>
  );
}
