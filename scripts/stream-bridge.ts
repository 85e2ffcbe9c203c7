/**
 * A small bridge between a data logger and a recording run, for browsers that cannot connect the
 * logger themselves: reads the logger's lines from a file, a serial device file or stdin and posts
 * them to POST /api/runs/:id/stream as newline-delimited JSON, in batches.
 *
 *   npx tsx scripts/stream-bridge.ts --url http://127.0.0.1:3000 --run 123 --token XXX [--file f.txt | stdin] [--batch 50] [--rate 20] [--long]
 *
 * Input, by default: lines in the joint's own layout and units, as set on the joint (Logger line:
 * delimiter, time field, channel fields, load unit). The bridge asks the server for the token's
 * joint (GET /api/stream/line-format) and reads the lines with the same parser as the browser's
 * Connect logger (lib/ingest/logger-line.ts: the joint's channel map, the one unit conversion);
 * malformed lines are reported with their reason and skipped. With --long: CSV with columns time,
 * stud, load in newtons (header names like t/time/time_s, stud/position, load/load_N).
 *
 * --batch: readings per request (default 50). --rate: requests per second at most (default 20;
 * 0 = as fast as possible). A failed request is retried 3 times (the server ignores a reading it
 * already has, so a retry is safe). Exits non-zero with the server's message on a refusal.
 */
import { createReadStream } from 'node:fs';
import { createInterface } from 'node:readline';
import { createLoggerLineParser, type LineBatch, type LoggerLineFormat } from '../lib/ingest/logger-line';
import { clockRestartSentence } from '../lib/ingest/logger-clock';
import type { JointForImport } from '../lib/ingest/normalise';
import type { StreamReading } from '../lib/record/stream-reading';

interface Options { url: string; run: number; token: string; file: string | null; batch: number; rate: number; long: boolean }

function parseArgs(argv: string[]): Options {
  const get = (name: string) => {
    const i = argv.indexOf(`--${name}`);
    return i >= 0 ? argv[i + 1] ?? null : null;
  };
  const url = get('url');
  const run = Number(get('run'));
  const token = get('token') ?? process.env.EVENLOAD_STREAM_TOKEN ?? null;
  if (!url || !Number.isInteger(run) || run < 1 || !token) {
    console.error('usage: npx tsx scripts/stream-bridge.ts --url http://127.0.0.1:3000 --run <run id> --token <bridge token> [--file lines.txt] [--batch 50] [--rate 20] [--long]');
    process.exit(2);
  }
  return { url: url.replace(/\/$/, ''), run, token, file: get('file'), batch: Math.max(1, Number(get('batch') ?? 50)), rate: Math.max(0, Number(get('rate') ?? 20)), long: argv.includes('--long') };
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function post(options: Options, lines: string[]): Promise<void> {
  for (let attempt = 1; ; attempt++) {
    try {
      const response = await fetch(`${options.url}/api/runs/${options.run}/stream`, {
        method: 'POST',
        headers: { authorization: `Bearer ${options.token}`, 'content-type': 'application/x-ndjson' },
        body: `${lines.join('\n')}\n`,
      });
      if (response.ok) return;
      const body = (await response.json().catch(() => null)) as { error?: { message?: string } } | null;
      const message = body?.error?.message ?? `HTTP ${response.status}`;
      if (response.status < 500 || attempt >= 3) throw Object.assign(new Error(message), { fatal: true });
    } catch (error) {
      if ((error as { fatal?: boolean }).fatal || attempt >= 3) throw error;
    }
    await sleep(500 * attempt);
  }
}

/** Posts batches no faster than --rate; `flush` sends what is waiting. */
function createSender(options: Options) {
  let batch: string[] = [];
  let sent = 0;
  let lastPost = 0;
  const gap = options.rate > 0 ? 1000 / options.rate : 0;
  const flush = async () => {
    if (!batch.length) return;
    const wait = lastPost + gap - Date.now();
    if (wait > 0) await sleep(wait);
    lastPost = Date.now();
    await post(options, batch);
    sent += batch.length;
    batch = [];
  };
  return {
    async add(reading: StreamReading) {
      batch.push(JSON.stringify(reading));
      if (batch.length >= options.batch) await flush();
    },
    flush,
    get sent() {
      return sent;
    },
  };
}

/** Lines in the joint's own layout and units, read with the browser's parser. */
async function bridgeJointLines(options: Options, input: NodeJS.ReadableStream): Promise<void> {
  const response = await fetch(`${options.url}/api/stream/line-format`, { headers: { authorization: `Bearer ${options.token}` } });
  const body = (await response.json().catch(() => null)) as { jointName: string; format: LoggerLineFormat; joint: JointForImport; error?: { message?: string } } | null;
  if (!response.ok || !body) throw new Error(body?.error?.message ?? `HTTP ${response.status} asking for the joint's line format`);
  const parser = createLoggerLineParser(body.format, body.joint);
  const sender = createSender(options);
  let malformed = 0;
  const take = async ({ readings, malformed: bad, clockRestarts }: LineBatch) => {
    for (const m of bad) console.error(`stream-bridge: skipped ${m.reason}`);
    for (const restart of clockRestarts) console.error(`stream-bridge: line ${restart.line}: ${clockRestartSentence(restart)}`);
    malformed += bad.length;
    for (const r of readings) await sender.add(r);
  };
  input.setEncoding('utf8');
  for await (const chunk of input) await take(parser.push(String(chunk)));
  await take(parser.end());
  await sender.flush();
  console.log(`stream-bridge: sent ${sender.sent} readings to run ${options.run} (${body.jointName}); ${malformed} malformed line${malformed === 1 ? '' : 's'} skipped`);
}

async function main() {
  const options = parseArgs(process.argv.slice(2));
  const input = options.file ? createReadStream(options.file) : process.stdin;
  if (!options.long) return bridgeJointLines(options, input);
  const rl = createInterface({ input, crlfDelay: Infinity });
  let columns: { t: number; stud: number; load: number } | null = null;
  let delimiter = ',';
  const sender = createSender(options);
  let lineNo = 0;
  for await (const raw of rl) {
    lineNo++;
    const line = raw.replace(/^\uFEFF/, '').trim();
    if (line === '' || line.startsWith('#')) continue;
    if (!columns) {
      delimiter = line.includes('\t') ? '\t' : line.includes(';') ? ';' : ',';
      const names = line.split(delimiter).map((h) => h.trim().toLowerCase());
      const find = (re: RegExp) => names.findIndex((n) => re.test(n));
      columns = { t: find(/^(t|time|seconds|elapsed)(?![a-z])/), stud: find(/^(stud|position|pos|bolt)(?![a-z])/), load: find(/^(load|force)(?![a-z])/) };
      if (columns.t < 0 || columns.stud < 0 || columns.load < 0) {
        console.error(`Line ${lineNo}: the header needs time, stud and load columns (load in newtons), got "${line}".`);
        process.exit(2);
      }
      continue;
    }
    const cells = line.split(delimiter);
    const reading = { t: Number(cells[columns.t]), stud: Number(cells[columns.stud]), load: Number(cells[columns.load]) };
    if (![reading.t, reading.stud, reading.load].every(Number.isFinite)) {
      console.error(`Line ${lineNo}: time, stud and load must be numbers, got "${line}".`);
      process.exit(2);
    }
    await sender.add(reading);
  }
  await sender.flush();
  console.log(`stream-bridge: sent ${sender.sent} readings to run ${options.run}`);
}

main().catch((error: Error) => {
  console.error(`stream-bridge: ${error.message}`);
  process.exit(1);
});
