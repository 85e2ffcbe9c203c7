/**
 * Prints the functions with the most self time in V8 CPU profiles (`node --cpu-prof` output, e.g. from
 * `BENCH_CPU_PROF_DIR=dir npm run bench`), summed over every file given:
 *   npx tsx scripts/bench/profile-top.ts dir/*.cpuprofile [--top 15]
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';

interface ProfileNode { id: number; callFrame: { functionName: string; url: string; lineNumber: number }; hitCount?: number }
interface Profile { nodes: ProfileNode[]; samples: number[]; timeDeltas: number[] }

const args = process.argv.slice(2);
const topAt = args.indexOf('--top');
const top = topAt >= 0 ? Number(args[topAt + 1]) : 15;
const files = args.filter((a, i) => !a.startsWith('--') && (topAt < 0 || i !== topAt + 1));
const selfMs = new Map<string, number>();
let totalMs = 0;
for (const file of files) {
  const profile = JSON.parse(readFileSync(file, 'utf8')) as Profile;
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  profile.samples.forEach((id, i) => {
    const node = byId.get(id)!;
    const { functionName, url, lineNumber } = node.callFrame;
    const where = url ? `${url.replace(/^.*node_modules\//, '').replace(/^file:\/\/.*?\/(lib|app|scripts|\.next)\//, '$1/')}:${lineNumber + 1}` : '';
    const key = `${functionName || '(anonymous)'} ${where}`.trim();
    const ms = (profile.timeDeltas[i] ?? 0) / 1000;
    selfMs.set(key, (selfMs.get(key) ?? 0) + ms);
    totalMs += ms;
  });
}
console.log(`${files.map((f) => path.basename(f)).join(', ')}: ${(totalMs / 1000).toFixed(1)} s sampled`);
for (const [key, ms] of [...selfMs].sort((a, b) => b[1] - a[1]).slice(0, top)) {
  console.log(`${((100 * ms) / totalMs).toFixed(1).padStart(5)} %  ${ms.toFixed(0).padStart(7)} ms  ${key.slice(0, 140)}`);
}
