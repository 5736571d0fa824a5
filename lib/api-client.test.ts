import { describe, expect, it, vi } from 'vitest'
import { z } from 'zod'
import { ApiError, apiFetch, apiFetchTagged, MALFORMED_ANSWER } from './api-client'

const answer = (status: number, body?: unknown) =>
  vi.fn(async () => new Response(body === undefined ? null : JSON.stringify(body), { status })) as unknown as typeof fetch

const countSchema = z.object({ count: z.number() })

describe('the API client', () => {
  it('returns an answer that matches its schema', async () => {
    await expect(apiFetch('/api/x', { schema: countSchema, fetch: answer(200, { count: 3, extra: true }) })).resolves.toEqual({ count: 3 })
  })

  it('turns an answer of the wrong shape into an ApiError naming the field, not a value a page trips on', async () => {
    const failure = await apiFetch('/api/x', { schema: countSchema, fetch: answer(200, { count: 'three' }) }).catch((error: unknown) => error)
    expect(failure).toBeInstanceOf(ApiError)
    expect(failure).toMatchObject({ message: MALFORMED_ANSWER, status: 200, issues: [{ path: 'count' }] })
  })

  it('throws the server’s message and field issues for a refusal', async () => {
    const refusal = answer(422, { error: { message: 'Please check name.', issues: [{ path: 'name', message: 'Give the pattern a name.' }] } })
    await expect(apiFetch('/api/x', { method: 'POST', json: {}, fetch: refusal })).rejects.toMatchObject({
      status: 422, message: 'Please check name.', issues: [{ path: 'name', message: 'Give the pattern a name.' }],
    })
  })

  it('answers nothing for 204 No Content', async () => {
    await expect(apiFetch('/api/x', { method: 'DELETE', schema: countSchema, fetch: answer(204) })).resolves.toBeUndefined()
  })

  it('asks with the tag of the answer it has and keeps that answer when the server says 304', async () => {
    const first = vi.fn(async () => new Response(JSON.stringify({ count: 3 }), { status: 200, headers: { etag: '"a1"' } }))
    const known = await apiFetchTagged('/api/x', null, { schema: countSchema, fetch: first as unknown as typeof fetch })
    expect(known).toEqual({ value: { count: 3 }, etag: '"a1"' })
    expect(new Headers((first.mock.calls[0] as unknown as [string, RequestInit])[1].headers).get('if-none-match')).toBeNull()

    const unchanged = vi.fn(async () => new Response(null, { status: 304, headers: { etag: '"a1"' } }))
    expect(await apiFetchTagged('/api/x', known, { schema: countSchema, fetch: unchanged as unknown as typeof fetch })).toBe(known)
    expect(new Headers((unchanged.mock.calls[0] as unknown as [string, RequestInit])[1].headers).get('if-none-match')).toBe('"a1"')

    const changed = answer(200, { count: 4 })
    await expect(apiFetchTagged('/api/x', known, { schema: countSchema, fetch: changed })).resolves.toEqual({ value: { count: 4 }, etag: null })
  })
})
