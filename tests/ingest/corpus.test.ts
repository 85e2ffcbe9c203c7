/**
 * The bad-file corpus: every file in tests/ingest/corpus/ is rejected with the code, line and
 * column its manifest entry names. All files are invented (see tests/ingest/README.md).
 */
import { readFileSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { AppError } from '@/lib/http/errors';
import { assertTextFile } from '@/lib/ingest/text-file';
import { parseLoggerText } from '@/lib/ingest/parse-text';
import type { ColumnMapping } from '@/lib/ingest/shapes';
import { CORPUS_JOINT } from './joints';

interface Case {
  file: string;
  code: string;
  fragment: string;
  row: number | null;
  column: string | null;
  mapping?: ColumnMapping;
}

const dir = path.join(__dirname, 'corpus');
const manifest = JSON.parse(readFileSync(path.join(dir, 'manifest.json'), 'utf8')) as { cases: Case[] };
const LIMIT = 5 * 1024 * 1024;

function importBytes(bytes: Uint8Array, mapping?: ColumnMapping, limit = LIMIT) {
  const text = assertTextFile(bytes, limit);
  return parseLoggerText(text, mapping, CORPUS_JOINT);
}

function caught(fn: () => unknown): AppError {
  try {
    fn();
  } catch (e) {
    if (e instanceof AppError) return e;
    throw e;
  }
  throw new Error('expected an AppError, nothing was thrown');
}

describe('bad-file corpus', () => {
  it('has at least 30 files and a manifest entry for each', () => {
    const files = readdirSync(dir).filter((f) => f !== 'manifest.json');
    expect(files.length).toBeGreaterThanOrEqual(30);
    expect(manifest.cases.map((c) => c.file).sort()).toEqual(files.sort());
  });

  it.each(manifest.cases)('rejects $file: $fragment', (c) => {
    const bytes = new Uint8Array(readFileSync(path.join(dir, c.file)));
    const err = caught(() => importBytes(bytes, c.mapping));
    expect(err.code).toBe(c.code);
    expect(err.message).toContain(c.fragment);
    if (c.row === null) expect(err.details.row).toBeUndefined();
    else {
      expect(err.details.row).toBe(c.row);
      expect(err.message).toMatch(new RegExp(`^Line ${c.row}\\b`));
    }
    if (c.column === null) expect(err.details.column).toBeUndefined();
    else {
      expect(err.details.column).toBe(c.column);
      expect(err.message).toContain(`column "${c.column}"`);
    }
  });
});

describe('generated bad files (not committed)', () => {
  it('rejects a file over the size limit with too_large and states the limit in MB', () => {
    const limit = 2 * 1024 * 1024;
    const line = '0.5,1,10,10,10,10,10,10,10,10\n';
    const bytes = new TextEncoder().encode('Time (s),Step,S1,S2,S3,S4,S5,S6,S7,S8\n' + line.repeat(Math.ceil((limit + 1) / line.length)));
    const err = caught(() => importBytes(bytes, undefined, limit));
    expect(err.code).toBe('too_large');
    expect(err.message).toContain('the limit is 2 MB');
    expect(err.details.limitBytes).toBe(limit);
  });

  it('accepts a file exactly at the size limit', () => {
    const bytes = new TextEncoder().encode('a,b\n1,2\n');
    expect(assertTextFile(bytes, bytes.length)).toBe('a,b\n1,2\n');
  });

  it('rejects random binary bytes with a NUL as not text', () => {
    const bytes = new Uint8Array(256).map((_, i) => (i * 37) % 256);
    const err = caught(() => assertTextFile(bytes, LIMIT));
    expect(err.code).toBe('invalid_input');
    expect(err.message).toContain('not a text file');
  });

  it('names the line of an invalid UTF-8 byte (a lone continuation byte on line 3)', () => {
    const bytes = new Uint8Array([...new TextEncoder().encode('a,b\n1,2\n3,'), 0x80, 0x0a]);
    const err = caught(() => assertTextFile(bytes, LIMIT));
    expect(err.details.row).toBe(3);
    expect(err.message).toContain('byte 11');
  });

  it('rejects an overlong UTF-8 encoding and a UTF-16 surrogate encoded in UTF-8', () => {
    for (const bad of [[0xc0, 0xaf], [0xed, 0xa0, 0x80]]) {
      const err = caught(() => assertTextFile(new Uint8Array([0x61, ...bad]), LIMIT));
      expect(err.message).toContain('not valid UTF-8 text (byte 2)');
    }
  });
});
