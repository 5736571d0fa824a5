import { z } from 'zod'
import { checkSession, sessionIdFromRequest, type CurrentUser } from '@/lib/auth/session'
import { DATABASE_RETRY_AFTER_SECONDS, isDatabaseUnavailable } from '@/lib/database-unavailable'
import { originSettings, type OriginSettings } from '@/lib/env'
import { MAX_DESIGN_BYTES } from '@/lib/limits'
import {
  ConflictError,
  ServiceError,
  StoredDesignError,
  TooManyRequestsError,
  UnauthenticatedError,
  ValidationError,
  type FieldIssue,
} from '@/lib/errors'

/**
 * The one wrapper every API route handler goes through. Each route declares its largest body,
 * whether it needs a session, a permission step and the schema of its body; the wrapper runs the
 * checks in this order, the same for every route:
 *   1. body size: a Content-Length over the route's limit is refused with 413 before anything is
 *      read (then, at step 5, a body without one, or one that lies, is cut at the limit: 413);
 *   2. origin: a state-changing request from a page of another origin is refused with 403;
 *   3. session: a route that needs one answers strangers 401, whatever the body or the ids;
 *   4. permission: the route's step (loading what it acts on and asking lib/authorization.ts),
 *      so that a pattern someone may not see is 404 exactly like a missing one;
 *   5. body contents: 415 unless JSON, 400 if malformed, 422 naming each field the schema refuses
 *      (a route declaring `body: 'bytes'`, an upload, gets the raw bytes read within its limit).
 * Service errors become JSON with their status; a database that cannot be reached (restarting,
 * full, down: lib/database-unavailable.ts) a 503 with `Retry-After`; the session cookie is
 * refreshed or cleared.
 */

/** Largest bodies, in bytes. A route names one of these (or its own number, e.g. for an upload). */
export const BODY_LIMITS = {
  /** Routes that take no body (every GET and DELETE, sign-out): a few stray bytes such as `{}`. */
  none: 1024,
  /** A small form: a name, a sign-in or sign-up, a state change. */
  form: 16 * 1024,
  /**
   * A pattern with its design: the largest design the schema accepts, as JSON.stringify writes it
   * (lib/limits.ts, about 3.2 MB), plus a form's room for the other fields.
   */
  design: MAX_DESIGN_BYTES + 16 * 1024,
} as const

/**
 * The deepest nesting of arrays and objects a JSON body may have. V8's JSON.parse takes about
 * 10 µs per level of nested arrays (measured here: 400,000 levels ≈ 3.7 s), so without a bound a
 * design-sized body of brackets held the web process for ~15 s; the depth is counted in one pass
 * over the bytes before anything is parsed (issue 17, item 3). 10,000 levels parse in about 0.1 s,
 * and leave room above the deepest good body (a design's join tree, MAX_SECTIONS = 400 levels) for
 * a too-deep join tree to reach the schema, which names `design.order.assembly` and its limit.
 */
export const MAX_JSON_DEPTH = 10_000

/**
 * Whether JSON text (as UTF-8 bytes) nests arrays and objects deeper than `limit`, counted without
 * parsing: brackets inside strings do not count. Malformed text is left for JSON.parse to refuse.
 *
 * @example nestsDeeperThan(new TextEncoder().encode('[[["[[["]]]'), 3) // false
 */
