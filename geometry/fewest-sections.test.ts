import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { buildArrangement } from './arrangement'
import { buildTopology } from './area-topology'
import { fewestSections } from './fewest-sections'
import { design, gridDesign, peelDesign, xInLastRegionDesign, yJunctionDesign } from './fixtures/generators'
import { independentJoinProblem, independentOrderProblem } from './fixtures/independent-checker'
import { planDesign } from './plan'
import type { Polygon } from './types'

const arc = (x: number): number => Math.sqrt(81 - x * x)

function sectionCount(seams: Parameters<typeof buildArrangement>[1]): number {
  const arrangement = buildArrangement(design().ring, seams)
  return fewestSections(buildTopology(arrangement), []).sectionCount
}

/** Exhaustive search, sharing no code with the core: every partition, every order, every join tree. */
function permutations<T>(items: readonly T[]): T[][] {
  if (items.length <= 1) return [[...items]]
  return items.flatMap((item, i) => permutations([...items.slice(0, i), ...items.slice(i + 1)]).map((rest) => [item, ...rest]))
}

function isOneSection(polygons: readonly Polygon[]): boolean {
  return permutations(polygons).some((order) => independentOrderProblem(order) === null)
}

function isJoinable(groups: readonly Polygon[][]): boolean {
  if (groups.length === 1) return true
  for (let mask = 1; mask < (1 << groups.length) - 1; mask += 2) {
    const first = groups.filter((_, i) => mask & (1 << i))
    const second = groups.filter((_, i) => !(mask & (1 << i)))
    if (independentJoinProblem(first.flat(), second.flat()) === null && isJoinable(first) && isJoinable(second)) return true
  }
  return false
}

function* partitions(items: readonly number[]): Generator<number[][]> {
  const [first, ...rest] = items
  if (first === undefined) {
    yield []
    return
  }
  for (const partition of partitions(rest)) {
    yield [[first], ...partition]
    for (let i = 0; i < partition.length; i += 1) yield [...partition.slice(0, i), [first, ...(partition[i] ?? [])], ...partition.slice(i + 1)]
  }
}

function bruteForceSections(polygons: readonly Polygon[]): number {
  let best = Infinity
  for (const partition of partitions(polygons.map((_, i) => i))) {
    if (partition.length >= best) continue
    const groups = partition.map((block) => block.map((i) => polygons[i] as Polygon))
    if (groups.every(isOneSection) && isJoinable(groups)) best = partition.length
  }
  return best
}

describe('fewestSections', () => {
  it('agrees with an exhaustive search over all partitions on small designs', () => {
    // the published criterion (Leake et al., ACM TOG 40(4) 2021) checked by brute force: every
    // partition of up to 7 areas, every order of each part, every binary join tree
    const designs = [gridDesign(2, 2), gridDesign(2, 3), gridDesign(3, 2), ...[1, 2, 3, 4, 5, 6].flatMap((seed) => [xInLastRegionDesign(2, seed), xInLastRegionDesign(3, seed)])]
    for (const d of designs) {
      const plan = planDesign(d)
      expect(plan.areas.length).toBeLessThanOrEqual(7)
      expect(plan.sections.length).toBe(bruteForceSections(plan.areas.map((area) => area.polygon)))
    }
  })

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
