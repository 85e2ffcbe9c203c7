'use client';

import Link from 'next/link';
import { useEffect, useRef, useState } from 'react';
import { formatForce } from '@/lib/calc/units';
import type { RecordJoint, RememberedMapping } from '@/lib/data/record';
import { BYTES_PER_MB } from '@/lib/ingest/text-file';
import { LOAD_UNITS, TORQUE_UNITS } from '@/lib/ingest/units';
import type { ColumnMapping } from '@/lib/ingest/shapes';
import { jointForImport } from '@/lib/record/joint-import';
import { UPLOAD_LIMIT_BYTES } from '@/lib/record/limits';
import type { ParsedFile, ParsedPreview, ParseResponse } from './parse-messages';
import { headerPayload, type HeaderErrors, type HeaderState } from './run-header-fields';

const CONTROL = 'mt-1 w-full rounded-md border border-rule bg-paper px-2 py-1 text-sm text-ink';
const BUTTON = 'rounded-md bg-accent px-4 py-2 text-sm font-medium text-accent-ink disabled:opacity-50';
const LIMIT_MB = UPLOAD_LIMIT_BYTES / BYTES_PER_MB;

type Progress = { label: string; fraction: number } | null;
type Outcome =
  | { kind: 'saved'; runId: number; stepCount: number }
  | { kind: 'duplicate'; runId: number | null; message: string }
  | { kind: 'error'; message: string }
  | null;

const sameHeaders = (a: readonly string[], b: readonly string[]) => a.length === b.length && a.every((h, i) => h.trim() === b[i]?.trim());

