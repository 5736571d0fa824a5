import { describe, expect, it } from 'vitest'
import { emptyDesign } from '@/lib/new-design'
import type { DesignFile } from '@/lib/schemas/design'
import { boardPlan } from './board-plan'
import { createBoardStore, design } from './store'

const emptyQuarterRing = (overrides: Partial<DesignFile> = {}): DesignFile => ({
  ...emptyDesign('Store test'),
  seams: [],
  colorways: [{ name: 'Autumn', fabrics: { background: { name: 'Cream tone-on-tone', color: '#f4ecd8' }, leaf: { name: 'Rust homespun', color: '#8a3b12' } } }],
  ...overrides,
})

describe('the board store', () => {
  it('runs commands as undoable steps and redoes them', () => {
    const store = createBoardStore(emptyQuarterRing())
    store.run('addSeam', { from: [4, 0], to: [0, 4] })
    store.run('addSeam', { from: [7, 0], to: [0, 7] })
    expect(design(store.getState()).seams.map((s) => s.id)).toEqual(['s1', 's2'])
    store.undo()
    expect(design(store.getState()).seams.map((s) => s.id)).toEqual(['s1'])
    store.redo()
    expect(design(store.getState()).seams).toHaveLength(2)
  })

  it('turns a dragged seam end into one undo step', () => {
    const store = createBoardStore(emptyQuarterRing({ seams: [{ id: 's1', from: [4, 0], to: [0, 4] }] }))
    store.beginDrag()
    for (const y of [4.5, 5, 5.5]) store.run('moveSeamEnd', { seamId: 's1', end: 'to', to: [0, y] })
    store.endDrag()
    expect(design(store.getState()).seams[0]!.to).toEqual([0, 5.5])
    store.undo()
    expect(design(store.getState()).seams[0]!.to).toEqual([0, 4])
  })

  it('puts a dragged end back on Escape', () => {
    const store = createBoardStore(emptyQuarterRing({ seams: [{ id: 's1', from: [4, 0], to: [0, 4] }] }))
    store.beginDrag()
    store.run('moveSeamEnd', { seamId: 's1', end: 'to', to: [0, 6] })
    store.cancelDrag()
    expect(design(store.getState()).seams[0]!.to).toEqual([0, 4])
    expect(store.getState().history.past).toHaveLength(0)
  })

  it('keeps the redo stack when only the view changes', () => {
    const store = createBoardStore(emptyQuarterRing())
    store.run('addSeam', { from: [4, 0], to: [0, 4] })
    store.undo()
    store.zoomAt([10, 10], 2)
    store.toggleSide()
    store.chooseTool('seam')
    store.redo()
    expect(design(store.getState()).seams).toHaveLength(1)
  })

  it('drops a selection whose seam was undone away', () => {
    const store = createBoardStore(emptyQuarterRing())
    store.run('addSeam', { from: [4, 0], to: [0, 4] })
    store.select({ kind: 'seam', id: 's1' })
    store.undo()
    expect(store.getState().selection).toBeNull()
  })

  it('deletes the leaves caught in a deleted seam', () => {
    const store = createBoardStore(emptyQuarterRing({ seams: [{ id: 's1', from: [4, 0], to: [0, 4] }] }))
    store.run('addLeaf', { seam: 's1', at: 0.5, side: 'left', angle: 0, length: 1.5, width: 0.75, layers: ['leaf'] })
    store.run('deleteSeam', { seamId: 's1' })
    expect(design(store.getState()).leaves).toEqual([])
  })

  it('converts every length when switching to centimetres (1 in = 2.54 cm exactly, 1959 agreement)', () => {
    const store = createBoardStore(emptyQuarterRing({ seams: [{ id: 's1', from: [4, 0], to: [0, 4] }] }))
    store.run('setUnits', { units: 'cm' })
    const converted = design(store.getState())
    expect(converted.ring.outerRadius).toBeCloseTo(22.86, 10) // 9 in × 2.54
    expect(converted.seams[0]!.from).toEqual([10.16, 0]) // 4 in × 2.54
    store.run('setUnits', { units: 'in' })
    expect(design(store.getState()).seams[0]!.from).toEqual([4, 0])
  })

  it('keeps a fill on its area when a seam moves, since the fill names the area by a point', () => {
    const store = createBoardStore(emptyQuarterRing({ seams: [{ id: 's1', from: [4, 0], to: [0, 4] }] }))
    store.run('fillArea', { at: [1, 1], fabric: 'leaf' })
    store.run('moveSeamEnd', { seamId: 's1', end: 'to', to: [0, 5] })
    const current = design(store.getState())
    const plan = boardPlan(current)
    const filled = plan.plan!.areas.filter((area) => area.areaSqIn < 12)
    expect(filled).toHaveLength(1)
    expect(current.fills).toEqual([{ at: [1, 1], fabric: 'leaf' }])
  })

  it('notifies subscribers on every change and stops after unsubscribing', () => {
    const store = createBoardStore(emptyQuarterRing())
    let calls = 0
    const unsubscribe = store.subscribe(() => (calls += 1))
    store.run('addSeam', { from: [4, 0], to: [0, 4] })
    store.chooseTool('seam')
    unsubscribe()
    store.undo()
    expect(calls).toBe(2)
  })
})

