import { describe, expect, it } from 'vitest'
import { leafLayers } from '@/geometry/leaf-template'
import { emptyDesign } from '@/lib/new-design'
import { designFileSchema, parseDesign, type DesignFile } from '@/lib/schemas/design'
import { design as designOf, createBoardStore } from './store'

/** A quarter ring with one seam and a leaf of two stacked layers, as a file written before offsets. */
function stackedLeafFile(): DesignFile {
  return {
    ...emptyDesign('Stack'),
    ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' },
    seams: [{ id: 's1', from: [4, 0], to: [0, 4] }],
    leaves: [{ id: 'l1', seam: 's1', at: 0.5, side: 'left', angle: 0, length: 1.5, width: 0.75, layers: ['dark', 'light'] }],
  }
}

const leafOf = (store: ReturnType<typeof createBoardStore>) => designOf(store.getState()).leaves[0]!

describe('layer offsets on the board', () => {
  it('turns and sizes one layer, as one undoable step, keeping the file valid', () => {
    const store = createBoardStore(stackedLeafFile())
    store.run('setLeafLayerOffset', { leafId: 'l1', index: 1, turn: -20, scale: 0.75 })
    expect(leafOf(store).layerOffsets).toEqual([{}, { turn: -20, scale: 0.75 }])
    expect(designFileSchema.safeParse(designOf(store.getState())).success).toBe(true)
    const parsed = parseDesign(designOf(store.getState()))
    if (!parsed.ok) throw new Error('the board keeps a valid design')
    // Top layer: 1 1/2 in × 0.75 = 1 1/8 in long, turned 20° clockwise; the bottom stays as drawn.
    expect(leafLayers(parsed.design.leaves[0]!).map((layer) => [layer.angle, layer.length])).toEqual([[0, 1.5], [-20, 1.125]])
    store.undo()
    expect(leafOf(store)).toEqual(stackedLeafFile().leaves![0])
  })

  it('writes no offsets once every layer is back on the default fan, so older readers read the file', () => {
    const store = createBoardStore(stackedLeafFile())
    store.run('setLeafLayerOffset', { leafId: 'l1', index: 1, turn: 5 })
    store.run('setLeafLayerOffset', { leafId: 'l1', index: 1, turn: null })
    expect('layerOffsets' in leafOf(store)).toBe(false)
  })

  it('keeps the file\'s range: a turn within ±45°, a scale from 1/4 to 1 1/2', () => {
    const store = createBoardStore(stackedLeafFile())
    store.run('setLeafLayerOffset', { leafId: 'l1', index: 0, turn: 90, scale: 3 })
    expect(leafOf(store).layerOffsets?.[0]).toEqual({ turn: 45, scale: 1.5 })
  })

  it('adds, recolours and removes layers with their offsets kept one per layer', () => {
    const store = createBoardStore(stackedLeafFile())
    store.run('setLeafLayerOffset', { leafId: 'l1', index: 1, scale: 0.7 })
    store.run('addLeafLayer', { leafId: 'l1', fabric: 'gold' })
    expect(leafOf(store).layers).toEqual(['dark', 'light', 'gold'])
    expect(leafOf(store).layerOffsets).toEqual([{}, { scale: 0.7 }, {}])
    store.run('setLeafLayerFabric', { leafId: 'l1', index: 2, fabric: 'rust' })
    store.run('removeLeafLayer', { leafId: 'l1', index: 0 })
    expect(leafOf(store).layers).toEqual(['light', 'rust'])
    expect(leafOf(store).layerOffsets).toEqual([{ scale: 0.7 }, {}])
    store.run('removeLeafLayer', { leafId: 'l1', index: 0 })
    store.run('removeLeafLayer', { leafId: 'l1', index: 0 })
    // The last layer stays.
    expect(leafOf(store).layers).toEqual(['rust'])
    expect('layerOffsets' in leafOf(store)).toBe(false)
  })
})

describe('spreading the leaf colours', () => {
  /** Four leaves on one seam of a quarter ring, all dark but the first, one with turned layers. */
  function fourLeaves(): DesignFile {
    const base = stackedLeafFile()
    const leaf = base.leaves![0]!
    return {
      ...base,
      leaves: [0.2, 0.4, 0.6, 0.8].map((at, index) => ({
        ...leaf,
        id: `l${index + 1}`,
        at,
        layers: index === 0 ? ['light', 'dark'] : ['dark', 'dark'],
        ...(index === 2 ? { layerOffsets: [{}, { turn: 12 }] } : {}),
      })),
    }
  }
  const layersOf = (store: ReturnType<typeof createBoardStore>) => designOf(store.getState()).leaves.map((leaf) => leaf.layers.join('+'))

  it('deals the fabrics out as one undo step, keeping offsets, and undo puts every leaf back', () => {
    const store = createBoardStore(fourLeaves())
    store.run('spreadLeafColours', {})
    // The seam runs from (4, 0) to (0, 4): l1 … l4 lie counter-clockwise. Fabrics in first use:
    // light, dark. Bottoms alternate light dark light dark (4 is even); tops turn by one.
    expect(layersOf(store)).toEqual(['light+dark', 'dark+light', 'light+dark', 'dark+light'])
    expect(designOf(store.getState()).leaves[2]!.layerOffsets).toEqual([{}, { turn: 12 }])
    expect(store.getState().history.past).toHaveLength(1)
    expect(designFileSchema.safeParse(designOf(store.getState())).success).toBe(true)
    store.undo()
    expect(designOf(store.getState()).leaves).toEqual(fourLeaves().leaves)
  })

  it('records nothing when the leaves are already spread, and the designer can still change one leaf', () => {
    const store = createBoardStore(fourLeaves())
    store.run('spreadLeafColours', {})
    store.run('spreadLeafColours', {})
    expect(store.getState().history.past).toHaveLength(1)
    store.run('setLeafLayerFabric', { leafId: 'l2', index: 0, fabric: 'light' })
    expect(layersOf(store)[1]).toBe('light+light')
  })
})
