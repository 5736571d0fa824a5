import fc from 'fast-check'
import polygonClipping from 'polygon-clipping'
import { describe, expect, it } from 'vitest'
import { cuttingShape, polygonArea } from './offset'
import { mirrorAcross, roughCutBeforeFlip, roughCutPiece, roundUpToEighthInch } from './rough-cut'
import { pathToPolygon, repeatOutline } from './trim-line'
import type { Point, Polygon, Segment } from './types'

/** polygon-clipping's rounding leaves slivers far below anything cut in fabric. */
const CONTAINMENT_SLACK_SQ_IN = 1e-9
/** Corner positions computed two ways differ only by floating-point noise. */
const POSITION_NOISE_INCHES = 1e-9

const asGeom = (polygon: Polygon): polygonClipping.Polygon => [polygon.map(([x, y]) => [x, y] as [number, number])]
function uncoveredArea(inner: Polygon, outer: Polygon): number {
  let total = 0
  for (const polygon of polygonClipping.difference(asGeom(inner), asGeom(outer))) {
    polygon.forEach((ring, index) => {
      const ringArea = Math.abs(polygonArea(ring.slice(0, -1) as Point[]))
      total += index === 0 ? ringArea : -ringArea
    })
  }
  return total
}

/**
 * The rectangle pushed out by a millionth of an inch on every side. polygon-clipping 0.15.7 can
 * fail on edges that overlap exactly, as the seam-side edge and the cutting shape's edge do by
 * design; the slack turns "contains" into "contains within a millionth of an inch".
 */
const CONTAINMENT_SLACK_INCHES = 1e-6
function grownRectangle(corners: Polygon): Polygon {
  return corners.map((corner, i) => {
    const before = unitVector(corners[(i + corners.length - 1) % corners.length]!, corner)
    const after = unitVector(corners[(i + 1) % corners.length]!, corner)
    return [corner[0] + CONTAINMENT_SLACK_INCHES * (before[0] + after[0]),
      corner[1] + CONTAINMENT_SLACK_INCHES * (before[1] + after[1])] as Point
  })
}
function unitVector(from: Point, to: Point): Point {
  const length = Math.hypot(to[0] - from[0], to[1] - from[1])
  return [(to[0] - from[0]) / length, (to[1] - from[1]) / length]
}
/** Signed distance of a point to the left of a directed line. */
const sideOf = (point: Point, origin: Point, direction: Point): number =>
  direction[0] * (point[1] - origin[1]) - direction[1] * (point[0] - origin[0])

const rotate = (point: Point, angle: number): Point =>
  [point[0] * Math.cos(angle) - point[1] * Math.sin(angle), point[0] * Math.sin(angle) + point[1] * Math.cos(angle)]
const edgeLength = (a: Point, b: Point): number => Math.hypot(b[0] - a[0], b[1] - a[1])

/**
 * A convex area sewn along one of its edges, as the plan produces them: corners on an ellipse
 * (convex), the sewing line the whole edge or a part of it (a seam shared with a larger area).
 */
const sewnArea = fc
  .record({
    weights: fc.array(fc.double({ min: 1, max: 2, noNaN: true }), { minLength: 3, maxLength: 9 }),
    radius: fc.double({ min: 0.5, max: 4, noNaN: true }),
    squash: fc.double({ min: 0.3, max: 1, noNaN: true }),
    turn: fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
    edge: fc.nat(),
    part: fc.tuple(fc.double({ min: 0, max: 0.4, noNaN: true }), fc.double({ min: 0.6, max: 1, noNaN: true })),
    reversed: fc.boolean(),
  })
  .map(({ weights, radius, squash, turn, edge, part, reversed }) => {
    const total = weights.reduce((sum, w) => sum + w, 0)
    let angle = turn
    const area: Polygon = weights.map((weight) => {
      angle += (2 * Math.PI * weight) / total
      return [radius * Math.cos(angle), radius * squash * Math.sin(angle)] as Point
    })
    const a = area[edge % area.length]!
    const b = area[(edge + 1) % area.length]!
    const at = (t: number): Point => [a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t]
    const line: Segment = reversed ? [at(part[1]), at(part[0])] : [at(part[0]), at(part[1])]
    return { area, line }
  })

const margin = fc.constantFrom(0, 0.125, 0.25, 0.5)

