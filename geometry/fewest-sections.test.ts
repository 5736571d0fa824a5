import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { buildArrangement } from './arrangement'
import { buildTopology } from './area-topology'
import { fewestSections } from './fewest-sections'
import { design, gridDesign, peelDesign, yJunctionDesign } from './fixtures/generators'
import { planDesign } from './plan'

const arc = (x: number): number => Math.sqrt(81 - x * x)

function sectionCount(seams: Parameters<typeof buildArrangement>[1]): number {
  const arrangement = buildArrangement(design().ring, seams)
  return fewestSections(buildTopology(arrangement), []).sectionCount
}

describe('fewestSections', () => {
  it('needs two sections for a straight X crossing', () => {
    // geometry.md consequence; published: Leake et al., ACM TOG 40(4) 2021 (an X is not
    // pieceable on one foundation, each half is)
    const seams = [
      { id: 'a', from: [3, 0], to: [3, arc(3)] },
      { id: 'b', from: [0, 3], to: [arc(3), 3] },
    ] as const
    expect(sectionCount([...seams])).toBe(2)
  })

  it('needs min(m, n) sections for a grid of m × n cells, and finds that number', () => {
    // geometry.md: a grid cut by full straight seams needs exactly min(m, n) sections
    // (derivable: every section of a full grid is a strip, one row or one column).
    for (const [m, n] of [[1, 5], [2, 2], [2, 5], [3, 3], [4, 3], [3, 6], [5, 4]] as const) {
      const grid = gridDesign(m, n)
      expect(sectionCount(grid.seams), `${m} × ${n}`).toBe(Math.min(m, n))
    }
  })

  it('keeps a straight seam with two rays rising from one point on it as one section', () => {
    // the rays' point lies on a seam that runs straight through it: no set-in seam (geometry.md)
    const seams = [
      { id: 'a', from: [0, 2], to: [arc(2), 2] },
      { id: 'r1', from: [4, 2], to: [2, arc(2)] },
      { id: 'r2', from: [4, 2], to: [6, arc(6)] },
    ] as const
    expect(sectionCount(seams.map((s) => ({ ...s, from: [...s.from] as const, to: [...s.to] as const })))).toBe(1)
  })

  it('finds no plan for a pinwheel although no Y junction is present, and says why at its centre', () => {
    // four seams around the square [3, 5] × [3, 5], each ending on the next (geometry.md)
    const plan = planDesign(
      design({
        seams: [
          { id: 'A', from: [3, 3], to: [Math.sqrt(72), 3] },
          { id: 'B', from: [5, 3], to: [5, Math.sqrt(56)] },
          { id: 'C', from: [5, 5], to: [0, 5] },
          { id: 'D', from: [3, 5], to: [3, 0] },
        ],
      }),
    )
    expect(plan.sewable).toBe(false)
    expect(plan.sections).toEqual([])
    expect(plan.problems.map((p) => p.code)).toEqual(['seam-cycle'])
    expect(plan.problems.some((p) => p.code === 'set-in-seam')).toBe(false)
    // the centre of the square: ((3 + 5) / 2, (3 + 5) / 2) = (4, 4) (arithmetic)
    expect(plan.problems[0]?.at).toEqual([4, 4])
    expect(plan.problems[0]?.message).toMatch(/pinwheel/)
  })

  it('always finds one section for designs cut off one area at a time', () => {
    // geometry.md consequence of the published criterion (Leake et al. 2021)
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 2, max: 25 }), (seed, count) => {
        const { design: peel } = peelDesign(count, seed)
        const result = fewestSections(buildTopology(buildArrangement(peel.ring, peel.seams)), [])
        expect(result.sectionCount).toBe(1)
      }),
      { numRuns: 60 },
    )
  })

  it('never finds a plan for a design with a Y junction, in any number of sections', () => {
    // geometry.md: a set-in (Y) seam cannot be pieced at all; the search must agree with the
    // shape test, so it runs here without it
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 1, max: 8 }), (seed, count) => {
        const y = yJunctionDesign(count, seed)
        const result = fewestSections(buildTopology(buildArrangement(y.ring, y.seams)), [])
        expect(result.tree).toBeNull()
        const plan = planDesign(y)
        expect(plan.sewable).toBe(false)
        expect(plan.problems.some((p) => p.code === 'set-in-seam')).toBe(true)
      }),
      { numRuns: 40 },
    )
  })
})
