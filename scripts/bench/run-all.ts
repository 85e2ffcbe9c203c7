/**
 * The benchmarks of `npm run bench`, side by side in one run:
 *  1. ingest: parse + store of a 1,000,000-reading wide CSV (8 channels named CH1 … CH8, zero offsets,
 *     no step column: tare and step derivation run) vs MariaDB's LOAD DATA LOCAL INFILE of the same
 *     readings into a scratch table (target >= 0.7x).
 *  2. compare: GET /api/compare over 10,000 runs in 6 groups (mixed model included) vs one bare SQL
 *     aggregate returning the same group counts and means (targets: first, uncached <= 5x; repeat
 *     <= 1.5x). The server is warmed by comparisons of other groups; "first" is then a query it
 *     has never seen, with the comparison cache emptied (three such, the first and the median
 *     reported); "repeat" is the full body from the shared cache, and a revalidation with
 *     If-None-Match (304) is reported beside it. The load average is printed with the figures.
 *  3. load: runs-list and run-analysis APIs under 50 connections vs a constant-JSON handler
 *     (targets: runs list and analysis >= 0.8x throughput, runs list p99 < 100 ms); the analysis
 *     also as a repeat with If-None-Match (answered 304 from the stored ETag).
 *  4. burst: 200 connections for 60 s on the runs list: errors, non-2xx, timeouts (target 0).
 *  5. uploads: /api/health's p99 while pathological 19.9 MB files and a chunked 40 MB body are
 *     refused, and the server's peak memory (targets p99 < 200 ms, peak < 600 MB), on a fresh server.
 * Prints a table; writes bench-results/bench-<time>.json.
 */
import { spawnSync } from 'node:child_process';
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import * as mariadb from 'mariadb';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../lib/platform/db';
import { env } from '../../lib/platform/env';
import { startAppServer } from '../../tests/support/app-server';
import { DEMO_ACCOUNTS, signInAs } from '../../tests/support/http-session';
import { encodeFloat64Blob } from '../../lib/record/float64-blob';
import { ingestInput } from './ingest-input';
import { benchUploadPressure } from './upload-pressure';

const root = path.resolve(__dirname, '../..');
const results: Record<string, unknown> = { machine: { cpus: os.cpus().length, memoryGiB: Math.round(os.totalmem() / 2 ** 30), node: process.version }, startedAt: new Date().toISOString() };
const rows: [string, string, string, string][] = [];
const only = process.argv.slice(2);
const want = (name: string) => only.length === 0 || only.includes(name);

/** BENCH_CPU_PROF_DIR=dir: the ingest child and the app servers write V8 CPU profiles there (node --cpu-prof, passed through tsx). */
const profileFlags = process.env.BENCH_CPU_PROF_DIR ? ['--cpu-prof', `--cpu-prof-dir=${path.resolve(process.env.BENCH_CPU_PROF_DIR)}`] : [];
const profileEnv: Record<string, string> = profileFlags.length ? { EVENLOAD_SERVER_NODE_FLAGS: profileFlags.join(' ') } : {};

const q = <T extends object>(sql: string, replacements: unknown[] = []) => sequelize.query<T>(sql, { type: QueryTypes.SELECT, replacements });
const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)] ?? NaN;

async function demoIds() {
  const [joint] = await q<{ id: number }>('SELECT id FROM joints WHERE stud_count = 8 ORDER BY id LIMIT 1');
  const [method] = await q<{ id: number }>('SELECT id FROM methods ORDER BY id LIMIT 1');
  const [lubricant] = await q<{ id: number }>('SELECT id FROM lubricants ORDER BY id LIMIT 1');
  const [operator] = await q<{ id: number }>("SELECT id FROM users WHERE role = 'researcher' LIMIT 1");
  return { jointId: joint!.id, methodId: method!.id, lubricantId: lubricant!.id, operatorId: operator!.id };
}

