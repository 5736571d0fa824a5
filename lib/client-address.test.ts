import { describe, expect, it } from 'vitest'
import { addressKey, clientAddress, PEER_ADDRESS_HEADER, UNKNOWN_ADDRESS } from './client-address'

const request = (headers: Record<string, string>) => new Request('http://127.0.0.1:3000/api/auth/sign-in', { headers })

describe('clientAddress', () => {
  it('reads the address stamped from the socket, ignoring X-Forwarded-For without a trusted proxy', () => {
    const spoofing = request({ [PEER_ADDRESS_HEADER]: '203.0.113.9', 'x-forwarded-for': '198.51.100.1' })
    expect(clientAddress(spoofing, { trustProxy: false })).toBe('203.0.113.9')
  })

  it('takes the last X-Forwarded-For entry, the one the trusted proxy appended', () => {
    // The de-facto X-Forwarded-For format (common practice; cf. RFC 7239 §5.2 for Forwarded): each proxy appends.
    const forwarded = request({ [PEER_ADDRESS_HEADER]: '10.0.0.2', 'x-forwarded-for': '198.51.100.1, 203.0.113.9' })
    expect(clientAddress(forwarded, { trustProxy: true })).toBe('203.0.113.9')
  })

  it('falls back to the socket when a trusted proxy sent no X-Forwarded-For', () => {
    expect(clientAddress(request({ [PEER_ADDRESS_HEADER]: '10.0.0.2' }), { trustProxy: true })).toBe('10.0.0.2')
  })

  it('puts requests with no readable address into one shared bucket', () => {
    expect(clientAddress(request({}), { trustProxy: false })).toBe(UNKNOWN_ADDRESS)
    expect(clientAddress(request({ [PEER_ADDRESS_HEADER]: 'not-an-address' }), { trustProxy: false })).toBe(UNKNOWN_ADDRESS)
  })
})

describe('addressKey', () => {
  it('keeps IPv4 addresses and unwraps IPv4-mapped IPv6 (RFC 4291 §2.5.5.2)', () => {
    expect(addressKey('192.0.2.7')).toBe('192.0.2.7')
    expect(addressKey('::ffff:192.0.2.7')).toBe('192.0.2.7')
    expect(addressKey('::FFFF:192.0.2.7')).toBe('192.0.2.7')
  })

  it('counts IPv6 addresses by their /64 network, however they are written (RFC 5952 forms)', () => {
    expect(addressKey('2001:db8:1:2:3:4:5:6')).toBe('2001:db8:1:2::/64')
    expect(addressKey('2001:0db8:0001:0002:ffff:0:0:1')).toBe('2001:db8:1:2::/64')
    expect(addressKey('[2001:db8:1:2::9]')).toBe('2001:db8:1:2::/64')
    expect(addressKey('2001:db8::1')).toBe('2001:db8:0:0::/64')
    expect(addressKey('::1')).toBe('0:0:0:0::/64')
    expect(addressKey('fe80::1%eth0')).toBe('fe80:0:0:0::/64')
    expect(addressKey('64:ff9b::192.0.2.33')).toBe('64:ff9b:0:0::/64')
  })

  it('refuses what is not an address', () => {
    expect(addressKey('')).toBe(UNKNOWN_ADDRESS)
    expect(addressKey('evil.example')).toBe(UNKNOWN_ADDRESS)
    expect(addressKey('1.2.3.4, 5.6.7.8')).toBe(UNKNOWN_ADDRESS)
  })
})
