import { describe, expect, it, vi } from 'vitest'
import { emptyDesign } from '@/lib/new-design'
import { createPatternApi, UNREACHABLE } from './pattern-api'

const PATTERN_ID = '00000000-0000-4000-8000-000000000001'

/** A fetch that answers every request with this status and JSON body. */
function answering(status: number, body: unknown) {
  return vi.fn(async () => new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } })) as unknown as typeof fetch
}

describe('the pattern API client of the board', () => {
  it('sends the revision and design, and reads the new revision from the answer', async () => {
    const fetch = answering(200, { pattern: { id: PATTERN_ID, revision: 4, design: emptyDesign('Star') } })
    const outcome = await createPatternApi(PATTERN_ID, fetch).save(3, emptyDesign('Star'))
    expect(outcome).toEqual({ kind: 'saved', revision: 4 })
    const [url, init] = (fetch as unknown as ReturnType<typeof vi.fn>).mock.calls[0]! as [string, RequestInit]
    expect(url).toBe(`/api/patterns/${PATTERN_ID}`)
    expect(init.method).toBe('PATCH')
    expect(JSON.parse(String(init.body))).toMatchObject({ revision: 3, design: { name: 'Star' } })
  })

  it('treats an answer of the wrong shape as a failure, not as a save', async () => {
    const outcome = await createPatternApi(PATTERN_ID, answering(200, { pattern: { revision: 'four' } })).save(3, emptyDesign('Star'))
    expect(outcome).toEqual({ kind: 'failed', message: 'The server’s answer made no sense.' })
  })

  it('refuses a saved pattern whose design is not a design', async () => {
    const fetch = answering(200, { pattern: { id: PATTERN_ID, revision: 4, design: { ...emptyDesign('Star'), ring: { innerRadius: 5, outerRadius: 1, repeats: 4, repeatMode: 'rotate' } } } })
    await expect(createPatternApi(PATTERN_ID, fetch).load()).rejects.toThrow('The saved pattern could not be read.')
  })

  it('tells a conflict, a refusal, a sign-out and an unreachable server apart', async () => {
    const save = (fetch: typeof globalThis.fetch) => createPatternApi(PATTERN_ID, fetch).save(1, emptyDesign('Star'))
    expect(await save(answering(409, { error: { message: 'saved elsewhere', currentRevision: 7 } }))).toEqual({ kind: 'conflict', currentRevision: 7 })
    expect(await save(answering(422, { error: { message: 'invalid', issues: [{ path: 'design.ring.repeats', message: 'Too big' }] } }))).toEqual({
      kind: 'invalid',
      message: 'The server refused this design (design.ring.repeats: Too big).',
    })
    expect((await save(answering(401, { error: { message: 'Sign in first.' } }))).kind).toBe('failed')
    expect(await save(answering(401, {}))).toMatchObject({ message: expect.stringContaining('signed out') })
    const offline = vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))) as unknown as typeof fetch
    expect(await save(offline)).toEqual({ kind: 'failed', message: UNREACHABLE })
  })

  it('names the pattern when the server cannot read its stored design', async () => {
    const fetch = answering(500, { error: { message: 'The saved design of the pattern “Star” (…) can no longer be read.', patternId: PATTERN_ID } })
    await expect(createPatternApi(PATTERN_ID, fetch).load()).rejects.toThrow(/“Star”/)
  })
})