export function nestsDeeperThan(bytes: Uint8Array, limit: number): boolean {
  let depth = 0
  let inString = false
  for (let index = 0; index < bytes.length; index += 1) {
    const byte = bytes[index]
    if (inString) {
      // A backslash escapes the next byte (`\"` is a quote inside the string); a quote ends it.
      if (byte === 0x5c) index += 1
      else if (byte === 0x22) inString = false
    } else if (byte === 0x22) {
      inString = true
    } else if (byte === 0x5b || byte === 0x7b) {
      depth += 1
      if (depth > limit) return true
    } else if (byte === 0x5d || byte === 0x7d) {
      depth -= 1
    }
  }
  return false
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS'])

type SessionRule = 'required' | 'optional'
type UserFor<S extends SessionRule> = S extends 'required' ? CurrentUser : CurrentUser | null

/** What the permission step sees: everything but the body, which is not read yet. */
export interface PermitContext<Params, S extends SessionRule> {
  readonly request: Request
  readonly user: UserFor<S>
  readonly params: Params
}

export interface RouteContext<Params, S extends SessionRule, Resource, Body> extends PermitContext<Params, S> {
  readonly sessionId: string | null
  /** What the permission step returned (e.g. the pattern it loaded). */
  readonly resource: Resource
  /** The body, parsed by the route's schema (undefined for routes without one). */
  readonly body: Body
}

/** A route's body: a JSON schema, or `'bytes'` for a raw body (an upload) the handler checks itself. */
type BodySpec = z.ZodType | 'bytes' | undefined

export interface RouteSpec<Param extends string, S extends SessionRule, Resource, Schema extends BodySpec> {
  /** The names of the path's dynamic segments, e.g. `['id']` for app/api/patterns/[id]. */
  readonly params?: readonly Param[]
  /** The largest body accepted, in bytes: one of BODY_LIMITS. */
  readonly bodyLimit: number
  /** 'required': strangers get 401 before anything else is looked at. */
  readonly session: S
  /**
   * Who may send state-changing requests: 'same' (the default) only this app's pages; 'signed' any
   * caller, for a webhook, which comes from another server with no browser origin and proves itself
   * by a signature over the raw body that its handler checks (`body: 'bytes'`).
   */
  readonly origin?: 'same' | 'signed'
  /**
   * Loads what the route acts on and calls `authorize` (lib/authorization.ts), throwing 401, 403 or
   * 404; what it returns is the handler's `resource`. Runs before the body is read.
   */
  readonly permit?: (context: PermitContext<Record<Param, string>, S>) => Resource | Promise<Resource>
  /** The JSON body's schema, or 'bytes' for the raw body; without either the route takes no body. */
  readonly body?: Schema
}

type BodyOf<Schema> = Schema extends z.ZodType ? z.output<Schema> : Schema extends 'bytes' ? Uint8Array : undefined

type Handler<Params, S extends SessionRule, Resource, Body> = (context: RouteContext<Params, S, Resource, Body>) => Promise<Response>

function tooLarge(limit: number): ServiceError {
  return new ServiceError(`The request body is larger than this address accepts (${limit} bytes).`, 413)
}

/** The first value of a header a proxy may have written as a list (`a, b`). */
function firstValue(header: string | null): string | null {
  const value = header?.split(',')[0]?.trim()
  return value ? value : null
}

/** The origin a trusted proxy says the client used, from X-Forwarded-Proto and X-Forwarded-Host. */
function forwardedOrigin(request: Request): string | null {
  const host = firstValue(request.headers.get('x-forwarded-host'))
  const proto = firstValue(request.headers.get('x-forwarded-proto'))
  if (!host || !proto || !/^https?$/.test(proto)) return null
  try {
    return new URL(`${proto}://${host}`).origin
  } catch {
    return null
  }
}

/**
 * True when the request comes from a page of this app: its Origin (scheme, host and port) is the
 * configured public URL's — or, only when TRUST_PROXY is set, the one the proxy forwarded.
 */
export function isSameOrigin(request: Request, settings: OriginSettings = originSettings()): boolean {
  const header = request.headers.get('origin')
  if (!header || !URL.canParse(header)) return false
  const origin = new URL(header).origin
  if (settings.origins.includes(origin)) return true
  return settings.trustProxy && forwardedOrigin(request) === origin
}

export function jsonError(status: number, message: string, extra: Record<string, unknown> = {}): Response {
  return Response.json({ error: { message, ...extra } }, { status })
}

/** Step 1: the announced size, before anything is read. */
function checkAnnouncedSize(request: Request, limit: number): void {
  const header = request.headers.get('content-length')
  if (header === null) return
  const length = Number(header)
  if (!/^\d+$/.test(header.trim()) || length > limit) throw tooLarge(limit)
}

/** Reads the body with a running count, stopping at the limit whatever Content-Length said. */
async function readLimited(request: Request, limit: number): Promise<Uint8Array> {
  if (!request.body) return new Uint8Array(0)
  const reader = request.body.getReader()
  const chunks: Uint8Array[] = []
  let size = 0
  for (;;) {
    const { done, value } = await reader.read()
    if (done) break
    size += value.byteLength
    if (size > limit) {
      // Stop reading: the rest never reaches the app (Node's server drops it after the answer).
      reader.releaseLock()
      throw tooLarge(limit)
    }
    chunks.push(value)
  }
  const body = new Uint8Array(size)
  let at = 0
  for (const chunk of chunks) {
    body.set(chunk, at)
    at += chunk.byteLength
  }
  return body
}

/** `application/json`, with at most a UTF-8 charset parameter. */
function isJsonContentType(header: string | null): boolean {
  if (!header) return false
  const [type, ...parameters] = header.split(';').map((part) => part.trim().toLowerCase())
  if (type !== 'application/json') return false
  return parameters.every((parameter) => parameter === '' || /^charset="?utf-8"?$/.test(parameter))
}

/**
 * Step 5: the body read whole within the limit, as JSON: another content type is a 415, more than
 * the limit a 413, malformed JSON (or not UTF-8, or nested deeper than MAX_JSON_DEPTH) a 400.
 */
async function readJson(request: Request, limit: number): Promise<unknown> {
  if (!isJsonContentType(request.headers.get('content-type'))) {
    throw new ServiceError('Send the request body as JSON (Content-Type: application/json).', 415)
  }
  const bytes = await readLimited(request, limit)
  if (nestsDeeperThan(bytes, MAX_JSON_DEPTH)) {
    throw new ServiceError(`The request body nests arrays and objects deeper than ${MAX_JSON_DEPTH} levels.`, 400)
  }
  try {
    return JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(bytes))
  } catch {
    throw new ServiceError('The request body is not valid JSON.', 400)
  }
}

