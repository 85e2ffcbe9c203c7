/**
 * Log relative error as NIST StRD uses it (McCullough, "Assessing the reliability of statistical
 * software", The American Statistician 52 (1998) 358–366):
 * LRE = −log10(|est − cert|/|cert|). When cert is exactly 0 the absolute error is used,
 * LRE = −log10|est|. An exact match is capped at 15, the number of digits NIST certifies.
 */
export const LRE_CAP = 15;

export function lre(estimate: number, certified: number): number {
  if (Number.isNaN(estimate)) return 0;
  const err = certified === 0 ? Math.abs(estimate) : Math.abs(estimate - certified) / Math.abs(certified);
  if (err === 0) return LRE_CAP;
  return Math.min(LRE_CAP, Math.max(0, -Math.log10(err)));
}

/** Prints a fixed-width table of LRE rows to the test output. */
export function printLreTable(title: string, columns: string[], rows: { name: string; values: (number | null)[] }[]): void {
  const head = ['dataset', ...columns].map((c, i) => (i === 0 ? c.padEnd(10) : c.padStart(9))).join(' ');
  const body = rows
    .map((r) => [r.name.padEnd(10), ...r.values.map((v) => (v === null ? '—' : v.toFixed(1)).padStart(9))].join(' '))
    .join('\n');
  console.log(`\n${title} (LRE = −log10 relative error, cap ${LRE_CAP})\n${head}\n${'-'.repeat(head.length)}\n${body}\n`);
}

/** Relative difference |a − b|/|b| (absolute when b = 0). */
export function relativeError(a: number, b: number): number {
  return b === 0 ? Math.abs(a) : Math.abs(a - b) / Math.abs(b);
}
