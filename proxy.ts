import { NextResponse, type NextRequest } from 'next/server'
import {
  contentSecurityPolicy,
  HSTS_VALUE,
  newNonce,
  securityOptionsFromEnv,
} from '@/lib/security-headers'
import { REQUESTED_PATH_HEADER } from '@/lib/safe-redirect'

/**
 * Runs before every page request (not the API, not the build's static files): a fresh CSP nonce,
 * which Next.js reads back from the request's Content-Security-Policy header and puts on its own
 * scripts, and HSTS when the site is served over https. See lib/security-headers.ts. API answers
 * get their fixed closed policy from next.config.mjs, without a proxy step on every request.
 */
export function proxy(request: NextRequest): NextResponse {
  const options = securityOptionsFromEnv()
  const policy = contentSecurityPolicy(newNonce(), options)
  const requestHeaders = new Headers(request.headers)
  requestHeaders.set('Content-Security-Policy', policy)
  // The page asked for, so that a layout sending a stranger to sign in can bring them back to it.
  requestHeaders.set(REQUESTED_PATH_HEADER, `${request.nextUrl.pathname}${request.nextUrl.search}`)
  const response = NextResponse.next({ request: { headers: requestHeaders } })
  response.headers.set('Content-Security-Policy', policy)
  if (options.https) response.headers.set('Strict-Transport-Security', HSTS_VALUE)
  return response
}

export const config = {
  matcher: [
    {
      // Everything but the API, the build's hashed static files and the image optimizer
      // (next.config.mjs gives those their fixed headers).
      source: '/((?!api/|_next/static|_next/image).*)',
      // Never a request that carries a body. For each request the proxy sees, Next.js reads the
      // whole body first (to hand the proxy a copy, up to 10 MB, the rest read and dropped), before
      // any route runs: a route could then no longer refuse a large body unread (lib/http.ts), and
      // a socket announcing 50 MB would wait for all of it. Pages are GETs without a body.
      missing: [
        { type: 'header', key: 'content-length' },
        { type: 'header', key: 'transfer-encoding' },
      ],
    },
  ],
}
