/**
 * Where a read goes when DB_READ_HOSTS lists replicas: pure rules, no I/O (wired into Sequelize by
 * replica-routing.ts).
 *
 * - Writes and everything inside a transaction go to the primary (Sequelize does that already).
 * - Read-your-writes: a request that wrote, and the same browser's requests for a short window after
 *   it (a cookie holds the window's end), read from the primary, so a page opened right after a save
 *   finds its row even when the replica lags.
 * - A replica that refused a connection is left alone for a while; reads go to the primary meanwhile.
 * - A replica that answers but lags (it has not applied, for longer than the allowed lag, a GTID
 *   position the primary had reached) is passed over too: a periodic probe compares the primary's
 *   `@@gtid_binlog_pos` with each replica's `@@gtid_slave_pos` ({@link nextLagState}), and reads go to
 *   the primary while any replica lags.
 */

export type ReadTarget = 'primary' | 'replica';

/** The cookie naming the end of the read-from-primary window (epoch milliseconds). */
export const READ_PRIMARY_COOKIE = 'evenload-read-primary-until';

export interface ReadRouteInput {
  /** Sequelize's query type ('SELECT' for reads). */
  queryType: string | undefined;
  /** The caller asked for the primary (Sequelize's useMaster). */
  useMaster: boolean;
  nowMs: number;
  /** End of this browser's read-from-primary window, from the cookie (null when none or unreadable). */
  primaryUntilMs: number | null;
  /** Until when the replicas are taken as down (0 when they answer). */
  replicaDownUntilMs: number;
  /** A replica answers but lags by more than the allowed lag (from the lag probe). */
  replicaLagging?: boolean;
}

/** Which server a query's connection comes from. */
export function chooseReadTarget(input: ReadRouteInput): ReadTarget {
  if (input.queryType !== 'SELECT' || input.useMaster) return 'primary';
  if (input.primaryUntilMs !== null && input.nowMs < input.primaryUntilMs) return 'primary';
  if (input.nowMs < input.replicaDownUntilMs) return 'primary';
  if (input.replicaLagging === true) return 'primary';
  return 'replica';
}

/** A GTID position (`@@gtid_binlog_pos`, `@@gtid_slave_pos`): the last sequence number per replication domain. */
export type GtidPosition = ReadonlyMap<number, number>;

/**
 * Reads MariaDB's GTID list text, `domain-server-sequence` entries separated by commas
 * (`0-1-1042,1-2-7`); an empty text is the empty position. Null for text that is not such a list.
 */
export function parseGtidPosition(text: string | null | undefined): GtidPosition | null {
  const position = new Map<number, number>();
  const trimmed = (text ?? '').trim();
  if (trimmed === '') return position;
  for (const entry of trimmed.split(',')) {
    const match = /^(\d+)-(\d+)-(\d+)$/.exec(entry.trim());
    if (!match) return null;
    const domain = Number(match[1]);
    position.set(domain, Math.max(position.get(domain) ?? 0, Number(match[3])));
  }
  return position;
}

/** Whether `replica` has applied everything up to `target`: in every domain of the target, a sequence number at least as high. */
export function gtidReached(replica: GtidPosition, target: GtidPosition): boolean {
  for (const [domain, sequence] of target) if ((replica.get(domain) ?? 0) < sequence) return false;
  return true;
}

/** What the lag probe remembers about one replica: the primary positions it has not applied yet, each with when the primary was first seen at it. */
export interface LagState {
  pending: ReadonlyArray<{ position: GtidPosition; sinceMs: number }>;
  /** How long the oldest position the replica has not applied has been on the primary (0 when caught up). */
  lagMs: number;
}

export const CAUGHT_UP: LagState = { pending: [], lagMs: 0 };

/** At most this many unapplied primary positions are remembered per replica (the oldest is kept). */
const PENDING_LIMIT = 64;

/**
 * One probe of one replica: the primary's and the replica's positions read at `nowMs`. The replica's
 * lag is the time since the primary was first seen at the oldest position the replica has still not
 * applied: within one probe interval of the true lag, never more, and 0 once it has caught up (a
 * replica that is idle because nothing was written does not lag). Pure.
 */
export function nextLagState(state: LagState, probe: { nowMs: number; primary: GtidPosition; replica: GtidPosition }): LagState {
  const pending = state.pending.filter((p) => !gtidReached(probe.replica, p.position));
  if (!gtidReached(probe.replica, probe.primary)) {
    const newest = pending[pending.length - 1];
    const samePosition = newest && gtidReached(newest.position, probe.primary) && gtidReached(probe.primary, newest.position);
    if (!samePosition) pending.push({ position: probe.primary, sinceMs: probe.nowMs });
    if (pending.length > PENDING_LIMIT) pending.splice(1, pending.length - PENDING_LIMIT);
  }
  return { pending, lagMs: pending.length ? probe.nowMs - pending[0]!.sinceMs : 0 };
}

/** Whether a replica lags by more than allowed. */
export function isLagging(state: LagState, maxLagMs: number): boolean {
  return state.lagMs > maxLagMs;
}

/**
 * Reads the cookie's value: a whole number of epoch milliseconds no further ahead than the window
 * (a forged far-future value would pin a browser to the primary), else null.
 */
export function parsePrimaryUntil(value: string | undefined, nowMs: number, windowMs: number): number | null {
  if (!value || !/^\d{1,15}$/.test(value)) return null;
  const until = Number(value);
  return until > nowMs + windowMs ? null : until;
}

/** Whether an error means the server could not be reached (then the read is retried on the primary). */
export function isConnectionFailure(error: unknown): boolean {
  const seen = new Set<unknown>();
  let current: unknown = error;
  while (current && typeof current === 'object' && !seen.has(current)) {
    seen.add(current);
    const { name, code } = current as { name?: unknown; code?: unknown };
    if (typeof name === 'string' && /^Sequelize(Connection\w*|HostNotReachable|HostNotFound|AccessDenied)Error$/.test(name)) return true;
    if (typeof code === 'string' && /^(ECONNREFUSED|ECONNRESET|ETIMEDOUT|EHOSTUNREACH|ENOTFOUND|ER_GET_CONNECTION_TIMEOUT|ER_SOCKET_UNEXPECTED_CLOSE|ER_CONNECTION_ALREADY_CLOSED)$/.test(code)) return true;
    current = (current as { parent?: unknown; original?: unknown; cause?: unknown }).parent ?? (current as { original?: unknown }).original ?? (current as { cause?: unknown }).cause;
  }
  return false;
}
