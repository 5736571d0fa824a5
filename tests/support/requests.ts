/** Calls a route handler the way Next.js would, with a real Request. */
export const TEST_ORIGIN = 'http://127.0.0.1:3000'

type Handler<Params> = (request: Request, context: { params: Promise<Params> }) => Promise<Response>

export interface CallOptions<Params> {
  method?: string
  path?: string
  body?: unknown
  /** Raw body text, for malformed JSON. */
  rawBody?: string
  cookie?: string
  /** The Origin header; defaults to this site's. Pass null to send none. */
  origin?: string | null
  /** Further headers, set last (e.g. `content-type`, `content-length`, `x-forwarded-host`). */
  headers?: Record<string, string>
  /** A body stream instead of `body`/`rawBody`, sent as is (without a length unless `headers` gives one). */
  stream?: ReadableStream<Uint8Array>
  params?: Params
}

export async function call<Params = Record<string, never>>(handler: Handler<Params>, options: CallOptions<Params> = {}) {
  const method = options.method ?? 'GET'
  const headers = new Headers({ host: new URL(TEST_ORIGIN).host })
  if (options.origin !== null && method !== 'GET') headers.set('origin', options.origin ?? TEST_ORIGIN)
  if (options.cookie) headers.set('cookie', options.cookie)
  let body: string | undefined
  if (options.rawBody !== undefined) body = options.rawBody
  else if (options.body !== undefined) body = JSON.stringify(options.body)
  if (body !== undefined || options.stream) headers.set('content-type', 'application/json')
  for (const [name, value] of Object.entries(options.headers ?? {})) headers.set(name, value)
  // `duplex` is required by fetch for a stream body but missing from the DOM RequestInit type.
  const init = { method, headers, body: options.stream ?? body, duplex: 'half' } as RequestInit
  const request = new Request(`${TEST_ORIGIN}${options.path ?? '/'}`, init)
  const response = await handler(request, { params: Promise.resolve((options.params ?? {}) as Params) })
  const text = await response.text()
  // A PDF, an image or a CSV is no JSON: `json` is null and the bytes are left to `text`.
  const isJson = /json/.test(response.headers.get('content-type') ?? 'application/json')
  // Tests read any field of a response body and check it with expect(), so the body stays loosely typed.
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  const json = text && isJson ? (JSON.parse(text) as Record<string, any>) : null
  return { status: response.status, json, text, headers: response.headers }
}

/** The session id a Set-Cookie header carries (empty when it clears the cookie). */
export function sessionFromSetCookie(headers: Headers): string | null {
  const setCookie = headers.get('set-cookie')
  if (!setCookie) return null
  const [pair] = setCookie.split(';')
  return pair ?? null
}
