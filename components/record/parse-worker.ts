/// <reference lib="webworker" />
/**
 * The upload's parse worker: reads the chosen file with progress, then runs exactly the parse the
 * server runs (lib/ingest parseLoggerText, papaparse inside), so a large file never freezes the
 * page. The server parses the raw file again on upload; this result is a preview.
 */
import { isAppError } from '@/lib/http/errors';
import { inspectText } from '@/lib/ingest/detect';
import { assertTextFile } from '@/lib/ingest/text-file';
import { uploadedFileText, type FileText } from '@/lib/ingest/workbook';
import { parseLoggerText, PREVIEW_ROWS, SAMPLE_ROWS, streamTableRows } from '@/lib/ingest/parse-text';
import { proposeMappingWithNotes } from '@/lib/ingest/shapes';
import type { JointForImport } from '@/lib/ingest/normalise';
import type { ColumnMapping } from '@/lib/ingest/shapes';
import type { ParsedPreview, ParseRequest, ParseResponse } from './parse-messages';

/** A wide mapping with no column chosen yet: the editor's starting point when nothing was recognised. */
function blankMapping(): ColumnMapping {
  return { shape: 'wide', timeColumn: null, studColumns: [], positionColumn: null, loadColumn: null, stepColumn: null, passColumn: null, torqueColumn: null, pressureColumn: null, tightenedColumn: null, loadUnit: 'kN', torqueUnit: 'N·m', tare: 'auto' };
}

const post = (message: ParseResponse) => (self as unknown as DedicatedWorkerGlobalScope).postMessage(message);

async function readWithProgress(file: File): Promise<Uint8Array> {
  const reader = file.stream().getReader();
  const bytes = new Uint8Array(file.size);
  let loaded = 0;
  let lastPost = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    bytes.set(value, loaded);
    loaded += value.length;
    if (loaded - lastPost > 256 * 1024 || loaded === file.size) {
      lastPost = loaded;
      post({ type: 'progress', phase: 'reading', loaded, total: file.size });
    }
  }
  return bytes.subarray(0, loaded);
}

/** What can still be shown when the full parse failed, so the mapping can be corrected. */
function partialOf({ text, sheets, sheet }: FileText, joint: JointForImport): ParsedPreview | null {
  try {
    const detection = inspectText(text);
    const rows: Array<{ line: number; cells: string[] }> = [];
    streamTableRows(detection, (cells, line) => rows.push({ line, cells }), SAMPLE_ROWS);
    let mapping = null;
    let notes: string[] = [];
    let certain = false;
    try {
      const p = proposeMappingWithNotes(detection.headers, rows.map((r) => r.cells), detection.headerLine, { channelMap: joint.channelMap, studCount: joint.studCount, metadata: detection.metadata });
      mapping = p.mapping;
      notes = p.notes;
      certain = p.certain;
    } catch {
      mapping = blankMapping();
      notes = ['The columns could not be recognised: give each stud its column below.'];
    }
    return { sentences: detection.sentences, headers: detection.headers, preview: rows.slice(0, PREVIEW_ROWS), mapping, mappingNotes: notes, mappingCertain: certain, sheets, sheet };
  } catch {
    return null;
  }
}

self.onmessage = async (event: MessageEvent<ParseRequest>) => {
  const { file, mapping, sheet, joint, limitBytes } = event.data;
  let read: FileText | null = null;
  try {
    if (file.size > limitBytes) assertTextFile(new Uint8Array(file.size), limitBytes);
    const bytes = await readWithProgress(file);
    read = await uploadedFileText(bytes, limitBytes, sheet);
    const { text } = read;
    post({ type: 'progress', phase: 'parsing', loaded: file.size, total: file.size });
    const r = parseLoggerText(text, mapping ?? undefined, joint);
    const last = r.run.steps[r.run.steps.length - 1];
    post({
      type: 'result',
      result: {
        sentences: r.detection.sentences,
        headers: r.detection.headers,
        preview: r.preview.rows,
        mapping: r.mapping,
        mappingNotes: r.mappingNotes,
        mappingCertain: r.mappingCertain,
        sheets: read.sheets,
        sheet: read.sheet,
        zeroNotes: r.zeroNotes,
        derivedSteps: r.derivedSteps,
        derived: r.derived.map((d) => ({ order: d.order, pass: d.pass, position: d.position, positions: d.covers?.map((c) => c.position), firstLine: d.firstLine, lastLine: d.lastLine, timeS: d.timeS, riseN: d.riseN })),
        stepCount: r.run.steps.length,
        studCount: r.run.studCount,
        rowCount: r.rowCount,
        warnings: r.warnings,
        finalLoadsN: last ? last.loadsN : [],
      },
    });
  } catch (error) {
    const appError = isAppError(error) ? error : null;
    post({
      type: 'error',
      message: appError?.message ?? `The file could not be read: ${(error as Error)?.message ?? error}`,
      row: typeof appError?.details.row === 'number' ? appError.details.row : null,
      column: typeof appError?.details.column === 'string' ? appError.details.column : null,
      partial: read === null ? null : partialOf(read, joint),
    });
  }
};
