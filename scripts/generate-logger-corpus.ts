/**
 * Writes the logger-file corpus of tests/ingest/logger-corpus: good files in the ways data loggers
 * name and lay out channels, and bad files with one problem each, plus `manifest.json` with what
 * each file must give (step count, final loads in N) or where it must be refused (line, column).
 * Every number is invented here from known inputs (a seeded tightening of an 8-stud joint with a
 * 80 kN target), so the expected values are the generator's own inputs, not the parser's output.
 * No file imitates any product's format; header words are ordinary dictionary words.
 *
 *   npx tsx scripts/generate-logger-corpus.ts
 */
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import writeXlsxFile from 'write-excel-file/node';
import { createRng } from '../lib/sim/random';

const OUT = path.resolve(__dirname, '../tests/ingest/logger-corpus');
const N = 8;
const TARGET_KN = 80;
const CROSS = [1, 5, 3, 7, 2, 6, 4, 8];
const LBF_PER_KN = 1000 / 4.4482216152605;
const NOTE = 'Invented test data for Evenload (not from any real logger)';

interface PlanStep { pass: number; position: number; check: boolean; percent: number }

/** Three cross passes at 30, 70, 100 % and `checkPasses` circular passes at 100 %. */
function plan(checkPasses: number): PlanStep[] {
  const steps: PlanStep[] = [];
  [30, 70, 100].forEach((percent, i) => CROSS.forEach((position) => steps.push({ pass: i + 1, position, check: false, percent })));
  for (let c = 0; c < checkPasses; c++) for (let p = 1; p <= N; p++) steps.push({ pass: 4 + c, position: p, check: true, percent: 100 });
  return steps;
}

/**
 * The true loads (kN) after each step: the tightened stud goes to its pass's share of the target
 * (a check pass finds it already there and nothing moves); each neighbour loses 4 % of the rise
 * (an invented elastic interaction).
 */
function tighten(steps: PlanStep[]): number[][] {
  const loads = new Array<number>(N).fill(0);
  return steps.map((s) => {
    const k = s.position - 1;
    const goal = (TARGET_KN * s.percent) / 100;
    const rise = s.check ? 0 : Math.max(0, goal - loads[k]!);
    loads[k] = loads[k]! + rise;
    for (const j of [(k + 1) % N, (k + N - 1) % N]) loads[j] = Math.max(0, loads[j]! - 0.04 * rise);
    return loads.map((v) => Math.round(v * 1000) / 1000);
  });
}

interface Wide { rows: number[][]; trueFinal: number[] }

/**
 * A continuous wide series at 10 rows per second: 5 rows at rest, then for each step a 20-row ramp
 * and 10 held rows; a check step is 30 held rows. Readings = true load + offset + noise (kN).
 */
function wideSeries(steps: PlanStep[], offsets: number[], noiseKn: number, seed: number): Wide {
  const rng = createRng(seed);
  const truth = tighten(steps);
  const rows: number[][] = [];
  let current = new Array<number>(N).fill(0);
  let t = 0;
  const emit = (loads: number[]) => rows.push([t++ / 10, ...loads.map((v, k) => v + offsets[k]! + rng.uniform(-noiseKn, noiseKn))]);
  for (let i = 0; i < 5; i++) emit(current);
  steps.forEach((s, i) => {
    const next = truth[i]!;
    if (!s.check) for (let r = 1; r <= 20; r++) emit(current.map((v, k) => v + ((next[k]! - v) * r) / 20));
    for (let r = 0; r < (s.check ? 30 : 10); r++) emit(next);
    current = next;
  });
  return { rows, trueFinal: truth[truth.length - 1]! };
}

const fmt = (v: number, decimals = 3) => v.toFixed(decimals);

interface GoodCase {
  file: string;
  about: string;
  steps: number;
  finalLoadsN: number[];
  /** Largest difference from the true final loads the file's noise allows, in N. */
  toleranceN: number;
  /** The method's steps the upload is made with (for check passes), when they matter. */
  plannedSteps?: Array<{ pass: number; position: number; check: boolean }>;
  channelMap?: Array<{ channel: string; position: number }>;
  sheet?: string;
  /** A sentence fragment the parse must report (zero offsets, noise). */
  reports?: string[];
}

interface BadCase { file: string; about: string; row: number; column: string | null; fragment: string; sheet?: string }

const good: GoodCase[] = [];
const bad: BadCase[] = [];

function write(dir: 'good' | 'bad', file: string, text: string) {
  writeFileSync(path.join(OUT, dir, file), text);
}