describe('rough-cut pieces sewn along a line', () => {
  it('sizes a 2 × 1 in area sewn on its long edge', () => {
    const cut = roughCutPiece([[0, 0], [2, 0], [2, 1], [0, 1]], [[0, 0], [2, 0]])
    // along: 2 in + 2 × 1/4 in allowance + 2 × 1/4 in margin = 3 in
    // across: 1/4 in past the line + 1 in + 1/4 in allowance + 1/4 in margin = 1.75 in
    expect(cut).toEqual({ widthIn: 3, heightIn: 1.75, corners: [[-0.5, -0.25], [2.5, -0.25], [2.5, 1.5], [-0.5, 1.5]] })
  })

  it('rounds a half-square-triangle piece up to 1/8 in with no margin (common practice)', () => {
    // Sewn on the hypotenuse of a right triangle with 2 in legs. Across the line: 1/4 in past it,
    // the triangle's height 2/√2 = √2, then the right angle's mitre d√2 past the corner:
    // 0.25 + 1.414 + 0.354 = 2.018 in → 2 1/8 in.
    const cut = roughCutPiece([[0, 0], [2, 0], [0, 2]], [[2, 0], [0, 2]], { marginInches: 0 })
    expect(cut.heightIn).toBe(2.125)
    // Along the line: the hypotenuse 2√2 = 2.828 plus the two 45° points, each cut square one
    // allowance out (limit 2 < 1/sin 22.5° = 2.61). The cut meets the leg's offset line
    // d·tan 33.75° = 0.167 in past the corner, which reaches (0.167 + 0.25)/√2 = 0.295 in beyond
    // the hypotenuse's end: 2.828 + 2 × 0.295 = 3.418 in → 3 1/2 in.
    expect(cut.widthIn).toBe(3.5)
  })

  it('puts its first edge on the seam side, parallel to the sewing line, one allowance past it', () => {
    fc.assert(
      fc.property(sewnArea, margin, ({ area, line }, m) => {
        const cut = roughCutPiece(area, line, { marginInches: m })
        const [c0, c1] = cut.corners as [Point, Point]
        const direction: Point = [line[1][0] - line[0][0], line[1][1] - line[0][1]]
        const edge: Point = [c1[0] - c0[0], c1[1] - c0[1]]
        const sine = (direction[0] * edge[1] - direction[1] * edge[0]) / (edgeLength(...line) * edgeLength(c0, c1))
        expect(Math.abs(sine)).toBeLessThan(POSITION_NOISE_INCHES)
        // Both ends of the first edge lie 1/4 in from the line, on the side away from the area.
        for (const corner of [c0, c1]) {
          expect(edgeLength(corner, mirrorAcross(corner, line)) / 2).toBeCloseTo(0.25, 9)
        }
        expect(edgeLength(c0, c1)).toBeCloseTo(cut.widthIn, 9)
        expect(edgeLength(c1, cut.corners[2]!)).toBeCloseTo(cut.heightIn, 9)
        expect(polygonArea(cut.corners)).toBeGreaterThan(0)
      }),
      { numRuns: 200 },
    )
  })

  it('covers the cutting shape once flipped about its sewing line (checked with polygon-clipping)', () => {
    fc.assert(
      fc.property(sewnArea, margin, ({ area, line }, m) => {
        const cut = roughCutPiece(area, line, { marginInches: m })
        const beforeFlip = roughCutBeforeFlip(cut, line)
        const flipped = beforeFlip.map((corner) => mirrorAcross(corner, line)).reverse()
        expect(uncoveredArea(cuttingShape(area), grownRectangle(flipped))).toBeLessThan(CONTAINMENT_SLACK_SQ_IN)
        // Before the flip it lies over the sewn side, reaching one allowance past the line.
        const direction = unitVector(line[0], line[1])
        const areaSide = Math.sign(area.reduce((sum, p) => sum + sideOf(p, line[0], direction), 0))
        for (const corner of beforeFlip) {
          expect(areaSide * sideOf(corner, line[0], direction)).toBeLessThan(0.25 + POSITION_NOISE_INCHES)
        }
      }),
      { numRuns: 200 },
    )
  })

  it('gives the same size at four rotations of the design', () => {
    fc.assert(
      fc.property(sewnArea, margin, ({ area, line }, m) => {
        const sizes = [0, 0.61, Math.PI / 2, 3.7].map((angle) => {
          const cut = roughCutPiece(area.map((p) => rotate(p, angle)), [rotate(line[0], angle), rotate(line[1], angle)],
            { marginInches: m })
          return [cut.widthIn, cut.heightIn]
        })
        for (const size of sizes) expect(size).toEqual(sizes[0])
      }),
      { numRuns: 100 },
    )
  })

  it('covers a whole repeat of a ring with a hole, reflex chords and all, sewn on a radial edge', () => {
    // Repeat 0 of a 4-repeat ring, radii 2 and 9 in: the inner arc's chords are reflex corners.
    const repeat = pathToPolygon(repeatOutline({ innerRadius: 2, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }))
    const line: Segment = [[2, 0], [9, 0]]
    const cut = roughCutPiece(repeat, line)
    // along x: from −1/4 (the allowance beside the edge at x = 0) − 1/4 margin to 9 + 1/4 + 1/4:
    // 9.5 + 0.5 = 10 in; across: 1/4 past the line + 9 + 1/4 + 1/4 margin = 9.75 in. The chords'
    // mitre at (9, 0) reaches 0.008 in farther, which the margin absorbs (under 1/64 in).
    expect([cut.widthIn, cut.heightIn]).toEqual([10, 9.75])
    expect(uncoveredArea(cuttingShape(repeat), grownRectangle(cut.corners))).toBeLessThan(CONTAINMENT_SLACK_SQ_IN)
    const first = roughCutPiece(repeat, null)
    expect(uncoveredArea(cuttingShape(repeat), grownRectangle(first.corners))).toBeLessThan(CONTAINMENT_SLACK_SQ_IN)
  })

  it('leaves the area and the sewing line untouched', () => {
    const area = Object.freeze([Object.freeze([0, 0]), Object.freeze([2, 0]), Object.freeze([1, 1])]) as unknown as Polygon
    const line = Object.freeze([Object.freeze([0, 0]), Object.freeze([2, 0])]) as unknown as Segment
    roughCutPiece(area, line)
    expect(area).toEqual([[0, 0], [2, 0], [1, 1]])
  })
})

