import { describe, expect, it } from 'vitest';
import { freshReads } from '@/lib/platform/fresh-read';

/** A read whose answer is the number of reads started before it, settled by hand. */
function manualReads() {
  const pending: { value: number; settle: () => void; fail: () => void }[] = [];
  let started = 0;
  const read = () =>
    new Promise<number>((resolve, reject) => {
      const value = ++started;
      pending.push({ value, settle: () => resolve(value), fail: () => reject(new Error(`read ${value} failed`)) });
    });
  return { read, pending, startedCount: () => started };
}

const tick = () => new Promise((resolve) => setImmediate(resolve));

describe('freshReads', () => {
  it('answers a caller who arrives while a read runs from the next read, shared with the others who arrived meanwhile', async () => {
    const reads = manualReads();
    const fresh = freshReads(reads.read);
    const first = fresh();
    const second = fresh();
    const third = fresh();
    expect(reads.startedCount()).toBe(1); // the later two wait: read 1 began before they called
    reads.pending[0]!.settle();
    expect(await first).toBe(1);
    await tick();
    expect(reads.startedCount()).toBe(2);
    reads.pending[1]!.settle();
    expect([await second, await third]).toEqual([2, 2]);
  });

  it('starts a new read for a caller after the last one settled, and recovers from a failed read', async () => {
    const reads = manualReads();
    const fresh = freshReads(reads.read);
    const failing = fresh();
    const waiting = fresh();
    reads.pending[0]!.fail();
    await expect(failing).rejects.toThrow('read 1 failed');
    await tick();
    reads.pending[1]!.settle();
    expect(await waiting).toBe(2);
    const later = fresh();
    expect(reads.startedCount()).toBe(3);
    reads.pending[2]!.settle();
    expect(await later).toBe(3);
  });
});
