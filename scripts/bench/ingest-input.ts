import { writeFileSync } from 'node:fs';

/**
 * The ingest bench's input, made here (not committed): a logger's wide file as most loggers write
 * it, channels named CH1 (kN) … CH8 (kN), with a zero offset on every channel, small noise and no
 * step or pass column, so the import finds the channels, removes the offsets (tare) and derives the
 * steps from the loads, as for a real file. 125,000 rows × 8 channels = 1,000,000 readings at 10 Hz:
 * blocks of four cross passes (30, 60, 90, 100 % of 60 kN; each pull 40 rows of ramp and 60 held),
 * every stud let off at the end of a block. The TSV for LOAD DATA holds the same 1,000,000 readings.
 */
export function ingestInput(csvPath: string, tsvPath: string): void {
  const studs = 8;
  const rows = 125_000;
  const cross = [1, 5, 3, 7, 2, 6, 4, 8];
  const offsetsKn = [-0.3, 0.2, -0.5, 0.1, 0, -0.2, 0.4, -0.1];
  let seed = 7;
  const noise = () => ((seed = (seed * 1_103_515_245 + 12_345) % 2 ** 31) / 2 ** 31 - 0.5) * 0.04;
  const loads = new Array<number>(studs).fill(0);
  const out = [`# bench logger file: ${studs} channels, 10 Hz`, ['Time (s)', ...Array.from({ length: studs }, (_, i) => `CH${i + 1} (kN)`)].join(',')];
  const tsv: string[] = [];
  const emit = () => {
    const n = out.length - 2;
    if (n >= rows) return;
    const cells = loads.map((v, k) => (v + offsetsKn[k]! + noise()).toFixed(3));
    out.push(`${(n / 10).toFixed(1)},${cells.join(',')}`);
    cells.forEach((cell, k) => tsv.push(`${n + 1}\t${k + 1}\t1\t${Math.round(Number(cell) * 1000)}`));
  };
  while (out.length - 2 < rows) {
    for (let r = 0; r < 50; r++) emit(); // at rest
    for (const percent of [30, 60, 90, 100]) {
      for (const position of cross) {
        const from = loads[position - 1]!;
        const to = (60 * percent) / 100;
        for (let r = 1; r <= 40; r++) (loads[position - 1] = from + ((to - from) * r) / 40), emit();
        for (let r = 0; r < 60; r++) emit();
      }
    }
    const top = [...loads];
    for (let r = 1; r <= 50; r++) (top.forEach((v, k) => (loads[k] = v * (1 - r / 50))), emit()); // let off together
  }
  writeFileSync(csvPath, `${out.join('\n')}\n`);
  writeFileSync(tsvPath, `${tsv.join('\n')}\n`);
}

// tsx scripts/bench/ingest-input.ts CSV TSV: writes the two files (for profiling the ingest child alone).
if (process.argv[1]?.endsWith('ingest-input.ts')) ingestInput(process.argv[2]!, process.argv[3]!);
