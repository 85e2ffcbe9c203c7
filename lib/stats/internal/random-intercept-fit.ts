/**
 * The working parts of `randomInterceptModel` (lib/stats/random-intercept-model.ts, where the
 * algorithm and its references are written): validating and centring the design once, taking a
 * subset of its predictors without another pass over the rows, and the profiled-likelihood fit.
 */
import { StatsError } from '../stats-error';
import { assertDesign } from './assert-design';
import { assertValues } from './assert-values';
import { brentRoot } from './brent-root';
import { choleskyFactor, choleskyInverse, choleskySolve, forwardSolve } from './cholesky';
import { describeNumber } from './describe-number';
import { mean } from '../mean';

/** Result of `randomInterceptModel`. */
export interface RandomInterceptModelResult {
  kind: 'randomInterceptModel';
  method: 'REML' | 'ML';
  /** Intercept first, then one per predictor in input order. */
  coefficients: number[];
  /** √diag(σ²(XᵀV⁻¹X)⁻¹) at the estimate, σ² the REML or ML residual variance (as lme4's vcov). */
  standardErrors: number[];
  /** σ²_b, the variance of the cluster intercepts (0 on the boundary). */
  clusterVariance: number;
  /** σ², the residual (within-cluster) variance. */
  residualVariance: number;
  /** σ²_b/σ², the ratio the likelihood is profiled over. */
  varianceRatio: number;
  /** REML criterion log-likelihood (REML) or log-likelihood (ML), as lme4's logLik reports it. */
  logLikelihood: number;
  /** True when the estimate sits on the boundary σ²_b = 0. */
  boundary: boolean;
  /** Evaluations of the profiled criterion used to find the estimate. */
  evaluations: number;
  numberOfClusters: number;
  n: number;
}

export interface ClusterSums {
  count: number;
  /** Column sums of the (centred) design within the cluster, intercept first. */
  x: number[];
  y: number;
}

interface Profile {
  deviance: number;
  /** d(deviance)/dθ. */
  slope: number;
  beta: number[];
  factor: number[][];
  logDetM: number;
}

const TWO_PI = 2 * Math.PI;

/** The centred design and its sums (one pass over the rows), shared by every fit on a subset of its columns. */
export interface PreparedDesign {
  n: number;
  m: number;
  yBar: number;
  xBars: number[];
  clusterIndex: number[];
  /** Centred columns, the intercept's column of ones first. */
  columns: Float64Array[];
  yc: Float64Array;
  sums: ClusterSums[];
  xtx: number[][];
  xty: number[];
  yty: number;
}

/** Validates and prepares the design (the checks and messages of `randomInterceptModel`). */
export function prepareDesign(
  fn: string,
  predictors: readonly (readonly number[])[],
  y: readonly number[],
  clusters: readonly (string | number)[],
): PreparedDesign {
  if (!Array.isArray(predictors)) throw new StatsError(`${fn} requires an array of predictor columns`);
  const p = predictors.length + 1;
  if (predictors.length > 0) assertDesign(fn, predictors, y, p);
  else assertValues(fn, y, 2, 'of the response');
  const n = y.length;
  const clusterIndex = indexClusters(fn, clusters, n);
  const m = Math.max(...clusterIndex) + 1;
  if (m < 2) throw new StatsError(`${fn} requires at least two clusters`);
  if (n <= m) throw new StatsError(`${fn} requires more observations than clusters (got ${n} for ${m})`);
  if (n <= p) throw new StatsError(`${fn} requires more observations than parameters (got ${n} for ${p})`);

  const firstInCluster = new Map<number, number>();
  const constantWithin = y.every((v, i) => {
    const first = firstInCluster.get(clusterIndex[i]!);
    if (first === undefined) firstInCluster.set(clusterIndex[i]!, v);
    return first === undefined || first === v;
  });
  if (constantWithin) throw new StatsError(`${fn} requires some variation within clusters`);

  const yBar = mean(y);
  const xBars = predictors.map((c) => mean(c));
  // Columns of the centred design, the intercept's column of ones first.
  // Plain loops: Float64Array.from with a mapping function is many times slower in V8.
  const centred = (values: readonly number[], centre: number): Float64Array => {
    const out = new Float64Array(n);
    for (let i = 0; i < n; i++) out[i] = values[i]! - centre;
    return out;
  };
  const columns = [new Float64Array(n).fill(1), ...predictors.map((c, j) => centred(c, xBars[j]!))];
  const yc = centred(y, yBar);
  const sums: ClusterSums[] = Array.from({ length: m }, () => ({ count: 0, x: new Array<number>(p).fill(0), y: 0 }));
  for (let i = 0; i < n; i++) {
    const s = sums[clusterIndex[i]!]!;
    s.count += 1;
    s.y += yc[i]!;
  }
  columns.forEach((column, a) => {
    for (let i = 0; i < n; i++) sums[clusterIndex[i]!]!.x[a]! += column[i]!;
  });
  const xtx = columns.map((u) => columns.map((v) => dot(u, v, n)));
  const xty = columns.map((u) => dot(u, yc, n));
  const yty = dot(yc, yc, n);

  return { n, m, yBar, xBars, clusterIndex, columns, yc, sums, xtx, xty, yty };
}

