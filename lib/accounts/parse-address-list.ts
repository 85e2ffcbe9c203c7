import { z } from 'zod';

const address = z.string().email().max(254);

export interface ParsedAddressList {
  /** Valid addresses, lower case, each once, in the order given. */
  valid: string[];
  /** Entries that are not e-mail addresses, as typed. */
  invalid: string[];
}

/**
 * Reads one address or a pasted list: separated by commas, semicolons, spaces or new lines;
 * "Name <address>" forms keep the address; duplicates (any case) count once.
 * @example parseAddressList('a@x.test; Bo <B@x.test>, nope') // { valid: ['a@x.test', 'b@x.test'], invalid: ['nope'] }
 */
export function parseAddressList(raw: string): ParsedAddressList {
  const valid: string[] = [];
  const invalid: string[] = [];
  // Angle-bracket forms first, so a display name with spaces does not split into entries.
  const withoutNames = raw.replace(/[^,;\n<>]*<([^<>]*)>/g, ' $1 ');
  for (const entry of withoutNames.split(/[\s,;]+/)) {
    const trimmed = entry.trim().replace(/^mailto:/i, '');
    if (!trimmed) continue;
    const lower = trimmed.toLowerCase();
    if (address.safeParse(lower).success) {
      if (!valid.includes(lower)) valid.push(lower);
    } else if (!invalid.includes(trimmed)) invalid.push(trimmed);
  }
  return { valid, invalid };
}
