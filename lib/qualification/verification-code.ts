/**
 * Verification codes of records of training: 16 characters of Crockford's base32 (0-9 and A-Z
 * without I, L, O and U), 80 random bits, so a code cannot be guessed or counted through; shown in
 * groups of four. Typed codes are read leniently: case, spaces and hyphens do not matter, and O, I and
 * L read as 0, 1 and 1, as Crockford's alphabet prescribes.
 */
const ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ';
export const VERIFICATION_CODE_LENGTH = 16;

/** A fresh code from 10 random bytes (crypto.getRandomValues: Node and browsers alike). */
export function newVerificationCode(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(10));
  let bits = 0;
  let value = 0;
  let code = '';
  for (const byte of bytes) {
    value = (value << 8) | byte;
    bits += 8;
    while (bits >= 5) {
      code += ALPHABET[(value >>> (bits - 5)) & 31];
      bits -= 5;
    }
    value &= (1 << bits) - 1;
  }
  return code;
}

/** The stored form of a typed code, or null when it cannot be one. */
export function normaliseVerificationCode(typed: string): string | null {
  const code = typed.toUpperCase().replace(/[\s-]/g, '').replace(/O/g, '0').replace(/[IL]/g, '1');
  if (code.length !== VERIFICATION_CODE_LENGTH) return null;
  return [...code].every((char) => ALPHABET.includes(char)) ? code : null;
}

/** "ABCD-EFGH-JKMN-PQRS", as printed and shown. */
export function formatVerificationCode(code: string): string {
  return code.match(/.{1,4}/g)?.join('-') ?? code;
}
