import { describe, expect, it } from 'vitest'
import { emptyDesign } from '@/lib/new-design'
import type { DesignFile } from '@/lib/schemas/design'
import { boardPlan } from './board-plan'
import { createPointerController } from './pointer'
import { createBoardStore, design, type Tool } from './store'

const quarterRing = (overrides: Partial<DesignFile> = {}): DesignFile => ({
  ...emptyDesign('Pointer test'),
  seams: [],
  colorways: [{ name: 'Autumn', fabrics: { background: { name: 'Cream tone-on-tone', color: '#f4ecd8' }, rust: { name: 'Rust homespun', color: '#8a3b12' } } }],
  ...overrides,
})

function board(tool: Tool, overrides: Partial<DesignFile> = {}) {
  const store = createBoardStore(quarterRing(overrides))
  store.chooseTool(tool)
  return { store, pointer: createPointerController(store, () => 0.15) }
}

describe('drawing seams', () => {
  it('draws a seam by press, drag and release, snapped onto the outline along a 15° direction', () => {
    const { store, pointer } = board('seam')
    pointer.down([4.05, 0.08])
    pointer.move([2, 2])
    pointer.up([0.07, 3.98])
    // At 135° from (4.05, 0) the seam meets the other radial edge at (0, 4.05).
    expect(design(store.getState()).seams).toEqual([{ id: 's1', from: [4.05, 0], to: [0, 4.05] }])
    expect(store.getState().draft.seam).toBeNull()
  })

  it('draws a seam with two clicks', () => {
    const { store, pointer } = board('seam')
    pointer.down([7, 0.02])
    pointer.up([7, 0.02])
    expect(design(store.getState()).seams).toEqual([])
    pointer.move([0.1, 6])
    pointer.down([0.03, 7])
    expect(design(store.getState()).seams).toEqual([{ id: 's1', from: [7, 0], to: [0, 7] }])
  })

  it('updates the areas while a seam end is dragged, and undoes the drag in one step', () => {
    const { store, pointer } = board('select', { seams: [{ id: 's1', from: [4, 0], to: [0, 4] }] })
    pointer.down([0, 4])
    pointer.move([0, 5])
    // Triangle legs 4 and 5: 4 · 5 / 2 = 10 sq in while the pointer is still down.
    const smallest = Math.min(...boardPlan(design(store.getState())).plan!.areas.map((a) => a.areaSqIn))
    expect(smallest).toBeCloseTo(10, 6)
    pointer.move([0, 6])
    pointer.up([0, 6])
    store.undo()
    expect(design(store.getState()).seams[0]!.to).toEqual([0, 4])
  })

  it('puts a dragged end back on Escape', () => {
    const { store, pointer } = board('select', { seams: [{ id: 's1', from: [4, 0], to: [0, 4] }] })
    pointer.down([0, 4])
    pointer.move([0, 6])
    pointer.cancel()
    expect(design(store.getState()).seams[0]!.to).toEqual([0, 4])
  })
})

describe('fills, leaves, berries and curls', () => {
  it('fills the clicked area, and a second fill of the same area replaces the first', () => {
    const { store, pointer } = board('fill', { seams: [{ id: 's1', from: [4, 0], to: [0, 4] }] })
    store.chooseFabric('rust')
    pointer.down([1, 1])
    store.chooseFabric('background')
    pointer.down([0.5, 2])
    expect(design(store.getState()).fills).toEqual([{ at: [0.5, 2], fabric: 'background' }])
  })

  it('places a leaf on the nearest seam, on the side of the click', () => {
    const { store, pointer } = board('leaf', { seams: [{ id: 's1', from: [7, 0], to: [0, 7] }] })
    pointer.down([3.4, 3.4])
    const [leaf] = design(store.getState()).leaves
    expect(leaf).toMatchObject({ seam: 's1', at: 0.5, side: 'left', length: 1.5, width: 0.75 })
    expect(store.getState().selection).toEqual({ kind: 'leaf', id: leaf!.id })
  })

  it('sizes new leaves in centimetres for a centimetre design (1 in = 2.54 cm)', () => {
    const { store, pointer } = board('leaf', {
      units: 'cm',
      ring: { innerRadius: 0, outerRadius: 22.86, repeats: 4, repeatMode: 'rotate' },
      seams: [{ id: 's1', from: [17.78, 0], to: [0, 17.78] }],
    })
    pointer.down([8.8, 8.8])
    expect(design(store.getState()).leaves[0]).toMatchObject({ length: 3.81, width: 1.905 })
  })

  it('drags a leaf along its seam', () => {
    const { store, pointer } = board('select', {
      seams: [{ id: 's1', from: [7, 0], to: [0, 7] }],
      leaves: [{ id: 'l1', seam: 's1', at: 0.5, side: 'left', angle: 0, length: 1.5, width: 0.75, layers: ['rust'] }],
    })
    pointer.down([3.2, 3.2])
    pointer.move([5.25, 1.75])
    pointer.up([5.25, 1.75])
    expect(design(store.getState()).leaves[0]!.at).toBeCloseTo(0.25, 3)
  })

  it('draws a curl from clicks and finishes it on double click', () => {
    const { store, pointer } = board('curl')
    pointer.down([3, 5])
    pointer.down([3.4, 5.6])
    pointer.down([3.1, 6])
    pointer.doubleClick()
    expect(design(store.getState()).curls).toEqual([{ points: [[3, 5], [3.4, 5.6], [3.1, 6]] }])
  })

  it('collects areas clicked in turn for an order set by hand, each area once', () => {
    const { store, pointer } = board('order', { seams: [{ id: 's1', from: [4, 0], to: [0, 4] }] })
    pointer.down([1, 1])
    pointer.down([1.2, 1])
    pointer.down([5, 5])
    expect(store.getState().handOrderDraft?.[0]).toHaveLength(2)
  })
})
