import { BlockList, isIP } from 'node:net';

/**
 * The client address a request came from, as the server sees it. `next start` fills
 * X-Forwarded-For from the socket only when the client sent none (`??=`), so a client can name any
 * address it likes; Evenload's server (scripts/serve.ts) therefore works the address out from the
 * socket before Next sees the request and passes it on in CLIENT_ADDRESS_HEADER, overwriting
 * whatever the client sent. X-Forwarded-For is believed only when the socket's peer is a trusted
 * proxy (EVENLOAD_TRUSTED_PROXIES), and then only as far back as the chain stays within trusted
 * proxies: the right-most address that is not a trusted proxy is the client.
 */
export const CLIENT_ADDRESS_HEADER = 'x-evenload-client-address';

export interface TrustedProxies {
  contains: (address: string) => boolean;
}

/** `::ffff:10.0.0.1` (an IPv4 client on a dual-stack socket) is the IPv4 address. */
export function normaliseAddress(address: string): string {
  const trimmed = address.trim().replace(/^\[|\]$/g, '');
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/i.exec(trimmed);
  return (mapped ? mapped[1]! : trimmed).toLowerCase();
}

/** Parses "10.0.0.5, 10.1.0.0/16, fd00::/8" (addresses or CIDR ranges, comma-separated). */
export function parseTrustedProxies(list: string | undefined): TrustedProxies {
  const blocks = new BlockList();
  for (const entry of (list ?? '').split(',').map((part) => part.trim()).filter(Boolean)) {
    const [address = '', prefix] = entry.split('/');
    const family = isIP(normaliseAddress(address));
    if (family === 0) throw new Error(`EVENLOAD_TRUSTED_PROXIES: "${entry}" is not an IP address or CIDR range`);
    const type = family === 4 ? 'ipv4' : 'ipv6';
    if (prefix === undefined) {
      blocks.addAddress(normaliseAddress(address), type);
      continue;
    }
    const bits = Number(prefix);
    if (!/^\d+$/.test(prefix) || bits > (family === 4 ? 32 : 128)) throw new Error(`EVENLOAD_TRUSTED_PROXIES: "${entry}" has a bad prefix length`);
    blocks.addSubnet(normaliseAddress(address), bits, type);
  }
  return {
    contains: (address) => {
      const normal = normaliseAddress(address);
      const family = isIP(normal);
      return family !== 0 && blocks.check(normal, family === 4 ? 'ipv4' : 'ipv6');
    },
  };
}

/**
 * The client's address from the socket's peer and the X-Forwarded-For header: the peer itself
 * unless it is a trusted proxy; otherwise the right-most X-Forwarded-For entry that is not a
 * trusted proxy (entries left of it were written by the client and prove nothing).
 */
export function resolveClientAddress(peer: string | undefined, forwardedFor: string | string[] | undefined, trusted: TrustedProxies): string {
  let address = normaliseAddress(peer ?? '') || 'unknown';
  if (!trusted.contains(address)) return address;
  const chain = (Array.isArray(forwardedFor) ? forwardedFor.join(',') : forwardedFor ?? '').split(',').map(normaliseAddress).filter(Boolean);
  for (let index = chain.length - 1; index >= 0; index -= 1) {
    const hop = chain[index]!;
    if (isIP(hop) === 0) break;
    address = hop;
    if (!trusted.contains(hop)) break;
  }
  return address;
}
