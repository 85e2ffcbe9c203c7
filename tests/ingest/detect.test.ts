import { describe, expect, it } from 'vitest';
import { AppError } from '@/lib/http/errors';
import { inspectText } from '@/lib/ingest/detect';
import { assertTextFile } from '@/lib/ingest/text-file';
import { splitLine } from '@/lib/ingest/detection/lines';

describe('inspectText', () => {
  it('comma file with LF and a header on line 1', () => {
    const r = inspectText('time,S1,S2\n0,1.5,2\n1,2.5,3\n');
    expect(r).toMatchObject({ delimiter: ',', decimalComma: false, lineEnding: 'LF', headerLine: 1, firstDataLine: 2, hadBom: false, headers: ['time', 'S1', 'S2'] });
    expect(r.sentences[0]).toBe('Comma-delimited, decimal point, header on line 1.');
  });

  it('a decimal comma is not taken for a delimiter in a semicolon file', () => {
    const r = inspectText('t;S1;S2\n0,5;12,5;13,25\n1,5;14,5;15,75\n');
    expect(r).toMatchObject({ delimiter: ';', decimalComma: true });
  });

  it('strips the BOM, reports CRLF and counts comment and key: value lines above the header', () => {
    const r = inspectText('\uFEFF# invented\r\n// also a comment\r\nOperator: A\r\n\r\ntime\tS1\tS2\r\n0\t1\t2\r\n');
    expect(r).toMatchObject({ hadBom: true, lineEnding: 'CRLF', delimiter: '\t', headerLine: 5 });
    expect(r.text.startsWith('#')).toBe(true);
    expect(r.linesAboveHeader.map((l) => l.kind)).toEqual(['comment', 'comment', 'metadata', 'blank']);
    expect(r.sentences[0]).toBe('Tab-delimited, decimal point, 3 metadata lines above the header (line 5).');
    expect(r.text.slice(r.headerOffset).startsWith('time\tS1')).toBe(true);
  });

  it('skips a padded key,value metadata line with the table\'s cell count', () => {
    const r = inspectText('Joint,Flange A,,\ntime,S1,S2,S3\n0,1,2,3\n');
    expect(r.headerLine).toBe(2);
    expect(r.metadata).toEqual([{ line: 1, key: 'Joint', value: 'Flange A' }]);
  });

  it('reports mixed decimal separators', () => {
    const r = inspectText('t;S1\n0;1,5\n1;2.5\n');
    expect(r.mixedDecimalSeparators).toBe(true);
    expect(r.sentences.join(' ')).toContain('Both decimal commas and decimal points');
  });

  it('splitLine honours quotes', () => {
    expect(splitLine('"a,b",c,"d ""e"""', ',')).toEqual(['a,b', 'c', 'd "e"']);
  });

  it('throws invalid_input for an all-number first row, naming the line', () => {
    expect(() => inspectText('# c\n1,2,3\n4,5,6\n')).toThrow(expect.objectContaining({ code: 'invalid_input', details: { row: 2 } }));
  });
});

describe('assertTextFile', () => {
  it('returns the text with the BOM kept for inspectText to report', () => {
    const text = assertTextFile(new Uint8Array([0xef, 0xbb, 0xbf, 0x61, 0x2c, 0x62]), 100);
    expect(text).toBe('\uFEFFa,b');
    expect(inspectText(`${text}\n1,2\n`).hadBom).toBe(true);
  });

  it('accepts multi-byte UTF-8 (µε, ·, ×)', () => {
    const bytes = new TextEncoder().encode('S1 (µε),T (N·m)\n1,2\n');
    expect(assertTextFile(bytes, 1000)).toContain('µε');
  });

  it('states the limit in MB for a too-large file', () => {
    try {
      assertTextFile(new Uint8Array(3 * 1024 * 1024 + 1), 3 * 1024 * 1024);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(AppError);
      expect((e as AppError).code).toBe('too_large');
      expect((e as AppError).message).toBe('The file is 3.0 MB; the limit is 3 MB.');
    }
  });
});
