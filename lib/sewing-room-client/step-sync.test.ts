import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { ApiError } from '@/lib/api-client'
import type { StepProgress, StepUpdateInput } from '@/lib/schemas/sewing-room'
import { storageKeyOf } from './pending-queue'
import { classifyFailure, createStepSync, type KeyValueStorage } from './step-sync'

const PROJECT = '9d7d6f3e-1111-4000-8000-000000000000'

function memoryStorage(initial: Record<string, string> = {}): KeyValueStorage & { values: Map<string, string> } {
  const values = new Map(Object.entries(initial))
  return { values, getItem: (key) => values.get(key) ?? null, setItem: (key, value) => void values.set(key, value), removeItem: (key) => void values.delete(key) }
}

/** A server the test answers by hand: each call waits until the test resolves or rejects it. */
function handServer() {
  const calls: { body: StepUpdateInput; resolve: (step: StepProgress) => void; reject: (error: unknown) => void }[] = []
  const send = (body: StepUpdateInput) => new Promise<StepProgress>((resolve, reject) => calls.push({ body, resolve, reject }))
  const saved = (body: StepUpdateInput): StepProgress => ({ id: body.stepId, done: body.done ?? false, note: body.note ?? null, updatedAt: new Date().toISOString() })
  return { calls, send, saved }
}

const settle = () => vi.advanceTimersByTimeAsync(0)

beforeEach(() => {
  vi.useFakeTimers()
})
afterEach(() => {
  vi.useRealTimers()
})

describe('createStepSync', () => {
  it('sends each step in its own request and forgets it once saved', async () => {
    const server = handServer()
    const storage = memoryStorage()
    const onSaved = vi.fn()
    const sync = createStepSync({ projectId: PROJECT, send: server.send, storage, onSaved })
    sync.change({ stepId: 'cut:background', done: true })
    sync.change({ stepId: 'r1:area:A1', done: true })
    expect(server.calls.map((call) => call.body)).toEqual([
      { stepId: 'cut:background', done: true },
      { stepId: 'r1:area:A1', done: true },
    ])
    expect(sync.getState().sending.size).toBe(2)
    expect(storage.values.has(storageKeyOf(PROJECT))).toBe(true)
    for (const call of server.calls) call.resolve(server.saved(call.body))
    await settle()
    expect(sync.getState().queue).toEqual([])
    expect(onSaved).toHaveBeenCalledTimes(2)
    expect(storage.values.has(storageKeyOf(PROJECT))).toBe(false)
    expect(sync.getState().lastSavedAt).not.toBeNull()
  })

  it('keeps a change made while the step’s request is on its way, and sends it after', async () => {
    const server = handServer()
    const sync = createStepSync({ projectId: PROJECT, send: server.send })
    sync.change({ stepId: 'a', done: true })
    sync.change({ stepId: 'a', done: false })
    expect(server.calls).toHaveLength(1) // one request per step at a time, so they land in order
    server.calls[0]!.resolve(server.saved(server.calls[0]!.body))
    await settle()
    expect(server.calls.map((call) => call.body)).toEqual([
      { stepId: 'a', done: true },
      { stepId: 'a', done: false },
    ])
    server.calls[1]!.resolve(server.saved(server.calls[1]!.body))
    await settle()
    expect(sync.getState().queue).toEqual([])
  })

  it('retries a failed send with back-off, showing it as waiting, until it is saved', async () => {
    const server = handServer()
    const sync = createStepSync({ projectId: PROJECT, send: server.send, random: () => 0.5 })
    sync.change({ stepId: 'a', done: true })
    server.calls[0]!.reject(new TypeError('Failed to fetch'))
    await settle()
    expect(sync.getState().queue[0]).toMatchObject({ failures: 1, lastError: 'No connection.' })
    expect(sync.getState().nextRetryAt).not.toBeNull()
    await vi.advanceTimersByTimeAsync(400)
    expect(server.calls).toHaveLength(1)
    await vi.advanceTimersByTimeAsync(200) // 1 s cap × 0.5 = 500 ms
    expect(server.calls).toHaveLength(2)
    server.calls[1]!.reject(new ApiError('Something went wrong', 503))
    await settle()
    await vi.advanceTimersByTimeAsync(999) // second failure: 2 s cap × 0.5 = 1 s
    expect(server.calls).toHaveLength(2)
    await vi.advanceTimersByTimeAsync(1)
    server.calls[2]!.resolve(server.saved(server.calls[2]!.body))
    await settle()
    expect(sync.getState().queue).toEqual([])
  })

  it('sends every waiting change at once when asked (the connection came back)', async () => {
    const server = handServer()
    const sync = createStepSync({ projectId: PROJECT, send: server.send, random: () => 0.99 })
    sync.change({ stepId: 'a', done: true })
    server.calls[0]!.reject(new TypeError('Failed to fetch'))
    await settle()
    sync.retryNow()
    expect(server.calls).toHaveLength(2)
  })

  it('drops a change the server refuses for good and says why', async () => {
    const server = handServer()
    const sync = createStepSync({ projectId: PROJECT, send: server.send })
    sync.change({ stepId: 'r9:area:Z9', done: true })
    server.calls[0]!.reject(new ApiError('No such step in this pattern.', 422))
    await settle()
    expect(sync.getState().queue).toEqual([])
    expect(sync.getState().refused).toEqual({ 'r9:area:Z9': 'No such step in this pattern.' })
    await vi.advanceTimersByTimeAsync(60_000)
    expect(server.calls).toHaveLength(1)
  })

  it('keeps changes for after a reload and sends them when the page comes back', async () => {
    const storage = memoryStorage()
    const first = handServer()
    const before = createStepSync({ projectId: PROJECT, send: first.send, storage })
    before.change({ stepId: 'a', done: true })
    before.change({ stepId: 'b', note: 'trim to the dashed line' })
    before.dispose() // the tab closed with both requests unanswered
    const second = handServer()
    const after = createStepSync({ projectId: PROJECT, send: second.send, storage })
    expect(after.getState().queue.map((entry) => entry.stepId)).toEqual(['a', 'b'])
    await settle()
    expect(second.calls.map((call) => call.body)).toEqual([
      { stepId: 'a', done: true },
      { stepId: 'b', note: 'trim to the dashed line' },
    ])
  })

  it('waits for the quilter to sign in again after a 401, keeping the change', async () => {
    const server = handServer()
    const sync = createStepSync({ projectId: PROJECT, send: server.send })
    sync.change({ stepId: 'a', done: true })
    server.calls[0]!.reject(new ApiError('Sign in first.', 401))
    await settle()
    expect(sync.getState()).toMatchObject({ signedOut: true })
    expect(sync.getState().queue).toHaveLength(1)
  })
})

describe('classifyFailure', () => {
  it('retries what a later try may fix and refuses what it cannot', () => {
    expect(classifyFailure(new TypeError('Failed to fetch')).kind).toBe('retry')
    expect(classifyFailure(new ApiError('busy', 503)).kind).toBe('retry')
    expect(classifyFailure(new ApiError('slow down', 429, [], { retryAfterSeconds: 7 }))).toMatchObject({ kind: 'retry', retryAfterSeconds: 7 })
    expect(classifyFailure(new ApiError('gone', 404)).kind).toBe('refused')
    expect(classifyFailure(new ApiError('bad step', 422)).kind).toBe('refused')
    expect(classifyFailure(new ApiError('who are you', 401)).kind).toBe('signed-out')
  })
})
