import fc from 'fast-check'
import polygonClipping from 'polygon-clipping'
import { EndType, inflatePathsD, JoinType } from 'clipper2-ts'
import { describe, expect, it } from 'vitest'
import { ROUNDING_SLACK_INCHES } from './tolerances'
import { cuttingShape, isSimpleRing, polygonArea } from './offset'
import type { Point, Polygon } from './types'

/** Clipper2 rounds to a 1e-8 in grid at precision 8; areas then agree to well under 1e-6 in². */
const CLIPPER_AREA_AGREEMENT_SQ_IN = 1e-6
/** polygon-clipping's own rounding leaves slivers far below anything cut in fabric. */
const CONTAINMENT_SLACK_SQ_IN = 1e-9
/** Closed-form and computed areas differ only by floating-point noise on a few square inches. */
const FORMULA_AGREEMENT_SQ_IN = 1e-9
const CLIPPER_PRECISION_DIGITS = 8
/** Corners this close to the mitre limit could be mitred by one side and cut by the other. */
const MITRE_LIMIT_CLEARANCE = 1e-6

const square = (side: number): Polygon => [[0, 0], [side, 0], [side, side], [0, side]]

/** Largest extent of a polygon along a unit direction. */
const extent = (polygon: Polygon, direction: Point): number => {
  const projections = polygon.map(([x, y]) => x * direction[0] + y * direction[1])
  return Math.max(...projections) - Math.min(...projections)
}
/** Written out here rather than imported, so the handbook check does not lean on rough-cut.ts. */
const roundUpToEighth = (inches: number): number => Math.ceil((inches - ROUNDING_SLACK_INCHES) * 8) / 8

/** Area of Clipper2's mitred offset: outer rings only, as our cutting shapes fill holes. */
function clipperOffsetArea(area: Polygon, allowance: number, mitreLimit: number): number {
  const solution = inflatePathsD([area.map(([x, y]) => ({ x, y }))], allowance, JoinType.Miter, EndType.Polygon,
    mitreLimit, CLIPPER_PRECISION_DIGITS)
  return solution
    .map((path) => polygonArea(path.map(({ x, y }) => [x, y] as Point)))
    .filter((pathArea) => pathArea > 0)
    .reduce((sum, pathArea) => sum + pathArea, 0)
}

function multiPolygonArea(multi: polygonClipping.MultiPolygon): number {
  let total = 0
  for (const polygon of multi) {
    polygon.forEach((ring, index) => {
      const ringArea = Math.abs(polygonArea(ring.slice(0, -1) as Point[]))
      total += index === 0 ? ringArea : -ringArea
    })
  }
  return total
}
const asGeom = (polygon: Polygon): polygonClipping.Polygon => [polygon.map(([x, y]) => [x, y] as [number, number])]
const uncoveredArea = (inner: Polygon, outer: Polygon): number =>
  multiPolygonArea(polygonClipping.difference(asGeom(inner), asGeom(outer)))

/** Convex polygons: corners on an ellipse at increasing angles. */
const convexPolygon = fc
  .record({
    weights: fc.array(fc.double({ min: 1, max: 2, noNaN: true }), { minLength: 4, maxLength: 12 }),
    radius: fc.double({ min: 0.5, max: 4, noNaN: true }),
    squash: fc.double({ min: 0.3, max: 1, noNaN: true }),
    turn: fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
  })
  .map(({ weights, radius, squash, turn }) => corners(weights, () => radius, squash, turn))

/** Star-shaped polygons about the origin: reflex corners, spikes and notches. */
const starPolygon = fc
  .record({
    weights: fc.array(fc.double({ min: 1, max: 2, noNaN: true }), { minLength: 4, maxLength: 14 }),
    radii: fc.array(fc.double({ min: 0.4, max: 3, noNaN: true }), { minLength: 14, maxLength: 14 }),
    turn: fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
  })
  .map(({ weights, radii, turn }) => corners(weights, (i) => radii[i]!, 1, turn))

function corners(weights: number[], radiusAt: (i: number) => number, squash: number, turn: number): Polygon {
  const total = weights.reduce((sum, w) => sum + w, 0)
  let angle = turn
  return weights.map((weight, i) => {
    angle += (2 * Math.PI * weight) / total
    return [radiusAt(i) * Math.cos(angle), radiusAt(i) * squash * Math.sin(angle)] as Point
  })
}

