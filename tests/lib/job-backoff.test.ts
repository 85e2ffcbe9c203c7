import { describe, expect, it } from 'vitest';
import { DEFAULT_RETRY_POLICY, retryDelayMs } from '@/lib/jobs/backoff';
import { pollDelayMs } from '@/lib/jobs/poll-delay';
import { parseJobPayload } from '@/lib/jobs/job-kinds';

describe('retryDelayMs: exponential back-off with a cap', () => {
  it('doubles from the base after each failed attempt (computed: 30 s × 2^(n−1))', () => {
    const seconds = [1, 2, 3, 4, 5, 6].map((n) => retryDelayMs(n) / 1000);
    expect(seconds).toEqual([30, 60, 120, 240, 480, 960]);
  });

  it('never waits longer than the cap (6 h by default), however many attempts failed', () => {
    // 30 s × 2^9 = 15,360 s is the last step under 6 h = 21,600 s (computed); the 11th is capped.
    expect(retryDelayMs(10)).toBe(15_360_000);
    expect(retryDelayMs(11)).toBe(DEFAULT_RETRY_POLICY.capMs);
    expect(retryDelayMs(500)).toBe(6 * 60 * 60_000);
    expect(retryDelayMs(1e6)).toBe(6 * 60 * 60_000);
  });

  it('follows a policy of its own (the tests\' workers use 200 ms up to 1 s)', () => {
    const policy = { baseMs: 200, capMs: 1000 };
    expect([1, 2, 3, 4].map((n) => retryDelayMs(n, policy))).toEqual([200, 400, 800, 1000]);
  });

  it('refuses attempts below 1 and a cap below the base', () => {
    expect(() => retryDelayMs(0)).toThrow(RangeError);
    expect(() => retryDelayMs(1.5)).toThrow(RangeError);
    expect(() => retryDelayMs(1, { baseMs: 1000, capMs: 10 })).toThrow(RangeError);
  });
});

describe('pollDelayMs: the idle poll spread ±50 %', () => {
  it('maps the random number onto half to one and a half intervals', () => {
    expect(pollDelayMs(5000, 0)).toBe(2500);
    expect(pollDelayMs(5000, 0.5)).toBe(5000);
    expect(pollDelayMs(5000, 0.999)).toBe(7495);
  });

  it('refuses a random number outside [0, 1)', () => {
    expect(() => pollDelayMs(5000, 1)).toThrow(RangeError);
    expect(() => pollDelayMs(0, 0.2)).toThrow(RangeError);
  });
});

describe('job payloads are checked per kind', () => {
  it('accepts a reminder for a record and a real date, refuses anything else', () => {
    expect(parseJobPayload('refresher_reminder', { trainingRecordId: 7, validUntil: '2029-02-28' })).toEqual({ trainingRecordId: 7, validUntil: '2029-02-28' });
    expect(() => parseJobPayload('refresher_reminder', { trainingRecordId: 7, validUntil: '2029-02-29' })).toThrow();
    expect(() => parseJobPayload('refresher_reminder', { trainingRecordId: -1, validUntil: '2029-02-28' })).toThrow();
    expect(() => parseJobPayload('refresher_reminder', { trainingRecordId: 7, validUntil: '2029-02-28', extra: 1 })).toThrow();
    expect(() => parseJobPayload('refresher_scan', { hour: 'yesterday' })).toThrow();
  });
});
