import 'server-only';
import { TrainingRecord } from '@/models';
import { countEvents, isLocked } from '../sign-in-throttle';
import { recordDto } from './training-records';
import { normaliseVerificationCode } from '../../qualification/verification-code';
import type { RecordStatus } from '../../qualification/training-record';

/**
 * The public check of a record of training by its code, rate-limited per client address in MariaDB
 * (the sign-in throttle's table and counter, key `verify:<address>`): `VERIFY_LIMIT.lookups` look-ups
 * in the throttle's 15-minute window lock the address for `lockMs`, so codes cannot be tried in bulk (they are 80 random
 * bits anyway). Every look-up counts, found or not, so the answer's timing and count say nothing.
 */
export const VERIFY_LIMIT = { lookups: 30, lockMs: 15 * 60_000 } as const;

/** Only what the page may show: no ids, no reasons, no issuer. */
export interface PublicRecord {
  traineeName: string;
  courseName: string;
  scope: string;
  issuedOn: string;
  validUntil: string;
  status: RecordStatus;
}

export type VerifyAnswer = { kind: 'found'; record: PublicRecord } | { kind: 'unknown' } | { kind: 'rate_limited' };

export const verifyKey = (address: string) => `verify:${address}`.slice(0, 300);

export async function verifyTrainingRecord(typedCode: string, address: string, now = new Date()): Promise<VerifyAnswer> {
  const key = verifyKey(address);
  if (await isLocked([key], now)) return { kind: 'rate_limited' };
  await countEvents([{ key, lockAfter: (lookups) => (lookups >= VERIFY_LIMIT.lookups ? new Date(now.getTime() + VERIFY_LIMIT.lockMs) : null) }], now);
  const code = normaliseVerificationCode(typedCode);
  // The primary: a record revoked a moment ago must not read as valid from a lagging replica.
  const row = code ? await TrainingRecord.findOne({ where: { code }, useMaster: true }) : null;
  if (!row) return { kind: 'unknown' };
  const { traineeName, courseName, scope, issuedOn, validUntil, status } = recordDto(row, now);
  return { kind: 'found', record: { traineeName, courseName, scope, issuedOn, validUntil, status } };
}

