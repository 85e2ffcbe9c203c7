import { describe, expect, it } from 'vitest';
import { clockRestartSentence, createLoggerClock, RESTART_GAP_S } from '@/lib/ingest/logger-clock';
import { createLoggerLineParser, LOGGER_LINE_TRAINING_DEFAULTS } from '@/lib/ingest/logger-line';
import { FOUR_STUD_JOINT } from './joints';

// A logger whose clock restarts sends times that start again from 0. Expected times are worked by
// hand from the rule in lib/ingest/logger-clock.ts: a time not after the last one placed continues
// at the last one plus the logger's own spacing (or RESTART_GAP_S before the spacing is known).

describe('createLoggerClock', () => {
  it('passes times through while they go forward', () => {
    const clock = createLoggerClock(null);
    expect([0, 0.5, 1, 1.5].map((t, i) => clock.place(t, i + 1))).toEqual([0, 0.5, 1, 1.5]);
    expect(clock.takeRestarts()).toEqual([]);
  });

  it('continues after the last time, at the logger’s spacing, when the clock restarts within one connection', () => {
    const clock = createLoggerClock(null);
    const placed = [0, 0.5, 1, 0, 0.5, 1].map((t, i) => clock.place(t, i + 1));
    // Spacing 0.5 s: the restart's 0 lands at 1 + 0.5 = 1.5, then 2 and 2.5.
    expect(placed).toEqual([0, 0.5, 1, 1.5, 2, 2.5]);
    expect(clock.takeRestarts()).toEqual([{ line: 4, loggerTimeS: 0, placedAtS: 1.5 }]);
    expect(clock.takeRestarts()).toEqual([]);
  });

  it('continues after the run’s last stored time on a new connection, even when the logger’s times are equal to it', () => {
    const clock = createLoggerClock(12.3);
    const placed = [0, 0.1, 0.2].map((t, i) => clock.place(t, i + 1));
    // Spacing unknown at the first line: 12.3 + 1 s = 13.3, then the logger's 0.1 s steps (no float dust).
    expect(RESTART_GAP_S).toBe(1);
    expect(placed).toEqual([13.3, 13.4, 13.5]);
    const equal = createLoggerClock(5);
    expect(equal.place(5, 1)).toBe(6);
    // A logger that kept its clock goes on unchanged.
    expect(createLoggerClock(5).place(5.25, 1)).toBe(5.25);
  });

  it('says it in words without engineering notes', () => {
    const sentence = clockRestartSentence({ line: 4, loggerTimeS: 0, placedAtS: 13.3 });
    expect(sentence).toBe('The logger’s clock restarted (it sent 0 s after later times); its readings continue after the last one, from 13.3 s in this run. Nothing stored was replaced.');
  });
});

describe('the line parser with a restarting logger', () => {
  const line = (t: number, kN: number) => `${t},${kN},${kN},${kN},${kN}\n`;

  it('never gives two readings of one stud the same time across a reconnect, and reports the restart once', () => {
    const first = createLoggerLineParser(LOGGER_LINE_TRAINING_DEFAULTS, FOUR_STUD_JOINT);
    const before = first.push(`time,ch1,ch2,ch3,ch4\n${line(0, 10)}${line(1, 11)}${line(2, 12)}`);
    expect(before.clockRestarts).toEqual([]);
    const lastStoredS = Math.max(...before.readings.map((r) => r.t));
    // The connection is lost; the logger comes back with its clock at 0 again.
    const second = createLoggerLineParser(LOGGER_LINE_TRAINING_DEFAULTS, FOUR_STUD_JOINT, { lastStoredS });
    const after = second.push(line(0, 13) + line(1, 14));
    expect([...new Set(after.readings.map((r) => r.t))]).toEqual([3, 4]);
    expect(after.clockRestarts).toEqual([{ line: 1, loggerTimeS: 0, placedAtS: 3 }]);
    const keys = [...before.readings, ...after.readings].map((r) => `${r.t}:${r.stud}`);
    expect(new Set(keys).size).toBe(keys.length);
    // A restart in the last line, without a line end, is reported by end(); kN read as 1000 N each.
    expect(second.push('0,15,15,15,15').readings).toEqual([]);
    const last = second.end();
    expect(last.readings[0]).toEqual({ t: 5, stud: 1, load: 15_000 });
    expect(last.clockRestarts).toEqual([{ line: 3, loggerTimeS: 0, placedAtS: 5 }]);
  });
});
