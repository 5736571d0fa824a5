import { describe, expect, it } from 'vitest'
import type { ProjectStep, SewingPicture } from '@/lib/schemas/sewing-room'
import {
  applySaved,
  areasCount,
  areasOfStep,
  groupsWithProgress,
  mergeServerSteps,
  nextStepOf,
  overlayPending,
  overlaysShown,
  percentOf,
  progressOf,
  sewnAreas,
} from './merge'
import type { PendingChange } from './pending-queue'

const step = (overrides: Partial<ProjectStep> = {}): ProjectStep => ({
  id: 'r1:area:A1',
  group: 'repeat-1',
  label: 'Sew A1',
  repeat: 1,
  areas: ['A1'],
  done: false,
  note: null,
  updatedAt: null,
  ...overrides,
})
const pending = (overrides: Partial<PendingChange> = {}): PendingChange => ({ stepId: 'r1:area:A1', done: true, version: 1, failures: 0, notBefore: 0, ...overrides })

const HALF_TURN = [-1, 0, 0, -1, 0, 0] as const
const picture: SewingPicture = {
  viewBox: [-10, -10, 20, 20],
  repeats: [
    { repeat: 1, matrix: [1, 0, 0, 1, 0, 0] },
    { repeat: 2, matrix: HALF_TURN },
  ],
  areas: ['A1', 'A2'].map((id) => ({ id, points: [[0, 0], [1, 0], [0, 1]] as [number, number][], fill: '#2f5540' })),
  overlays: [
    { d: 'M 2 2', fill: '#2f5540', stroke: null, stepIds: ['r1:area:A2', null] },
    { stepId: 'finish:stem', d: 'M 0 0', fill: null, stroke: '#3f6b4f', strokeWidthIn: 0.25 },
    { d: 'M 1 1', fill: '#a3392b', stroke: null, stepIds: ['finish:berries', 'finish:berries'] },
  ],
}

describe('mergeServerSteps', () => {
  it('keeps, step by step, the later of what it knew and what the server now says', () => {
    const known = [step({ id: 'a', done: true, updatedAt: '2026-12-02T10:00:05Z' }), step({ id: 'b', done: true, updatedAt: '2026-12-02T10:00:00Z' })]
    const incoming = [step({ id: 'a', done: false, updatedAt: '2026-12-02T10:00:01Z' }), step({ id: 'b', done: false, updatedAt: '2026-12-02T10:00:09Z' }), step({ id: 'c' })]
    expect(mergeServerSteps(known, incoming).map((s) => [s.id, s.done])).toEqual([
      ['a', true], // the PATCH's answer was newer than the GET that crossed it
      ['b', false], // the other device unticked it later
      ['c', false],
    ])
  })
})

describe('applySaved', () => {
  it('writes a PATCH answer into its own step only, unless the step already holds something newer', () => {
    const steps = [step({ id: 'a' }), step({ id: 'b', done: true, updatedAt: '2026-12-02T10:00:09Z' })]
    const once = applySaved(steps, { id: 'a', done: true, note: 'pressed well', updatedAt: '2026-12-02T10:00:10Z' })
    expect(once.map((s) => [s.id, s.done, s.note])).toEqual([
      ['a', true, 'pressed well'],
      ['b', true, null],
    ])
    expect(applySaved(once, { id: 'b', done: false, note: null, updatedAt: '2026-12-02T10:00:01Z' })[1]!.done).toBe(true)
  })
})

describe('overlayPending', () => {
  it('shows a waiting change on its step as not saved yet, and the others as saved', () => {
    const shown = overlayPending([step({ id: 'a' }), step({ id: 'b', done: true })], [pending({ stepId: 'a', lastError: 'No connection.' })])
    expect(shown.map((s) => [s.id, s.done, s.saveState, s.problem])).toEqual([
      ['a', true, 'waiting', 'No connection.'],
      ['b', true, 'saved', undefined],
    ])
  })

  it('lays a waiting note over the step and keeps the server’s tick', () => {
    const [shown] = overlayPending([step({ done: true, note: 'old' })], [pending({ done: undefined, note: 'new' })])
    expect(shown).toMatchObject({ done: true, note: 'new', saveState: 'waiting' })
  })

  it('marks a refused step with the server’s reason', () => {
    const [shown] = overlayPending([step()], [], { 'r1:area:A1': 'No such step in this pattern.' })
    expect(shown).toMatchObject({ saveState: 'refused', problem: 'No such step in this pattern.' })
  })
})

describe('progress', () => {
  it('counts the steps done, overall and per group, and finds the next step in work order', () => {
    const steps = [step({ id: 'cut', group: 'cut', done: true }), step({ id: 'a1' }), step({ id: 'a2', done: true })]
    expect(progressOf(steps)).toEqual({ done: 2, total: 3 })
    expect(percentOf({ done: 2, total: 3 })).toBe(67)
    expect(percentOf({ done: 0, total: 0 })).toBe(0)
    const groups = groupsWithProgress([{ id: 'cut', label: 'Cut' }, { id: 'repeat-1', label: 'Repeat 1' }], steps)
    expect(groups.map((g) => [g.id, g.done, g.total])).toEqual([
      ['cut', 1, 1],
      ['repeat-1', 1, 2],
    ])
    expect(nextStepOf(steps)?.id).toBe('a1')
    expect(nextStepOf([step({ done: true })])).toBeNull()
  })
})

describe('the picture', () => {
  it('fills the areas of done steps in their own repeat', () => {
    const steps = [step({ id: 'a', repeat: 2, areas: ['A2'], done: true }), step({ id: 'b', repeat: 1, areas: ['A1'] })]
    expect([...sewnAreas(steps, picture)]).toEqual(['2:A2'])
  })

  it('fills a whole-ring step’s areas in every repeat', () => {
    expect([...sewnAreas([step({ repeat: null, areas: ['A1'], done: true })], picture)].sort()).toEqual(['1:A1', '2:A1'])
  })

  it('marks the next step’s areas whether or not it is done', () => {
    expect([...areasOfStep(step({ repeat: 1, areas: ['A1', 'A2'] }), picture)]).toEqual(['1:A1', '1:A2'])
    expect(areasOfStep(null, picture).size).toBe(0)
  })

  it('counts the areas of every repeat', () => {
    expect(areasCount(picture, sewnAreas([step({ repeat: 2, areas: ['A2'], done: true })], picture))).toEqual({ done: 1, total: 4 })
  })

  it('draws what lies over the areas once its step is done, in each repeat whose step is', () => {
    const shown = overlaysShown(picture, [step({ id: 'finish:berries', done: true }), step({ id: 'finish:stem' }), step({ id: 'r1:area:A2', done: true })])
    expect(shown.map((item) => [item.stepId, item.matrix])).toEqual([
      ['r1:area:A2', [1, 0, 0, 1, 0, 0]],
      ['finish:berries', [1, 0, 0, 1, 0, 0]],
      ['finish:berries', HALF_TURN],
    ])
    expect(new Set(shown.map((item) => item.key)).size).toBe(shown.length)
    expect(overlaysShown(picture, [step({ id: 'finish:stem', done: true })])).toEqual([{ key: '1', stepId: 'finish:stem', matrix: null, d: 'M 0 0', fill: null, stroke: '#3f6b4f', strokeWidthIn: 0.25 }])
  })
})
