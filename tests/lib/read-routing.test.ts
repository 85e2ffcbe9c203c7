/**
 * Read-replica routing rules (lib/platform/read-routing.ts): which server a query goes to given the
 * read-from-primary cookie and the replicas' health. Expected values follow the rules stated in
 * the module and in README's "Running several instances" (computed by hand from them).
 */
import { describe, expect, it } from 'vitest';
import { CAUGHT_UP, chooseReadTarget, gtidReached, isConnectionFailure, isLagging, nextLagState, parseGtidPosition, parsePrimaryUntil, type GtidPosition, type LagState, type ReadRouteInput } from '@/lib/platform/read-routing';

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

  it('reads from the primary while a reachable replica lags, from the replica again once it does not', () => {
    expect(chooseReadTarget(read({ replicaLagging: true }))).toBe('primary');
    expect(chooseReadTarget(read({ replicaLagging: false }))).toBe('replica');
  });
});

// GTID list text as MariaDB prints @@gtid_binlog_pos / @@gtid_slave_pos: domain-server-sequence, comma-separated
// (MariaDB Knowledge Base, "Global Transaction ID").
const pos = (text: string): GtidPosition => parseGtidPosition(text)!;

describe('parseGtidPosition and gtidReached', () => {
  it('reads one sequence number per domain; the empty text is the empty position', () => {
    expect([...pos('0-1-1042,1-2-7')]).toEqual([[0, 1042], [1, 7]]);
    expect(pos('').size).toBe(0);
    expect(parseGtidPosition(null)!.size).toBe(0);
  });

  it('refuses text that is not a GTID list', () => {
    expect(parseGtidPosition('0-1')).toBeNull();
    expect(parseGtidPosition('abc')).toBeNull();
    expect(parseGtidPosition('0-1-5,,')).toBeNull();
  });

  it('a replica has reached a position when every domain of it is at least as far (server id does not matter)', () => {
    expect(gtidReached(pos('0-1-10'), pos('0-1-10'))).toBe(true);
    expect(gtidReached(pos('0-2-11'), pos('0-1-10'))).toBe(true);
    expect(gtidReached(pos('0-1-9'), pos('0-1-10'))).toBe(false);
    expect(gtidReached(pos('0-1-10'), pos('0-1-10,1-1-1'))).toBe(false);
    expect(gtidReached(pos('0-1-10,1-1-3'), pos('0-1-10'))).toBe(true);
    expect(gtidReached(pos(''), pos(''))).toBe(true);
  });
});

describe('nextLagState (lag measured from when the primary was first seen at the oldest position not applied)', () => {
  const probe = (state: LagState, nowMs: number, primary: string, replica: string) => nextLagState(state, { nowMs, primary: pos(primary), replica: pos(replica) });

  it('a replica at the primary position does not lag, however long nothing is written', () => {
    let s = CAUGHT_UP;
    for (let t = 0; t < 10_000; t += 1000) s = probe(s, NOW + t, '0-1-50', '0-1-50');
    expect(s.lagMs).toBe(0);
    expect(isLagging(s, 3000)).toBe(false);
  });

  it('a replica stuck behind one write lags by the time since the primary was first seen past it', () => {
    let s = probe(CAUGHT_UP, NOW, '0-1-51', '0-1-50');
    expect(s.lagMs).toBe(0);
    s = probe(s, NOW + 1000, '0-1-51', '0-1-50');
    s = probe(s, NOW + 2000, '0-1-51', '0-1-50');
    expect(s.lagMs).toBe(2000); // 2000 ms since NOW, when 51 was first seen
    expect(isLagging(s, 3000)).toBe(false);
    s = probe(s, NOW + 3500, '0-1-51', '0-1-50');
    expect(s.lagMs).toBe(3500);
    expect(isLagging(s, 3000)).toBe(true);
    s = probe(s, NOW + 4000, '0-1-51', '0-1-51'); // applied: caught up
    expect(s).toEqual(CAUGHT_UP);
  });

  it('under steady writes a replica that applies each write 2 s late lags by at most 2 s (a deliberately delayed replica)', () => {
    // The primary writes one transaction every 500 ms; the replica applies sequence n 2000 ms after the primary wrote it.
    let s = CAUGHT_UP;
    let worst = 0;
    for (let t = 0; t <= 20_000; t += 500) {
      const primarySeq = 100 + t / 500;
      const replicaSeq = Math.max(100, 100 + (t - 2000) / 500);
      s = probe(s, NOW + t, `0-1-${primarySeq}`, `0-1-${replicaSeq}`);
      worst = Math.max(worst, s.lagMs);
    }
    // Computed: sequence n, seen at its write time, is applied by the probe 2000 ms later, so the oldest
    // position still unapplied at any probe was seen 1500 ms before it (one probe interval less).
    expect(worst).toBe(1500);
    expect(isLagging(s, 3000)).toBe(false);
  });

  it('a replica that stops applying while writes go on lags from its oldest unapplied position, not the newest', () => {
    let s = CAUGHT_UP;
    for (let t = 0; t <= 5000; t += 1000) s = probe(s, NOW + t, `0-1-${200 + t / 1000}`, '0-1-199');
    expect(s.lagMs).toBe(5000);
    expect(s.pending.length).toBe(6);
    s = probe(s, NOW + 6000, '0-1-206', '0-1-203'); // partly applied: 204 (seen at NOW + 4000) is the oldest left
    expect(s.lagMs).toBe(2000);
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
