import { describe, expect, it } from 'vitest'
import { recordTick, undoLastTick, UNDO_DEPTH } from './tick-history'

describe('tick history', () => {
  it('undoes the newest tick first, one at a time', () => {
    let history = recordTick([], { stepId: 'a', done: true, label: 'A1' })
    history = recordTick(history, { stepId: 'b', done: false, label: 'A2' })
    const first = undoLastTick(history)
    expect(first?.change).toEqual({ stepId: 'b', done: true })
    const second = undoLastTick(first!.history)
    expect(second?.change).toEqual({ stepId: 'a', done: false })
    expect(undoLastTick(second!.history)).toBeNull()
  })

  it('keeps only the last few ticks', () => {
    let history = recordTick([], { stepId: 'first', done: true, label: 'first' })
    for (let index = 0; index < UNDO_DEPTH; index += 1) history = recordTick(history, { stepId: `s${index}`, done: true, label: `s${index}` })
    expect(history).toHaveLength(UNDO_DEPTH)
    expect(history.some((tick) => tick.stepId === 'first')).toBe(false)
  })
})