/** A wide text file: comment, metadata lines, header, optional units row, rows. */
function wideText(o: { headers: string[]; rows: number[][]; delimiter?: string; decimalComma?: boolean; meta?: string[]; unitsRow?: string[]; scale?: number; bom?: boolean; crlf?: boolean }): string {
  const d = o.delimiter ?? ',';
  const scale = o.scale ?? 1;
  const cell = (v: number, i: number) => {
    const s = i === 0 ? fmt(v, 1) : fmt(v * scale, scale === 1 ? 3 : 1);
    return o.decimalComma ? s.replace('.', ',') : s;
  };
  const lines = [`# ${NOTE}: 8-stud joint, 80 kN target.`, ...(o.meta ?? []), o.headers.join(d), ...(o.unitsRow ? [o.unitsRow.join(d)] : []), ...o.rows.map((r) => r.map(cell).join(d))];
  return (o.bom ? '\uFEFF' : '') + lines.join(o.crlf ? '\r\n' : '\n') + (o.crlf ? '\r\n' : '\n');
}

const kN = (loads: number[]) => loads.map((v) => Math.round(v * 1000));
const three = plan(0);
const withCheck = plan(1);
const zero = new Array<number>(N).fill(0);
const chan = (f: (k: number) => string) => Array.from({ length: N }, (_, k) => f(k));

function addWide(file: string, about: string, headers: string[], o: Omit<Parameters<typeof wideText>[0], 'headers' | 'rows'> & { steps?: PlanStep[]; offsets?: number[]; noise?: number; seed: number; extra?: Partial<GoodCase> }) {
  const steps = o.steps ?? three;
  const series = wideSeries(steps, o.offsets ?? zero, o.noise ?? 0.02, o.seed);
  write('good', file, wideText({ ...o, headers, rows: series.rows }));
  const lbf = (o.scale ?? 1) !== 1;
  good.push({ file, about, steps: steps.length, finalLoadsN: kN(series.trueFinal), toleranceN: Math.round(((o.noise ?? 0.02) * 2 + (lbf ? 0.05 : 0.0005)) * 1000), ...o.extra });
}

