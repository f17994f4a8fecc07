// Who is on the other end of a request. The connection's peer, unless the peer is a proxy the operator named in
// TRUSTED_PROXIES: then the client is the right-most address in X-Forwarded-For that is not itself a trusted
// proxy (every proxy appends the address it received the request from, so entries to the left of the
// trusted ones are whatever the client chose to send). Forwarding headers from anyone else are ignored.
import { BlockList, isIP } from 'node:net';

/** `::ffff:192.0.2.7` (an IPv4 client on a dual-stack socket) as `192.0.2.7`. */
export function plainAddress(address) {
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/i.exec(address ?? '');
  return mapped ? mapped[1] : (address ?? '');
}

/**
 * TRUSTED_PROXIES as a BlockList: addresses and CIDR ranges separated by commas or spaces, e.g.
 * `127.0.0.1, 10.0.0.0/8, ::1`. Empty or unset: no proxy is trusted. A malformed entry stops the start.
 * @param {string | undefined} text
 * @returns {BlockList | null}
 */
export function parseTrustedProxies(text) {
  const entries = (text ?? '').split(/[\s,]+/).filter(Boolean);
  if (entries.length === 0) return null;
  const list = new BlockList();
  for (const entry of entries) {
    const [address, bits] = entry.split('/');
    const family = isIP(address ?? '');
    if (family === 0) throw new RangeError(`TRUSTED_PROXIES: "${entry}" is not an IP address or CIDR range`);
    const type = family === 4 ? 'ipv4' : 'ipv6';
    if (bits === undefined) list.addAddress(address, type);
    else {
      const prefix = Number(bits);
      if (!Number.isInteger(prefix) || prefix < 0 || prefix > (family === 4 ? 32 : 128)) throw new RangeError(`TRUSTED_PROXIES: "${entry}" has no valid prefix length`);
      list.addSubnet(address, prefix, type);
    }
  }
  return list;
}

function trusted(list, address) {
  const family = isIP(address);
  return list !== null && family !== 0 && list.check(address, family === 4 ? 'ipv4' : 'ipv6');
}

/**
 * The client's address for a request from `peer` carrying `forwardedFor` (the X-Forwarded-For header).
 * @param {string | undefined} peer the socket's remote address
 * @param {string | string[] | undefined} forwardedFor
 * @param {BlockList | null} proxies
 * @returns {{ address: string, viaProxy: boolean }}
 */
export function resolveClient(peer, forwardedFor, proxies) {
  const direct = plainAddress(peer);
  if (!trusted(proxies, direct)) return { address: direct, viaProxy: false };
  const hops = [forwardedFor ?? []].flat().join(',').split(',').map((hop) => plainAddress(hop.trim())).filter(Boolean);
  let client = direct;
  for (let i = hops.length - 1; i >= 0; i--) {
    const hop = hops[i];
    if (isIP(hop) === 0) break; // not an address: the chain is not trustworthy beyond this point
    client = hop;
    if (!trusted(proxies, hop)) break;
  }
  return { address: client, viaProxy: true };
}