async function benchIngest() {
  const dir = path.join(root, '.data', 'bench');
  mkdirSync(dir, { recursive: true });
  const csvPath = path.join(dir, 'channels-1m.csv');
  const tsvPath = path.join(dir, 'readings-1m.tsv');
  ingestInput(csvPath, tsvPath);
  const ids = await demoIds();

  const child = spawnSync(path.join(root, 'node_modules/.bin/tsx'), [...profileFlags, 'scripts/bench/ingest-child.ts', csvPath, String(ids.jointId), String(ids.methodId), String(ids.lubricantId), String(ids.operatorId), '--bench-input'], { cwd: root, env: process.env, encoding: 'utf8', maxBuffer: 10 * 2 ** 20 });
  if (child.status !== 0) throw new Error(`ingest child failed: ${child.stderr}`);
  const ingest = JSON.parse(child.stdout.trim().split('\n').pop() as string) as { runId: number; readings: number; steps: number; tareNotes: number; totalSeconds: number; parseSeconds: number; storeSeconds: number; maxRssMb: number };
  await sequelize.query('DELETE FROM runs WHERE id = ?', { replacements: [ingest.runId] });

  const connection = await mariadb.createConnection({ host: env.DB_HOST, port: env.DB_PORT, user: env.DB_USER, password: env.DB_PASSWORD, database: env.DB_NAME, permitLocalInfile: true });
  await connection.query('DROP TABLE IF EXISTS bench_load_data');
  await connection.query('CREATE TABLE bench_load_data (step_id INT UNSIGNED NOT NULL, position SMALLINT UNSIGNED NOT NULL, run_id INT UNSIGNED NOT NULL, load_n DOUBLE NOT NULL, PRIMARY KEY (step_id, position), KEY (run_id, step_id)) ENGINE=InnoDB');
  const loadStarted = performance.now();
  await connection.query(`LOAD DATA LOCAL INFILE ? INTO TABLE bench_load_data FIELDS TERMINATED BY '\\t' LINES TERMINATED BY '\\n'`, [tsvPath]);
  const loadSeconds = (performance.now() - loadStarted) / 1000;
  const [{ n }] = (await connection.query('SELECT COUNT(*) AS n FROM bench_load_data')) as [{ n: bigint }];
  await connection.query('DROP TABLE bench_load_data');
  await connection.end();
  rmSync(dir, { recursive: true, force: true });

  const ingestRate = ingest.readings / ingest.totalSeconds;
  const loadRate = Number(n) / loadSeconds;
  results.ingest = { ...ingest, loadDataRows: Number(n), loadDataSeconds: loadSeconds, ingestReadingsPerSecond: ingestRate, loadDataRowsPerSecond: loadRate, ratio: ingestRate / loadRate, target: '>= 0.7' };
  rows.push(['ingest 1M readings (CH1…CH8, tare, derived steps)', `${Math.round(ingestRate).toLocaleString('en-US')} readings/s (${ingest.totalSeconds.toFixed(1)} s; parse ${ingest.parseSeconds.toFixed(1)} s, store ${ingest.storeSeconds.toFixed(1)} s; ${ingest.steps} steps derived)`, `LOAD DATA ${Math.round(loadRate).toLocaleString('en-US')} rows/s (${loadSeconds.toFixed(1)} s)`, `${(ingestRate / loadRate).toFixed(2)}x (>= 0.7x)`]);
  rows.push(['ingest peak memory', `${ingest.maxRssMb.toFixed(0)} MB max RSS`, '', ingest.maxRssMb < 500 ? 'under 500 MB' : 'OVER 500 MB']);
}

/** The float64 bytes storeRun writes beside the JSON (lib/record/float64-blob.ts), as a SQL hex literal. */
const hexBlob = (values: number[]) => `X'${Buffer.from(encodeFloat64Blob(values)).toString('hex')}'`;