function generateGood() {
  addWide('channels-ch-kn.csv', 'CH1 (kN) … CH8 (kN), no step column', ['Time (s)', ...chan((k) => `CH${k + 1} (kN)`)], { seed: 1 });
  addWide('channels-ai-zero-based.csv', 'AI0 … AI7 (AI0 = stud 1), unit on a metadata line', ['t', ...chan((k) => `AI${k}`)], { seed: 2, meta: ['units: kN'] });
  addWide('channels-underscore-units.csv', 'ch1_kN … ch8_kN', ['time', ...chan((k) => `ch${k + 1}_kN`)], { seed: 3 });
  addWide('channels-units-row.csv', 'Channel 1 … Channel 8 with a units row', ['Time', ...chan((k) => `Channel ${k + 1}`)], { seed: 4, unitsRow: ['s', ...chan(() => 'kN')] });
  addWide('chan-lbf-metadata.csv', 'Chan 1 … Chan 8 in lbf, unit on a metadata line', ['Time', ...chan((k) => `Chan ${k + 1}`)], { seed: 5, meta: ['Unit: lbf'], scale: LBF_PER_KN });
  addWide('german-semicolon-comma.csv', 'Zeit; Kraft 1 …; semicolon and decimal comma; Einheit: kN', ['Zeit', ...chan((k) => `Kraft ${k + 1}`)], { seed: 6, delimiter: ';', decimalComma: true, meta: ['Einheit: kN'] });
  addWide('french-bolts.csv', 'temps, boulon 1 (kN) …', ['temps', ...chan((k) => `boulon ${k + 1} (kN)`)], { seed: 7 });
  addWide('spanish-force.csv', 'tiempo, fuerza 1 [kN] …', ['tiempo', ...chan((k) => `fuerza ${k + 1} [kN]`)], { seed: 8 });
  addWide('italian-tab.tsv', 'tempo, forza 1 (kN) …, tab separated', ['tempo', ...chan((k) => `forza ${k + 1} (kN)`)], { seed: 9, delimiter: '\t' });
  addWide('dutch-bom-crlf.csv', 'tijd, kracht 1 (kN) …, byte-order mark and CRLF', ['tijd', ...chan((k) => `kracht ${k + 1} (kN)`)], { seed: 10, bom: true, crlf: true });
  const offsets = [0, -0.35, -0.72, 0.2, -0.9, 0.1, -0.05, 0.4];
  addWide('tare-offsets.csv', 'CH1 … CH8 with zero offsets up to −0.9 kN, removed by tare', ['Time (s)', ...chan((k) => `CH${k + 1} (kN)`)], {
    seed: 11,
    offsets,
    noise: 0.01,
    extra: { reports: ['CH3 (kN) read −0.7', 'at rest; loads corrected by +0.7'] },
  });
  addWide('noise-negatives.csv', 'CH1 … CH8 with ±0.08 kN noise, small negatives at rest', ['Time (s)', ...chan((k) => `CH${k + 1} (kN)`)], { seed: 12, noise: 0.08, extra: { reports: ['taken as 0'] } });
  addWide('check-pass-wide.csv', 'CH1 … CH8, three cross passes and a check pass where nothing moves', ['Time (s)', ...chan((k) => `CH${k + 1} (kN)`)], {
    seed: 13,
    steps: withCheck,
    extra: { plannedSteps: withCheck.map(({ pass, position, check }) => ({ pass, position, check })) },
  });
  const serials = ['SG-4471', 'SG-4472', 'SG-4480', 'SG-4475', 'SG-4473', 'SG-4478', 'SG-4476', 'SG-4479'];
  addWide('gauge-serials.csv', 'gauge serial names placed by the joint channel map', ['Time (s)', ...serials.map((s) => `${s} (kN)`)], {
    seed: 14,
    extra: { channelMap: serials.map((channel, k) => ({ channel, position: k + 1 })) },
  });

  // Long: one snapshot of every stud per step (the first at rest), check pass included.
  const truth = tighten(withCheck);
  const longRows = ['time_s,stud,load_kN'];
  for (let p = 1; p <= N; p++) longRows.push(`0,${p},0.000`);
  truth.forEach((loads, i) => loads.forEach((v, k) => longRows.push(`${(i + 1) * 10},${k + 1},${fmt(v)}`)));
  write('good', 'long-snapshots-check-pass.csv', `# ${NOTE}: one snapshot per step.\n${longRows.join('\n')}\n`);
  good.push({ file: 'long-snapshots-check-pass.csv', about: 'long, one snapshot of every stud per step, 8 check steps with no rise', steps: withCheck.length, finalLoadsN: kN(truth[truth.length - 1]!), toleranceN: 1, plannedSteps: withCheck.map(({ pass, position, check }) => ({ pass, position, check })) });

  const de = ['Zeit;Bolzen;Kraft [kN]'];
  for (let p = 1; p <= N; p++) de.push(`0;${p};0`);
  tighten(three).forEach((loads, i) => loads.forEach((v, k) => de.push(`${(i + 1) * 5};${k + 1};${fmt(v).replace('.', ',')}`)));
  write('good', 'long-german.csv', `# ${NOTE}.\n${de.join('\n')}\n`);
  good.push({ file: 'long-german.csv', about: 'long, German headers (Zeit, Bolzen, Kraft), decimal comma', steps: three.length, finalLoadsN: kN(tighten(three).at(-1)!), toleranceN: 1 });
}

async function generateWorkbook() {
  const series = wideSeries(three, zero, 0.02, 15);
  const header = ['Zeit (s)', ...chan((k) => `CH${k + 1} (kN)`)];
  const data = [header.map((value) => ({ value })), ...series.rows.map((r) => r.map((v, i) => ({ value: i === 0 ? v : Math.round(v * 1000) / 1000 })))];
  const buffer = await writeXlsxFile([
    { sheet: 'Notes', data: [[{ value: NOTE }]] },
    { sheet: 'Messung', data },
  ] as never).toBuffer();
  writeFileSync(path.join(OUT, 'good', 'workbook.xlsx'), buffer);
  good.push({ file: 'workbook.xlsx', about: 'Excel workbook, second sheet "Messung"', steps: three.length, finalLoadsN: kN(series.trueFinal), toleranceN: 41, sheet: 'Messung' });

  const badData = data.map((row) => [...row]);
  badData[40]![3] = { value: 'broken' as never };
  const badBuffer = await writeXlsxFile([{ sheet: 'Messung', data: badData }] as never).toBuffer();
  writeFileSync(path.join(OUT, 'bad', 'workbook-text-in-load.xlsx'), badBuffer);
  bad.push({ file: 'workbook-text-in-load.xlsx', about: 'text in a load cell of a workbook', row: 41, column: 'CH3 (kN)', fragment: 'broken' });
}