/**
 * The design restricted to some of its predictors (0-based indices into the predictor columns;
 * the intercept is always kept): the same numbers a preparation of those columns alone gives.
 */
export function selectPredictors(data: PreparedDesign, keep: readonly number[]): PreparedDesign {
  const cols = [0, ...keep.map((j) => j + 1)];
  return {
    ...data,
    xBars: keep.map((j) => data.xBars[j]!),
    columns: cols.map((c) => data.columns[c]!),
    sums: data.sums.map((s) => ({ count: s.count, x: cols.map((c) => s.x[c]!), y: s.y })),
    xtx: cols.map((a) => cols.map((b) => data.xtx[a]![b]!)),
    xty: cols.map((c) => data.xty[c]!),
  };
}

/** Fits the prepared design by REML or ML (the algorithm of `randomInterceptModel`). */
export function fitPrepared(fn: string, data: PreparedDesign, method: 'REML' | 'ML'): RandomInterceptModelResult {
  if (method !== 'REML' && method !== 'ML') throw new StatsError(`${fn} requires a method of REML or ML (got ${String(method)})`);
  const { n, m, yBar, xBars, clusterIndex, columns, yc, sums, xtx, xty, yty } = data;
  const p = columns.length;
  const dfSigma = method === 'REML' ? n - p : n;
  let evaluations = 0;
  const profile = (theta: number): Profile => {
    evaluations += 1;
    const mm = xtx.map((r) => [...r]);
    const q = [...xty];
    let yHy = yty;
    let logDetH = 0;
    for (const s of sums) {
      const c = theta / (1 + s.count * theta);
      logDetH += Math.log1p(s.count * theta);
      for (let a = 0; a < p; a++) {
        q[a]! -= c * s.x[a]! * s.y;
        for (let b = 0; b < p; b++) mm[a]![b]! -= c * s.x[a]! * s.x[b]!;
      }
      yHy -= c * s.y * s.y;
    }
    const factor = choleskyFactor(mm);
    if (!factor) throw new StatsError(`${fn} requires predictors that are not collinear`);
    const beta = choleskySolve(factor, q);
    const r2 = yHy - q.reduce((acc, v, a) => acc + v * beta[a]!, 0);
    if (!(r2 > 0)) throw new StatsError(`${fn} requires some variation within clusters`);
    const logDetM = 2 * factor.reduce((acc, r, j) => acc + Math.log(r[j]!), 0);
    let dr2 = 0;
    let dLogDetH = 0;
    let dLogDetM = 0;
    for (const s of sums) {
      const w = 1 / (1 + s.count * theta) ** 2;
      const residualSum = s.y - s.x.reduce((acc, v, a) => acc + v * beta[a]!, 0);
      dr2 -= residualSum * residualSum * w;
      dLogDetH += s.count / (1 + s.count * theta);
      if (method === 'REML') dLogDetM -= forwardSolve(factor, s.x).reduce((acc, v) => acc + v * v, 0) * w;
    }
    const deviance = dfSigma * (1 + Math.log((TWO_PI * r2) / dfSigma)) + logDetH + (method === 'REML' ? logDetM : 0);
    const slope = (dfSigma * dr2) / r2 + dLogDetH + dLogDetM;
    return { deviance, slope, beta, factor, logDetM };
  };

  const theta = minimiseProfile(fn, profile);
  const best = profile(theta);
  // r² and σ² again from the residuals themselves (no cancellation of yᵀH⁻¹y − qᵀβ̂).
  const residuals = yc.slice();
  columns.forEach((column, a) => {
    for (let i = 0; i < n; i++) residuals[i]! -= best.beta[a]! * column[i]!;
  });
  const residualSums = new Array<number>(m).fill(0);
  for (let i = 0; i < n; i++) residualSums[clusterIndex[i]!]! += residuals[i]!;
  const squares = dot(residuals, residuals, n);
  const r2 = squares - sums.reduce((acc, s, k) => acc + (theta / (1 + s.count * theta)) * residualSums[k]! ** 2, 0);
  const logDetH = sums.reduce((acc, s) => acc + Math.log1p(s.count * theta), 0);
  const residualVariance = r2 / dfSigma;
  const deviance = dfSigma * (1 + Math.log((TWO_PI * r2) / dfSigma)) + logDetH + (method === 'REML' ? best.logDetM : 0);

  const covariance = choleskyInverse(best.factor).map((r) => r.map((v) => v * residualVariance));
  // Back from centred predictors: b₀ = ȳ + β₀ − Σβⱼx̄ⱼ, Var(b₀) = aᵀCa with a = (1, −x̄₁, …).
  const a = [1, ...xBars.map((v) => -v)];
  const interceptVariance = a.reduce((acc, ai, i) => acc + ai * a.reduce((s, aj, j) => s + covariance[i]![j]! * aj, 0), 0);
  const coefficients = [yBar + best.beta.reduce((acc, b, i) => acc + a[i]! * b, 0), ...best.beta.slice(1)];
  const standardErrors = [Math.sqrt(interceptVariance), ...covariance.slice(1).map((r, j) => Math.sqrt(r[j + 1]!))];
  return {
    kind: 'randomInterceptModel',
    method,
    coefficients,
    standardErrors,
    clusterVariance: theta * residualVariance,
    residualVariance,
    varianceRatio: theta,
    logLikelihood: -deviance / 2,
    boundary: theta === 0,
    evaluations,
    numberOfClusters: m,
    n,
  };
}

