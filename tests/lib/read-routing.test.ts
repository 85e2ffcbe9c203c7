/**
 * Read-replica routing rules (lib/platform/read-routing.ts): which server a query goes to given the
 * read-from-primary cookie and the replicas' health. Expected values follow the rules stated in
 * the module and in README's "Running several instances" (computed by hand from them).
 */
import { describe, expect, it } from 'vitest';
import { chooseReadTarget, isConnectionFailure, parsePrimaryUntil, type ReadRouteInput } from '@/lib/platform/read-routing';

const NOW = 1_800_000_000_000;
const read = (over: Partial<ReadRouteInput> = {}): ReadRouteInput => ({
  queryType: 'SELECT',
  useMaster: false,
  nowMs: NOW,
  primaryUntilMs: null,
  replicaDownUntilMs: 0,
  ...over,
});

describe('chooseReadTarget', () => {
  it('sends a plain read to the replica', () => {
    expect(chooseReadTarget(read())).toBe('replica');
  });

  it('sends writes, raw statements and transactions (no SELECT type) to the primary', () => {
    for (const queryType of ['INSERT', 'UPDATE', 'DELETE', 'RAW', undefined]) expect(chooseReadTarget(read({ queryType }))).toBe('primary');
  });

  it('honours an explicit useMaster', () => {
    expect(chooseReadTarget(read({ useMaster: true }))).toBe('primary');
  });

  it('reads from the primary inside the window after a write, from the replica once it has passed', () => {
    expect(chooseReadTarget(read({ primaryUntilMs: NOW + 1 }))).toBe('primary');
    expect(chooseReadTarget(read({ primaryUntilMs: NOW }))).toBe('replica');
    expect(chooseReadTarget(read({ primaryUntilMs: NOW - 5000 }))).toBe('replica');
  });

  it('reads from the primary while the replicas are down, and tries them again afterwards', () => {
    expect(chooseReadTarget(read({ replicaDownUntilMs: NOW + 10_000 }))).toBe('primary');
    expect(chooseReadTarget(read({ replicaDownUntilMs: NOW - 1 }))).toBe('replica');
  });
});

describe('parsePrimaryUntil', () => {
  it('reads a time inside the window', () => {
    expect(parsePrimaryUntil(String(NOW + 4000), NOW, 5000)).toBe(NOW + 4000);
    expect(parsePrimaryUntil(String(NOW - 4000), NOW, 5000)).toBe(NOW - 4000);
  });

  it('refuses a missing, malformed or far-future value (a forged cookie cannot pin reads to the primary)', () => {
    expect(parsePrimaryUntil(undefined, NOW, 5000)).toBeNull();
    expect(parsePrimaryUntil('', NOW, 5000)).toBeNull();
    expect(parsePrimaryUntil('12abc', NOW, 5000)).toBeNull();
    expect(parsePrimaryUntil('-5', NOW, 5000)).toBeNull();
    expect(parsePrimaryUntil(String(NOW + 5001), NOW, 5000)).toBeNull();
    expect(parsePrimaryUntil('9'.repeat(16), NOW, 5000)).toBeNull();
  });
});

describe('isConnectionFailure', () => {
  it('recognises refused or broken connections, also wrapped by Sequelize', () => {
    expect(isConnectionFailure(Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:3401'), { code: 'ECONNREFUSED' }))).toBe(true);
    expect(isConnectionFailure({ name: 'SequelizeConnectionRefusedError', message: 'refused' })).toBe(true);
    expect(isConnectionFailure({ name: 'SequelizeDatabaseError', parent: { code: 'ER_SOCKET_UNEXPECTED_CLOSE' } })).toBe(true);
  });

  it('leaves query errors alone (they are not retried elsewhere)', () => {
    expect(isConnectionFailure({ name: 'SequelizeDatabaseError', parent: { code: 'ER_PARSE_ERROR' } })).toBe(false);
    expect(isConnectionFailure({ name: 'SequelizeUniqueConstraintError', original: { code: 'ER_DUP_ENTRY' } })).toBe(false);
    expect(isConnectionFailure(new Error('plain'))).toBe(false);
    expect(isConnectionFailure(null)).toBe(false);
  });
});
