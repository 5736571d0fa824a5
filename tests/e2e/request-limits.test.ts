/**
 * Request limits, origin and check order against the built app (`next start`, with its proxy),
 * over real sockets: what lib/http.ts `route()` promises must also hold once Next.js's own server
 * sits in front of it (issue 10, items 1, 2 and 8).
 */
import { randomUUID } from 'node:crypto'
import net from 'node:net'
import { beforeAll, describe, expect, it } from 'vitest'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { baseUrl } from '../support/browser'

const MB = 1024 * 1024
const DESIGNER = 'marguerite@bramblelane.example'
/** Longest wait for a refusal that needs no body: a human would call anything slower a hang. */
const PROMPT_MS = 2_000

interface RawAnswer {
  /** 0 when no answer came before the timeout. */
  status: number
  /** From the first byte written to the status line read. */
  elapsedMs: number
  /** Body bytes written before the answer came. */
  bodyBytesWritten: number
  head: string
}

/**
 * Sends a request over a plain socket: the head as given, then `bodyBytes` of body in 64 KiB
 * pieces (as chunked encoding when `chunked`), stopping as soon as an answer's status line is read.
 */
function rawRequest(head: string, options: { bodyBytes: number; chunked?: boolean; timeoutMs?: number }): Promise<RawAnswer> {
  const url = new URL(baseUrl())
  const piece = Buffer.alloc(64 * 1024, 'x')
  return new Promise((resolve) => {
    const started = performance.now()
    let written = 0
    let received = ''
    let done = false
    const socket = net.connect({ host: url.hostname, port: Number(url.port) })
    const finish = (status: number) => {
      if (done) return
      done = true
      clearTimeout(timer)
      socket.destroy()
      resolve({ status, elapsedMs: performance.now() - started, bodyBytesWritten: written, head: received.split('\r\n\r\n')[0] ?? '' })
    }
    const timer = setTimeout(() => finish(0), options.timeoutMs ?? 30_000)
    socket.on('data', (data) => {
      received += data.toString('latin1')
      const match = /^HTTP\/1\.1 (\d{3})/.exec(received)
      if (match && received.includes('\r\n\r\n')) finish(Number(match[1]))
    })
    // The server may close while we still write (that is the point); the answer already read counts.
    socket.on('error', () => finish(0))
    socket.on('close', () => finish(0))
    // One piece at a time, reading between pieces as a browser does: an answer that comes early is
    // read before the next write would meet the closed connection.
    const writeBody = () => {
      if (done) return
      if (written >= options.bodyBytes) return void (options.chunked && socket.write('0\r\n\r\n'))
      const size = Math.min(piece.byteLength, options.bodyBytes - written)
      written += size
      if (options.chunked) socket.write(`${size.toString(16)}\r\n`)
      socket.write(piece.subarray(0, size))
      if (options.chunked) socket.write('\r\n')
      if (socket.writableNeedDrain) socket.once('drain', writeBody)
      else setImmediate(writeBody)
    }
    socket.once('connect', () => {
      socket.write(head)
      writeBody()
    })
  })
}

function postHead(path: string, headers: Record<string, string>): string {
  const url = new URL(baseUrl())
  const lines = [`POST ${path} HTTP/1.1`, `Host: ${url.host}`, `Origin: ${url.origin}`, 'Content-Type: application/json']
  for (const [name, value] of Object.entries(headers)) lines.push(`${name}: ${value}`)
  return `${lines.join('\r\n')}\r\n\r\n`
}

let designerCookie = ''
let existingPatternId = ''

