/**
 * Builds the server's worker threads into plain JS files Next does not bundle: `next start` runs
 * route handlers from its own bundles, and a worker needs a file path that exists at run time.
 * lib/data/runs/parse-upload-worker.ts -> dist/workers/parse-upload.cjs (papaparse and lib/ingest
 * bundled in). Run after every `next build` (npm run build, start.sh, test.sh, bench.sh).
 */
import { build } from 'esbuild';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
await build({
  absWorkingDir: root,
  entryPoints: { 'parse-upload': 'lib/data/runs/parse-upload-worker.ts' },
  outdir: 'dist/workers',
  outExtension: { '.js': '.cjs' },
  bundle: true,
  platform: 'node',
  format: 'cjs',
  target: 'node20',
  tsconfig: 'tsconfig.json',
  logLevel: 'warning',
});
