/** The stream tests' fixture and a way to run the bridge CLI. */
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { GOOD_DIR } from './record-fixtures';

const root = path.resolve(__dirname, '../..');

/** wide-no-marker.csv as (t, stud, load in N) rows: the file's loads are kN (no unit; guessed kN by size). */
export function wideFixtureAsStream(): { csv: string; readings: number } {
  const lines = readFileSync(path.join(GOOD_DIR, 'wide-no-marker.csv'), 'utf8').split(/\r?\n/).filter((l) => l && !l.startsWith('#'));
  const out = ['time_s,stud,load_N'];
  for (const line of lines.slice(1)) {
    const [t, ...loads] = line.split(',');
    loads.forEach((v, i) => out.push(`${t},${i + 1},${Number(v) * 1000}`));
  }
  return { csv: `${out.join('\n')}\n`, readings: out.length - 1 };
}

export function runBridge(args: string[]): Promise<{ code: number; output: string }> {
  return new Promise((resolve) => {
    const child = spawn(path.join(root, 'node_modules/.bin/tsx'), ['scripts/stream-bridge.ts', ...args], { cwd: root, stdio: ['ignore', 'pipe', 'pipe'] });
    let output = '';
    child.stdout.on('data', (c) => (output += String(c)));
    child.stderr.on('data', (c) => (output += String(c)));
    child.on('exit', (code) => resolve({ code: code ?? 1, output }));
  });
}

