import { describe, expect, it } from 'vitest';
import { decodeFloat64Blob, encodeFloat64Blob, float64BlobOfJson } from '@/lib/record/float64-blob';

const hex = (bytes: Uint8Array) => Buffer.from(bytes).toString('hex');

describe('float64 blob of per-stud figures', () => {
  it('writes IEEE 754 binary64, little-endian, 8 bytes a value', () => {
    // IEEE 754-2008 binary64: 1.0 = 0x3FF0000000000000, −2.0 = 0xC000000000000000 (the standard's
    // encoding: sign, 11-bit biased exponent, 52-bit fraction), least significant byte first.
    expect(hex(encodeFloat64Blob([1, -2]))).toBe('000000000000f03f' + '00000000000000c0');
  });

  it('keeps a missing value (JSON null) as NaN and reads it back as null', () => {
    const bytes = encodeFloat64Blob([0.5, null, 3]);
    // NaN is an exponent of all ones with a non-zero fraction (IEEE 754-2008 §3.4).
    const middle = new DataView(bytes.buffer).getFloat64(8, true);
    expect(Number.isNaN(middle)).toBe(true);
    expect(decodeFloat64Blob(bytes)).toEqual([0.5, null, 3]);
  });

  it('gives back exactly the numbers of the stored JSON, also from a slice of a larger buffer (as the driver hands it)', () => {
    const json = JSON.stringify([60123.456789012345, 59876.54321, -0.000001, 1e-300, 61000]);
    const bytes = float64BlobOfJson(json)!;
    const padded = new Uint8Array(bytes.length + 3);
    padded.set(bytes, 3);
    expect(decodeFloat64Blob(padded.subarray(3))).toEqual(JSON.parse(json));
    expect(float64BlobOfJson(null)).toBeNull();
  });
});
