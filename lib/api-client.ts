/**
 * The browser's side of the JSON API: one fetch wrapper so every screen shows the server's
 * message and field paths the same way.
 */
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

export async function apiFetch<T>(url: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const { json, headers, ...rest } = init
  const response = await fetch(url, {
    ...rest,
    headers: { accept: 'application/json', ...(json !== undefined ? { 'content-type': 'application/json' } : {}), ...headers },
    body: json !== undefined ? JSON.stringify(json) : rest.body,
    credentials: 'same-origin',
  })
  if (response.status === 204) return undefined as T
  const body = (await response.json().catch(() => ({}))) as Record<string, unknown>
  if (!response.ok) {
    const error = (body.error ?? {}) as { message?: string; issues?: ApiIssue[] }
    throw new ApiError(error.message ?? `Request failed (${response.status})`, response.status, error.issues ?? [], error)
  }
  return body as T
}

/** SWR's fetcher: GET and return the JSON body. */
export const getJson = <T,>(url: string): Promise<T> => apiFetch<T>(url)