/** Bad files: a good wide CH file with one cell changed, and a few of other shapes. */
function generateBad() {
  const series = wideSeries(three, zero, 0.02, 21);
  const headers = ['Time (s)', ...chan((k) => `CH${k + 1} (kN)`)];
  const base = wideText({ headers, rows: series.rows }).split('\n');
  // line numbers: 1 comment, 2 header, data from 3
  const edit = (file: string, about: string, line: number, col: number | null, replace: (cells: string[]) => string[], fragment: string) => {
    const lines = [...base];
    lines[line - 1] = replace(lines[line - 1]!.split(',')).join(',');
    write('bad', file, lines.join('\n'));
    bad.push({ file, about, row: line, column: col === null ? null : headers[col]!, fragment });
  };
  const set = (col: number, value: string) => (cells: string[]) => cells.map((c, i) => (i === col ? value : c));
  edit('clearly-negative.csv', 'a load of −5 kN mid-file', 120, 3, set(3, '-5.000'), 'negative load');
  edit('text-in-load.csv', 'text in a load cell', 60, 2, set(2, 'n/a'), 'n/a');
  edit('empty-load.csv', 'an empty load cell', 61, 5, set(5, ''), 'empty');
  edit('absurd-load.csv', 'a load far above the stud limit', 90, 4, set(4, '9000'), 'above the limit');
  edit('nan-load.csv', 'NaN in a load cell', 95, 6, set(6, 'NaN'), 'NaN');
  edit('infinity-load.csv', 'Infinity in a load cell', 96, 7, set(7, 'Infinity'), 'Infinity');
  edit('spreadsheet-error.csv', 'a spreadsheet error cell', 97, 8, set(8, '#DIV/0!'), '#DIV/0!');
  edit('time-backwards.csv', 'time goes backwards', 100, 0, set(0, '1.0'), 'back');
  edit('ragged-short.csv', 'a row with a cell missing', 101, 8, (c) => c.slice(0, 8), 'missing');
  edit('decimal-comma-cell.csv', 'a decimal comma in a decimal-point file', 102, 1, set(1, '"1,5"'), '1,5');

  const tared = wideSeries(three, [0, 0, -0.5, 0, 0, 0, 0, 0], 0.01, 22);
  const tl = wideText({ headers, rows: tared.rows }).split('\n');
  tl[149] = tl[149]!.split(',').map((c, i) => (i === 3 ? '-3.000' : c)).join(',');
  write('bad', 'negative-after-tare.csv', tl.join('\n'));
  bad.push({ file: 'negative-after-tare.csv', about: 'CH3 tared by +0.5 kN still reads −2.5 kN', row: 150, column: 'CH3 (kN)', fragment: 'negative load' });

  const longBad = (file: string, about: string, line: number, value: string, column: string, fragment: string) => {
    const rows = ['time_s,stud,load_kN'];
    for (let p = 1; p <= N; p++) rows.push(`0,${p},0`);
    tighten(three).slice(0, 4).forEach((loads, i) => loads.forEach((v, k) => rows.push(`${(i + 1) * 10},${k + 1},${fmt(v)}`)));
    const lines = [`# ${NOTE}.`, ...rows];
    const cells = lines[line - 1]!.split(',');
    cells[column === 'stud' ? 1 : 2] = value;
    lines[line - 1] = cells.join(',');
    write('bad', file, `${lines.join('\n')}\n`);
    bad.push({ file, about, row: line, column, fragment });
  };
  longBad('long-stud-out-of-range.csv', 'stud 9 on an 8-stud joint', 14, '9', 'stud', 'outside 1..8');
  longBad('long-stud-text.csv', 'a stud position that is text', 15, 'four', 'stud', 'four');
  longBad('long-duplicate-stud.csv', 'a stud twice at one time stamp', 16, '3', 'stud', 'appears twice');
  longBad('long-negative.csv', 'a clearly negative load in a long file', 20, '-4.0', 'load_kN', 'negative load');

  const de = wideText({ headers: ['Zeit', ...chan((k) => `Kraft ${k + 1}`), 'Kraft 9'], rows: series.rows.map((r) => [...r, 0]), delimiter: ';', decimalComma: true, meta: ['Einheit: kN'] });
  write('bad', 'german-ninth-stud.csv', de);
  bad.push({ file: 'german-ninth-stud.csv', about: 'a ninth load column on an 8-stud joint', row: 3, column: 'Kraft 9', fragment: 'outside 1..8' });
}

async function main() {
  rmSync(OUT, { recursive: true, force: true });
  mkdirSync(path.join(OUT, 'good'), { recursive: true });
  mkdirSync(path.join(OUT, 'bad'), { recursive: true });
  generateGood();
  generateBad();
  await generateWorkbook();
  const manifest = {
    about: `${NOTE}. Written by scripts/generate-logger-corpus.ts; expected values are the generator's own inputs.`,
    joint: { studCount: N, targetLoadN: TARGET_KN * 1000 },
    good,
    bad,
  };
  writeFileSync(path.join(OUT, 'manifest.json'), `${JSON.stringify(manifest, null, 1)}\n`);
  console.log(`wrote ${good.length} good and ${bad.length} bad files to ${path.relative(process.cwd(), OUT)}`);
}

void main();
