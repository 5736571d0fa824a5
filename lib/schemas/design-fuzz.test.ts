/**
 * The design parser against bad input (issue 17, item 3): whatever JSON comes, `parseDesign`
 * answers with issues naming field paths and never throws; and a design with more seams than
 * MAX_SEAMS (lib/limits.ts) is refused by the schema before any geometry runs.
 */
import fc from 'fast-check'
import { beforeEach, describe, expect, it, vi } from 'vitest'
import { buildArrangement } from '@/geometry/arrangement'
import { planDesign } from '@/geometry/plan'
import { MAX_DESIGN_BYTES, MAX_SEAMS } from '@/lib/limits'
import { hollyberryWreath } from '@/scripts/demo-wreath'
import { badBodies, nestedArrays, pathsOf, withValueAt } from '@/tests/support/fuzz'
import { parseDesign } from './design'

// The geometry's entry points, watched: a refused design must not reach them.
vi.mock('@/geometry/plan', async (importOriginal) => {
  const original = await importOriginal<typeof import('@/geometry/plan')>()
  return { ...original, planDesign: vi.fn(original.planDesign) }
})
vi.mock('@/geometry/arrangement', async (importOriginal) => {
  const original = await importOriginal<typeof import('@/geometry/arrangement')>()
  return { ...original, buildArrangement: vi.fn(original.buildArrangement) }
})

beforeEach(() => vi.clearAllMocks())

/** What every refusal must look like: issues, each a dotted path (or `(root)`) and a message. */
function expectNamedIssues(json: unknown) {
  const result = parseDesign(json)
  if (result.ok) return
  expect(result.issues.length).toBeGreaterThan(0)
  for (const issue of result.issues) {
    expect(issue.path).toMatch(/^(\(root\)|[^.]+(\.[^.]+)*)$/)
    expect(typeof issue.message).toBe('string')
    expect(issue.message.length).toBeGreaterThan(0)
  }
}

describe('parseDesign with arbitrary input', () => {
  it('answers any JSON value with named issues and never throws', () => {
    fc.assert(fc.property(fc.jsonValue({ maxDepth: 5 }), (json) => expectNamedIssues(json)), { numRuns: 300 })
  })

  it('answers any JavaScript value (undefined, NaN, -0, null prototypes) with named issues and never throws', () => {
    fc.assert(fc.property(fc.anything({ maxDepth: 4, withNullPrototype: true, withBoxedValues: true, withSparseArray: true }), (value) => expectNamedIssues(value)), { numRuns: 300 })
  })

  it('answers the demo wreath with one field made wrong (any value, huge strings, deep nesting) with named issues', () => {
    fc.assert(
      fc.property(badBodies(hollyberryWreath, { limit: MAX_DESIGN_BYTES / 8 }), (text) => {
        let json: unknown
        try {
          json = JSON.parse(text)
        } catch {
          return // Not JSON: the route refuses it (400) before the parser sees it.
        }
        expectNamedIssues(json)
      }),
      { numRuns: 100 },
    )
  })

  it('names the field made wrong: a seam end given a string is refused at that path', () => {
    fc.assert(
      fc.property(fc.constantFrom(...pathsOf(hollyberryWreath).filter((path) => path[0] === 'seams' && path.length === 4)), fc.string(), (path, value) => {
        const result = parseDesign(withValueAt(hollyberryWreath, path, value))
        expect(result.ok).toBe(false)
        if (!result.ok) expect(result.issues.map((issue) => issue.path)).toContain(path.join('.'))
      }),
      { numRuns: 50 },
    )
  })

  it('refuses a join tree nested 100,000 deep without overflowing the stack', () => {
    const design = JSON.parse(JSON.stringify({ ...hollyberryWreath, order: { sections: [{ label: 'A', areas: [[1, 1]] }], assembly: 'DEEP' } }).replace('"DEEP"', nestedArrays(100_000)))
    const result = parseDesign(design)
    expect(result.ok).toBe(false)
    if (!result.ok) expect(result.issues.map((issue) => issue.path)).toContain('order.assembly')
  })
})

describe('the seam limit (lib/limits.ts MAX_SEAMS)', () => {
  const seams = (count: number) => Array.from({ length: count }, (_, i) => ({ id: `s${i}`, from: [1 + (i % 7), 0], to: [0, 2 + (i % 5)] }))

  it('refuses a design with one seam over the limit at parse time, naming `seams` and the limit, and no geometry runs', () => {
    const result = parseDesign({ ...hollyberryWreath, leaves: [], seams: seams(MAX_SEAMS + 1) })
    expect(result.ok).toBe(false)
    if (!result.ok) expect(result.issues).toEqual([{ path: 'seams', message: `at most ${MAX_SEAMS} seams` }])
    expect(planDesign).not.toHaveBeenCalled()
    expect(buildArrangement).not.toHaveBeenCalled()
  })

  it('refuses any count over the limit the same way, however the seams look', () => {
    fc.assert(
      fc.property(fc.integer({ min: MAX_SEAMS + 1, max: 20 * MAX_SEAMS }), (count) => {
        const result = parseDesign({ ...hollyberryWreath, leaves: [], seams: seams(count) })
        expect(!result.ok && result.issues.some((issue) => issue.path === 'seams' && issue.message === `at most ${MAX_SEAMS} seams`)).toBe(true)
      }),
      { numRuns: 20 },
    )
    expect(planDesign).not.toHaveBeenCalled()
    expect(buildArrangement).not.toHaveBeenCalled()
  })

  it('accepts exactly the limit (the parser alone runs no geometry either)', () => {
    const result = parseDesign({ ...hollyberryWreath, leaves: [], seams: seams(MAX_SEAMS) })
    expect(result.ok).toBe(true)
    expect(planDesign).not.toHaveBeenCalled()
  })
})
