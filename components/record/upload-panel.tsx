'use client';

import { formatDecimals } from '@/lib/calc/units';
import Link from 'next/link';
import { useState } from 'react';
import type { RecordJoint, RecordMethod, RememberedMapping } from '@/lib/data/record';
import { UPLOAD_LIMIT_BYTES } from '@/lib/record/limits';
import { BYTES_PER_MB } from '@/lib/ingest/text-file';
import { MappingEditor } from './mapping-editor';
import { headerPayload, type HeaderErrors, type HeaderState } from './run-header-fields';
import { sendUpload, type UploadOutcome } from './upload-request';
import { DerivedSteps, MappingConfirm, PreviewTable, SheetChoice } from './upload-preview';
import { SavedOutcome } from './upload-outcome';
import { useFileParse, type Progress } from './use-file-parse';

const BUTTON = 'rounded-md bg-accent px-4 py-2 text-sm font-medium text-accent-ink disabled:opacity-50';
const LIMIT_MB = UPLOAD_LIMIT_BYTES / BYTES_PER_MB;

/**
 * Upload a file: drop or choose, parse in a worker (`use-file-parse.ts`), confirm the mapping,
 * send raw file + mapping + header (`upload-request.ts`).
 */
export function UploadPanel({ joint, method, header, rememberedMappings, onHeaderErrors, units }: {
  joint: RecordJoint;
  method: RecordMethod | null;
  header: HeaderState;
  rememberedMappings: RememberedMapping[];
  onHeaderErrors: (errors: HeaderErrors) => void;
  units: 'si' | 'us';
}) {
  const [progress, setProgress] = useState<Progress>(null);
  const [outcome, setOutcome] = useState<UploadOutcome | null>(null);
  const [dragging, setDragging] = useState(false);
  const { file, mapping, parsed, partial, parseError, remembered, confirmed, setConfirmed, mappingConfirmed, setMappingConfirmed, choose, chooseSheet, changeMapping } = useFileParse({
    joint,
    method,
    rememberedMappings,
    onProgress: setProgress,
    onParseStart: () => setOutcome(null),
  });

  function upload() {
    if (!file || !mapping) return;
    setOutcome(null);
    const sheet = (parsed ?? partial)?.sheet;
    sendUpload({ file, mapping: sheet ? { ...mapping, sheet } : mapping, header: headerPayload(header) }, { onProgress: setProgress, onOutcome: setOutcome, onHeaderErrors });
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
        <p className="font-medium">Drop the logger&rsquo;s CSV, text or Excel (.xlsx) export here, or</p>
        <label className="mt-2 inline-block cursor-pointer rounded-md border border-rule bg-paper px-3 py-1.5 text-sm focus-within:ring-2 focus-within:ring-accent">
          Choose a file
          <input type="file" accept=".csv,.tsv,.txt,.xlsx,text/csv,text/plain,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet" className="sr-only" onChange={(e) => choose(e.target.files)} aria-describedby="upload-limit" />
        </label>
        <p id="upload-limit" className="mt-2 text-xs text-muted">
          Comma, semicolon or tab separated; UTF-8. Up to {LIMIT_MB} MB. Shapes: wide (a column per stud), long (time, stud, load) or a step table (pass, step, stud, load).
        </p>
        {file ? <p className="mt-2 text-sm"><span className="font-medium">{file.name}</span> <span className="num text-muted">({formatDecimals(file.size / 1024, 1)} KB)</span></p> : null}
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
            {parsed?.zeroNotes.map((s) => <li key={s}>{s}</li>)}
            {parsed?.warnings.map((s) => <li key={s} className="text-caution">{s}</li>)}
          </ul>
          {remembered ? <p className="text-sm text-good">Column mapping remembered from the last file with these columns on this joint.</p> : null}
        </section>
      ) : null}

      {view && view.sheets.length > 1 ? <SheetChoice sheets={view.sheets} sheet={view.sheet} onChoose={chooseSheet} /> : null}
      {view && mapping ? <MappingEditor headers={headers} mapping={mapping} onChange={changeMapping} joint={joint} /> : null}
      {parsed && !parsed.mappingCertain ? <MappingConfirm confirmed={mappingConfirmed} onConfirmed={setMappingConfirmed} /> : null}

      {view ? <PreviewTable headers={headers} rows={view.preview} mapping={mapping} /> : null}

      {parsed?.derivedSteps ? <DerivedSteps derived={parsed.derived} units={units} confirmed={confirmed} onConfirmed={setConfirmed} /> : null}

      {parsed ? (
        <div className="flex flex-wrap items-center gap-3">
          <button type="button" className={BUTTON} disabled={!confirmed || !mappingConfirmed || progress !== null || outcome?.kind === 'saved'} onClick={upload}>
            Save run ({parsed.stepCount} steps, {parsed.stepCount * parsed.studCount} readings)
          </button>
          {!mappingConfirmed ? <span className="text-sm text-muted">Check the column mapping first.</span> : !confirmed ? <span className="text-sm text-muted">Confirm the derived steps first.</span> : null}
        </div>
      ) : null}

      <div aria-live="polite">
        {outcome?.kind === 'saved' ? <SavedOutcome outcome={outcome} /> : null}
        {outcome?.kind === 'duplicate' ? (
          <p className="text-sm text-caution" role="alert">{outcome.message} {outcome.runId ? <Link className="underline" href={`/runs/${outcome.runId}`}>Open run {outcome.runId}</Link> : null}</p>
        ) : null}
        {outcome?.kind === 'error' ? <p className="text-sm text-danger" role="alert">{outcome.message}</p> : null}
      </div>
    </div>
  );
}