const allowance = fc.double({ min: 0.05, max: 0.5, noNaN: true })
const mitreLimit = fc.constantFrom(1.5, 2, 3, 5, Infinity)

describe('cutting shapes reproduce the handbook cuts (common practice)', () => {
  it('cuts a finished square at +1/2 in', () => {
    const shape = cuttingShape(square(2))
    // 2 in finished + 2 × 1/4 in allowance = 2.5 in cut (common practice)
    expect(extent(shape, [1, 0])).toBeCloseTo(2.5, 12)
    expect(extent(shape, [0, 1])).toBeCloseTo(2.5, 12)
    expect(polygonArea(shape)).toBeCloseTo(6.25, 12)
  })

  it('cuts a half-square triangle from a square +7/8 in on the leg', () => {
    for (const leg of [2, 3.5, 6]) {
      const shape = cuttingShape([[0, 0], [leg, 0], [0, leg]], { mitreLimit: Infinity })
      // The legs grow by d(2 + √2) = 0.25 × 3.414 = 0.854 in → rounded up to 1/8 in = 7/8 in.
      const grownLeg = extent(shape, [1, 0])
      expect(grownLeg - leg).toBeCloseTo(0.25 * (2 + Math.SQRT2), 12)
      expect(roundUpToEighth(grownLeg)).toBe(leg + 7 / 8)
    }
  })

  it('cuts a quarter-square triangle from a square +1 1/4 in on the long side', () => {
    for (const longSide of [3, 4.5, 8]) {
      const shape = cuttingShape([[0, 0], [longSide, 0], [longSide / 2, longSide / 2]], { mitreLimit: Infinity })
      // The long side grows by 2d(1 + √2) = 0.5 × 2.414 = 1.207 in → rounded up to 1/8 in = 1 1/4 in.
      const grownSide = extent(shape, [1, 0])
      expect(grownSide - longSide).toBeCloseTo(2 * 0.25 * (1 + Math.SQRT2), 12)
      expect(roundUpToEighth(grownSide)).toBe(longSide + 5 / 4)
    }
  })

  it('cuts a point sharper than the mitre limit square, one allowance past the corner', () => {
    // A 20° point: its mitre would reach 0.25 / sin(10°) = 1.44 in, beyond 2 × 0.25 in.
    const tip: Point = [4, 0]
    const sharp: Polygon = [[0, -0.7053], tip, [0, 0.7053]]
    const shape = cuttingShape(sharp)
    const farthest = Math.max(...shape.map(([x]) => x))
    expect(farthest).toBeCloseTo(4.25, 3)
  })
})

