import { describe, expect, it } from 'vitest';
import { hashToken, looksLikeToken, newTokenValue, TOKEN_LIFETIME_MS, tokenExpiry, tokenState } from '@/lib/accounts/one-time-token';

describe('hashToken', () => {
  it('is SHA-256 in hex (FIPS 180-2 Appendix B.1 example: "abc")', () => {
    expect(hashToken('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  it('never returns the token itself', () => {
    const value = newTokenValue();
    expect(hashToken(value)).not.toContain(value);
    expect(hashToken(value)).toMatch(/^[0-9a-f]{64}$/);
  });
});

describe('newTokenValue', () => {
  it('makes 43 base64url characters (32 random bytes), different every time', () => {
    const values = new Set(Array.from({ length: 50 }, () => newTokenValue()));
    expect(values.size).toBe(50);
    for (const value of values) expect(looksLikeToken(value)).toBe(true);
  });
});

describe('tokenState and tokenExpiry', () => {
  const now = new Date('2026-12-01T12:00:00Z');

  it('gives an invitation 72 hours and a reset link 2 hours', () => {
    expect(tokenExpiry('invite', now).toISOString()).toBe('2026-12-04T12:00:00.000Z');
    expect(tokenExpiry('reset', now).toISOString()).toBe('2026-12-01T14:00:00.000Z');
    expect(TOKEN_LIFETIME_MS.invite).toBe(259_200_000);
  });

  it('is valid until the expiry instant and expired from it on', () => {
    const expiresAt = new Date('2026-12-01T13:00:00Z');
    expect(tokenState({ expiresAt, usedAt: null }, new Date('2026-12-01T12:59:59.999Z'))).toBe('valid');
    expect(tokenState({ expiresAt, usedAt: null }, expiresAt)).toBe('expired');
  });

  it('is used once used, even before expiry, and unknown when there is no row', () => {
    expect(tokenState({ expiresAt: new Date('2027-01-01T00:00:00Z'), usedAt: now }, now)).toBe('used');
    expect(tokenState(null, now)).toBe('unknown');
  });
});
