import { NextResponse, type NextRequest } from 'next/server'
import {
  API_CONTENT_SECURITY_POLICY,
  contentSecurityPolicy,
  HSTS_VALUE,
  newNonce,
  securityOptionsFromEnv,
} from '@/lib/security-headers'
import { REQUESTED_PATH_HEADER } from '@/lib/safe-redirect'

/**
 * Runs before every page and API request (not the build's static files): a fresh CSP nonce for
 * pages, which Next.js reads back from the request's Content-Security-Policy header and puts on
 * its own scripts, and HSTS when the site is served over https. See lib/security-headers.ts.
 */
export function proxy(request: NextRequest): NextResponse {
  const options = securityOptionsFromEnv()
  const isApi = request.nextUrl.pathname.startsWith('/api/')
  const policy = isApi ? API_CONTENT_SECURITY_POLICY : contentSecurityPolicy(newNonce(), options)
  const requestHeaders = new Headers(request.headers)
  if (!isApi) requestHeaders.set('Content-Security-Policy', policy)
  // The page asked for, so that a layout sending a stranger to sign in can bring them back to it.
  if (!isApi) requestHeaders.set(REQUESTED_PATH_HEADER, `${request.nextUrl.pathname}${request.nextUrl.search}`)
  const response = NextResponse.next({ request: { headers: requestHeaders } })
  response.headers.set('Content-Security-Policy', policy)
  if (options.https) response.headers.set('Strict-Transport-Security', HSTS_VALUE)
  return response
}

export const config = {
  matcher: [
    {
      // Everything but the build's hashed static files and the image optimizer (next.config.mjs gives
      // those their fixed headers).
      source: '/((?!_next/static|_next/image).*)',
      // Never a request that carries a body. For each request the proxy sees, Next.js reads the
      // whole body first (to hand the proxy a copy, up to 10 MB, the rest read and dropped), before
      // any route runs: a route could then no longer refuse a large body unread (lib/http.ts), and
      // a socket announcing 50 MB would wait for all of it. Pages and API reads are GETs without a
      // body, so they keep their headers; API answers to writes keep next.config.mjs's fixed ones.
      missing: [
        { type: 'header', key: 'content-length' },
        { type: 'header', key: 'transfer-encoding' },
      ],
    },
  ],
}
