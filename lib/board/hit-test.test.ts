import { describe, expect, it } from 'vitest'
import { emptyDesign } from '@/lib/new-design'
import { normalizeDesign } from './commands'
import { hitTest } from './hit-test'

const design = normalizeDesign({
  ...emptyDesign('Hits'),
  seams: [{ id: 's1', from: [7, 0], to: [0, 7] }],
  leaves: [{ id: 'l1', seam: 's1', at: 0.5, side: 'left', angle: 0, length: 1.5, width: 0.75, layers: ['leaf'] }],
  berries: [{ at: [6, 4], finishedDiameter: 0.5, fabric: 'berry' }],
})

describe('hitTest', () => {
  it('finds a seam end before the seam itself', () => {
    expect(hitTest(design, [6.95, 0.05], 0.2)).toEqual({ kind: 'seam-end', seamId: 's1', end: 'from' })
  })

  it('finds the leaf lying over the seam', () => {
    // The leaf's open end sits at the seam's middle (3.5, 3.5) and points towards the centre (its left side).
    expect(hitTest(design, [3.1, 3.1], 0.1)).toEqual({ kind: 'leaf', leafId: 'l1' })
  })

  it('passes over a leaf too wide for its length instead of throwing (the plan reports it)', () => {
    // 0.5 in long, 3 in wide: no pointed leaf (length must exceed half the width); the seam is hit
    const stubby = normalizeDesign({ ...design, leaves: [{ ...design.leaves[0]!, length: 0.5, width: 3 }] })
    expect(hitTest(stubby, [3.5, 3.5], 0.1)).toMatchObject({ kind: 'seam', seamId: 's1' })
  })

  it('finds a seam with the fraction along it and the side of the pointer', () => {
    // Along (7,0)→(0,7): ((5.3 − 7)·(−7) + 1.9·7) / 98 = 25.2 / 98 = 0.257 of the way.
    const hit = hitTest(design, [5.3, 1.9], 0.2)
    expect(hit).toMatchObject({ kind: 'seam', seamId: 's1', side: 'right' })
    expect(hit && 'fraction' in hit ? hit.fraction : 0).toBeCloseTo(0.257, 2)
  })

  it('finds a berry by its circle', () => {
    expect(hitTest(design, [6.1, 4.1], 0.05)).toEqual({ kind: 'berry', index: 0 })
  })

  it('finds nothing in open space', () => {
    expect(hitTest(design, [1, 1], 0.1)).toBeNull()
  })
})
