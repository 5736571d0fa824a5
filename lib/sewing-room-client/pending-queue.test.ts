import { describe, expect, it } from 'vitest'
import {
  afterFailed,
  afterSaved,
  dueChanges,
  nextDueAt,
  queueChange,
  readQueue,
  requestBodyOf,
  serializeQueue,
  withoutStep,
  type PendingChange,
} from './pending-queue'

const change = (overrides: Partial<PendingChange> = {}): PendingChange => ({ stepId: 'r1:area:A2', done: true, version: 1, failures: 0, notBefore: 0, ...overrides })

describe('queueChange', () => {
  it('keeps one entry per step, in the order the steps were first changed', () => {
    let queue = queueChange([], { stepId: 'cut:background', done: true })
    queue = queueChange(queue, { stepId: 'r1:area:A1', done: true })
    queue = queueChange(queue, { stepId: 'cut:background', done: false })
    expect(queue.map((entry) => [entry.stepId, entry.done, entry.version])).toEqual([
      ['cut:background', false, 2],
      ['r1:area:A1', true, 1],
    ])
  })

  it('merges a note into a waiting tick without losing the tick', () => {
    const queue = queueChange(queueChange([], { stepId: 'a', done: true }), { stepId: 'a', note: 'darker green' })
    expect(queue).toEqual([{ stepId: 'a', done: true, note: 'darker green', version: 2, failures: 0, notBefore: 0, lastError: undefined }])
  })

  it('makes a waiting change due at once but keeps its failure count for the back-off', () => {
    const queue = queueChange([change({ failures: 3, notBefore: 50_000, lastError: 'No connection.' })], { stepId: 'r1:area:A2', done: false })
    expect(queue[0]).toMatchObject({ done: false, failures: 3, notBefore: 0, version: 2 })
    expect(queue[0]!.lastError).toBeUndefined()
  })

  it('does not change the queue it is given', () => {
    const queue = Object.freeze([Object.freeze(change())])
    queueChange(queue, { stepId: 'r1:area:A2', done: false })
    expect(queue[0]!.done).toBe(true)
  })
})

describe('sending', () => {
  it('sends only what is due and not already on its way', () => {
    const queue = [change({ stepId: 'a' }), change({ stepId: 'b', notBefore: 2_000 }), change({ stepId: 'c' })]
    expect(dueChanges(queue, 1_000, new Set(['c'])).map((entry) => entry.stepId)).toEqual(['a'])
    expect(nextDueAt(queue, new Set(['a', 'c']))).toBe(2_000)
    expect(nextDueAt([], new Set())).toBeNull()
  })

  it('drops a saved change, but keeps a newer change made while it was on its way', () => {
    expect(afterSaved([change({ version: 1 })], 'r1:area:A2', 1)).toEqual([])
    expect(afterSaved([change({ version: 2, failures: 2, notBefore: 9 })], 'r1:area:A2', 1)).toEqual([change({ version: 2, lastError: undefined })])
  })

  it('counts a failure and waits before the next try', () => {
    expect(afterFailed([change()], 'r1:area:A2', 1_000, 2_000, 'No connection.')[0]).toMatchObject({ failures: 1, notBefore: 3_000, lastError: 'No connection.' })
  })

  it('forgets a refused change and no other', () => {
    expect(withoutStep([change({ stepId: 'a' }), change({ stepId: 'b' })], 'a').map((entry) => entry.stepId)).toEqual(['b'])
  })

  it('sends exactly the fields that changed, through the server’s schema', () => {
    expect(requestBodyOf(change({ done: undefined, note: '  used the darker green  ' }))).toEqual({ stepId: 'r1:area:A2', note: 'used the darker green' })
    expect(requestBodyOf(change({ note: null }))).toEqual({ stepId: 'r1:area:A2', done: true, note: null })
  })
})

describe('the stored queue', () => {
  it('reads back what was written, due at once', () => {
    const queue = [change({ failures: 2, notBefore: 99_999, lastError: 'No connection.' }), change({ stepId: 'finish:binding', done: undefined, note: 'bias from the red' })]
    expect(readQueue(serializeQueue(queue))).toEqual([
      { stepId: 'r1:area:A2', done: true, version: 1, failures: 2, notBefore: 0 },
      { stepId: 'finish:binding', note: 'bias from the red', version: 1, failures: 0, notBefore: 0 },
    ])
  })

  it('drops what does not read as a change rather than trusting it', () => {
    expect(readQueue(null)).toEqual([])
    expect(readQueue('not json')).toEqual([])
    expect(readQueue('[1, 2]')).toEqual([])
    const stored = JSON.stringify({
      version: 1,
      queue: [
        { stepId: '', done: true },
        { stepId: 'a' },
        { stepId: 'b\u0000', done: true },
        { stepId: 'c', done: 'yes', note: 7 },
        { stepId: 'd', done: false, version: -4, failures: 'many' },
        { stepId: 'd', done: true },
      ],
    })
    expect(readQueue(stored)).toEqual([{ stepId: 'd', done: false, version: 1, failures: 0, notBefore: 0 }])
  })
})
