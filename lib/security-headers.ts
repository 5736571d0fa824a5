/**
 * The security headers that depend on the request or the settings, built here and sent by proxy.ts
 * on pages: the Content-Security-Policy and HSTS. The ones that never change (X-Content-Type-Options,
 * X-Frame-Options, Referrer-Policy, and on the API Cache-Control: no-store and the closed policy
 * below) are in next.config.mjs `headers()`, which also covers static files. API answers carry no
 * HSTS: a browser keeps it from the site's pages, which every visitor opens first.
 *
 * Pages get a nonce-based Content-Security-Policy: Next.js reads the nonce from the request's
 * policy and puts it on its own inline and framework scripts, so no inline script without it runs.
 * A nonce is fresh for every request, which makes every page dynamic (they already are: the site
 * header reads the session).
 *
 * What the app itself needs from the policy:
 * - scripts: Next.js's own (nonce, and 'strict-dynamic' for the chunks they load); never
 *   'unsafe-eval' outside `next dev` (React uses eval there for its error stacks);
 * - workers: the booklet builder and pdfjs-dist's worker are files of this app's build ('self');
 *   blob: for workers started from object URLs;
 * - images: thumbnails are blob: object URLs, small images may be data: URLs;
 * - fonts: self-hosted (fonts/, served from the build);
 * - styles: stylesheets of the build ('self') and Next.js's inline style elements (nonce). Style
 *   *attributes* are allowed ('unsafe-inline' in style-src-attr only): React writes `style={…}` as
 *   an attribute in the server HTML (the fabric swatches, the print preview's page frames), and a
 *   style attribute can neither run script nor, unlike an injected style element, select and
 *   leak other content; url() inside one is still held to img-src / font-src. A nonce cannot
 *   cover attributes, and hashes would need every colour a designer picks.
 */

/** Options that change the policy; see `securityOptionsFromEnv`. */
export interface SecurityOptions {
  /** `next dev`: React needs eval for its error stacks, and hot reloading injects styles without a nonce. */
  readonly development: boolean
  /** The public URL is https: send HSTS and ask the browser to upgrade any http subresource. */
  readonly https: boolean
}

/** HSTS for two years, the value browsers' preload lists ask for (hstspreload.org, common practice). */
export const HSTS_VALUE = 'max-age=63072000; includeSubDomains'

/** A fresh nonce: 128 random bits, base64 (CSP3 §2.3.1 nonce-source: base64-value). */
export function newNonce(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16))
  return btoa(String.fromCharCode(...bytes))
}

/**
 * The Content-Security-Policy of a page answer.
 *
 * @example contentSecurityPolicy('abc', { development: false, https: false }).includes("frame-ancestors 'none'") // true
 */
export function contentSecurityPolicy(nonce: string, options: SecurityOptions): string {
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${options.development ? " 'unsafe-eval'" : ''}`,
    // A nonce switches 'unsafe-inline' off, so development (whose hot reloading injects style
    // elements without one) allows inline styles instead.
    options.development ? "style-src 'self' 'unsafe-inline'" : `style-src 'self' 'nonce-${nonce}'`,
    "style-src-attr 'unsafe-inline'",
    "img-src 'self' blob: data:",
    "font-src 'self'",
    "worker-src 'self' blob:",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    ...(options.https ? ['upgrade-insecure-requests'] : []),
  ]
  return directives.join('; ')
}

/**
 * The policy of an API answer: JSON is never a document, so it may load nothing and be framed by no
 * one. Sent by next.config.mjs (which cannot import this file), the same text; the page-access test
 * checks every API answer against this constant.
 */
export const API_CONTENT_SECURITY_POLICY = "default-src 'none'; frame-ancestors 'none'"

/**
 * Reads the options from the environment: https when PUBLIC_URL (the address people open the app
 * at, required in production and checked by lib/env.ts) is an https URL; without PUBLIC_URL
 * (development, tests), when the session cookie is Secure. Read from process.env directly, since
 * the proxy must answer even where the rest of the server environment is not needed.
 */
export function securityOptionsFromEnv(env: Record<string, string | undefined> = process.env): SecurityOptions {
  const development = env.NODE_ENV === 'development'
  const publicUrl = env.PUBLIC_URL
  const https = publicUrl
    ? URL.canParse(publicUrl) && new URL(publicUrl).protocol === 'https:'
    : env.SESSION_COOKIE_SECURE
      ? env.SESSION_COOKIE_SECURE === 'true'
      : !development
  return { development, https }
}
