import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { buildArrangement } from './arrangement'
import { areaSetOf } from './area-set'
import { buildTopology } from './area-topology'
import { design, gridDesign, peelDesign } from './fixtures/generators'
import { independentOrderProblem } from './fixtures/independent-checker'
import { planDesign } from './plan'
import { checkSectionOrder, createPeelSearch, findSectionOrder } from './sewing-order'
import type { Point } from './types'

const arc = (x: number): number => Math.sqrt(81 - x * x)

/** Three strips of a quarter wedge, bottom to top, split by y = 2 and y = 4. */
function strips() {
  const arrangement = buildArrangement(design().ring, [
    { id: 'low', from: [0, 2], to: [arc(2), 2] },
    { id: 'high', from: [0, 4], to: [arc(4), 4] },
  ])
  const topology = buildTopology(arrangement)
  const at = (y: number): number => arrangement.areas.findIndex((area) => area.point[1] > y - 1 && area.point[1] < y + 1)
  return { arrangement, topology, bottom: at(1), middle: at(3), top: at(6) }
}

describe('checkSectionOrder', () => {
  it('accepts strips sewn bottom to top and gives each step its sewing line', () => {
    // published criterion: Leake et al., ACM TOG 40(4) 2021 (each strip meets the sewn ones along one line)
    const { topology, bottom, middle, top } = strips()
    const { steps, failures } = checkSectionOrder(topology, [bottom, middle, top], [], 'A')
    expect(failures).toEqual([])
    expect(steps[0]?.sewnAlong).toBeNull()
    // the middle strip is sewn along y = 2 from the y axis to the arc (arithmetic)
    const along = steps[1]?.sewnAlong as readonly [Point, Point]
    expect(along.map((p) => p[1])).toEqual([2, 2])
  })

  it('names a step that meets the sewn areas along nothing', () => {
    const { topology, bottom, middle, top } = strips()
    const { failures } = checkSectionOrder(topology, [bottom, top, middle], [], 'A')
    // the top strip touches nothing sewn; then the middle one meets both, along two lines
    expect(failures.map((f) => f.message)).toEqual(['A2 does not meet the sewn areas along a seam.', 'A3 meets the sewn areas along two lines.'])
  })

  it('names a step that meets the sewn areas along two lines', () => {
    // X crossing: sewing the four quarters round in a circle, the third touches the first only
    // at the crossing point (ignored), the fourth meets two lines
    const arrangement = buildArrangement(design().ring, [
      { id: 'a', from: [3, 0], to: [3, arc(3)] },
      { id: 'b', from: [0, 3], to: [arc(3), 3] },
    ])
    const topology = buildTopology(arrangement)
    const quadrant = (x: number, y: number): number => arrangement.areas.findIndex((area) => (area.point[0] > 3) === x > 3 && (area.point[1] > 3) === y > 3)
    const order = [quadrant(1, 1), quadrant(5, 1), quadrant(5, 5), quadrant(1, 5)]
    const { failures } = checkSectionOrder(topology, order, [], 'B')
    expect(failures.map((f) => f.message)).toEqual(['B4 meets the sewn areas along two lines.'])
  })

  it('names a leaf basted too late', () => {
    const { topology, bottom, middle } = strips()
    const constraints = [{ leafId: 'l2', over: middle, under: bottom, at: [1, 2] as Point }]
    const { failures } = checkSectionOrder(topology, [bottom, middle], constraints, 'A')
    expect(failures.map((f) => f.message)).// The plan replaces the mention by the leaf's plain name (leaf-names.ts).
    toEqual(['{leaf:l2} must be basted on A2 before A1 is sewn, but A2 comes later.'])
  })
})

describe('findSectionOrder', () => {
  it('finds no one-section order for a 2 × 2 grid', () => {
    // published: Leake et al. 2021; the last of four cells round a crossing meets two lines
    const grid = gridDesign(2, 2)
    const topology = buildTopology(buildArrangement(grid.ring, grid.seams))
    expect(findSectionOrder(createPeelSearch(topology, []), areaSetOf(4, [0, 1, 2, 3]))).toBeNull()
  })

  it('proposes orders that pass an independent checker on cut-off designs', () => {
    // published criterion: Leake et al., ACM TOG 40(4) 2021; the checker shares no code with the core
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 2, max: 20 }), (seed, count) => {
        const plan = planDesign(peelDesign(count, seed).design)
        expect(plan.sections).toHaveLength(1)
        expect(plan.sewable).toBe(true)
        const byId = new Map(plan.areas.map((area) => [area.id, area.polygon]))
        expect(independentOrderProblem((plan.sections[0]?.order ?? []).map((id) => byId.get(id)!))).toBeNull()
      }),
      { numRuns: 60 },
    )
  })

  it('does not multiply independent ears into every order of them (30 caps along the arc)', () => {
    // an X crossing near the centre and 30 caps cut off the arc, each touching only the area
    // inside it: 2 sections (the X, geometry.md); the caps peel in any order, so trying every
    // order (2^30 sets) must not happen
    const radius = 30
    const arc30 = (x: number): number => Math.sqrt(radius * radius - x * x)
    const polar = (degrees: number): Point => [radius * Math.cos((degrees * Math.PI) / 180), radius * Math.sin((degrees * Math.PI) / 180)]
    const seams = [
      { id: 'v', from: [3, 0] as Point, to: [3, arc30(3)] as Point },
      { id: 'h', from: [0, 3] as Point, to: [arc30(3), 3] as Point },
      ...Array.from({ length: 30 }, (_, i) => ({ id: `c${i}`, from: polar(12 + 2.2 * i), to: polar(12 + 2.2 * (i + 1)) })),
    ]
    const plan = planDesign(design({ ring: { innerRadius: 0, outerRadius: radius, repeats: 4, repeatMode: 'rotate' }, seams }))
    expect(plan.sewable).toBe(true)
    expect(plan.sections).toHaveLength(2)
    expect(plan.problems.filter((p) => p.code.startsWith('search'))).toEqual([])
  })

  it('honours a leaf by sewing the area it lies over first', () => {
    const { topology, bottom, middle, top } = strips()
    // a leaf over the top strip caught in the top/middle seam: top before middle
    const order = findSectionOrder(createPeelSearch(topology, [{ leafId: 'l1', over: top, under: middle, at: [1, 4] }]), areaSetOf(3, [0, 1, 2]))
    expect(order).toEqual([top, middle, bottom])
  })
})