function dot(u: Float64Array, v: Float64Array, n: number): number {
  let acc = 0;
  for (let i = 0; i < n; i++) acc += u[i]! * v[i]!;
  return acc;
}

/** Cluster labels to 0-based indices in order of first appearance; labels compare as strings. */
function indexClusters(fn: string, clusters: readonly (string | number)[], n: number): number[] {
  if (!Array.isArray(clusters) || clusters.length !== n) {
    throw new StatsError(`${fn} requires one cluster label per observation (got ${Array.isArray(clusters) ? clusters.length : 0}, expected ${n})`);
  }
  const seen = new Map<string, number>();
  return clusters.map((label, i) => {
    if (!(typeof label === 'string' || (typeof label === 'number' && Number.isFinite(label)))) {
      throw new StatsError(`${fn} requires string or finite number cluster labels (got ${describeNumber(label)} at index ${i})`);
    }
    const key = String(label);
    if (!seen.has(key)) seen.set(key, seen.size);
    return seen.get(key)!;
  });
}

/**
 * θ̂ ≥ 0 minimising the profiled deviance: the boundary θ = 0 and every local minimum found by a
 * scan of log θ (factor √10 per step) refined by Brent on the sign of the derivative.
 */
function minimiseProfile(fn: string, profile: (theta: number) => Profile): number {
  const atZero = profile(0);
  const candidates: { theta: number; deviance: number }[] = atZero.slope >= 0 ? [{ theta: 0, deviance: atZero.deviance }] : [];
  const slopeInLog = (logTheta: number): number => {
    const t = Math.exp(logTheta);
    return t * profile(t).slope;
  };
  let previousLog = Number.NEGATIVE_INFINITY;
  let previousSlope = atZero.slope;
  for (let k = -16; ; k++) {
    const logTheta = (k / 2) * Math.LN10;
    const here = profile(Math.exp(logTheta));
    if (previousSlope < 0 && here.slope >= 0) {
      const root =
        previousLog === Number.NEGATIVE_INFINITY
          ? brentRoot((t) => profile(t).slope, 0, Math.exp(logTheta))
          : Math.exp(brentRoot(slopeInLog, previousLog, logTheta));
      candidates.push({ theta: root, deviance: profile(root).deviance });
    }
    previousLog = logTheta;
    previousSlope = here.slope;
    if (k >= 16 && here.slope >= 0) break;
    if (k >= 32) throw new StatsError(`${fn} requires some variation within clusters`);
  }
  return candidates.reduce((best, c) => (c.deviance < best.deviance ? c : best)).theta;
}
