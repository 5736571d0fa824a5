import { isIP } from 'node:net'
import { serverEnv } from '@/lib/env'

/**
 * The address a request came from, as the rate limits count it.
 *
 * Next.js gives route handlers no socket. `next start` writes the socket's address into
 * `X-Forwarded-For` only when the request has none, so without a proxy a client could name any
 * address it likes there. Instead, instrumentation.ts copies the socket's address into
 * PEER_ADDRESS_HEADER on every request, overwriting whatever a client sent under that name, and
 * this module reads that — unless TRUST_PROXY says a reverse proxy in front of the app appends the
 * address it saw to `X-Forwarded-For`, in which case the last entry of that list is the client.
 */

/** Set from the socket by instrumentation.ts; never trusted from the client. */
export const PEER_ADDRESS_HEADER = 'x-wreathwright-peer-address'

/**
 * The key for requests whose address is unknown (a request before the stamp is installed, a test
 * calling a handler directly): they share one bucket, so nobody gains by hiding their address.
 */
export const UNKNOWN_ADDRESS = 'unknown'

/**
 * The client's address from a request, normalised by addressKey.
 *
 * @example clientAddress(new Request('http://x/', { headers: { 'x-wreathwright-peer-address': '::ffff:192.0.2.7' } }), { trustProxy: false }) // '192.0.2.7'
 */
export function clientAddress(request: Request, { trustProxy }: { trustProxy: boolean }): string {
  if (trustProxy) {
    // The proxy appends the address it saw: the last entry. Earlier ones are whatever the client claimed.
    const forwarded = request.headers.get('x-forwarded-for')?.split(',').at(-1)?.trim()
    if (forwarded) return addressKey(forwarded)
  }
  return addressKey(request.headers.get(PEER_ADDRESS_HEADER) ?? '')
}

/** The client's address of a request to this server, trusting a proxy as TRUST_PROXY (lib/env.ts) says. */
export function requestAddress(request: Request): string {
  return clientAddress(request, { trustProxy: serverEnv().TRUST_PROXY === 'true' })
}

/**
 * What the limits count for an address: an IPv4 address as it is (also when written as IPv4-mapped
 * IPv6), an IPv6 address by its /64 network, since one subscriber is usually given a whole /64
 * (common practice, RFC 6177 §2 recommends at least a /56 per site) and could otherwise take a new
 * address for every attempt; anything unreadable as UNKNOWN_ADDRESS.
 *
 * @example addressKey('2001:db8:1:2:3:4:5:6') // '2001:db8:1:2::/64'
 * @example addressKey('::ffff:198.51.100.4') // '198.51.100.4'
 */
export function addressKey(address: string): string {
  // Brackets and a zone (`[fe80::1%eth0]`) are not part of the address.
  const bare = address.trim().replace(/^\[|\]$/g, '').replace(/%.*$/, '')
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/i.exec(bare)
  if (mapped && isIP(mapped[1]!) === 4) return mapped[1]!
  const version = isIP(bare)
  if (version === 4) return bare
  if (version !== 6) return UNKNOWN_ADDRESS
  const groups = expandIpv6(bare)
  return `${groups.slice(0, 4).map((group) => group.toString(16)).join(':')}::/64`
}

/** The eight 16-bit groups of a valid IPv6 address (one with a trailing IPv4 part included). */
function expandIpv6(address: string): number[] {
  const [head = '', tail] = address.split('::')
  const parse = (part: string): number[] =>
    part === ''
      ? []
      : part.split(':').flatMap((group) => {
          if (!group.includes('.')) return [parseInt(group, 16)]
          const [a = 0, b = 0, c = 0, d = 0] = group.split('.').map(Number)
          return [(a << 8) | b, (c << 8) | d]
        })
  const front = parse(head)
  if (tail === undefined) return front
  const back = parse(tail)
  return [...front, ...new Array<number>(8 - front.length - back.length).fill(0), ...back]
}
