import http from 'node:http'
import { PEER_ADDRESS_HEADER } from '@/lib/client-address'

const STAMPED = Symbol.for('wreathwright.peerAddressStamp')

/**
 * Copies each request's socket address into PEER_ADDRESS_HEADER before Next.js sees the request,
 * overwriting any such header the client sent. Next.js gives route handlers no socket, and its own
 * `X-Forwarded-For` keeps whatever the client wrote there, so this is the one address a client
 * cannot choose. Installed once per process by instrumentation.ts; it wraps `emit` of Node's HTTP
 * servers, where each parsed request is handed to the server's 'request' listeners.
 */
export function stampPeerAddresses(): void {
  const prototype = http.Server.prototype as http.Server & { [STAMPED]?: true }
  if (prototype[STAMPED]) return
  prototype[STAMPED] = true
  const emit = prototype.emit
  prototype.emit = function (this: http.Server, event: string | symbol, ...args: unknown[]): boolean {
    if (event === 'request') {
      const request = args[0] as http.IncomingMessage
      request.headers[PEER_ADDRESS_HEADER] = request.socket.remoteAddress ?? ''
    }
    return Reflect.apply(emit, this, [event, ...args]) as boolean
  } as typeof emit
}
