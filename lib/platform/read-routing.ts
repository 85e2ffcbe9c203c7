/**
 * Where a read goes when DB_READ_HOSTS lists replicas: pure rules, no I/O (wired into Sequelize by
 * replica-routing.ts).
 *
 * - Writes and everything inside a transaction go to the primary (Sequelize does that already).
 * - Read-your-writes: a request that wrote, and the same browser's requests for a short window after
 *   it (a cookie holds the window's end), read from the primary, so a page opened right after a save
 *   finds its row even when the replica lags.
 * - A replica that refused a connection is left alone for a while; reads go to the primary meanwhile.
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
}

/** Which server a query's connection comes from. */
export function chooseReadTarget(input: ReadRouteInput): ReadTarget {
  if (input.queryType !== 'SELECT' || input.useMaster) return 'primary';
  if (input.primaryUntilMs !== null && input.nowMs < input.primaryUntilMs) return 'primary';
  if (input.nowMs < input.replicaDownUntilMs) return 'primary';
  return 'replica';
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