async function ensureCompareRuns(): Promise<number[]> {
  const wanted = 10_000;
  const ids = await demoIds();
  let methods = (await q<{ id: number }>('SELECT id FROM methods ORDER BY id')).map((m) => m.id);
  for (let i = methods.length; i < 6; i += 1) {
    await sequelize.query("INSERT INTO methods (name, tool_kind, passes, check_passes, notes, created_at, updated_at) VALUES (?, 'manual_torque_wrench', '[]', 0, 'bench method', NOW(), NOW())", { replacements: [`Bench method ${i + 1}`] });
  }
  methods = (await q<{ id: number }>('SELECT id FROM methods ORDER BY id LIMIT 6')).map((m) => m.id);
  const [existing] = await q<{ n: number }>("SELECT COUNT(*) AS n FROM runs WHERE notes = 'bench compare run'");
  let have = Number(existing?.n ?? 0);
  let seed = 1;
  const rand = () => ((seed = (seed * 1_103_515_245 + 12_345) % 2 ** 31) / 2 ** 31);
  while (have < wanted) {
    const batch: string[] = [];
    for (let i = 0; i < 1000 && have < wanted; i += 1, have += 1) {
      const group = have % 6;
      const spread = 0.02 + group * 0.015;
      const loads = Array.from({ length: 8 }, () => 60_000 * (1 + spread * (rand() + rand() + rand() - 1.5) * 2));
      const m = loads.reduce((a, b) => a + b, 0) / 8;
      const sd = Math.sqrt(loads.reduce((a, b) => a + (b - m) ** 2, 0) / 7);
      const drift = loads.map((_, p) => -10 * spread * (8 - p) * rand());
      batch.push(`(${ids.jointId},${methods[group]},${ids.lubricantId},${ids.operatorId},NULL,60000,10,'simulated','complete',NOW(),'bench compare run',8,8,1,${m},${sd},${sd / m},${Math.min(...loads)},${Math.max(...loads)},'${JSON.stringify(loads)}','${JSON.stringify(drift)}',${hexBlob(loads)},${hexBlob(drift)},NOW(),NOW())`);
    }
    await sequelize.query(`INSERT INTO runs (joint_id, method_id, lubricant_id, operator_id, cohort_id, target_load_n, band_percent, source, status, recorded_at, notes, stud_count, step_count, pass_count, final_mean_n, final_sd_n, final_cv, final_min_n, final_max_n, final_loads_json, drift_json, final_loads_f64, drift_f64, created_at, updated_at) VALUES ${batch.join(',')}`);
  }
  // Spread the runs over several operators (the trainees as blocks of the mixed model).
  const operators = (await q<{ id: number }>("SELECT id FROM users WHERE role = 'trainee' ORDER BY id LIMIT 12")).map((u) => u.id);
  if (operators.length >= 2) await sequelize.query(`UPDATE runs SET operator_id = ELT(1 + id % ${operators.length}, ${operators.join(',')}) WHERE notes = 'bench compare run'`);
  return methods;
}

