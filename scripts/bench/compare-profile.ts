/**
 * Profiles the Node part of a comparison shaped like the bench's (10,000 runs, 6 groups of 8-stud
 * runs, 12 operators, attempts): rows as the database returns them (final loads and drift as float64
 * bytes, decoded as `lib/data/compare.ts` does) → `compareGroups` → JSON.
 * Run: `node --cpu-prof --cpu-prof-dir=DIR --import tsx scripts/bench/compare-profile.ts`; prints
 * the CPU time of the first and later computations. Not part of `npm run bench`'s table.
 */
import { compareGroups, type GroupInput } from '../../lib/analysis/compare-groups';
import { decodeFloat64Blob, encodeFloat64Blob } from '../../lib/record/float64-blob';

let seed = 1;
const rand = () => ((seed = (seed * 1_103_515_245 + 12_345) % 2 ** 31) / 2 ** 31);
const rows = Array.from({ length: 10_000 }, (_, i) => {
  const group = i % 6;
  const spread = 0.02 + group * 0.015;
  const loads = Array.from({ length: 8 }, () => 60_000 * (1 + spread * (rand() + rand() + rand() - 1.5) * 2));
  const m = loads.reduce((a, b) => a + b, 0) / 8;
  const sd = Math.sqrt(loads.reduce((a, b) => a + (b - m) ** 2, 0) / 7);
  return { group, operator: 100 + (i % 12), attempt: Math.floor(i / 12) + 1, loads: Buffer.from(encodeFloat64Blob(loads)), drift: Buffer.from(encodeFloat64Blob(loads.map((_, p) => -10 * spread * (8 - p) * rand()))), m, sd };
});

let bodyBytes = 0;

/** CPU milliseconds of this process (user + system), steadier than wall time on a shared machine. */
function once(): number {
  const started = process.cpuUsage();
  const inputs: GroupInput[] = Array.from({ length: 6 }, (_, g) => ({
    key: String(g + 1),
    label: `Method ${g + 1}`,
    runs: rows.filter((r) => r.group === g).map((r) => ({ targetLoadN: 60_000, finalLoadsN: decodeFloat64Blob(r.loads) as number[], driftPercent: decodeFloat64Blob(r.drift), operator: r.operator, attempt: r.attempt, stored: { meanN: r.m, sdN: r.sd } })),
  }));
  bodyBytes = JSON.stringify(compareGroups(inputs, { subject: 'these methods' })).length;
  const used = process.cpuUsage(started);
  return (used.user + used.system) / 1000;
}
const times = Array.from({ length: Number(process.argv[2] ?? 5) }, once);
console.log(`CPU per comparison: ${times.map((t) => t.toFixed(1)).join(' ms, ')} ms; JSON ${bodyBytes.toLocaleString('en-US')} characters`);
