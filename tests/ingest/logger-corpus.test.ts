/**
 * The logger-file corpus (tests/ingest/logger-corpus, written by scripts/generate-logger-corpus.ts)
 * through the pure parser, as the server runs it: `uploadedFileText` then `parseLoggerText` with no
 * mapping (the parser's own guess). The expected step counts and final loads in `manifest.json` are
 * the generator's own inputs (the true loads of its seeded tightening before offsets and noise were
 * added): that is the outside truth here, not a previous parse.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { isAppError } from '@/lib/http/errors';
import { parseLoggerText } from '@/lib/ingest/parse-text';
import { uploadedFileText } from '@/lib/ingest/workbook';
import type { JointForImport } from '@/lib/ingest/normalise';
import { CORPUS_JOINT } from './joints';

const DIR = path.join(__dirname, 'logger-corpus');
interface Good { file: string; steps: number; finalLoadsN: number[]; toleranceN: number; plannedSteps?: JointForImport['plannedSteps']; channelMap?: JointForImport['channelMap']; sheet?: string; reports?: string[] }
interface Bad { file: string; row: number; column: string | null; fragment: string }
const manifest = JSON.parse(readFileSync(path.join(DIR, 'manifest.json'), 'utf8')) as { joint: { studCount: number; targetLoadN: number }; good: Good[]; bad: Bad[] };

const LIMIT = 20 * 1024 * 1024;

async function parse(dir: 'good' | 'bad', file: string, extra: Partial<JointForImport> = {}, sheet?: string) {
  const bytes = new Uint8Array(readFileSync(path.join(DIR, dir, file)));
  const { text } = await uploadedFileText(bytes, LIMIT, sheet);
  return parseLoggerText(text, undefined, { ...CORPUS_JOINT, ...extra });
}

describe('logger corpus: the joint matches the generator', () => {
  it('8 studs, 80 kN target (the generator\'s joint)', () => {
    expect(manifest.joint).toEqual({ studCount: CORPUS_JOINT.studCount, targetLoadN: CORPUS_JOINT.targetLoadN });
    expect(manifest.good.length).toBeGreaterThanOrEqual(15);
    expect(manifest.bad.length).toBeGreaterThanOrEqual(15);
  });
});

describe('logger corpus: good files give the generator\'s steps and final loads', () => {
  it.each(manifest.good)('$file', async (g) => {
    const r = await parse('good', g.file, { plannedSteps: g.plannedSteps, channelMap: g.channelMap }, g.sheet);
    expect(r.run.steps).toHaveLength(g.steps);
    const final = r.run.steps.at(-1)!.loadsN;
    final.forEach((n, k) => expect(Math.abs(n - g.finalLoadsN[k]!), `stud ${k + 1}: ${n} N vs ${g.finalLoadsN[k]} N`).toBeLessThanOrEqual(g.toleranceN));
    for (const fragment of g.reports ?? []) expect(r.zeroNotes.join(' ')).toContain(fragment);
    // Derived step lines never overlap (step 3 "29–38" and step 4 "29–46" was a bug).
    r.stepLines.slice(1).forEach((s, i) => expect(s.firstLine, `step ${s.order}`).toBeGreaterThan(r.stepLines[i]!.lastLine));
  });

  it('AI0 is stud 1: the zero-based file maps AI0..AI7 to positions 1..8 and says so', async () => {
    const r = await parse('good', 'channels-ai-zero-based.csv');
    expect(r.mapping.studColumns.map((s) => [s.column, s.position])).toEqual(Array.from({ length: 8 }, (_, k) => [`AI${k}`, k + 1]));
    expect(r.mappingNotes.join(' ')).toContain('AI0 = stud 1');
    expect(r.mapping.loadUnit).toBe('kN');
    expect(r.mappingCertain).toBe(true);
  });

  it('units from a metadata line ("Unit: lbf") are used and named', async () => {
    const r = await parse('good', 'chan-lbf-metadata.csv');
    expect(r.mapping.loadUnit).toBe('lbf');
    expect(r.mappingNotes.join(' ')).toMatch(/Load unit lbf taken from line 2/);
  });

  it('German headers: Zeit is time, Kraft n the load of stud n', async () => {
    const r = await parse('good', 'german-semicolon-comma.csv');
    expect(r.mapping.timeColumn).toBe('Zeit');
    expect(r.mapping.studColumns[2]).toEqual({ column: 'Kraft 3', position: 3 });
  });

  it('gauge serial names without the joint channel map are a guess the user must confirm', async () => {
    const r = await parse('good', 'gauge-serials.csv');
    expect(r.mappingCertain).toBe(false);
    const mapped = await parse('good', 'gauge-serials.csv', { channelMap: manifest.good.find((g) => g.file === 'gauge-serials.csv')!.channelMap });
    expect(mapped.mappingCertain).toBe(true);
  });

  it('the wide check pass is lost without the method and kept with it (8 steps with no rise)', async () => {
    const g = manifest.good.find((c) => c.file === 'check-pass-wide.csv')!;
    expect((await parse('good', g.file)).run.steps).toHaveLength(24);
    const r = await parse('good', g.file, { plannedSteps: g.plannedSteps });
    expect(r.run.steps.slice(24).map((s) => s.position)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    expect(r.run.steps.slice(24).every((s) => s.pass === 4)).toBe(true);
  });

  it('the long check pass takes each stud from the method\'s order (1…8 after the cross passes), not a guess', async () => {
    const g = manifest.good.find((c) => c.file === 'long-snapshots-check-pass.csv')!;
    const guessed = await parse('good', g.file);
    expect(guessed.warnings.filter((w) => w.includes('is a guess'))).toHaveLength(8);
    const r = await parse('good', g.file, { plannedSteps: g.plannedSteps });
    // The generator's plan: three cross passes (24 steps), then a circular check pass 1…8 (scripts/generate-logger-corpus.ts).
    expect(r.run.steps.map((s) => s.position)).toEqual(g.plannedSteps!.map((p) => p.position));
    expect(r.run.steps.slice(24).map((s) => s.position)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    expect(r.warnings.join(' ')).not.toContain('is a guess');
  });

  it.each(manifest.good.filter((g) => !g.plannedSteps && !/^long-/.test(g.file)))('$file with a method that has a check pass keeps the generator\'s steps: the short hold after the last pull is no check pass', async (g) => {
    // The generator holds 10 rows after each pull; its check steps are 30 held rows each (scripts/generate-logger-corpus.ts).
    const plannedSteps = manifest.good.find((c) => c.file === 'check-pass-wide.csv')!.plannedSteps;
    const r = await parse('good', g.file, { plannedSteps, channelMap: g.channelMap }, g.sheet);
    expect(r.run.steps).toHaveLength(g.steps);
  });

  it('tare is switchable: switched off, CH5\'s −0.9 kN offset (the generator\'s) is a negative load beyond the noise band', async () => {
    const text = readFileSync(path.join(DIR, 'good', 'tare-offsets.csv'), 'utf8');
    const guessed = parseLoggerText(text, undefined, CORPUS_JOINT);
    expect(guessed.mapping.tare).toBe('auto');
    expect(() => parseLoggerText(text, { ...guessed.mapping, tare: 'off' }, CORPUS_JOINT)).toThrow(/^Line 3, column "CH5 \(kN\)": −0\.(?:8[5-9]|9\d) kN is a negative load/);
  });

  it('tare switched off on a file without offsets keeps the readings and says so', async () => {
    const text = readFileSync(path.join(DIR, 'good', 'channels-ch-kn.csv'), 'utf8');
    const guessed = parseLoggerText(text, undefined, CORPUS_JOINT);
    const off = parseLoggerText(text, { ...guessed.mapping, tare: 'off' }, CORPUS_JOINT);
    expect(off.zeroNotes[0]).toContain('tare switched off');
    expect(off.run.steps).toHaveLength(guessed.run.steps.length);
  });
});

describe('logger corpus: bad files are refused naming line and column', () => {
  it.each(manifest.bad)('$file', async (b) => {
    let caught: unknown = null;
    try {
      await parse('bad', b.file);
    } catch (e) {
      caught = e;
    }
    expect(isAppError(caught), String(caught)).toBe(true);
    const e = caught as { message: string; details: { row?: number; column?: string } };
    expect(e.message).toContain(b.fragment);
    expect(e.details.row).toBe(b.row);
    expect(e.message).toMatch(new RegExp(`^Line ${b.row}\\b`));
    if (b.column !== null) expect(e.details.column).toBe(b.column);
  });
});
