import { z } from 'zod';

/** C0/C1 controls and the bidirectional embedding, override and isolate marks: never kept in a name. */
const STRIPPED = /[\p{Cc}\u202A-\u202E\u2066-\u2069]/gu;
/** What does not show on screen: other format characters (zero-width space, joiners, BOM, soft hyphen), separators, white space. */
const INVISIBLE = /[\p{Cf}\p{Z}\s]/gu;

/** A name as stored: Unicode NFC, controls and bidi overrides removed, runs of white space made one space, trimmed. */
export function normaliseName(raw: string): string {
  return raw.normalize('NFC').replace(STRIPPED, '').replace(/\s+/gu, ' ').trim();
}

/** How many characters of a name show on screen (letters, digits, marks, punctuation, symbols). */
export function visibleLength(name: string): number {
  return [...name.replace(INVISIBLE, '')].length;
}

/**
 * The one zod rule for every name a person types: people, joints, lubricants, methods, cohorts.
 * Normalises (see `normaliseName`) and refuses a name with fewer than `min` visible characters,
 * so a name made only of zero-width, control or bidi-override characters is refused.
 * `what` is the thing named, as the message says it ("the lubricant name").
 */
export function nameSchema({ what, min = 1, max = 160, tooShort }: { what: string; min?: number; max?: number; tooShort?: string }) {
  return z
    .string()
    .transform(normaliseName)
    .refine((name) => visibleLength(name) >= min, { message: tooShort ?? (min === 1 ? `Enter ${what}.` : `Enter ${what} of at least ${min} characters.`) })
    .refine((name) => [...name].length <= max, { message: `Keep ${what} to ${max} characters or fewer.` });
}
