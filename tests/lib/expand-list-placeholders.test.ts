/**
 * Prepared statements take one value per placeholder (MariaDB's binary protocol, COM_STMT_EXECUTE):
 * a list parameter of `IN (?)` must become one placeholder per element, in order, and the values
 * must stay parameters. Expected values worked by hand from that rule.
 */
import { describe, expect, it } from 'vitest';
import { expandListPlaceholders } from '@/lib/platform/expand-list-placeholders';

describe('expandListPlaceholders', () => {
  it('gives each element of a list its own placeholder, in order, beside plain values', () => {
    expect(expandListPlaceholders('SELECT 1 FROM runs r WHERE r.a = ? AND r.b IN (?) AND r.c >= ?', [7, [1, 2, 3], '2000-01-01'])).toEqual({
      sql: 'SELECT 1 FROM runs r WHERE r.a = ? AND r.b IN (?, ?, ?) AND r.c >= ?',
      values: [7, 1, 2, 3, '2000-01-01'],
    });
  });

  it('keeps a text value that looks like SQL as a value, and makes an empty list match nothing', () => {
    expect(expandListPlaceholders('SELECT ? AS t WHERE x IN (?)', ["'); DROP TABLE runs; --", []])).toEqual({ sql: 'SELECT ? AS t WHERE x IN (NULL)', values: ["'); DROP TABLE runs; --"] });
  });

  it('refuses a count of values that does not match the placeholders', () => {
    expect(() => expandListPlaceholders('SELECT ?', [1, 2])).toThrow(/2 values for 1 placeholders/);
    expect(() => expandListPlaceholders('SELECT ?, ?', [1])).toThrow(/1 values for 2 placeholders/);
  });
});
