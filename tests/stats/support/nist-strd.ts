import fs from 'node:fs';

/** Parsers for the NIST StRD file formats (see tests/fixtures/reference/README.md). Accept CRLF and LF. */

const NUM = '([-+]?\\d*\\.?\\d+(?:[eE][-+]?\\d+)?)';

function lines(file: string): string[] {
  return fs.readFileSync(file, 'utf8').split(/\r?\n/);
}

function numberAfter(text: string[], pattern: RegExp, label: string): number {
  for (const l of text) {
    const m = pattern.exec(l);
    if (m?.[1] !== undefined) return Number(m[1]);
  }
  throw new Error(`certified ${label} not found`);
}

/** Data rows from line 61 (1-based) to the end, blank lines skipped. */
function dataRows(text: string[]): number[][] {
  return text
    .slice(60)
    .filter((l) => l.trim() !== '')
    .map((l) => l.trim().split(/\s+/).map(Number));
}

export interface UnivariateSet {
  values: number[];
  mean: number;
  sd: number;
  r1: number;
  n: number;
}

export function readUnivariate(file: string): UnivariateSet {
  const t = lines(file);
  const certified = t.slice(40, 43); // lines 41-43
  const values = dataRows(t).map((r) => r[0]!);
  return {
    values,
    mean: numberAfter(certified, new RegExp(`ybar:\\s+${NUM}`), 'mean'),
    sd: numberAfter(certified, new RegExp(`\\bs:\\s+${NUM}`), 'sd'),
    r1: numberAfter(certified, new RegExp(`r\\(1\\):\\s+${NUM}`), 'r(1)'),
    n: numberAfter(t, new RegExp(`Number of Observations:\\s+${NUM}`), 'n'),
  };
}

export interface AnovaSet {
  groups: number[][];
  dfBetween: number;
  ssBetween: number;
  msBetween: number;
  f: number;
  dfWithin: number;
  ssWithin: number;
  msWithin: number;
  rSquared: number;
  residualSd: number;
}

export function readAnova(file: string): AnovaSet {
  const t = lines(file);
  const certified = t.slice(39, 49); // lines 40-49 cover both 41-47 and AtmWtAg's 42-48
  const between = certified.map((l) => new RegExp(`^\\s*Between \\w+\\s+${NUM}\\s+${NUM}\\s+${NUM}\\s+${NUM}`).exec(l)).find(Boolean);
  const within = certified.map((l) => new RegExp(`^\\s*Within \\w+\\s+${NUM}\\s+${NUM}\\s+${NUM}`).exec(l)).find(Boolean);
  if (!between || !within) throw new Error(`certified ANOVA table not found in ${file}`);
  const byTreatment = new Map<number, number[]>();
  for (const [id, y] of dataRows(t)) {
    const g = byTreatment.get(id!) ?? [];
    g.push(y!);
    byTreatment.set(id!, g);
  }
  return {
    groups: [...byTreatment.keys()].sort((a, b) => a - b).map((k) => byTreatment.get(k)!),
    dfBetween: Number(between[1]),
    ssBetween: Number(between[2]),
    msBetween: Number(between[3]),
    f: Number(between[4]),
    dfWithin: Number(within[1]),
    ssWithin: Number(within[2]),
    msWithin: Number(within[3]),
    rSquared: numberAfter(certified, new RegExp(`R-Squared\\s+${NUM}`), 'R²'),
    residualSd: numberAfter(certified, new RegExp(`Standard Deviation\\s+${NUM}`), 'residual SD'),
  };
}

export interface RegressionSet {
  /** Data columns: y then x (or x1..x6 for Longley). */
  y: number[];
  x: number[][];
  coefficients: number[];
  standardErrors: number[];
  residualSd: number;
  rSquared: number;
}

export function readRegression(file: string): RegressionSet {
  const t = lines(file);
  const certified = t.slice(28, 56);
  const coefficients: number[] = [];
  const standardErrors: number[] = [];
  for (const l of certified) {
    const m = new RegExp(`^\\s*B\\d+\\s+${NUM}\\s+${NUM}`).exec(l);
    if (m) {
      coefficients.push(Number(m[1]));
      standardErrors.push(Number(m[2]));
    }
  }
  const rows = dataRows(t);
  const width = rows[0]!.length;
  return {
    y: rows.map((r) => r[0]!),
    x: Array.from({ length: width - 1 }, (_, j) => rows.map((r) => r[j + 1]!)),
    coefficients,
    standardErrors,
    residualSd: numberAfter(certified, new RegExp(`^\\s*Standard Deviation\\s+${NUM}`), 'residual SD'),
    rSquared: numberAfter(certified, new RegExp(`R-Squared\\s+${NUM}`), 'R²'),
  };
}