/** Upload a file: drop or choose, parse in a worker, confirm the mapping, send raw file + mapping + header. */
export function UploadPanel({ joint, header, rememberedMappings, onHeaderErrors, units }: {
  joint: RecordJoint;
  header: HeaderState;
  rememberedMappings: RememberedMapping[];
  onHeaderErrors: (errors: HeaderErrors) => void;
  units: 'si' | 'us';
}) {
  const [file, setFile] = useState<File | null>(null);
  const [mapping, setMapping] = useState<ColumnMapping | null>(null);
  const [parsed, setParsed] = useState<ParsedFile | null>(null);
  const [partial, setPartial] = useState<ParsedPreview | null>(null);
  const [parseError, setParseError] = useState<{ message: string; row: number | null; column: string | null } | null>(null);
  const [progress, setProgress] = useState<Progress>(null);
  const [remembered, setRemembered] = useState(false);
  const [confirmed, setConfirmed] = useState(false);
  const [outcome, setOutcome] = useState<Outcome>(null);
  const [dragging, setDragging] = useState(false);
  const workerRef = useRef<Worker | null>(null);
  const inputRef = useRef<HTMLInputElement>(null);

  useEffect(() => () => workerRef.current?.terminate(), []);

  function parse(target: File, withMapping: ColumnMapping | null, firstLook: boolean) {
    workerRef.current?.terminate();
    const worker = new Worker(new URL('./parse-worker.ts', import.meta.url), { type: 'module' });
    workerRef.current = worker;
    setProgress({ label: 'Reading the file', fraction: 0 });
    setOutcome(null);
    worker.onmessage = (event: MessageEvent<ParseResponse>) => {
      const msg = event.data;
      if (msg.type === 'progress') {
        setProgress({ label: msg.phase === 'reading' ? 'Reading the file' : 'Checking every row', fraction: msg.total ? msg.loaded / msg.total : 1 });
        return;
      }
      setProgress(null);
      worker.terminate();
      if (msg.type === 'result') {
        const saved = firstLook ? rememberedMappings.find((m) => m.jointId === joint.id && sameHeaders(m.headers, msg.result.headers)) : undefined;
        if (saved) {
          setRemembered(true);
          if (JSON.stringify(saved.mapping) !== JSON.stringify(msg.result.mapping)) {
            parse(target, saved.mapping, false);
            return;
          }
        }
        setParsed(msg.result);
        setPartial(null);
        setMapping(msg.result.mapping);
        setParseError(null);
        setConfirmed(!msg.result.derivedSteps);
      } else {
        if (firstLook && msg.partial) {
          const saved = rememberedMappings.find((m) => m.jointId === joint.id && sameHeaders(m.headers, msg.partial!.headers));
          if (saved) {
            setRemembered(true);
            parse(target, saved.mapping, false);
            return;
          }
        }
        setParsed(null);
        setPartial(msg.partial);
        if (msg.partial?.mapping && !withMapping) setMapping(msg.partial.mapping);
        setParseError({ message: msg.message, row: msg.row, column: msg.column });
        setConfirmed(false);
      }
    };
    worker.onerror = (e) => {
      setProgress(null);
      setParseError({ message: `The file reader stopped: ${e.message || 'unknown error'}. Reload the page and try again.`, row: null, column: null });
    };
    worker.postMessage({ type: 'parse', file: target, mapping: withMapping, joint: jointForImport(joint), limitBytes: UPLOAD_LIMIT_BYTES });
  }

  function choose(files: FileList | null) {
    const f = files?.[0];
    if (!f) return;
    setFile(f);
    setMapping(null);
    setParsed(null);
    setPartial(null);
    setRemembered(false);
    parse(f, null, true);
  }

  // Re-parse when the joint changes (stud count, limits and remembered maps depend on it).
  const jointKey = joint.id;
  useEffect(() => {
    if (file) parse(file, mapping, true);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [jointKey]);

  function changeMapping(next: ColumnMapping) {
    setMapping(next);
    setRemembered(false);
    if (file) parse(file, next, false);
  }

  function upload() {
    if (!file || !mapping) return;
    const form = new FormData();
    form.append('file', file);
    form.append('mapping', JSON.stringify(mapping));
    form.append('header', JSON.stringify(headerPayload(header)));
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/uploads');
    xhr.responseType = 'json';
    setProgress({ label: 'Sending the file', fraction: 0 });
    setOutcome(null);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) setProgress({ label: e.loaded >= e.total ? 'Storing the run' : 'Sending the file', fraction: e.loaded / e.total });
    };
    xhr.upload.onload = () => setProgress({ label: 'Storing the run', fraction: 1 });
    xhr.onload = () => {
      setProgress(null);
      const body = (xhr.response ?? {}) as { runId?: number; stepCount?: number; error?: { message?: string; runId?: number | null; fieldErrors?: HeaderErrors } };
      if (xhr.status === 201 && body.runId) {
        setOutcome({ kind: 'saved', runId: body.runId, stepCount: body.stepCount ?? 0 });
        onHeaderErrors({});
      } else if (xhr.status === 409) {
        setOutcome({ kind: 'duplicate', runId: body.error?.runId ?? null, message: body.error?.message ?? 'This file was uploaded before.' });
      } else {
        if (body.error?.fieldErrors) onHeaderErrors(body.error.fieldErrors);
        setOutcome({ kind: 'error', message: body.error?.message ?? `The server answered ${xhr.status}. Try again.` });
      }
    };
    xhr.onerror = () => {
      setProgress(null);
      setOutcome({ kind: 'error', message: 'The upload did not reach the server. Check the connection and try again.' });
    };
    xhr.send(form);
  }

  const view = parsed ?? partial;
  const headers = view?.headers ?? [];
  return (
    <div className="space-y-4">
      <div
        onDragOver={(e) => { e.preventDefault(); setDragging(true); }}
        onDragLeave={() => setDragging(false)}
        onDrop={(e) => { e.preventDefault(); setDragging(false); choose(e.dataTransfer.files); }}
        className={`rounded-card border-2 border-dashed p-6 text-center ${dragging ? 'border-accent bg-paper' : 'border-rule'}`}>
        <p className="font-medium">Drop the logger&rsquo;s CSV or text export here, or</p>
        <label className="mt-2 inline-block cursor-pointer rounded-md border border-rule bg-paper px-3 py-1.5 text-sm focus-within:ring-2 focus-within:ring-accent">
          Choose a file
          <input ref={inputRef} type="file" accept=".csv,.tsv,.txt,text/csv,text/plain" className="sr-only" onChange={(e) => choose(e.target.files)} aria-describedby="upload-limit" />
        </label>
        <p id="upload-limit" className="mt-2 text-xs text-muted">
          Comma, semicolon or tab separated; UTF-8. Up to {LIMIT_MB} MB. Shapes: wide (a column per stud), long (time, stud, load) or a step table (pass, step, stud, load).
        </p>
        {file ? <p className="mt-2 text-sm"><span className="font-medium">{file.name}</span> <span className="num text-muted">({(file.size / 1024).toFixed(1)} KB)</span></p> : null}
      </div>

      {progress ? (
        <div aria-live="polite">
          <p className="text-sm">{progress.label}… <span className="num">{Math.round(progress.fraction * 100)} %</span></p>
          <progress className="h-2 w-full accent-[var(--el-accent)]" max={1} value={progress.fraction} aria-label={progress.label} />
        </div>
      ) : null}

      <div aria-live="polite">
        {parseError ? (
          <div className="rounded-md border border-danger p-3 text-sm" role="alert">
            <p className="font-medium text-danger">{parseError.message}</p>
            <p className="mt-1 text-muted">
              {parseError.row ? `Line ${parseError.row}${parseError.column ? `, column "${parseError.column}"` : ''}. ` : ''}
              Correct the file, or change the column mapping below if a column was read wrongly.
            </p>
          </div>
        ) : null}
      </div>

      {view ? (
        <section aria-labelledby="detected-title" className="space-y-1">
          <h2 id="detected-title" className="font-semibold">What was detected</h2>
          <ul className="list-disc pl-5 text-sm">
            {view.sentences.map((s) => <li key={s}>{s}</li>)}
            {view.mappingNotes.map((s) => <li key={s}>{s}</li>)}
            {parsed?.warnings.map((s) => <li key={s} className="text-caution">{s}</li>)}
          </ul>
          {remembered ? <p className="text-sm text-good">Column mapping remembered from the last file with these columns on this joint.</p> : null}
        </section>
      ) : null}

      {view && mapping ? <MappingEditor headers={headers} mapping={mapping} onChange={changeMapping} joint={joint} /> : null}
      {view && !mapping ? <p className="text-sm text-danger">The columns could not be guessed. Rename the stud load columns &ldquo;Stud 1&rdquo;, &ldquo;Stud 2&rdquo;, … or use a long or step-table layout, then choose the file again.</p> : null}

      {view ? <PreviewTable headers={headers} rows={view.preview} mapping={mapping} /> : null}

      {parsed?.derivedSteps ? (
        <section aria-labelledby="derived-title" className="space-y-2">
          <h2 id="derived-title" className="font-semibold">Steps found in the loads ({parsed.derived.length})</h2>
          <p className="text-sm text-muted">The file has no step marker, so each time one stud&rsquo;s load rose clearly while the others did not, that is taken as a step on that stud. Check them before saving.</p>
          <div className="max-h-72 overflow-auto rounded-md border border-rule">
            <table className="w-full text-sm">
              <thead className="sticky top-0 bg-panel text-left"><tr><th className="px-2 py-1">Step</th><th className="px-2 py-1">Pass</th><th className="px-2 py-1">Stud</th><th className="px-2 py-1">Lines</th><th className="px-2 py-1">Time</th><th className="px-2 py-1">Rise</th></tr></thead>
              <tbody>
                {parsed.derived.map((d) => (
                  <tr key={d.order} className="border-t border-rule">
                    <td className="num px-2 py-1">{d.order}</td><td className="num px-2 py-1">{d.pass}</td><td className="num px-2 py-1">{d.position}</td>
                    <td className="num px-2 py-1">{d.firstLine}–{d.lastLine}</td><td className="num px-2 py-1">{d.timeS === null ? '—' : `${d.timeS} s`}</td>
                    <td className="num px-2 py-1">{formatForce(d.riseN, units)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" checked={confirmed} onChange={(e) => setConfirmed(e.target.checked)} /> These {parsed.derived.length} steps are right
          </label>
        </section>
      ) : null}

      {parsed ? (
        <div className="flex flex-wrap items-center gap-3">
          <button type="button" className={BUTTON} disabled={!confirmed || progress !== null} onClick={upload}>
            Save run ({parsed.stepCount} steps, {parsed.stepCount * parsed.studCount} readings)
          </button>
          {!confirmed ? <span className="text-sm text-muted">Confirm the derived steps first.</span> : null}
        </div>
      ) : null}

      <div aria-live="polite">
        {outcome?.kind === 'saved' ? (
          <p className="text-sm text-good" role="status">Saved run {outcome.runId} with {outcome.stepCount} steps. <Link className="underline" href={`/runs/${outcome.runId}`}>Open run {outcome.runId}</Link></p>
        ) : null}
        {outcome?.kind === 'duplicate' ? (
          <p className="text-sm text-caution" role="alert">{outcome.message} {outcome.runId ? <Link className="underline" href={`/runs/${outcome.runId}`}>Open run {outcome.runId}</Link> : null}</p>
        ) : null}
        {outcome?.kind === 'error' ? <p className="text-sm text-danger" role="alert">{outcome.message}</p> : null}
      </div>
    </div>
  );
}

function roleOf(header: string, m: ColumnMapping | null): string {
  if (!m) return '';
  const h = header.trim();
  const stud = m.studColumns.find((s) => s.column === h);
  if (stud) return `stud ${stud.position}`;
  const roles: Array<[keyof ColumnMapping, string]> = [['timeColumn', 'time'], ['stepColumn', 'step'], ['passColumn', 'pass'], ['positionColumn', 'stud position'], ['loadColumn', 'load'], ['torqueColumn', 'torque'], ['pressureColumn', 'pressure'], ['tightenedColumn', 'tightened stud']];
  return roles.find(([k]) => m[k] === h)?.[1] ?? 'not used';
}

function PreviewTable({ headers, rows, mapping }: { headers: string[]; rows: Array<{ line: number; cells: string[] }>; mapping: ColumnMapping | null }) {
  return (
    <section aria-labelledby="preview-title" className="space-y-1">
      <h2 id="preview-title" className="font-semibold">First rows</h2>
      <div className="overflow-x-auto rounded-md border border-rule">
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

function MappingEditor({ headers, mapping, onChange, joint }: { headers: string[]; mapping: ColumnMapping; onChange: (m: ColumnMapping) => void; joint: RecordJoint }) {
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
          <span className="block">Torque unit</span>
          <select className={CONTROL} value={mapping.torqueUnit} onChange={(e) => set({ torqueUnit: e.target.value as ColumnMapping['torqueUnit'] })}>
            {TORQUE_UNITS.map((u) => <option key={u} value={u}>{u}</option>)}
          </select>
        </label>
      </div>
      {mapping.loadUnit === 'microstrain' ? (
        <p className="text-sm text-muted">Microstrain is turned into load with the joint&rsquo;s calibration factors ({joint.calibration.map((c) => c.toFixed(3)).join(', ')}), the studs&rsquo; tensile stress area and E = 205 GPa.</p>
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
