/**
 * Layout rule (DEVELOPERS.md, "Layout"): no component or page file over 300 lines, so a file that
 * grows past it is split by job (sub-components per section, a reducer or hook for the state).
 * Reads every .ts/.tsx file under app/ and components/ from the disk.
 */
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const ROOT = path.resolve(import.meta.dirname, '../..');
const MAX_LINES = 300;

function sourceFiles(dir: string): string[] {
  return readdirSync(path.join(ROOT, dir), { withFileTypes: true }).flatMap((entry) => {
    const rel = path.join(dir, entry.name);
    if (entry.isDirectory()) return sourceFiles(rel);
    return /\.tsx?$/.test(entry.name) ? [rel] : [];
  });
}

/** Lines as `wc -l` counts them (newline characters), plus a last line without one. */
function lineCount(text: string): number {
  const newlines = text.split('\n').length - 1;
  return text.endsWith('\n') || text === '' ? newlines : newlines + 1;
}

describe('file size', () => {
  const files = [...sourceFiles('app'), ...sourceFiles('components')];

  it('finds the component and page files', () => {
    expect(files).toContain(path.join('components', 'calculator', 'calculator-form.tsx'));
    expect(files).toContain(path.join('app', '(lab)', 'calculator', 'page.tsx'));
  });

  it('counts lines as wc -l does', () => {
    expect(lineCount('a\nb\n')).toBe(2);
    expect(lineCount('a\nb')).toBe(2);
    expect(lineCount('')).toBe(0);
  });

  it(`keeps every file in app/ and components/ at ${MAX_LINES} lines or fewer`, () => {
    const tooLong = files
      .map((file) => ({ file, lines: lineCount(readFileSync(path.join(ROOT, file), 'utf8')) }))
      .filter((f) => f.lines > MAX_LINES)
      .map((f) => `${f.file}: ${f.lines} lines`);
    expect(tooLong).toEqual([]);
  });
});
