import { describe, expect, it } from 'vitest'
import { bailToMark, createHistory, markHistory, pushHistory, redoHistory, squashToMark, undoHistory } from './history'

describe('history', () => {
  it('undoes and redoes in order, and a new change clears the redo stack', () => {
    let h = createHistory('a')
    h = pushHistory(h, 'b')
    h = pushHistory(h, 'c')
    h = undoHistory(h)
    expect(h.present).toBe('b')
    h = undoHistory(h)
    expect(h.present).toBe('a')
    h = redoHistory(h)
    expect(h.present).toBe('b')
    h = pushHistory(h, 'd')
    expect(h.future).toEqual([])
    expect(redoHistory(h).present).toBe('d')
  })

  it('keeps at least 100 steps', () => {
    let h = createHistory(0)
    for (let i = 1; i <= 150; i += 1) h = pushHistory(h, i)
    for (let i = 0; i < 100; i += 1) h = undoHistory(h)
    expect(h.present).toBe(50)
  })

  it('squashes a drag into one undo step', () => {
    let h = pushHistory(createHistory('start'), 'before drag')
    h = markHistory(h)
    for (const position of ['x1', 'x2', 'x3']) h = pushHistory(h, position)
    h = squashToMark(h)
    expect(h.present).toBe('x3')
    expect(undoHistory(h).present).toBe('before drag')
    expect(undoHistory(undoHistory(h)).present).toBe('start')
  })

  it('bails a drag back to where it started, leaving no step', () => {
    let h = pushHistory(createHistory('start'), 'before drag')
    h = markHistory(h)
    h = pushHistory(pushHistory(h, 'x1'), 'x2')
    h = bailToMark(h)
    expect(h.present).toBe('before drag')
    expect(h.past).toEqual(['start'])
  })

  it('leaves no step for a drag that changed nothing', () => {
    let h = markHistory(pushHistory(createHistory('start'), 'same'))
    h = squashToMark(h)
    expect(h.past).toEqual(['start'])
  })

  it('keeps older steps and the starting point however long a drag is', () => {
    let h = createHistory(0)
    for (let i = 1; i <= 150; i += 1) h = pushHistory(h, i)
    h = markHistory(h)
    for (let move = 0; move < 1000; move += 1) h = pushHistory(h, 1000 + move)
    expect(bailToMark(h).present).toBe(150)
    h = squashToMark(h)
    expect(h.present).toBe(1999)
    h = undoHistory(h)
    expect(h.present).toBe(150)
    for (let i = 0; i < 100; i += 1) h = undoHistory(h)
    expect(h.present).toBe(50)
  })

  it('does not undo in the middle of a drag', () => {
    const h = pushHistory(markHistory(pushHistory(createHistory(1), 2)), 3)
    expect(undoHistory(h)).toBe(h)
  })
})
