import polygonClipping from 'polygon-clipping'
import { describe, expect, it } from 'vitest'
import { planDesign } from './plan'
import { polygonArea } from './offset'
import { sectionOutline, weldTJunctions } from './section-outline'
import type { Design } from './types'

describe('section outlines', () => {
  it('welds a corner lying a rounding error off a neighbour edge into that edge', () => {
    const [square] = weldTJunctions([[[0, 0], [2, 0], [2, 1], [0, 1]], [[1, 1.0000004], [2, 1], [2, 2]]])
    expect(square).toEqual([[0, 0], [2, 0], [2, 1], [1, 1.0000004], [0, 1]])
  })

  it('outlines the whole section where a seam ends on another seam (checked with polygon-clipping)', () => {
    // Sixths with a hole, two chords and a radial seam ending on the outer chord's middle.
    const cos = (d: number) => Math.cos((d * Math.PI) / 180)
    const sin = (d: number) => Math.sin((d * Math.PI) / 180)
    const design: Design = {
      name: 'T-junction',
      ring: { innerRadius: 3, outerRadius: 10, repeats: 6, repeatMode: 'rotate' },
      seams: [
        { id: 'a', from: [6, 0], to: [6 * cos(60), 6 * sin(60)] },
        { id: 'b', from: [8.5, 0], to: [8.5 * cos(60), 8.5 * sin(60)] },
        { id: 'c', from: [8.5 * cos(30) * cos(30), 8.5 * cos(30) * sin(30)], to: [10 * cos(30), 10 * sin(30)] },
      ],
      fills: [], leaves: [], stems: [], berries: [], curls: [], colorways: [], order: null,
    }
    const plan = planDesign(design)
    const [first, ...rest] = plan.areas.map((area): polygonClipping.Polygon => [area.polygon.map((p) => [p[0], p[1]] as [number, number])])
    const union = polygonClipping.union(first!, ...rest)
    const outline = sectionOutline(plan.areas.map((area) => area.polygon))
    // The outline holds the whole repeat, not just its largest piece: the areas' union (polygon-clipping 0.15.7).
    const unionArea = union.reduce((sum, piece) => sum + polygonArea(piece[0]!.map((p) => [p[0], p[1]] as const)), 0)
    expect(polygonArea(outline)).toBeCloseTo(unionArea, 4)
    expect(plan.sections).toHaveLength(1)
  })
})
