/**
 * Where to go after signing in or up: the `next` a page was given, but only when it is a path of
 * this app. Everything else (another site, a scheme, a path the URL parser would read as another
 * host) gives the fallback.
 *
 * The check follows the WHATWG URL Standard, the parser browsers use: `next` is resolved against
 * a stand-in origin and must stay on it, and the path it resolves to must not start with `//`,
 * which a browser would read as another host. Before that, anything a browser strips or rewrites
 * while parsing (tabs, newlines, other control characters, spaces, backslashes) refuses the value
 * outright, as do their percent-encoded forms and encoded slashes, which no path of this app needs.
 *
 * Pure and without Node or DOM APIs beyond `URL`: the sign-in page (server) and its form (browser)
 * both call it.
 */

/**
 * The path and query of the page asked for, set by proxy.ts on every page request (overwriting any
 * a client sent), so that a layout, which Next.js does not tell its path, can send a stranger to
 * sign in and back (lib/auth/current-user.ts). Read through safeRedirectPath like any `next`.
 */
export const REQUESTED_PATH_HEADER = 'x-wreathwright-requested-path'

/** Where people go when `next` is missing or refused: the home page sends each role on. */
export const DEFAULT_AFTER_SIGN_IN = '/'

/** A stand-in origin: only relative paths are accepted, so any origin would do. */
const STAND_IN_ORIGIN = 'https://wreathwright.invalid'

/** Longer than any path of this app with its query; longer values are refused unread. */
const MAX_NEXT_LENGTH = 2048

/**
 * Characters the URL parser strips, rewrites or treats as a separator (WHATWG URL: C0 controls and
 * space, tab and newlines removed anywhere, `\` read as `/` in http(s)), plus DEL and every other
 * Unicode space or line separator. None belongs in a path we send people to.
 */
// eslint-disable-next-line no-control-regex -- matching control characters is the point here
const UNSAFE_CHARACTERS = /[\u0000-\u001f\u007f\s\\]/u

/**
 * Percent-encoded forms of the same, and of `/`: `%2F`, `%5C`, `%00`–`%1F`, `%7F`, `%20`. A later
 * decode (a proxy, a router, a second redirect) could turn them into a second slash.
 */
const UNSAFE_ENCODINGS = /%(?:2f|5c|[01][0-9a-f]|7f|20)/i

/**
 * `next` when it is a path of this app, else `fallback`. Returns the path as the URL parser
 * normalised it (path, query and fragment), so the value followed is the value checked.
 *
 * @example safeRedirectPath('/patterns/42?tab=print') // '/patterns/42?tab=print'
 * @example safeRedirectPath('/\\evil.example/') // '/'
 */
export function safeRedirectPath(next: unknown, fallback: string = DEFAULT_AFTER_SIGN_IN): string {
  if (typeof next !== 'string' || next.length === 0 || next.length > MAX_NEXT_LENGTH) return fallback
  // One leading slash: `//host` and `https:`, `javascript:` or a bare `evil.example` are refused.
  if (!next.startsWith('/') || next.startsWith('//')) return fallback
  if (UNSAFE_CHARACTERS.test(next) || UNSAFE_ENCODINGS.test(next)) return fallback
  let resolved: URL
  try {
    resolved = new URL(next, STAND_IN_ORIGIN)
  } catch {
    return fallback
  }
  if (resolved.origin !== STAND_IN_ORIGIN) return fallback
  const path = `${resolved.pathname}${resolved.search}${resolved.hash}`
  // `/.//evil` resolves to the path `//evil`, which a browser would follow to the host `evil`.
  if (!path.startsWith('/') || path.startsWith('//')) return fallback
  return path
}

/**
 * The sign-in address that brings a person back to `path` afterwards, e.g. for a page that needs a
 * session.
 *
 * @example signInPathFor('/patterns/42') // '/sign-in?next=%2Fpatterns%2F42'
 */
export function signInPathFor(path: string | null | undefined): string {
  const next = safeRedirectPath(path, '')
  return next && next !== DEFAULT_AFTER_SIGN_IN ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'
}
