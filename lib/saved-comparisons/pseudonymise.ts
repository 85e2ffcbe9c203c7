/** One thing to replace in what a reviewer receives: a trainee's name, label or key, and its pseudonym. */
export interface Replacement {
  from: string;
  to: string;
}

/**
 * Replaces every occurrence of each text (trainee names, the labels and keys a viewer saw them by)
 * in JSON text, inside its strings: each is replaced in its JSON-escaped form, longest first, so a
 * name that contains another is replaced whole. Numbers and keys of the JSON are never touched
 * because only non-empty texts of at least two characters are replaced, as they appear in strings.
 */
export function pseudonymiseJson(json: string, replacements: readonly Replacement[]): string {
  const escaped = replacements
    .filter((r) => r.from.trim().length >= 2)
    .map((r) => ({ from: JSON.stringify(r.from).slice(1, -1), to: JSON.stringify(r.to).slice(1, -1) }))
    .sort((a, b) => b.from.length - a.from.length);
  let out = json;
  for (const r of escaped) out = out.split(r.from).join(r.to);
  return out;
}

/** The filters that name a person by id, left out of what a reviewer receives. */
export const PERSON_FILTERS = ['operatorId'] as const;
