import { createHash } from 'node:crypto'
import fresh from 'fresh'

/**
 * A JSON answer that a web process keeps (lib/row-changes.ts), written once when it is made: its
 * UTF-8 bytes, neither serialised nor encoded again per request, and an entity tag naming them, so
 * that a page asking again whether it changed (the sewing room every half minute) is answered
 * 304 without the body when it did not.
 */
export interface KeptJson {
  readonly bytes: Uint8Array<ArrayBuffer>
  /** A strong entity tag (RFC 9110 §8.8.3): 132 bits of the bytes' SHA-256, quoted. */
  readonly etag: string
}

/**
 * `value` as a kept JSON answer.
 *
 * @example keptJson({ ok: true }).bytes // the UTF-8 bytes of '{"ok":true}'
 */
export function keptJson(value: unknown): KeptJson {
  const bytes = new TextEncoder().encode(JSON.stringify(value))
  return { bytes, etag: `"${createHash('sha256').update(bytes).digest('base64url').slice(0, 22)}"` }
}

/** What keeping it costs in memory, for KeptAnswers' budget. */
export const keptJsonSize = (kept: KeptJson): number => kept.bytes.byteLength

/**
 * The answer with a kept JSON: 304 with no body when the request's If-None-Match names its tag
 * (RFC 9110 §13.1.2, compared by the `fresh` package), else 200 with the bytes; its ETag either way.
 * No Content-Length or Content-Encoding: Next.js drops both from a route's answer
 * (next/dist/server/send-response.js) and sends it chunked.
 *
 * @example return keptJsonResponse(request, await projectAnswer(user, id))
 */
export function keptJsonResponse(request: Request, kept: KeptJson): Response {
  // If-None-Match alone: a request's Cache-Control: no-cache is addressed to caches on the way
  // (RFC 9111 §5.2.1.4), not to us, and browsers add it to every conditional request a page makes
  // with fetch's cache: 'no-store' (Fetch standard, HTTP-network-or-cache fetch); `fresh` would
  // read it as "send the body again".
  const asked = { 'if-none-match': request.headers.get('if-none-match') ?? undefined }
  if (fresh(asked, { etag: kept.etag })) return new Response(null, { status: 304, headers: { etag: kept.etag } })
  // A stream of the one kept chunk: a Uint8Array body would be copied for every answer.
  const body = new ReadableStream<Uint8Array>({
    start(controller) {
      controller.enqueue(kept.bytes)
      controller.close()
    },
  })
  return new Response(body, { headers: { 'content-type': 'application/json', etag: kept.etag } })
}
