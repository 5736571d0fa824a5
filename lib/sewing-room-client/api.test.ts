import { afterEach, describe, expect, it, vi } from 'vitest'
import { ApiError, MALFORMED_ANSWER } from '@/lib/api-client'
import type { PlanAnswer } from '@/lib/schemas/sewing-room'
import { projectSummary } from '@/lib/sewing-room/test-support/project'
import { fetchProject } from './api'

const answer: PlanAnswer = {
  project: projectSummary({ done: 1, total: 2, nextStepLabel: 'Sew A2' }),
  groups: [{ id: 'repeat-1', label: 'Repeat 1', done: 1, total: 2 }],
  words: ['Sew along the line.'],
  steps: [
    { id: 'r1:area:A1', group: 'repeat-1', label: 'Place A1', repeat: 1, areas: ['A1'], instruction: 0, done: true, note: null, updatedAt: '2026-12-03T10:00:00.000Z' },
    { id: 'r1:area:A2', group: 'repeat-1', label: 'Sew A2', repeat: 1, areas: ['A2'], instruction: 0 },
  ],
  nextStepId: 'r1:area:A2',
  picture: { viewBox: [-9, -9, 18, 18], repeats: [{ repeat: 1, matrix: [1, 0, 0, 1, 0, 0] }], areas: [], overlays: [] },
}

const serve = (response: () => Response) => vi.stubGlobal('fetch', vi.fn(async () => response()))

afterEach(() => {
  vi.unstubAllGlobals()
})

describe('fetchProject', () => {
  it('reads the plan as sent into every step with its words and progress', async () => {
    serve(() => new Response(JSON.stringify(answer), { status: 200, headers: { etag: '"p1"' } }))
    const { value, etag } = await fetchProject(answer.project.id)
    expect(etag).toBe('"p1"')
    expect(value.steps).toEqual([
      { id: 'r1:area:A1', group: 'repeat-1', label: 'Place A1', repeat: 1, areas: ['A1'], instruction: 'Sew along the line.', done: true, note: null, updatedAt: '2026-12-03T10:00:00.000Z' },
      { id: 'r1:area:A2', group: 'repeat-1', label: 'Sew A2', repeat: 1, areas: ['A2'], instruction: 'Sew along the line.', done: false, note: null, updatedAt: null },
    ])
  })

  it('keeps the plan it has when the server says 304', async () => {
    serve(() => new Response(JSON.stringify(answer), { status: 200, headers: { etag: '"p1"' } }))
    const known = await fetchProject(answer.project.id)
    serve(() => new Response(null, { status: 304, headers: { etag: '"p1"' } }))
    expect(await fetchProject(answer.project.id, known)).toBe(known)
  })

  it('calls an answer it cannot read malformed rather than showing half a plan', async () => {
    const broken = { ...answer, steps: [{ ...answer.steps[1]!, instruction: 4 }] }
    serve(() => new Response(JSON.stringify(broken), { status: 200 }))
    const failure = await fetchProject(answer.project.id).catch((error: unknown) => error)
    expect(failure).toBeInstanceOf(ApiError)
    expect(failure).toMatchObject({ message: MALFORMED_ANSWER, issues: [{ message: expect.stringMatching(/names instruction 4/) }] })
    serve(() => new Response(JSON.stringify({ project: answer.project }), { status: 200 }))
    await expect(fetchProject(answer.project.id)).rejects.toMatchObject({ message: MALFORMED_ANSWER })
  })
})