async function benchCompare(baseUrl: string) {
  const methods = await ensureCompareRuns();
  const researcher = await signInAs(baseUrl, DEMO_ACCOUNTS.researcher);
  // The bench runs are stored as simulated, so the comparison asks for simulated runs explicitly.
  const url = `/api/compare?by=method&source=simulated&ids=${methods.join(',')}`;
  const sqlOnce = async () => {
    const t = performance.now();
    await q("SELECT method_id, COUNT(*) AS n, AVG(final_mean_n / target_load_n) AS mean_ratio, AVG(final_cv) AS mean_cv FROM runs WHERE status = 'complete' AND source = 'simulated' AND method_id IN (?) GROUP BY method_id", [methods]);
    return performance.now() - t;
  };
  const sql: number[] = [];
  // Warm the server (modules loaded, the statistics code compiled) with comparisons of other groups:
  // by lubricant over measured and simulated runs (a large group), and by method over the measured
  // demo runs (several small groups, so the code of many pairs and the mixed model with several
  // groups is compiled too). Never the query measured below, nor its runs grouped this way.
  await (await researcher.get(`/api/compare?by=lubricant&source=both`)).json();
  await (await researcher.get(`/api/compare?by=method&source=measured`)).json();
  // First (uncached): three queries the server has never seen, each selecting the same 10,000 runs
  // (a "from" date before every run makes a new query and cache key), with the comparison cache
  // emptied before each, so every one reads the runs and computes every statistic.
  const cold: number[] = [];
  for (const day of ['01', '02', '03']) {
    await sequelize.query('DELETE FROM comparison_cache');
    sql.push(await sqlOnce());
    const t = performance.now();
    await (await researcher.get(`${url}&from=2000-01-${day}`)).json();
    cold.push(performance.now() - t);
  }
  // Repeat: the measured URL once (computed and cached), then 12 repeats with the full body from the
  // shared cache, and 12 revalidations with If-None-Match (answered 304 without the body).
  let totalRuns = 0;
  const first = await researcher.get(url);
  const etag = first.headers.get('etag') ?? '';
  totalRuns = ((await first.json()) as { totalRuns: number }).totalRuns;
  const api: number[] = [];
  const revalidate: number[] = [];
  let notModified = 0;
  for (let i = 0; i < 12; i += 1) {
    let t = performance.now();
    await (await researcher.get(url)).json();
    api.push(performance.now() - t);
    sql.push(await sqlOnce());
    t = performance.now();
    const response = await researcher.send('GET', url, undefined, { 'if-none-match': etag });
    await response.arrayBuffer();
    revalidate.push(performance.now() - t);
    if (response.status === 304) notModified += 1;
  }
  const apiMs = median(api.slice(2));
  const revalidateMs = median(revalidate.slice(2));
  const sqlMs = median(sql);
  const coldMs = cold[0]!;
  const coldMedianMs = median(cold);
  const [load1] = os.loadavg();
  results.compare = {
    runs: totalRuns, groups: methods.length, measured: 'first: a new query after a warm-up on another comparison, cache emptied; repeat: full body from the shared cache; revalidate: If-None-Match, 304',
    coldMs, coldMedianMs, coldAllMs: cold, apiMedianMs: apiMs, revalidateMedianMs: revalidateMs, notModified, sqlMedianMs: sqlMs,
    ratio: apiMs / sqlMs, revalidateRatio: revalidateMs / sqlMs, coldRatio: coldMs / sqlMs, coldMedianRatio: coldMedianMs / sqlMs, loadAverage1m: load1,
    target: '<= 1.5 (repeat, from the shared cache); first <= 5',
  };
  rows.push([`compare ${totalRuns.toLocaleString('en-US')} runs, 6 groups (first)`, `first ${coldMs.toFixed(0)} ms; 3 new queries ${cold.map((c) => c.toFixed(0)).join(', ')} ms`, `bare SQL aggregate ${sqlMs.toFixed(1)} ms`, `${(coldMs / sqlMs).toFixed(1)}x, median ${(coldMedianMs / sqlMs).toFixed(1)}x (<= 5x)`]);
  rows.push(['compare repeat', `GET ${apiMs.toFixed(1)} ms (median, full body); If-None-Match ${revalidateMs.toFixed(1)} ms (${notModified}/12 answered 304)`, `load average ${load1!.toFixed(1)}`, `${(apiMs / sqlMs).toFixed(2)}x; revalidated ${(revalidateMs / sqlMs).toFixed(2)}x (<= 1.5x)`]);
}

/**
 * autocannon at `url`; besides the rates, what the non-2xx answers were: the count per status code and
 * the first answers' bodies per status (the error code and message the app sent), so a burst's
 * failures name their reason in the bench output.
 */
async function cannon(url: string, cookie: string, connections: number, seconds: number, extraHeaders: Record<string, string> = {}) {
  const reasons: Record<string, string[]> = {};
  const onResponse = (status: number, body: string) => {
    if (status < 300 || status === 304) return;
    const seen = (reasons[status] ??= []);
    if (seen.length < 3 && !seen.includes(body.slice(0, 200))) seen.push(body.slice(0, 200));
  };
  const result = await autocannon({ url, connections, duration: seconds, headers: { ...(cookie ? { cookie } : {}), ...extraHeaders }, timeout: 10, requests: [{ method: 'GET', onResponse }] });
  const statusCodes = Object.fromEntries(Object.entries((result.statusCodeStats ?? {}) as Record<string, { count: number }>).map(([code, stat]) => [code, stat.count]));
  const notModified = statusCodes['304'] ?? 0;
  return { requestsPerSecond: result.requests.average, p50: result.latency.p50, p99: result.latency.p99, errors: result.errors, timeouts: result.timeouts, non2xx: result.non2xx - notModified, notModified, total: result.requests.total, statusCodes, reasons, loadAverage1m: os.loadavg()[0]! };
}

