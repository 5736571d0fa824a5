/**
 * The checks lib/http.ts `route()` runs for every API route, in order: body size, origin, session,
 * permission, body contents. Each case here was answered differently before the wrapper ran them
 * in that order (issue 10, items 1, 2 and 8).
 */
import { randomUUID } from 'node:crypto'
import { afterAll, beforeEach, describe, expect, it, vi } from 'vitest'
import { POST as signIn } from '@/app/api/auth/sign-in/route'
import { DELETE as deletePattern, GET as readPattern, PATCH as updatePattern } from '@/app/api/patterns/[id]/route'
import { GET as listRevisions } from '@/app/api/patterns/[id]/revisions/route'
import { GET as listPatterns, POST as createPattern } from '@/app/api/patterns/route'
import { BODY_LIMITS } from '@/lib/http'
import { Pattern } from '@/models'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { call, TEST_ORIGIN } from '../support/requests'

beforeEach(freshDatabase)
afterAll(closeDatabase)

const MB = 1024 * 1024

async function designer() {
  const user = await createUser({ roles: ['designer'] })
  return { user, cookie: await sessionCookieFor(user) }
}

/** A body stream of `size` bytes of JSON-ish text, counting how much of it was pulled. */
function countedStream(size: number, chunk = 64 * 1024) {
  const counter = { pulled: 0 }
  const bytes = new TextEncoder().encode('x'.repeat(chunk))
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (counter.pulled >= size) return controller.close()
      counter.pulled += bytes.byteLength
      controller.enqueue(bytes)
    },
  })
  return { stream, counter }
}

describe('body size, before anything else', () => {
  it('refuses a 50 MB Content-Length from a stranger with 413 without reading the body', async () => {
    const { stream, counter } = countedStream(50 * MB)
    const response = await call(createPattern, { method: 'POST', stream, headers: { 'content-length': String(50 * MB) } })
    expect(response.status).toBe(413)
    expect(counter.pulled).toBeLessThanOrEqual(64 * 1024)
  })

  it('cuts a body whose Content-Length lies at the route limit (413), reading no more than that', async () => {
    const { cookie } = await designer()
    const { stream, counter } = countedStream(50 * MB)
    const response = await call(createPattern, { method: 'POST', cookie, stream, headers: { 'content-length': '100' } })
    expect(response.status).toBe(413)
    // The running count stops within one chunk past the limit.
    expect(counter.pulled).toBeLessThanOrEqual(BODY_LIMITS.design + 2 * 64 * 1024)
    expect(await Pattern.count()).toBe(0)
  })

  it('cuts a body without a Content-Length (chunked) at the limit too', async () => {
    const { cookie } = await designer()
    const { stream } = countedStream(BODY_LIMITS.design + MB)
    const response = await call(createPattern, { method: 'POST', cookie, stream })
    expect(response.status).toBe(413)
  })

  it('refuses a sign-in body larger than a form with 413', async () => {
    const response = await call(signIn, { method: 'POST', body: { email: 'a@example.test', password: 'x'.repeat(BODY_LIMITS.form) } })
    expect(response.status).toBe(413)
  })

  it('refuses a GET or DELETE that carries more than a tiny body', async () => {
    const { user, cookie } = await designer()
    const pattern = await createPatternRow(user)
    const headers = { 'content-length': String(BODY_LIMITS.none + 1) }
    expect((await call(listPatterns, { cookie, headers })).status).toBe(413)
    expect((await call(deletePattern, { method: 'DELETE', cookie, params: { id: pattern.id }, rawBody: 'x'.repeat(BODY_LIMITS.none + 1) })).status).toBe(413)
    expect(await Pattern.count()).toBe(1)
    // An empty JSON object on a DELETE is within the tiny limit.
    expect((await call(deletePattern, { method: 'DELETE', cookie, params: { id: pattern.id }, body: {} })).status).toBe(204)
  })
})

describe('a client that hangs up mid-body', () => {
  /** Part of a JSON body, then the error Node's server gives the body stream when the socket closes. */
  function cutOffStream() {
    const aborted = Object.assign(new Error('aborted'), { code: 'ECONNRESET' })
    return new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(new TextEncoder().encode('{"name":"Half a na'))
        controller.error(aborted)
      },
    })
  }

  it('gets 499, is not logged as our error, and nothing is changed', async () => {
    const { user, cookie } = await designer()
    const pattern = await createPatternRow(user, { name: 'Before' })
    const logged = vi.spyOn(console, 'error').mockImplementation(() => undefined)
    try {
      const response = await call(updatePattern, { method: 'PATCH', cookie, stream: cutOffStream(), params: { id: pattern.id } })
      expect(response.status).toBe(499)
      expect(logged).not.toHaveBeenCalled()
    } finally {
      logged.mockRestore()
    }
    expect((await Pattern.findByPk(pattern.id))!.name).toBe('Before')
  })

  it('still logs and answers 500 for a body stream that fails for another reason, even once the client has gone', async () => {
    const { user, cookie } = await designer()
    const pattern = await createPatternRow(user, { name: 'Before' })
    const logged = vi.spyOn(console, 'error').mockImplementation(() => undefined)
    try {
      for (const gone of [false, true]) {
        const broken = new ReadableStream<Uint8Array>({ start: (controller) => controller.error(new Error('disk on fire')) })
        const signal = gone ? AbortSignal.abort() : undefined
        const request = new Request(`${TEST_ORIGIN}/api/patterns/${pattern.id}`, {
          method: 'PATCH',
          headers: { cookie, origin: TEST_ORIGIN, 'content-type': 'application/json' },
          body: broken,
          signal,
          duplex: 'half',
        } as RequestInit)
        const response = await updatePattern(request, { params: Promise.resolve({ id: pattern.id }) })
        expect(response.status).toBe(500)
      }
      expect(logged).toHaveBeenCalledTimes(2)
    } finally {
      logged.mockRestore()
    }
  })
})