beforeAll(async () => {
  const signIn = await fetch(`${baseUrl()}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: baseUrl() },
    body: JSON.stringify({ email: DESIGNER, password: DEMO_PASSWORD }),
  })
  expect(signIn.status).toBe(200)
  designerCookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0]!
  const list = await fetch(`${baseUrl()}/api/patterns`, { headers: { cookie: designerCookie } })
  const { patterns } = (await list.json()) as { patterns: { id: string }[] }
  existingPatternId = patterns[0]!.id
})

describe('bodies over the limit are refused before they are read', () => {
  it('answers a socket announcing 50 MB with 413 at once, without the body', async () => {
    const answer = await rawRequest(postHead('/api/patterns', { 'Content-Length': String(50 * MB) }), { bodyBytes: 0 })
    expect(answer.status).toBe(413)
    expect(answer.elapsedMs).toBeLessThan(PROMPT_MS)
  })

  it('answers a stranger sending 50 MB chunked (no length) with 401 before reading it', async () => {
    const answer = await rawRequest(postHead('/api/patterns', { 'Transfer-Encoding': 'chunked' }), { bodyBytes: 50 * MB, chunked: true })
    expect(answer.status).toBe(401)
    expect(answer.bodyBytesWritten).toBeLessThan(50 * MB)
  })

  it("cuts a signed-in designer's chunked 50 MB body at the route's limit with 413", async () => {
    const answer = await rawRequest(postHead('/api/patterns', { 'Transfer-Encoding': 'chunked', Cookie: designerCookie }), {
      bodyBytes: 50 * MB,
      chunked: true,
    })
    expect(answer.status).toBe(413)
    // The limit is a few MB; socket buffers on both sides hold a few MB more at most.
    expect(answer.bodyBytesWritten).toBeLessThan(20 * MB)
  })

  it('refuses each of a stream of 10 MB bodies from strangers with 413', async () => {
    const answers = await Promise.all(
      Array.from({ length: 6 }, () => rawRequest(postHead('/api/patterns', { 'Content-Length': String(10 * MB) }), { bodyBytes: 10 * MB })),
    )
    expect(answers.map((answer) => answer.status)).toEqual([413, 413, 413, 413, 413, 413])
  })
})

describe('content type, origin and the order of checks through the real server', () => {
  const send = (path: string, init: { method: string; headers?: Record<string, string>; body?: string }) =>
    fetch(`${baseUrl()}${path}`, { ...init, headers: { origin: baseUrl(), ...init.headers } })

  it('refuses a designer body that is not JSON with 415', async () => {
    const response = await send('/api/patterns', { method: 'POST', headers: { cookie: designerCookie, 'content-type': 'text/plain' }, body: '{"name":"x"}' })
    expect(response.status).toBe(415)
  })

  it('gives a stranger 401, not 422, for a bad body', async () => {
    const response = await send('/api/patterns', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{"name":""}' })
    expect(response.status).toBe(401)
  })

  it('gives a stranger the same answer for an existing pattern id and a random one', async () => {
    for (const method of ['GET', 'PATCH', 'DELETE']) {
      const init = { method, headers: { 'content-type': 'application/json' }, body: method === 'PATCH' ? '{"revision":1,"name":"Taken"}' : undefined }
      const existing = await send(`/api/patterns/${existingPatternId}`, init)
      const random = await send(`/api/patterns/${randomUUID()}`, init)
      expect([existing.status, await existing.text()], method).toEqual([random.status, await random.text()])
      expect(existing.status, method).toBe(401)
    }
  })

  it('refuses a forged X-Forwarded-Host with the matching wrong origin (403)', async () => {
    const response = await send('/api/patterns', {
      method: 'POST',
      headers: { cookie: designerCookie, 'content-type': 'application/json', origin: 'http://evil.example', 'x-forwarded-host': 'evil.example', 'x-forwarded-proto': 'http' },
      body: '{"name":"Forged"}',
    })
    expect(response.status).toBe(403)
  })

  it('refuses the app host under https when the app is served over http (403)', async () => {
    const response = await send('/api/patterns', {
      method: 'POST',
      headers: { cookie: designerCookie, 'content-type': 'application/json', origin: baseUrl().replace(/^http:/, 'https:') },
      body: '{"name":"Other scheme"}',
    })
    expect(response.status).toBe(403)
  })
})
