import { describe, expect, it } from 'vitest'
import { emptyDesign } from '@/lib/new-design'
import { actionForKey, boardActions, keyOf } from './actions'
import { createBoardStore, design } from './store'

const store = () =>
  createBoardStore({
    ...emptyDesign('Keys'),
    seams: [{ id: 's1', from: [4, 0], to: [0, 4] }],
  })

const context = (s: ReturnType<typeof store>) => ({ store: s, fit: () => {}, toggleHelp: () => {}, canvasCentre: () => [0, 0] as const })

describe('board actions', () => {
  it('reads key presses the way the table writes them', () => {
    expect(keyOf({ key: 'Z', ctrlKey: true, metaKey: false, shiftKey: true })).toBe('Mod+Shift+z')
    expect(keyOf({ key: 'z', ctrlKey: false, metaKey: true, shiftKey: false })).toBe('Mod+z')
    expect(keyOf({ key: '?', ctrlKey: false, metaKey: false, shiftKey: true })).toBe('?')
    expect(actionForKey('Mod+Shift+z')).toBe('redo')
    expect(actionForKey('Delete')).toBe('deleteSelection')
  })

  it('gives every shortcut to one action only', () => {
    const keys = Object.values(boardActions).flatMap((action) => action.keys)
    expect(new Set(keys).size).toBe(keys.length)
  })

  it('deletes the selected seam, undoably', () => {
    const s = store()
    s.select({ kind: 'seam', id: 's1' })
    boardActions.deleteSelection.run(context(s))
    expect(design(s.getState()).seams).toEqual([])
    boardActions.undo.run(context(s))
    expect(design(s.getState()).seams).toHaveLength(1)
  })

  it('switches sides without recording an undo step', () => {
    const s = store()
    boardActions.toggleSide.run(context(s))
    expect(s.getState().view.side).toBe('printed')
    expect(s.getState().history.past).toHaveLength(0)
  })
})