/** Checks a body against a schema: a 422 naming each field that does not fit. */
function checkBody<Schema extends z.ZodType>(body: unknown, schema: Schema): z.output<Schema> {
  const parsed = schema.safeParse(body)
  if (!parsed.success) throw new ValidationError(fieldIssues(parsed.error))
  return parsed.data
}

/**
 * Wraps a route handler, e.g.
 * `export const GET = route({ bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user }) =>
 * authorize(user, 'list-own-patterns') }, async ({ user }) => Response.json(await listOwnPatterns(user)))`.
 */
export function route<Param extends string = never, S extends SessionRule = SessionRule, Resource = undefined, Schema extends BodySpec = undefined>(
  spec: RouteSpec<Param, S, Resource, Schema>,
  handler: Handler<Record<Param, string>, S, Resource, BodyOf<Schema>>,
) {
  type Params = Record<Param, string>
  return async (request: Request, context?: { params?: Promise<Params> }): Promise<Response> => {
    let response: Response
    let setCookie: string | null = null
    try {
      checkAnnouncedSize(request, spec.bodyLimit)
      if (spec.origin !== 'signed' && !SAFE_METHODS.has(request.method) && !isSameOrigin(request)) {
        throw new ServiceError('This request did not come from a Wreathwright page.', 403)
      }
      const check = await checkSession(sessionIdFromRequest(request))
      setCookie = check.setCookie
      if (spec.session === 'required' && !check.user) throw new UnauthenticatedError()
      const user = check.user as UserFor<S>
      const params = ((await context?.params) ?? {}) as Params
      const resource = (spec.permit ? await spec.permit({ request, user, params }) : undefined) as Resource
      let body: BodyOf<Schema>
      if (spec.body === 'bytes') {
        body = (await readLimited(request, spec.bodyLimit)) as BodyOf<Schema>
      } else if (spec.body) {
        body = checkBody(await readJson(request, spec.bodyLimit), spec.body) as BodyOf<Schema>
      } else {
        // No body expected: whatever came (chunked, without a length) must still fit the small limit.
        await readLimited(request, spec.bodyLimit)
        body = undefined as BodyOf<Schema>
      }
      response = await handler({ request, user, params, sessionId: check.session?.id ?? null, resource, body })
    } catch (error) {
      response = wentAway(request, error) ? clientWentAway() : errorResponse(error)
      // A body refused unread (too large, a stranger, no permission) is left to Node's server,
      // which drops what still comes, chunk by chunk, without keeping it. Closing the connection
      // instead lost the answer: a client still sending meets a reset before it reads the 413.
    }
    if (setCookie && !response.headers.has('set-cookie')) response.headers.append('set-cookie', setCookie)
    return response
  }
}

/**
 * Whether the request failed because its client hung up: its body cut off mid-way (Node's server
 * ends the stream with `aborted`, ECONNRESET), or an abort of the request's signal, which Next.js
 * gives when the connection closes. Nothing was read in full, so nothing was written, and the
 * client is not there to answer. Any other failure, even of a request whose client has gone, is
 * ours and logged.
 */
function wentAway(request: Request, error: unknown): boolean {
  const failure = error as (Error & { code?: string }) | null
  return failure?.code === 'ECONNRESET' || (request.signal.aborted && failure?.name === 'AbortError')
}

/**
 * The answer to a client that hung up: 499, the status proxies log for "client closed request"
 * (nginx's; no standard code exists), not logged as our fault. Without it every tick cut off by a
 * closing browser tab was logged with its stack as an unexpected error.
 */
function clientWentAway(): Response {
  return new Response(null, { status: 499 })
}

function errorResponse(error: unknown): Response {
  if (error instanceof ValidationError) return jsonError(422, error.message, { issues: error.issues })
  if (error instanceof ConflictError) return jsonError(409, error.message, error.details)
  if (error instanceof StoredDesignError) return jsonError(error.status, error.message, error.details)
  if (error instanceof TooManyRequestsError) {
    // RFC 9110 §10.2.3: Retry-After as a number of seconds.
    const response = jsonError(429, error.message, { retryAfterSeconds: error.retryAfterSeconds })
    response.headers.set('retry-after', String(error.retryAfterSeconds))
    return response
  }
  if (error instanceof ServiceError) return jsonError(error.status, error.message)
  if (isDatabaseUnavailable(error)) {
    // Logged, one line, so an outage that lasts is seen; the stack says nothing more here.
    console.error(`database unreachable, answered 503: ${(error as Error).message}`)
    // "Nothing was changed", as the 500 says: a transaction whose connection broke was rolled back.
    const response = jsonError(503, `The database could not be reached, so nothing was changed; try again in ${DATABASE_RETRY_AFTER_SECONDS} seconds.`, {
      retryAfterSeconds: DATABASE_RETRY_AFTER_SECONDS,
    })
    response.headers.set('retry-after', String(DATABASE_RETRY_AFTER_SECONDS))
    return response
  }
  console.error(error)
  return jsonError(500, 'Something went wrong on our side; nothing was changed.')
}

/** Turns zod's issues into field paths such as `design.ring.outerRadius`. */
export function fieldIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({ path: issue.path.map(String).join('.') || '(body)', message: issue.message }))
}