/** "200: 51234, 503: 49 (unavailable: The database is not answering…)": each status with its first reason. */
const statusLine = (r: { statusCodes: Record<string, number>; reasons: Record<string, string[]> }) =>
  Object.entries(r.statusCodes).map(([code, n]) => `${code}: ${n}${r.reasons[code]?.[0] ? ` (${r.reasons[code]![0]!.slice(0, 120)})` : ''}`).join(', ');

async function benchLoad(baseUrl: string) {
  const researcher = await signInAs(baseUrl, DEMO_ACCOUNTS.researcher);
  const [run] = await q<{ id: number }>("SELECT id FROM runs WHERE notes <> 'bench compare run' AND step_count > 8 ORDER BY id LIMIT 1");
  const seconds = Number(process.env.BENCH_LOAD_SECONDS ?? 10);
  const constant = await cannon(`${baseUrl}/api/ping`, '', 50, seconds);
  const list = await cannon(`${baseUrl}/api/runs?pageSize=25`, researcher.cookie, 50, seconds);
  const analysisUrl = `${baseUrl}/api/runs/${run!.id}/analysis`;
  const analysis = await cannon(analysisUrl, researcher.cookie, 50, seconds);
  // A repeat: the client sends the ETag it holds and gets 304 Not Modified.
  const etag = (await researcher.get(`/api/runs/${run!.id}/analysis`)).headers.get('etag');
  const repeat = await cannon(analysisUrl, researcher.cookie, 50, seconds, etag ? { 'if-none-match': etag } : {});
  results.load = { connections: 50, seconds, constant, runsList: list, runAnalysis: analysis, runAnalysisRepeat: repeat, runsListRatio: list.requestsPerSecond / constant.requestsPerSecond, analysisRatio: analysis.requestsPerSecond / constant.requestsPerSecond, analysisRepeatRatio: repeat.requestsPerSecond / constant.requestsPerSecond, target: 'runs list and analysis >= 0.8x constant, runs list p99 < 100 ms' };
  const line = (name: string, r: typeof list) => `${Math.round(r.requestsPerSecond)} req/s, p50 ${r.p50} ms, p99 ${r.p99} ms, errors ${r.errors + r.timeouts + r.non2xx}`;
  rows.push(['load 50 conn: constant JSON', line('constant', constant), '', 'baseline']);
  rows.push(['load 50 conn: GET /api/runs', line('list', list), `load average ${list.loadAverage1m.toFixed(1)}; ${statusLine(list)}`, `${(list.requestsPerSecond / constant.requestsPerSecond).toFixed(2)}x (>= 0.8x), p99 ${list.p99 < 100 ? '<' : '>='} 100 ms`]);
  rows.push(['load 50 conn: GET /api/runs/:id/analysis', line('analysis', analysis), '', `${(analysis.requestsPerSecond / constant.requestsPerSecond).toFixed(2)}x (>= 0.8x)`]);
  rows.push(['load 50 conn: analysis, If-None-Match', `${line('repeat', repeat)}, 304s ${repeat.notModified}`, etag ? `ETag ${etag.slice(0, 12)}…` : 'no ETag', `${(repeat.requestsPerSecond / constant.requestsPerSecond).toFixed(2)}x (>= 0.8x)`]);
}

