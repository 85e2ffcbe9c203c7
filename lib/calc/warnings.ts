/**
 * A warning the calculator shows beside its results. `danger` means the numbers describe a state
 * that must not be reached (e.g. the stud past yield); `caution` means outside the usual range and
 * worth a second look; `info` is context.
 */
export type WarningSeverity = 'info' | 'caution' | 'danger';

export interface CalcWarning {
  /** Stable code, e.g. `"above-usual-range"`; tests and the UI key on it. */
  code: string;
  severity: WarningSeverity;
  /** One sentence in plain words. */
  message: string;
  /** Where a practitioner can look the threshold up (standard and table), or "training default: set your own"; shown on screen. */
  source: string;
}
