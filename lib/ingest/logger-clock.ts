/**
 * The logger's clock on a live connection. A logger that loses power or its connection may start
 * its clock again from 0; its readings would then land on times already stored for the run and
 * replace them (the stream stores one load per run, time and stud). The clock keeps an offset
 * instead: a line whose time is not after the last time placed (the run's last stored time on a new
 * connection, the previous line within one) is a restart, and the readings from there on continue
 * after the last one, spaced as the logger spaced them. Pure and browser-safe (the serial worker and
 * the bridge).
 */

/**
 * The gap put after the last stored reading when the logger's clock restarts before its own spacing
 * is known (the first line of a new connection): the connection was lost for at least this long.
 * Our own choice, not a trade figure; the true gap is not known.
 */
export const RESTART_GAP_S = 1;

/** One restart of the logger's clock: the line, the time the logger sent and the time it was placed at. */
export interface ClockRestart {
  line: number;
  loggerTimeS: number;
  placedAtS: number;
}

export interface LoggerClock {
  /** The time to store for a line whose logger time is `loggerTimeS`; records a restart when the clock went back. */
  place(loggerTimeS: number, line: number): number;
  /** Restarts seen since the last call (each reported once). */
  takeRestarts(): ClockRestart[];
}

/** Microsecond rounding, so an offset leaves no float dust (12.300000000000001 s). */
const roundMicro = (s: number) => Math.round(s * 1e6) / 1e6;

/** A clock for one connection; `lastStoredS` is the run's last stored time (null: nothing stored yet). */
export function createLoggerClock(lastStoredS: number | null): LoggerClock {
  let offset = 0;
  let lastPlaced = lastStoredS;
  let lastLogger: number | null = null;
  let spacing: number | null = null;
  let restarts: ClockRestart[] = [];
  return {
    place(loggerTimeS, line) {
      let placed = roundMicro(loggerTimeS + offset);
      if (lastPlaced !== null && placed <= lastPlaced) {
        const continueAt = roundMicro(lastPlaced + (spacing ?? RESTART_GAP_S));
        offset = continueAt - loggerTimeS;
        placed = continueAt;
        restarts.push({ line, loggerTimeS, placedAtS: placed });
      } else if (lastLogger !== null && loggerTimeS > lastLogger) {
        spacing = loggerTimeS - lastLogger;
      }
      lastLogger = loggerTimeS;
      lastPlaced = placed;
      return placed;
    },
    takeRestarts() {
      const out = restarts;
      restarts = [];
      return out;
    },
  };
}

/** The restart in words for the person recording (the live panel, the bridge). */
export function clockRestartSentence(restart: ClockRestart): string {
  const s = (v: number) => `${Number(v.toPrecision(9))} s`;
  return `The logger’s clock restarted (it sent ${s(restart.loggerTimeS)} after later times); its readings continue after the last one, from ${s(restart.placedAtS)} in this run. Nothing stored was replaced.`;
}