describe('named operations for everything that is not the design', () => {
  it('offers no general update: every change of the view, tool or selection has a name', () => {
    const store = createBoardStore(emptyQuarterRing())
    expect('update' in store).toBe(false)
  })

  it('starts a hand-set order with the order tool and drops it with any other tool', () => {
    const store = createBoardStore(emptyQuarterRing())
    store.chooseTool('order')
    expect(store.getState()).toMatchObject({ tool: 'order', handOrderDraft: [[]] })
    store.addHandOrderArea([1, 1])
    store.newHandOrderSection()
    store.addHandOrderArea([5, 5])
    expect(store.getState().handOrderDraft).toEqual([[[1, 1]], [[5, 5]]])
    store.cancelDraft()
    expect(store.getState().handOrderDraft).toEqual([[]])
    store.fillWith('background')
    expect(store.getState()).toMatchObject({ tool: 'fill', activeFabric: 'background', handOrderDraft: null })
  })

  it('steps through the plan from the first step, never before it', () => {
    const store = createBoardStore(emptyQuarterRing())
    store.previousStep()
    expect(store.getState().step).toBe(0)
    store.showStep(null)
    store.nextStep()
    store.nextStep()
    expect(store.getState().step).toBe(1)
    store.previousStep()
    store.previousStep()
    expect(store.getState().step).toBe(0)
  })

  it('pans, zooms about a point and fits the ring, none of it undoable', () => {
    const store = createBoardStore(emptyQuarterRing())
    store.fit(800, 600)
    // 600 px × 0.92 border / 18 in across = 30.67 px per in, centred in the box
    expect(store.getState().view).toMatchObject({ zoom: (600 * 0.92) / 18, centre: [400, 300] })
    store.panBy(10, -20)
    expect(store.getState().view.centre).toEqual([410, 280])
    store.zoomAt([410, 280], 2)
    expect(store.getState().view.centre).toEqual([410, 280]) // the point under the cursor stays
    expect(store.getState().history.past).toHaveLength(0)
  })
})

describe('section outlines', () => {
  it('draws one outline per section: an X crossing makes two papers, each half of the repeat', async () => {
    const { sectionOutlines } = await import('./board-plan')
    // A square-ish repeat is not needed: two seams crossing as an X inside a quarter ring.
    const store = createBoardStore(
      emptyQuarterRing({
        seams: [
          { id: 'a', from: [6, 0], to: [0, 6] },
          { id: 'b', from: [0, 0], to: [6.363961, 6.363961] },
        ],
      }),
    )
    const result = boardPlan(design(store.getState()))
    expect(result.plan!.sections).toHaveLength(2)
    const outlines = sectionOutlines(result)
    expect(outlines.map((outline) => outline.rings.length)).toEqual([1, 1])
    // The two outlines together cover the repeat: a quarter of a 9 in disc, π · 81 / 4 ≈ 63.6 sq in.
    const area = (ring: readonly (readonly [number, number])[]) =>
      Math.abs(ring.reduce((sum, p, i) => { const q = ring[(i + 1) % ring.length]!; return sum + p[0] * q[1] - q[0] * p[1] }, 0)) / 2
    const total = outlines.reduce((sum, outline) => sum + area(outline.rings[0]!), 0)
    expect(total).toBeCloseTo((Math.PI * 81) / 4, 0)
  })
})
