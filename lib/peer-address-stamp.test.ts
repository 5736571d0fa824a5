import http from 'node:http'
import type { AddressInfo } from 'node:net'
import { afterAll, describe, expect, it } from 'vitest'
import { PEER_ADDRESS_HEADER } from './client-address'
import { stampPeerAddresses } from './peer-address-stamp'

stampPeerAddresses()
const seen: (string | string[] | undefined)[] = []
const server = http.createServer((request, response) => {
  seen.push(request.headers[PEER_ADDRESS_HEADER])
  response.end('ok')
})
afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())))

describe('stampPeerAddresses', () => {
  it('overwrites a peer address the client claims with the socket address', async () => {
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve))
    const { port } = server.address() as AddressInfo
    await fetch(`http://127.0.0.1:${port}/`, { headers: { [PEER_ADDRESS_HEADER]: '203.0.113.66', 'x-forwarded-for': '203.0.113.66' } })
    await fetch(`http://127.0.0.1:${port}/`)
    expect(seen).toEqual(['127.0.0.1', '127.0.0.1'])
  })

  it('wraps the servers only once however often it is called', () => {
    const emit = http.Server.prototype.emit
    stampPeerAddresses()
    expect(http.Server.prototype.emit).toBe(emit)
  })
})
