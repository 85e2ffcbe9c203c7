import { createHash } from 'node:crypto';
import fs from 'node:fs';
import { describe, expect, it } from 'vitest';
import { referencePath } from './support/reference-path';

// Source of every expected value: the byte counts and sha256 sums in tests/fixtures/reference/README.md,
// taken from the public repositories and commits it names (NIST StRD and NIST/SEMATECH e-Handbook
// files). A missing, retyped or re-ended file (CRLF lost) fails here before any statistic is checked.
const README = fs.readFileSync(referencePath('README.md'), 'utf8');
const FOLDERS: Record<string, string[]> = {
  'nist-strd/univariate': [],
  'nist-strd/anova': [],
  'nist-strd/regression': [],
  'nist-ehandbook': [],
};

/** The README's table rows: | `file` | … | bytes | EOL | `sha256` |, grouped by the "### folder/" heading above them. */
function listedFiles(): { folder: string; file: string; bytes: number; eol: string; sha256: string }[] {
  const out: { folder: string; file: string; bytes: number; eol: string; sha256: string }[] = [];
  let folder = '';
  for (const line of README.split('\n')) {
    const heading = /^### (.+)\/$/.exec(line);
    if (heading) folder = heading[1]!;
    const row = /^\| `([^`]+)` \|.*\| (\d+) \| (CRLF|LF) \| `([0-9a-f]{64})` \|$/.exec(line);
    if (row) out.push({ folder, file: row[1]!, bytes: Number(row[2]), eol: row[3]!, sha256: row[4]! });
  }
  return out;
}

describe('reference data files in the repository', () => {
  const files = listedFiles();

  it('the README lists the 32 files of the four folders (9 univariate, 11 ANOVA, 11 regression, GEAR.DAT)', () => {
    for (const f of files) FOLDERS[f.folder]?.push(f.file);
    expect(Object.fromEntries(Object.entries(FOLDERS).map(([k, v]) => [k, v.length]))).toEqual({
      'nist-strd/univariate': 9,
      'nist-strd/anova': 11,
      'nist-strd/regression': 11,
      'nist-ehandbook': 1,
    });
  });

  for (const f of files) {
    it(`${f.folder}/${f.file}: ${f.bytes} bytes, ${f.eol} endings, sha256 as listed`, () => {
      const bytes = fs.readFileSync(referencePath(...f.folder.split('/'), f.file));
      expect(bytes.length).toBe(f.bytes);
      expect(bytes.includes('\r\n')).toBe(f.eol === 'CRLF');
      expect(createHash('sha256').update(bytes).digest('hex')).toBe(f.sha256);
    });
  }
});
