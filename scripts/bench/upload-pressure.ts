/**
 * Bench scenario "uploads": the pathological 19.9 MB files of tests/support/pathological-files.ts
 * (one line of commas; a quoted cell that never closes; a header and then millions of newlines) and a chunked 40 MB body without
 * Content-Length are posted to /api/uploads one after another while four clients poll
 * /api/health back to back. Reports each upload's status and time, /api/health's p50/p99 during
 * the uploads, and the server's peak resident memory (VmHWM of the next-server process, read from
 * /proc). Targets: p99 < 200 ms, peak < 600 MB.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { pathologicalFiles } from '../../tests/support/pathological-files';

const MB = 1024 * 1024;

/** Peak resident memory in MB of the server: VmHWM of the next-server process (or the started process). */
export function peakRssMb(pid: number): number {
  const read = (p: number) => {
    const match = /VmHWM:\s+(\d+) kB/.exec(readFileSync(`/proc/${p}/status`, 'utf8'));
    return match ? Number(match[1]) / 1024 : 0;
  };
  const candidates = [pid];
  for (const entry of readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const status = readFileSync(`/proc/${entry}/status`, 'utf8');
      if (new RegExp(`^PPid:\\s+${pid}$`, 'm').test(status)) candidates.push(Number(entry));
    } catch {
      // gone
    }
  }
  return Math.max(...candidates.map(read));
}

function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] ?? NaN;
}

function chunkedBody(total: number): ReadableStream<Uint8Array> {
  const boundary = '----evenload-bench';
  const head = new TextEncoder().encode(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="big.csv"\r\nContent-Type: text/csv\r\n\r\n`);
  let sent = 0;
  const chunk = new Uint8Array(MB).fill(0x31);
  return new ReadableStream({
    pull(controller) {
      if (sent === 0) controller.enqueue(head);
      if (sent >= total) return controller.close();
      controller.enqueue(chunk);
      sent += chunk.length;
    },
  });
}

interface HealthFigures {
  requests: number;
  p50: number;
  p99: number;
  max: number;
  failures: number;
}

export interface UploadPressureResult {
  uploads: Array<{ name: string; status: number; seconds: number; message: string }>;
  /** /api/health with no upload running, for the machine's own load. */
  idle: HealthFigures;
  health: HealthFigures;
  peakRssMb: number;
}

/** /api/health polled back to back by four clients until `until` settles: latencies and failures. */
async function pollHealth(baseUrl: string, until: Promise<unknown>) {
  let running = true;
  const latencies: number[] = [];
  let failures = 0;
  const poll = async () => {
    while (running) {
      const started = performance.now();
      try {
        const response = await fetch(`${baseUrl}/api/health`);
        await response.arrayBuffer();
        if (response.status !== 200) failures++;
      } catch {
        failures++;
      }
      latencies.push(performance.now() - started);
    }
  };
  const pollers = Array.from({ length: 4 }, poll);
  await until.catch(() => undefined);
  running = false;
  await Promise.all(pollers);
  return { requests: latencies.length, p50: Math.round(percentile(latencies, 50)), p99: Math.round(percentile(latencies, 99)), max: Math.round(Math.max(...latencies)), failures };
}

export async function benchUploadPressure(baseUrl: string, cookie: string, serverPid: number, runHeader: unknown): Promise<UploadPressureResult> {
  // The same polling with no upload first: on a loaded machine this is the floor the figures sit on.
  const idle = await pollHealth(baseUrl, new Promise((resolve) => setTimeout(resolve, 5000)));
  const uploads: UploadPressureResult['uploads'] = [];
  const post = async (name: string, init: RequestInit) => {
    const started = performance.now();
    const response = await fetch(`${baseUrl}/api/uploads`, { method: 'POST', ...init, headers: { cookie, ...(init.headers as Record<string, string>) } }).catch((error: Error) => ({ status: 0, json: async () => ({ error: { message: error.message } }) }));
    const body = (await response.json().catch(() => ({}))) as { error?: { message?: string } };
    uploads.push({ name, status: response.status, seconds: (performance.now() - started) / 1000, message: (body.error?.message ?? '').slice(0, 100) });
  };
  const files = pathologicalFiles();
  const sendAll = async () => {
    for (const file of files) {
      const form = new FormData();
      form.append('file', new Blob([file.bytes as BlobPart], { type: 'text/csv' }), 'pathological.csv');
      form.append('mapping', 'null');
      form.append('header', JSON.stringify(runHeader));
      await post(file.name, { body: form });
    }
    await post('chunked 40 MB, no Content-Length', { body: chunkedBody(40 * MB), headers: { 'content-type': 'multipart/form-data; boundary=----evenload-bench' }, duplex: 'half' } as RequestInit);
  };
  const health = await pollHealth(baseUrl, sendAll());
  return { uploads, idle, health, peakRssMb: Math.round(peakRssMb(serverPid)) };
}
