/**
 * Deterministic jitter for dot strips: the same key and index always give the same offset, so a
 * chart looks the same on every render, in print and in tests (no Math.random).
 *
 * Hash: 32-bit FNV-1a (Fowler–Noll–Vo, offset basis 2166136261, prime 16777619) of
 * `${key}#${index}`, then a murmur3 finaliser (fmix32) to spread nearby inputs.
 */
/** 32-bit FNV-1a of the UTF-16 code units (equal to the byte version for ASCII). */
export function fnv1a32(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i += 1) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return h >>> 0;
}

export function hash32(text: string): number {
  let h = fnv1a32(text);
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h >>> 0;
}

/** An offset in [−width, +width] for the index-th value of a group. */
export function jitter(key: string, index: number, width: number): number {
  const unit = hash32(`${key}#${index}`) / 0xffffffff; // 0..1
  return (unit * 2 - 1) * width;
}