describe("rough-cut pieces for a section's first area", () => {
  it('finds the smallest rectangle at any rotation', () => {
    // A 2 × 1 in rectangle turned by 30°: cut 2.5 × 1.5 with allowance, + 2 × 1/4 margin = 3 × 2.
    const turned = ([[0, 0], [2, 0], [2, 1], [0, 1]] as Point[]).map((p) => rotate(p, Math.PI / 6))
    const cut = roughCutPiece(turned, null)
    expect([cut.widthIn, cut.heightIn]).toEqual([3, 2])
    const [c0, c1] = cut.corners as [Point, Point]
    expect(Math.atan2(c1[1] - c0[1], c1[0] - c0[0]) % Math.PI).toBeCloseTo(Math.PI / 6, 9)
  })

  it('covers the cutting shape, first edge along its long side, the same at four rotations', () => {
    fc.assert(
      fc.property(sewnArea, margin, ({ area }, m) => {
        const cut = roughCutPiece(area, null, { marginInches: m })
        expect(cut.widthIn).toBeGreaterThanOrEqual(cut.heightIn)
        expect(uncoveredArea(cuttingShape(area), grownRectangle(cut.corners))).toBeLessThan(CONTAINMENT_SLACK_SQ_IN)
        for (const angle of [0.61, Math.PI / 2, 3.7]) {
          const turned = roughCutPiece(area.map((p) => rotate(p, angle)), null, { marginInches: m })
          expect([turned.widthIn, turned.heightIn]).toEqual([cut.widthIn, cut.heightIn])
        }
      }),
      { numRuns: 100 },
    )
  })
})

describe('rounding up to 1/8 in', () => {
  it('keeps exact steps and ignores floating-point noise', () => {
    expect(roundUpToEighthInch(2.5)).toBe(2.5)
    expect(roundUpToEighthInch(2.5 + 4e-15)).toBe(2.5)
    // 2 in leg + d(2 + √2) = 2.854 in → 2 7/8 in (common practice)
    expect(roundUpToEighthInch(2 + 0.25 * (2 + Math.SQRT2))).toBe(2.875)
  })
})
