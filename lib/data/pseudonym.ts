import { createHmac } from 'node:crypto';
import { authSecret } from '../platform/env';

/**
 * A stable pseudonym for a person: the same person gets the same label under the same key, and the
 * label reveals nothing of the name or e-mail. Researchers see these instead of trainees' names;
 * exports take their own key so pseudonyms are stable per export key.
 */
export function pseudonymFor(userId: number, key = 'researcher-view'): string {
  const digest = createHmac('sha256', `${authSecret()}:${key}`).update(String(userId)).digest();
  const alphabet = 'ABCDEFGHJKLMNPQRSTUVWXYZ23456789';
  let label = '';
  for (let index = 0; index < 6; index += 1) label += alphabet[(digest[index] ?? 0) % alphabet.length];
  return `Operator ${label}`;
}
