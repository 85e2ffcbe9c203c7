import fs from 'node:fs';
import { referencePath } from './reference-path';

/** GEAR.DAT (NIST/SEMATECH e-Handbook): data lines 26-125, `DIAMETER BATCH`, 10 batches x 10. */
export function readGear(): number[][] {
  const lines = fs.readFileSync(referencePath('nist-ehandbook', 'GEAR.DAT'), 'utf8').split(/\r?\n/).slice(25);
  const byBatch = new Map<number, number[]>();
  for (const l of lines) {
    const parts = l.trim().split(/\s+/);
    if (parts.length !== 2) continue;
    const batch = Math.round(Number(parts[1]));
    byBatch.set(batch, [...(byBatch.get(batch) ?? []), Number(parts[0])]);
  }
  return [...byBatch.keys()].sort((a, b) => a - b).map((k) => byBatch.get(k)!);
}
