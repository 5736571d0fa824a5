import { describe, expect, it } from 'vitest'
import { estimatedAreaCount } from './area-count'
import { gridDesign, seededRandom } from './fixtures/generators'
import { planDesign } from './plan'
import { MAX_PLAN_AREAS } from './tolerances'
import type { Design, Seam } from './types'

/** The most seams a design file may hold (lib/limits.ts MAX_SEAMS; the core does not import lib/). */
const SEAMS_AT_THE_LIMIT = 400
const wedge = gridDesign(1, 1, 12)

/** `count` chords from the x axis to the y axis of a 12 in quarter wedge, at random: they cross. */
function crossingSeams(count: number, seed: number): Design {
  const random = seededRandom(seed)
  const seams: Seam[] = Array.from({ length: count }, (_, i) => ({ id: `s${i}`, from: [0.2 + random() * 11.5, 0], to: [0, 0.2 + random() * 11.5] }))
  return { ...wedge, seams }
}

describe('a design at the limits', () => {
  it('counts areas from crossings: one, plus one per seam, plus one per crossing', () => {
    // Two crossing chords of a disc make four areas (Euler's formula, derivable: 1 + 2 + 1).
    expect(estimatedAreaCount([{ id: 'a', from: [0, 1], to: [2, 1] }, { id: 'b', from: [1, 0], to: [1, 2] }], 100)).toBe(4)
    // A grid of m × n cells: (m − 1) + (n − 1) seams crossing (m − 1)(n − 1) times, m·n areas.
    expect(estimatedAreaCount(gridDesign(5, 8).seams, 1000)).toBe(40)
  })

  it('ends at once with search-gave-up for 400 crossing seams (about 40,000 areas), not after minutes', () => {
    const started = performance.now()
    const plan = planDesign(crossingSeams(SEAMS_AT_THE_LIMIT, 11))
    const elapsed = performance.now() - started
    expect(plan.sewable).toBe(false)
    expect(plan.areas).toEqual([])
    expect(plan.problems[0]).toMatchObject({ code: 'search-gave-up', severity: 'error' })
    expect(plan.problems[0]?.message).toContain(`at most ${MAX_PLAN_AREAS}`)
    // Not a speed test: a hang would be minutes (it was before the limit); this bounds the order of magnitude.
    expect(elapsed).toBeLessThan(2000)
  })

  it('plans 400 chords, one section of 401 areas, without a stack overflow', () => {
    const seams: Seam[] = Array.from({ length: SEAMS_AT_THE_LIMIT }, (_, i) => {
      const r = (11.9 * (i + 1)) / (SEAMS_AT_THE_LIMIT + 1)
      return { id: `c${i}`, from: [r, 0], to: [0, r] }
    })
    const plan = planDesign({ ...wedge, seams })
    expect([plan.sewable, plan.areas.length, plan.sections.length]).toEqual([true, 401, 1])
  })

  it('plans a grid of 399 seams (2 × 399 cells): exactly min(m, n) = 2 sections (geometry.md)', { timeout: 60_000 }, () => {
    const plan = planDesign(gridDesign(2, 399, 12))
    expect([plan.sewable, plan.areas.length, plan.sections.length]).toEqual([true, 798, 2])
  })

  it('ends a search over many crossing areas within its limits, with an answer', { timeout: 60_000 }, () => {
    // 60 crossing seams make 942 areas, under MAX_PLAN_AREAS: the search stops at MAX_SECTION_WORK.
    const plan = planDesign(crossingSeams(60, 11))
    expect(plan.areas.length).toBeLessThanOrEqual(MAX_PLAN_AREAS)
    expect(plan.problems.some((problem) => problem.code === 'search-gave-up' || problem.code === 'search-limit') || plan.sewable).toBe(true)
  })
})