describe('cutting shapes as offsets', () => {
  it('matches the closed-form area A + P·d + d²·Σ tan(φ/2) for convex polygons with unlimited mitres', () => {
    fc.assert(
      fc.property(convexPolygon, allowance, (area, d) => {
        const shape = cuttingShape(area, { seamAllowanceInches: d, mitreLimit: Infinity })
        expect(Math.abs(polygonArea(shape) - closedFormArea(area, d))).toBeLessThan(FORMULA_AGREEMENT_SQ_IN)
      }),
      { numRuns: 300 },
    )
  })

  it('matches the closed form under the default limit when every corner stays within it', () => {
    fc.assert(
      fc.property(convexPolygon, allowance, (area, d) => {
        // Mitre length d / cos(φ/2) ≤ 2d ⇔ cos(φ/2) ≥ 1/2 ⇔ every turn φ ≤ 120°.
        fc.pre(turningAngles(area).every((phi) => Math.cos(phi / 2) >= 0.5 + MITRE_LIMIT_CLEARANCE))
        const shape = cuttingShape(area, { seamAllowanceInches: d })
        expect(Math.abs(polygonArea(shape) - closedFormArea(area, d))).toBeLessThan(FORMULA_AGREEMENT_SQ_IN)
      }),
      { numRuns: 200 },
    )
  })

  it('agrees with clipper2-ts 2.0.1 (JoinType.Miter) on convex polygons', () => {
    fc.assert(
      fc.property(convexPolygon, allowance, mitreLimit, (area, d, limit) => {
        const shape = cuttingShape(area, { seamAllowanceInches: d, mitreLimit: limit })
        expect(Math.abs(polygonArea(shape) - clipperOffsetArea(area, d, limit))).toBeLessThan(CLIPPER_AREA_AGREEMENT_SQ_IN)
      }),
      { numRuns: 300 },
    )
  })

  it('agrees with clipper2-ts 2.0.1 (JoinType.Miter) on star-shaped polygons with reflex corners', () => {
    fc.assert(
      fc.property(starPolygon, allowance, mitreLimit, (area, d, limit) => {
        const shape = cuttingShape(area, { seamAllowanceInches: d, mitreLimit: limit })
        expect(isSimpleRing(shape)).toBe(true)
        expect(Math.abs(polygonArea(shape) - clipperOffsetArea(area, d, limit))).toBeLessThan(CLIPPER_AREA_AGREEMENT_SQ_IN)
      }),
      { numRuns: 300 },
    )
  })

  it('contains its area (checked with polygon-clipping)', () => {
    fc.assert(
      fc.property(fc.oneof(convexPolygon, starPolygon), allowance, mitreLimit, (area, d, limit) => {
        const shape = cuttingShape(area, { seamAllowanceInches: d, mitreLimit: limit })
        expect(uncoveredArea(area, shape)).toBeLessThan(CONTAINMENT_SLACK_SQ_IN)
      }),
      { numRuns: 200 },
    )
  })

  it('closes a notch narrower than two allowances, as clipper2-ts 2.0.1 does', () => {
    // A U whose slot is 0.3 in wide: the two 1/4 in allowances overlap inside the slot.
    const u: Polygon = [[0, 0], [3, 0], [3, 3], [1.65, 3], [1.65, 1], [1.35, 1], [1.35, 3], [0, 3]]
    const shape = cuttingShape(u)
    expect(isSimpleRing(shape)).toBe(true)
    expect(Math.abs(polygonArea(shape) - clipperOffsetArea(u, 0.25, 2))).toBeLessThan(CLIPPER_AREA_AGREEMENT_SQ_IN)
    // 3.5 × 3.5 in outer square, the slot filled: the shape is the whole square.
    expect(polygonArea(shape)).toBeCloseTo(3.5 * 3.5, 9)
  })

  it('keeps a T-junction corner on a straight edge without a kink', () => {
    const withJunction: Polygon = [[0, 0], [1, 0], [2, 0], [2, 2], [0, 2]]
    expect(polygonArea(cuttingShape(withJunction))).toBeCloseTo(2.5 * 2.5, 12)
  })

  it('turns a clockwise area round and leaves its input untouched', () => {
    const clockwise = Object.freeze([[0, 0], [0, 2], [2, 2], [2, 0]].map((p) => Object.freeze(p))) as unknown as Polygon
    const shape = cuttingShape(clockwise)
    expect(polygonArea(shape)).toBeCloseTo(6.25, 12)
    expect(clockwise).toEqual([[0, 0], [0, 2], [2, 2], [2, 0]])
  })

  it('rejects a negative allowance as a programmer error', () => {
    expect(() => cuttingShape(square(1), { seamAllowanceInches: -0.25 })).toThrow(RangeError)
  })
})

function turningAngles(polygon: Polygon): number[] {
  return polygon.map((corner, i) => {
    const before = polygon[(i + polygon.length - 1) % polygon.length]!
    const after = polygon[(i + 1) % polygon.length]!
    const inX = corner[0] - before[0]
    const inY = corner[1] - before[1]
    const outX = after[0] - corner[0]
    const outY = after[1] - corner[1]
    return Math.atan2(inX * outY - inY * outX, inX * outX + inY * outY)
  })
}

/** Area of a convex polygon's mitred offset: A + P·d + d²·Σ tan(φᵢ/2) (derivable, from memory). */
function closedFormArea(polygon: Polygon, d: number): number {
  const perimeter = polygon.reduce((sum, p, i) => {
    const q = polygon[(i + 1) % polygon.length]!
    return sum + Math.hypot(q[0] - p[0], q[1] - p[1])
  }, 0)
  const tangents = turningAngles(polygon).reduce((sum, phi) => sum + Math.tan(phi / 2), 0)
  return polygonArea(polygon) + perimeter * d + d * d * tangents
}
