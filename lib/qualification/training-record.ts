/**
 * Records of training: validity, status and the scopes a centre may name. Pure; the data live in
 * lib/data/qualification/training-records.ts.
 */

/**
 * Requalification every three years is common practice in the trade, so a cohort's records are valid
 * for 36 months unless the centre sets its own (on screen: "training default: set your own").
 */
export const DEFAULT_RECORD_VALIDITY_MONTHS = 36;
export const MAX_RECORD_VALIDITY_MONTHS = 120;

/** Scopes a course may cover; the centre names its own (common practice in the trade for bolted joints). */
export const DEFAULT_SCOPES = ['Hand torque', 'Powered torque', 'Tensioning'] as const;

export type RecordStatus = 'valid' | 'expired' | 'revoked' | 'replaced';

export const RECORD_STATUS_LABEL: Record<RecordStatus, string> = {
  valid: 'Valid',
  expired: 'Expired',
  revoked: 'Revoked',
  replaced: 'Revoked: replaced by a newer record',
};

/** `issuedOn` (YYYY-MM-DD) plus whole months; a day past the month's end falls back to its last day (31 Jan + 1 month = 28/29 Feb). */
export function addMonths(isoDate: string, months: number): string {
  const [year, month, day] = isoDate.split('-').map(Number) as [number, number, number];
  const target = new Date(Date.UTC(year, month - 1 + months, 1));
  const lastDay = new Date(Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0)).getUTCDate();
  target.setUTCDate(Math.min(day, lastDay));
  return target.toISOString().slice(0, 10);
}

/** Revoked wins over expired; a record is valid through the whole of its last day (UTC). */
export function recordStatus(record: { revokedAt: string | null; replacedById: number | null; validUntil: string }, today: string): RecordStatus {
  if (record.revokedAt !== null) return record.replacedById !== null ? 'replaced' : 'revoked';
  return today > record.validUntil ? 'expired' : 'valid';
}
