/**
 * Labels belong to the design, not to its size, its units or the order its seams are listed in:
 * the same areas get the same labels at any scale, in inches or centimetres, whatever the list.
 */
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { parseDesign } from '../lib/schemas/design'
import { DEMO_PATTERNS } from '../scripts/demo-data'
import { buildArrangement } from './arrangement'
import { gridDesign, peelDesign, xInLastRegionDesign } from './fixtures/generators'
import { planDesign, type Plan } from './plan'
import { isPointInPolygon } from './polygon-measure'
import { scaleDesign } from './symmetry'
import type { Design, Point } from './types'

const anyDesign = fc.oneof(
  fc.record({ seed: fc.integer({ min: 1, max: 1_000_000 }), count: fc.integer({ min: 2, max: 16 }) }).map(({ seed, count }) => peelDesign(count, seed).design),
  fc.record({ m: fc.integer({ min: 1, max: 5 }), n: fc.integer({ min: 1, max: 5 }) }).map(({ m, n }) => gridDesign(m, n)),
  fc.record({ seed: fc.integer({ min: 1, max: 1_000_000 }), count: fc.integer({ min: 2, max: 12 }) }).map(({ seed, count }) => xInLastRegionDesign(count, seed)),
)

/**
 * The design with its seam ends where snapping puts them. The generators put ends on the chords
 * of the outline, up to 0.005 in inside the arc; scaled by 4 that is 0.02 in, past the 0.01 in snap
 * distance, and the design would change with its size. Snapped once, every end lies on the outline
 * or a seam exactly, and so it does at every size.
 */
function snapped(d: Design): Design {
  return { ...d, seams: buildArrangement(d.ring, d.seams).seams }
}

/** 1 in = 2.54 cm exactly (standard: international yard and pound agreement, 1959). */
const CENTIMETRES_PER_INCH = 2.54

/**
 * The design as a file in the given units, every length times `factor` (in file units), its seam
 * list rotated by `rotation` places, read back through the one parser the app uses.
 */
function transformed(d: Design, factor: number, units: 'in' | 'cm', rotation: number): Design {
  const k = factor * (units === 'cm' ? CENTIMETRES_PER_INCH : 1)
  const at = (p: Point): [number, number] => [p[0] * k, p[1] * k]
  const count = d.seams.length
  const seams = d.seams.map((_, i) => d.seams[(i + rotation) % count]!)
  const parsed = parseDesign({
    format: 'wreathwright-design',
    version: 1,
    name: d.name,
    units,
    ring: { ...d.ring, innerRadius: d.ring.innerRadius * k, outerRadius: d.ring.outerRadius * k },
    seams: seams.map((s) => ({ id: s.id, from: at(s.from), to: at(s.to) })),
    order: null,
  })
  if (!parsed.ok) throw new Error(parsed.issues.map((issue) => `${issue.path}: ${issue.message}`).join('; '))
  return parsed.design
}

/** Each area's label in `plan`, next to the label of the area of `other` holding its point scaled by `factor`. */
function pairedLabels(plan: Plan, other: Plan, factor: number): [string | null, string | null][] {
  return plan.areas.map((area) => {
    const point: Point = [area.point[0] * factor, area.point[1] * factor]
    const found = other.areas.find((candidate) => isPointInPolygon(point, candidate.polygon))
    return [area.label, found ? found.label : 'no area there']
  })
}

describe('labels do not depend on size, units or the order of the seam list', () => {
  it('gives corresponding areas the same labels at any scale, in inches or centimetres, for any rotation of the list', () => {
    fc.assert(
      fc.property(
        anyDesign.map(snapped),
        fc.double({ min: 0.5, max: 4, noNaN: true }),
        fc.constantFrom('in' as const, 'cm' as const),
        fc.nat({ max: 30 }),
        (d, factor, units, rotation) => {
          const plan = planDesign(d)
          fc.pre(plan.sewable)
          const other = planDesign(transformed(d, factor, units, rotation))
          expect(other.sewable).toBe(true)
          for (const [label, found] of pairedLabels(plan, other, factor)) expect(found).toBe(label)
        },
      ),
      { numRuns: 150 },
    )
  }, 60_000)

  it('numbers the demo wreath the same at 18 in and at 36 in', () => {
    // The demo wreath once numbered A1 and A2 the other way round at 36 in: its ids, from
    // centroids in thousandths of an inch, were sorted as strings ('area-6592…' < 'area-7000…'
    // at one size, not at the other).
    const parsed = parseDesign(DEMO_PATTERNS[0]!.design)
    if (!parsed.ok) throw new Error('the demo wreath does not parse')
    const at18 = planDesign(scaleDesign(parsed.design, 18))
    expect(at18.sewable).toBe(true)
    for (const diameter of [36, 20, 27, 9, 45.72]) {
      const factor = diameter / 18
      const scaled = planDesign(scaleDesign(parsed.design, diameter))
      for (const [label, found] of pairedLabels(at18, scaled, factor)) expect(found).toBe(label)
      // and each label stands at the same place, scaled (candidates equally clear on paper tie)
      for (const area of at18.areas) {
        const twin = scaled.areas.find((candidate) => candidate.label === area.label)!
        expect(Math.hypot(twin.point[0] / factor - area.point[0], twin.point[1] / factor - area.point[1])).toBeLessThan(0.01)
      }
    }
  })
})
