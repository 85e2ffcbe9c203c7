import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { daysBefore, refresherDedupeKey, refresherDueOn, refresherIsDue } from '@/lib/qualification/refresher';

/** GNU date (coreutils), outside the project: the day `days` days before `iso`. */
const gnuDaysBefore = (iso: string, days: number) => execFileSync('date', ['-u', '-d', `${iso} -${days} days`, '+%F'], { encoding: 'utf8' }).trim();

describe('refresherDueOn: lead time before valid-until', () => {
  // Counted by hand on the Gregorian calendar (2028 is a leap year: divisible by 4, not by 100).
  it.each([
    ['2029-03-01', 1, '2029-02-28'],
    ['2028-03-01', 1, '2028-02-29'],
    ['2029-05-31', 90, '2029-03-02'], // 31 (May) + 30 (April) + 29 into March
    ['2029-01-15', 30, '2028-12-16'], // across the year's end
    ['2028-03-31', 31, '2028-02-29'], // lands on the leap day
    ['2029-12-31', 0, '2029-12-31'],
  ])('%s less %i days is %s', (validUntil, leadDays, expected) => {
    expect(refresherDueOn(validUntil, leadDays)).toBe(expected);
  });

  it('agrees with GNU date on every month end of 2027–2029 for 1, 30, 90 and 365 days', () => {
    for (const year of [2027, 2028, 2029]) {
      for (let month = 1; month <= 12; month += 1) {
        const monthEnd = new Date(Date.UTC(year, month, 0)).toISOString().slice(0, 10);
        for (const days of [1, 30, 90, 365]) expect(daysBefore(monthEnd, days), `${monthEnd} − ${days}`).toBe(gnuDaysBefore(monthEnd, days));
      }
    }
  });

  it('refuses a negative or fractional lead time', () => {
    expect(() => refresherDueOn('2029-01-01', -1)).toThrow(RangeError);
    expect(() => refresherDueOn('2029-01-01', 1.5)).toThrow(RangeError);
  });
});

describe('refresherIsDue', () => {
  it('is due from the due day through the last valid day, not before and not once expired', () => {
    // valid until 2029-03-31 with 90 days: due from 2028-12-31 (computed: 31 + 28 + 31 days back).
    expect(refresherIsDue('2029-03-31', 90, '2028-12-30')).toBe(false);
    expect(refresherIsDue('2029-03-31', 90, '2028-12-31')).toBe(true);
    expect(refresherIsDue('2029-03-31', 90, '2029-03-31')).toBe(true);
    expect(refresherIsDue('2029-03-31', 90, '2029-04-01')).toBe(false);
  });

  it('keys a reminder by record and valid-until date, so a reissued record gets its own', () => {
    expect(refresherDedupeKey(12, '2029-03-31')).toBe('refresher:12:2029-03-31');
    expect(refresherDedupeKey(12, '2029-03-31')).not.toBe(refresherDedupeKey(13, '2029-03-31'));
    expect(refresherDedupeKey(12, '2029-03-31')).not.toBe(refresherDedupeKey(12, '2032-03-31'));
  });
});
