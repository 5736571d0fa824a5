import { describe, expect, it } from 'vitest'
import { keptJson, keptJsonResponse, keptJsonSize } from './kept-json'

const request = (headers: Record<string, string> = {}) => new Request('http://127.0.0.1/api/x', { headers })

describe('keptJson', () => {
  it('keeps the UTF-8 bytes of the JSON with a quoted tag that changes with them', () => {
    const kept = keptJson({ name: 'Hollyberry Wreath', note: 'Fußnote' })
    expect(new TextDecoder().decode(kept.bytes)).toBe('{"name":"Hollyberry Wreath","note":"Fußnote"}')
    expect(keptJsonSize(kept)).toBe(kept.bytes.byteLength)
    // RFC 9110 §8.8.3: an entity tag is a quoted string of visible characters.
    expect(kept.etag).toMatch(/^"[A-Za-z0-9_-]{22}"$/)
    expect(keptJson({ name: 'Hollyberry Wreath', note: 'Fußnote' }).etag).toBe(kept.etag)
    expect(keptJson({ name: 'Hollyberry Wreath', note: 'Fussnote' }).etag).not.toBe(kept.etag)
  })
})

describe('keptJsonResponse', () => {
  const kept = keptJson({ steps: [{ id: 'cut:star-light', done: true }] })
  const other = keptJson({ steps: [{ id: 'cut:star-light', done: false }] })

  it('sends the bytes with their tag to a request that names none', async () => {
    const response = keptJsonResponse(request(), kept)
    expect(response.status).toBe(200)
    expect(response.headers.get('etag')).toBe(kept.etag)
    expect(response.headers.get('content-type')).toBe('application/json')
    expect(new Uint8Array(await response.arrayBuffer())).toEqual(kept.bytes)
  })

  // If-None-Match as RFC 9110 §13.1.2 reads it: a list of tags compared weakly (W/ ignored), or *.
  it.each([
    ['its own tag', () => kept.etag, 304],
    ['a list holding it', () => `${other.etag}, ${kept.etag}`, 304],
    ['its tag marked weak', () => `W/${kept.etag}`, 304],
    ['*', () => '*', 304],
    ["another answer's tag", () => other.etag, 200],
  ])('answers If-None-Match naming %s with %i', async (_, header, status) => {
    const response = keptJsonResponse(request({ 'if-none-match': header() }), kept)
    expect(response.status).toBe(status)
    expect(response.headers.get('etag')).toBe(kept.etag)
    if (status === 304) expect(await response.text()).toBe('')
  })

  // Browsers add Cache-Control: no-cache (and Pragma) to a page's fetch with cache: 'no-store'
  // (Fetch standard); that directive is for caches (RFC 9111 §5.2.1.4), and RFC 9110 §13.1.2 has
  // the origin judge If-None-Match alone. Found when the sewing room's refresh never got a 304.
  it('answers 304 to a browser that also sends Cache-Control: no-cache', () => {
    expect(keptJsonResponse(request({ 'if-none-match': kept.etag, 'cache-control': 'no-cache', pragma: 'no-cache' }), kept).status).toBe(304)
  })
})
