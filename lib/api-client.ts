/**
 * The browser's side of the JSON API: one fetch wrapper so every screen shows the server's
 * message and field paths the same way, and reads answers through the zod schemas the server's
 * answers are typed with (lib/schemas), so an answer of the wrong shape is an error here, not a
 * crash somewhere in a component.
 */
import type { z } from 'zod'

export interface ApiIssue {
  readonly path: string
  readonly message: string
}

export class ApiError extends Error {
  constructor(
    message: string,
    readonly status: number,
    readonly issues: readonly ApiIssue[] = [],
    readonly body: Record<string, unknown> = {},
  ) {
    super(message)
  }
}

/** What a successful answer that does not match its schema is called. */
export const MALFORMED_ANSWER = 'The server’s answer made no sense.'

export interface ApiRequest<T> extends RequestInit {
  /** A body to send as JSON. */
  readonly json?: unknown
  /** The schema of a successful answer's body; without it the body is not checked. */
  readonly schema?: z.ZodType<T>
  /** The fetch to use (tests pass a fake); the browser's by default. */
  readonly fetch?: typeof fetch
}

/**
 * Sends a request and returns the answer's body, parsed with `schema` when one is given. A
 * refusal (4xx, 5xx) throws an `ApiError` with the server's message, field issues and error body;
 * so does an answer that does not match `schema` (status kept, message `MALFORMED_ANSWER`); a
 * network failure rejects as fetch does.
 *
 * @example const { pattern } = await apiFetch(`/api/patterns/${id}`, { schema: patternAnswerSchema })
 */
export async function apiFetch<T>(url: string, init: ApiRequest<T> = {}): Promise<T> {
  return (await apiFetchTagged(url, null, init)).value
}

/** An answer with the entity tag it came with (null when the server sent none). */
export interface Tagged<T> {
  readonly value: T
  readonly etag: string | null
}

/**
 * As apiFetch, asking with the tag of the answer already `known` (If-None-Match, RFC 9110
 * §13.1.2) and returning `known` itself when the server answers 304 Not Modified: a page that asks
 * again whether something changed receives the body only when it did.
 *
 * @example known = await apiFetchTagged(`/api/sewing-room/projects/${id}`, known)
 */
export async function apiFetchTagged<T>(url: string, known: Tagged<T> | null, init: ApiRequest<T> = {}): Promise<Tagged<T>> {
  const { json, headers, schema, fetch: send = (input, options) => globalThis.fetch(input, options), ...rest } = init
  const response = await send(url, {
    ...rest,
    headers: {
      accept: 'application/json',
      ...(json !== undefined ? { 'content-type': 'application/json' } : {}),
      ...(known?.etag ? { 'if-none-match': known.etag } : {}),
      ...headers,
    },
    body: json !== undefined ? JSON.stringify(json) : rest.body,
    credentials: 'same-origin',
  })
  if (response.status === 304 && known) return known
  const etag = response.headers.get('etag')
  if (response.status === 204) return { value: undefined as T, etag }
  const body = (await response.json().catch(() => ({}))) as Record<string, unknown>
  if (!response.ok) {
    const error = (body?.error ?? {}) as { message?: string; issues?: ApiIssue[] }
    throw new ApiError(error.message ?? `Request failed (${response.status})`, response.status, error.issues ?? [], error)
  }
  if (!schema) return { value: body as T, etag }
  const parsed = schema.safeParse(body)
  if (!parsed.success) {
    const issues = parsed.error.issues.map((issue) => ({ path: issue.path.map(String).join('.') || '(body)', message: issue.message }))
    throw new ApiError(MALFORMED_ANSWER, response.status, issues)
  }
  return { value: parsed.data, etag }
}

/**
 * SWR's fetcher for an answer of a known shape: GET and return the parsed JSON body.
 *
 * @example useSWR('/api/patterns', getJsonOf(patternListAnswerSchema))
 */
export const getJsonOf =
  <T,>(schema: z.ZodType<T>) =>
  (url: string): Promise<T> =>
    apiFetch<T>(url, { schema })
