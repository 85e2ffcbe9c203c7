import { createHmac } from 'node:crypto';
import { authSecret } from '../platform/env';

/** Pseudonyms already worked out, per key and person (a pure function's memo; at most PSEUDONYM_LIMIT, the oldest dropped first). */
const PSEUDONYM_LIMIT = 50_000;
const known = new Map<string, string>();

/**
 * A stable pseudonym for a person: the same person gets the same label under the same key, and the
 * label reveals nothing of the name or e-mail. Researchers see these instead of trainees' names;
 * exports take their own key so pseudonyms are stable per export key. The HMAC is computed once per
 * key and person (a page of the runs list names up to 200 operators per request).
 */
export function pseudonymFor(userId: number, key = 'researcher-view'): string {
  const memoKey = `${key}\u0000${userId}`;
  const remembered = known.get(memoKey);
  if (remembered !== undefined) return remembered;
  const digest = createHmac('sha256', `${authSecret()}:${key}`).update(String(userId)).digest();
  const alphabet = 'ABCDEFGHJKLMNPQRSTUVWXYZ23456789';
  let label = '';
  for (let index = 0; index < 6; index += 1) label += alphabet[(digest[index] ?? 0) % alphabet.length];
  if (known.size >= PSEUDONYM_LIMIT) known.delete(known.keys().next().value as string);
  known.set(memoKey, `Operator ${label}`);
  return `Operator ${label}`;
}