describe('content type', () => {
  it('refuses a body that is not sent as JSON with 415, and takes JSON with a UTF-8 charset', async () => {
    const { cookie } = await designer()
    const body = { name: 'Typed' }
    for (const type of ['text/plain', 'application/x-www-form-urlencoded', 'multipart/form-data; boundary=x', 'application/json; charset=latin1']) {
      const response = await call(createPattern, { method: 'POST', cookie, body, headers: { 'content-type': type } })
      expect(response.status, type).toBe(415)
    }
    const charset = await call(createPattern, { method: 'POST', cookie, body, headers: { 'content-type': 'application/json; charset=UTF-8' } })
    expect(charset.status).toBe(201)
    expect(await Pattern.count()).toBe(1)
  })
})

describe('a stranger learns nothing about bodies or ids', () => {
  it('gets 401, not 422, for a bad body', async () => {
    const response = await call(createPattern, { method: 'POST', body: { name: '', design: { nonsense: true } } })
    expect(response.status).toBe(401)
    expect(response.json?.error.issues).toBeUndefined()
  })

  it('gets 401, not 415, for a body of another type', async () => {
    const response = await call(createPattern, { method: 'POST', rawBody: 'name=x', headers: { 'content-type': 'text/plain' } })
    expect(response.status).toBe(401)
  })

  it('gets the same answer for an existing pattern id, a random one and a malformed one', async () => {
    const { user } = await designer()
    const existing = await createPatternRow(user)
    const answers = async (id: string) => [
      await call(readPattern, { params: { id } }),
      await call(listRevisions, { params: { id } }),
      await call(updatePattern, { method: 'PATCH', params: { id }, body: { revision: 1, name: 'Taken' } }),
      await call(updatePattern, { method: 'PATCH', params: { id }, body: { revision: 'bad' } }),
      await call(deletePattern, { method: 'DELETE', params: { id } }),
    ].map((response) => ({ status: response.status, json: response.json }))
    const forExisting = await answers(existing.id)
    expect(forExisting.map((answer) => answer.status)).toEqual([401, 401, 401, 401, 401])
    expect(await answers(randomUUID())).toEqual(forExisting)
    expect(await answers('not-an-id')).toEqual(forExisting)
    await existing.reload()
    expect(existing.name).toBe('Test ring')
  })
})

describe('permission before the body', () => {
  it("answers another designer's pattern 404 like a missing one, whatever the body", async () => {
    const owner = await designer()
    const other = await designer()
    const draft = await createPatternRow(owner.user)
    const badBody = { revision: 'not a number', design: { nonsense: true } }
    const hidden = await call(updatePattern, { method: 'PATCH', cookie: other.cookie, params: { id: draft.id }, body: badBody })
    const missing = await call(updatePattern, { method: 'PATCH', cookie: other.cookie, params: { id: randomUUID() }, body: badBody })
    expect(hidden.status).toBe(404)
    expect({ status: hidden.status, json: hidden.json }).toEqual({ status: missing.status, json: missing.json })
  })

  it('answers a quilter 403 for creating a pattern before looking at the body', async () => {
    const quilter = await createUser({ roles: ['quilter'] })
    const cookie = await sessionCookieFor(quilter)
    const response = await call(createPattern, { method: 'POST', cookie, body: { name: '' } })
    expect(response.status).toBe(403)
  })

  it('still names the fields of a bad body with 422 for someone allowed', async () => {
    const { cookie } = await designer()
    const response = await call(createPattern, { method: 'POST', cookie, body: { name: '' } })
    expect(response.status).toBe(422)
    expect(response.json?.error.issues.map((issue: { path: string }) => issue.path)).toEqual(['name'])
  })
})

describe('origin: the configured public URL, scheme, host and port', () => {
  it('refuses a forged X-Forwarded-Host naming the wrong origin (403)', async () => {
    const { cookie } = await designer()
    const response = await call(createPattern, {
      method: 'POST',
      cookie,
      origin: 'https://evil.example',
      headers: { 'x-forwarded-host': 'evil.example', 'x-forwarded-proto': 'https' },
      body: { name: 'Forged' },
    })
    expect(response.status).toBe(403)
    expect(await Pattern.count()).toBe(0)
  })

  it('refuses the right host under the wrong scheme (403)', async () => {
    const { cookie } = await designer()
    const https = TEST_ORIGIN.replace(/^http:/, 'https:')
    const response = await call(createPattern, { method: 'POST', cookie, origin: https, body: { name: 'Other scheme' } })
    expect(response.status).toBe(403)
  })

  it('refuses the right host on another port (403)', async () => {
    const { cookie } = await designer()
    const response = await call(createPattern, { method: 'POST', cookie, origin: 'http://127.0.0.1:3001', body: { name: 'Other port' } })
    expect(response.status).toBe(403)
  })

  it('takes the configured origin itself', async () => {
    const { cookie } = await designer()
    const response = await call(createPattern, { method: 'POST', cookie, origin: TEST_ORIGIN, body: { name: 'Mine' } })
    expect(response.status).toBe(201)
  })
})
