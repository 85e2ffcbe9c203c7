/**
 * The client address from the socket's peer and X-Forwarded-For. Expected values follow the header's
 * definition (each proxy appends the address it received the request from, so only the entries
 * added by trusted proxies, read from the right, can be believed: common practice, as in MDN's
 * X-Forwarded-For "Selecting an IP address" and RFC 7239 §5.2 for the Forwarded header).
 */
import { describe, expect, it } from 'vitest';
import { normaliseAddress, parseTrustedProxies, resolveClientAddress } from '@/lib/http/client-address';

const none = parseTrustedProxies('');
const balancer = parseTrustedProxies('10.0.0.5, 10.1.0.0/16, fd00::/8');

describe('resolveClientAddress', () => {
  it('uses the socket peer and ignores X-Forwarded-For when no proxy is trusted', () => {
    expect(resolveClientAddress('192.0.2.10', '198.51.100.1', none)).toBe('192.0.2.10');
    expect(resolveClientAddress('::ffff:192.0.2.10', undefined, none)).toBe('192.0.2.10');
  });

  it('ignores X-Forwarded-For from a peer that is not a trusted proxy', () => {
    expect(resolveClientAddress('192.0.2.10', '198.51.100.1', balancer)).toBe('192.0.2.10');
  });

  it('takes the right-most entry that is not a trusted proxy when the peer is one', () => {
    expect(resolveClientAddress('10.0.0.5', '198.51.100.1', balancer)).toBe('198.51.100.1');
    // A client that prepends its own entries changes nothing: they sit left of the one the balancer added.
    expect(resolveClientAddress('10.0.0.5', '203.0.113.9, 198.51.100.1', balancer)).toBe('198.51.100.1');
    // Two trusted hops (10.1.2.3 inside 10.1.0.0/16) are skipped.
    expect(resolveClientAddress('10.0.0.5', '198.51.100.1, 10.1.2.3', balancer)).toBe('198.51.100.1');
    expect(resolveClientAddress('fd00::1', '2001:db8::7', balancer)).toBe('2001:db8::7');
  });

  it('stops at a malformed entry and keeps the last believable hop', () => {
    expect(resolveClientAddress('10.0.0.5', 'not-an-ip', balancer)).toBe('10.0.0.5');
    expect(resolveClientAddress('10.0.0.5', undefined, balancer)).toBe('10.0.0.5');
  });
});

describe('parseTrustedProxies', () => {
  it('matches addresses and CIDR ranges, IPv4-mapped IPv6 as IPv4', () => {
    expect(balancer.contains('10.1.255.255')).toBe(true);
    expect(balancer.contains('10.2.0.1')).toBe(false);
    expect(balancer.contains('::ffff:10.0.0.5')).toBe(true);
    expect(balancer.contains('nonsense')).toBe(false);
  });

  it('refuses entries that are not addresses or ranges', () => {
    expect(() => parseTrustedProxies('10.0.0.0/33')).toThrow(/prefix length/);
    expect(() => parseTrustedProxies('load-balancer.internal')).toThrow(/not an IP address/);
  });

  it('normalises brackets and case', () => {
    expect(normaliseAddress('[FD00::1]')).toBe('fd00::1');
  });
});