async function benchBurst(baseUrl: string) {
  const researcher = await signInAs(baseUrl, DEMO_ACCOUNTS.researcher);
  const seconds = Number(process.env.BENCH_BURST_SECONDS ?? 60);
  const burst = await cannon(`${baseUrl}/api/runs?pageSize=25`, researcher.cookie, 200, seconds);
  results.burst = { connections: 200, seconds, ...burst, poolMax: env.DB_POOL_MAX, poolAcquireMs: env.DB_POOL_ACQUIRE_MS, target: '0 errors' };
  rows.push([`burst 200 conn x ${seconds} s: GET /api/runs`, `${burst.total.toLocaleString('en-US')} requests, ${Math.round(burst.requestsPerSecond)} req/s, p99 ${burst.p99} ms`, `pool max ${env.DB_POOL_MAX}, load average ${burst.loadAverage1m.toFixed(1)}`, `errors ${burst.errors}, timeouts ${burst.timeouts}, non-2xx ${burst.non2xx}`]);
  rows.push(['burst: answers by status', statusLine(burst), '', '']);
}

async function benchUploads() {
  // A server of its own (before the shared one starts), so its peak memory (VmHWM) is this scenario's alone.
  const server = await startAppServer(Number(process.env.EVENLOAD_BENCH_PORT ?? 3200), profileEnv);
  try {
    const researcher = await signInAs(server.baseUrl, DEMO_ACCOUNTS.researcher);
    const ids = await demoIds();
    const runHeader = { ...ids, cohortId: null, recordedAt: '2026-03-31T09:30', notes: 'bench pathological upload' };
    const result = await benchUploadPressure(server.baseUrl, researcher.cookie, server.pid, runHeader);
    results.uploads = { ...result, target: 'health p99 < 200 ms, peak RSS < 600 MB' };
    for (const u of result.uploads) rows.push([`upload: ${u.name}`, `${u.status} in ${u.seconds.toFixed(1)} s`, u.message.slice(0, 60), '']);
    rows.push(['uploads: GET /api/health, no upload', `${result.idle.requests} requests, p50 ${result.idle.p50} ms, p99 ${result.idle.p99} ms`, `failures ${result.idle.failures}`, 'machine floor']);
    rows.push(['uploads: GET /api/health meanwhile', `${result.health.requests} requests, p50 ${result.health.p50} ms, p99 ${result.health.p99} ms, max ${result.health.max} ms`, `failures ${result.health.failures}`, `p99 ${result.health.p99 < 200 ? '<' : '>='} 200 ms`]);
    rows.push(['uploads: server peak memory', `${result.peakRssMb} MB VmHWM`, '', result.peakRssMb < 600 ? 'under 600 MB' : 'OVER 600 MB']);
  } finally {
    await server.stop();
  }
}

async function main() {
  if (want('ingest')) await benchIngest();
  if (want('uploads')) await benchUploads();
  const needsServer = ['compare', 'load', 'burst'].some(want);
  const server = needsServer ? await startAppServer(Number(process.env.EVENLOAD_BENCH_PORT ?? 3200), profileEnv) : null;
  try {
    if (server && want('compare')) await benchCompare(server.baseUrl);
    if (server && want('load')) await benchLoad(server.baseUrl);
    if (server && want('burst')) await benchBurst(server.baseUrl);
  } finally {
    await server?.stop();
    await sequelize.close();
  }
  const widths = [0, 1, 2, 3].map((i) => Math.max(...[['benchmark', 'measured', 'beside', 'ratio / target'], ...rows].map((r) => r[i]!.length)));
  const print = (r: string[]) => console.log(r.map((c, i) => c.padEnd(widths[i]!)).join(' | '));
  print(['benchmark', 'measured', 'beside', 'ratio / target']);
  console.log(widths.map((w) => '-'.repeat(w)).join('-|-'));
  rows.forEach(print);
  mkdirSync(path.join(root, 'bench-results'), { recursive: true });
  const file = path.join(root, 'bench-results', `bench-${new Date().toISOString().replace(/[:.]/g, '-')}.json`);
  writeFileSync(file, JSON.stringify(results, null, 2));
  console.log(`\nwritten: ${path.relative(root, file)}`);
}

// Exit when done: an upload body the server refused early may keep the client's stream open.
main().then(() => process.exit(0)).catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
