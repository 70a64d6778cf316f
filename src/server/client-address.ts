/**
 * Who is asking: the socket's peer, unless that peer is one of our own proxies (named in
 * TRUSTED_PROXIES), in which case X-Forwarded-For is read from the right, hop by hop, up to
 * the first address that is not ours. Anyone can write X-Forwarded-For; only our proxies'
 * entries count, so a client cannot reset a per-address limit by inventing a header.
 */
import { BlockList, isIP } from 'node:net';

/** Parses `TRUSTED_PROXIES`: addresses and CIDR ranges, comma separated (IPv4 and IPv6). */
export function trustedProxies(spec: string | undefined): BlockList {
  const list = new BlockList();
  for (const raw of (spec ?? '').split(',')) {
    const entry = raw.trim();
    if (!entry) continue;
    const [address, bits] = entry.split('/');
    const family = isIP(address ?? '');
    if (!family) throw new Error(`TRUSTED_PROXIES: "${entry}" is not an IP address or CIDR range.`);
    const type = family === 6 ? 'ipv6' : 'ipv4';
    if (bits === undefined) list.addAddress(address!, type);
    else {
      const prefix = Number(bits);
      if (!Number.isInteger(prefix) || prefix < 0 || prefix > (family === 6 ? 128 : 32)) {
        throw new Error(`TRUSTED_PROXIES: "${entry}" has a prefix length that does not fit.`);
      }
      list.addSubnet(address!, prefix, type);
    }
  }
  return list;
}

function normalize(address: string): string {
  // An IPv4 peer on a dual-stack socket shows as ::ffff:a.b.c.d.
  return address.startsWith('::ffff:') && isIP(address.slice(7)) === 4 ? address.slice(7) : address;
}

/** True when the socket's peer is one of our proxies. */
export function isTrustedPeer(proxies: BlockList, peer: string | undefined): boolean {
  return isTrusted(proxies, normalize(peer ?? ''));
}

function isTrusted(list: BlockList, address: string): boolean {
  const family = isIP(address);
  if (!family) return false;
  return list.check(address, family === 6 ? 'ipv6' : 'ipv4');
}

/** The client's address for this request. */
export function clientAddressOf(peer: string | undefined, forwardedFor: string | string[] | undefined, proxies: BlockList): string {
  let current = normalize(peer ?? '');
  if (!current) return 'unknown';
  const hops = (Array.isArray(forwardedFor) ? forwardedFor.join(',') : (forwardedFor ?? ''))
    .split(',')
    .map((hop) => normalize(hop.trim()))
    .filter(Boolean);
  while (isTrusted(proxies, current) && hops.length > 0) {
    const next = hops.pop()!;
    if (!isIP(next)) break;
    current = next;
  }
  return current;
}
