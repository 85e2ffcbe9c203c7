'use client';

import { useEffect, useRef, useState } from 'react';
import type { RecordJoint, RecordMethod, RememberedMapping } from '@/lib/data/record';
import type { JointForImport } from '@/lib/ingest/normalise';
import type { ColumnMapping } from '@/lib/ingest/shapes';
import { jointForImport } from '@/lib/record/joint-import';
import { UPLOAD_LIMIT_BYTES } from '@/lib/record/limits';
import { importPlanSteps } from '@/lib/record/step-plan';
import type { ParsedFile, ParsedPreview, ParseResponse } from './parse-messages';

/** What the panel shows while a long job runs (parsing here, sending in `upload-request.ts`). */
export type Progress = { label: string; fraction: number } | null;

export interface ParseError {
  message: string;
  row: number | null;
  column: string | null;
}

const sameHeaders = (a: readonly string[], b: readonly string[]) => a.length === b.length && a.every((h, i) => h.trim() === b[i]?.trim());

/**
 * The chosen file and its parse in a web worker (`parse-worker.ts`): the preview, the column
 * mapping (a remembered one for the same headers on this joint is tried first), the first error,
 * and whether derived steps are confirmed. The file is parsed again when the joint changes.
 */
/** The joint as lib/ingest needs it, with the chosen method's steps (as the server adds them). */
function importJoint(joint: RecordJoint, method: RecordMethod | null): JointForImport {
  return { ...jointForImport(joint), plannedSteps: method ? importPlanSteps(method, joint.studCount) : undefined };
}

export function useFileParse({ joint, method, rememberedMappings, onProgress, onParseStart }: {
  joint: RecordJoint;
  method: RecordMethod | null;
  rememberedMappings: RememberedMapping[];
  onProgress: (progress: Progress) => void;
  /** Called when a parse starts (the last upload's outcome no longer applies). */
  onParseStart: () => void;
}) {
  const [file, setFile] = useState<File | null>(null);
  const [mapping, setMapping] = useState<ColumnMapping | null>(null);
  const [parsed, setParsed] = useState<ParsedFile | null>(null);
  const [partial, setPartial] = useState<ParsedPreview | null>(null);
  const [parseError, setParseError] = useState<ParseError | null>(null);
  const [remembered, setRemembered] = useState(false);
  const [confirmed, setConfirmed] = useState(false);
  const [mappingConfirmed, setMappingConfirmed] = useState(false);
  const [sheet, setSheet] = useState<string | null>(null);
  const workerRef = useRef<Worker | null>(null);

  useEffect(() => () => workerRef.current?.terminate(), []);

  const rememberedFor = (headers: readonly string[]) => rememberedMappings.find((m) => m.jointId === joint.id && sameHeaders(m.headers, headers));

  function parse(target: File, withMapping: ColumnMapping | null, firstLook: boolean, inSheet: string | null = sheet) {
    workerRef.current?.terminate();
    const worker = new Worker(new URL('./parse-worker.ts', import.meta.url), { type: 'module' });
    workerRef.current = worker;
    onProgress({ label: 'Reading the file', fraction: 0 });
    onParseStart();
    worker.onmessage = (event: MessageEvent<ParseResponse>) => {
      const msg = event.data;
      if (msg.type === 'progress') {
        onProgress({ label: msg.phase === 'reading' ? 'Reading the file' : 'Checking every row', fraction: msg.total ? msg.loaded / msg.total : 1 });
        return;
      }
      onProgress(null);
      worker.terminate();
      if (msg.type === 'result') {
        const saved = firstLook ? rememberedFor(msg.result.headers) : undefined;
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
        setMappingConfirmed(msg.result.mappingCertain || withMapping !== null);
      } else {
        if (firstLook && msg.partial) {
          const saved = rememberedFor(msg.partial.headers);
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
      onProgress(null);
      setParseError({ message: `The file reader stopped: ${e.message || 'unknown error'}. Reload the page and try again.`, row: null, column: null });
    };
    worker.postMessage({ type: 'parse', file: target, mapping: withMapping, sheet: inSheet, joint: importJoint(joint, method), limitBytes: UPLOAD_LIMIT_BYTES });
  }

  function choose(files: FileList | null) {
    const f = files?.[0];
    if (!f) return;
    setFile(f);
    setMapping(null);
    setParsed(null);
    setPartial(null);
    setRemembered(false);
    setSheet(null);
    parse(f, null, true, null);
  }

  /** Reads another sheet of a workbook (its columns are guessed afresh). */
  function chooseSheet(name: string) {
    setSheet(name);
    setMapping(null);
    if (file) parse(file, null, true, name);
  }

  // Re-parse when the joint or method changes (stud count, limits, remembered maps and planned steps depend on them).
  const jointKey = `${joint.id}:${method?.id ?? ''}`;
  useEffect(() => {
    if (file) parse(file, mapping, true);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [jointKey]);

  function changeMapping(next: ColumnMapping) {
    setMapping(next);
    setRemembered(false);
    if (file) parse(file, next, false);
  }

  return { file, mapping, parsed, partial, parseError, remembered, confirmed, setConfirmed, mappingConfirmed, setMappingConfirmed, choose, chooseSheet, changeMapping };
}
