/**
 * The compact stored form of a run's per-stud figures (`runs.final_loads_f64`, `runs.drift_f64`):
 * IEEE 754 float64 values, little-endian, 8 bytes each, index 0 = position 1; a missing value (a
 * stud never tightened, JSON null) is NaN. A comparison of thousands of runs reads these bytes
 * instead of parsing the JSON columns, which keep the same numbers for everything else.
 */
export function encodeFloat64Blob(values: readonly (number | null)[]): Uint8Array {
  const bytes = new Uint8Array(values.length * 8);
  const view = new DataView(bytes.buffer);
  values.forEach((v, i) => view.setFloat64(i * 8, v ?? Number.NaN, true));
  return bytes;
}

/** The values of {@link encodeFloat64Blob}'s bytes, NaN read back as null. */
export function decodeFloat64Blob(bytes: Uint8Array): (number | null)[] {
  const n = bytes.byteLength >> 3;
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const out = new Array<number | null>(n);
  for (let i = 0; i < n; i++) {
    const v = view.getFloat64(i * 8, true);
    out[i] = Number.isNaN(v) ? null : v;
  }
  return out;
}

/** The blob of a stored JSON array of numbers (or nulls), or null when there is none. */
export function float64BlobOfJson(json: string | null | undefined): Uint8Array | null {
  if (json === null || json === undefined) return null;
  return encodeFloat64Blob(JSON.parse(json) as (number | null)[]);
}
