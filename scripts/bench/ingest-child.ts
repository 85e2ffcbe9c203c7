/**
 * Bench child: parses a wide logger CSV (channel names, no step column) with lib/ingest and stores it with lib/data/runs/store-run in one
 * transaction, the same path the upload route takes, then prints one JSON line with its timings
 * and peak memory (maxRSS of this process). Run by scripts/bench/run-all.ts.
 *   tsx scripts/bench/ingest-child.ts FILE JOINT_ID METHOD_ID LUBRICANT_ID OPERATOR_ID [--bench-input]
 * With --bench-input (the bench's own file) it refuses, before storing anything, a file that did not
 * need step derivation and tare, so the figure always covers both. The fault tests feed it other files.
 */
import { readFileSync } from 'node:fs';
import { sequelize } from '../../lib/platform/db';
import { parseLoggerText } from '../../lib/ingest/parse-text';
import { storeRun } from '../../lib/data/runs/store-run';

async function main() {
  const [file, jointId, methodId, lubricantId, operatorId, flag] = process.argv.slice(2);
  const started = performance.now();
  const text = readFileSync(file as string, 'utf8');
  const parsed = parseLoggerText(text, undefined, { studCount: 8, targetLoadN: 60_000, maxStudLoadN: 200_000, maxStudLoadSource: 'bench limit' });
  const parsedAt = performance.now();
  if (flag === '--bench-input' && (!parsed.derivedSteps || parsed.zeroNotes.length === 0)) throw new Error('the bench file was expected to need step derivation and tare');
  console.error('[ingest-child] parsed; storing');
  const runId = await sequelize.transaction((transaction) =>
    storeRun(
      { jointId: Number(jointId), methodId: Number(methodId), lubricantId: Number(lubricantId), operatorId: Number(operatorId), cohortId: null, targetLoadN: 60_000, bandPercent: 10, source: 'upload', status: 'complete', recordedAt: new Date(), notes: 'bench run (deleted after the benchmark)' },
      parsed.run,
      transaction,
    ),
  );
  const storedAt = performance.now();
  // The file's readings (every channel of every row), what LOAD DATA is given; the run stores its derived steps.
  const readings = parsed.rowCount * parsed.run.studCount;
  console.log(JSON.stringify({ runId, readings, steps: parsed.run.steps.length, tareNotes: parsed.zeroNotes.length, parseSeconds: (parsedAt - started) / 1000, storeSeconds: (storedAt - parsedAt) / 1000, totalSeconds: (storedAt - started) / 1000, maxRssMb: process.resourceUsage().maxRSS / 1024 }));
  await sequelize.close();
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
