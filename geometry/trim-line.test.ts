import fc from 'fast-check'
import { EndType, inflatePathsD, JoinType } from 'clipper2-ts'
import { describe, expect, it } from 'vitest'
import { polygonArea } from './offset'
import {
  arcSweep, endOf, outlineFromPolygon, pathToPolygon, repeatOutline, sectionTrimLine, startOf, trimLine,
  type ArcPathSegment, type OutlinePath, type PathSegment,
} from './trim-line'
import type { Point, Ring } from './types'

/** Lengths computed two ways agree to floating-point noise on lengths of a few inches. */
const NOISE_INCHES = 1e-9
/** Exact areas of the same region computed two ways: floating-point noise only. */
const EXACT_AREA_SQ_IN = 1e-9
/**
 * clipper2-ts mitres along the last chord's tangent where we follow the circle: at each
 * line–arc corner the two differ by a sliver of order d³/r (0.25³ / 6 = 0.0026 sq in; seen up
 * to 0.0022 sq in for a whole ring with a hole).
 */
const CLIPPER_JOIN_SLIVERS_SQ_IN = 0.005
/** The same chords offset by us and by Clipper2 (1e-8 in grid) agree to far better than this. */
const CLIPPER_SAME_CHORDS_SQ_IN = 1e-6
/** Chords for the Clipper reference: fine enough that chord error stays under 1e-4 sq in. */
const REFERENCE_SEGMENTS_PER_RADIAN = 2000

const ring = (overrides: Partial<Ring> = {}): Ring =>
  ({ innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate', ...overrides })
const distance = (a: Point, b: Point): number => Math.hypot(a[0] - b[0], a[1] - b[1])

/** Exact area enclosed by a path (Green's theorem; arcs integrated exactly). */
function pathArea(path: OutlinePath): number {
  return path.reduce((sum, segment) => {
    if (segment.kind === 'line') return sum + (segment.from[0] * segment.to[1] - segment.to[0] * segment.from[1]) / 2
    const sweep = arcSweep(segment) * (segment.anticlockwise ? 1 : -1)
    const a = segment.startAngle
    const b = a + sweep
    const [cx, cy] = segment.center
    const r = segment.radius
    return sum + (r * r * sweep + r * (cx * (Math.sin(b) - Math.sin(a)) - cy * (Math.cos(b) - Math.cos(a)))) / 2
  }, 0)
}

/** Distance from a point to an outline element (the nearest point of the line segment or arc). */
function distanceToSegment(point: Point, segment: PathSegment): number {
  if (segment.kind === 'line') {
    const [a, b] = [segment.from, segment.to]
    const t = Math.max(0, Math.min(1, ((point[0] - a[0]) * (b[0] - a[0]) + (point[1] - a[1]) * (b[1] - a[1])) / distance(a, b) ** 2))
    return distance(point, [a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])])
  }
  const angle = Math.atan2(point[1] - segment.center[1], point[0] - segment.center[0])
  const from = segment.anticlockwise ? segment.startAngle : segment.endAngle
  const within = ((angle - from) % (2 * Math.PI) + 2 * Math.PI) % (2 * Math.PI) <= arcSweep(segment)
  if (within) return Math.abs(distance(point, segment.center) - segment.radius)
  return Math.min(distance(point, startOf(segment)), distance(point, endOf(segment)))
}
const distanceToOutline = (point: Point, outline: OutlinePath): number =>
  Math.min(...outline.map((segment) => distanceToSegment(point, segment)))

function clipperTrimArea(outline: OutlinePath, allowance: number, mitreLimit: number): number {
  const points: Point[] = []
  for (const segment of outline) {
    if (segment.kind === 'line') {
      points.push(segment.from)
      continue
    }
    const steps = Math.ceil(arcSweep(segment) * REFERENCE_SEGMENTS_PER_RADIAN)
    const sign = segment.anticlockwise ? 1 : -1
    for (let i = 0; i < steps; i += 1) {
      const angle = segment.startAngle + (sign * arcSweep(segment) * i) / steps
      points.push([segment.center[0] + segment.radius * Math.cos(angle), segment.center[1] + segment.radius * Math.sin(angle)])
    }
  }
  const solution = inflatePathsD([points.map(([x, y]) => ({ x, y }))], allowance, JoinType.Miter, EndType.Polygon, mitreLimit, 8)
  return solution.reduce((sum, path) => sum + polygonArea(path.map(({ x, y }) => [x, y] as Point)), 0)
}

describe('trim lines of a repeat', () => {
  it('moves a quarter wedge out by 1/4 in, its arc to radius 9.25 in', () => {
    const { path } = trimLine(repeatOutline(ring()))
    expect(path.map((segment) => segment.kind)).toEqual(['line', 'arc', 'line'])
    const arc = path[1] as ArcPathSegment
    // 9 in outer radius + 1/4 in allowance = 9.25 in (common practice: trim 1/4 in outside)
    expect(arc.radius).toBe(9.25)
    // The 90° apex keeps its mitre: d/cos 45° = 0.354 in ≤ 2 × 0.25 in, at (−1/4, −1/4).
    expect(distance(startOf(path[0]!), [-0.25, -0.25])).toBeLessThan(NOISE_INCHES)
    // The line y = −1/4 meets the circle of radius 9.25 at x = √(9.25² − 0.25²) = 9.2466.
    expect(distance(endOf(path[0]!), [Math.sqrt(9.25 ** 2 - 0.0625), -0.25])).toBeLessThan(NOISE_INCHES)
  })

  it('encloses the closed-form area of the quarter wedge grown by d', () => {
    for (const d of [0.125, 0.25, 0.375]) {
      const big = 9 + d
      // {x ≥ −d, y ≥ −d, x² + y² ≤ R²}: quarter disc + two strips ∫₋d⁰ √(R² − y²) dy + the d × d corner.
      const strip = (d / 2) * Math.sqrt(big * big - d * d) + ((big * big) / 2) * Math.asin(d / big)
      const expected = (Math.PI * big * big) / 4 + 2 * strip + d * d
      expect(Math.abs(pathArea(trimLine(repeatOutline(ring()), { seamAllowanceInches: d }).path) - expected))
        .toBeLessThan(EXACT_AREA_SQ_IN)
    }
  })

  it('keeps both arcs of a ring with a hole: outer radius + 1/4, inner radius − 1/4', () => {
    const { path } = trimLine(repeatOutline(ring({ innerRadius: 3, repeats: 6 })))
    const arcs = path.filter((segment): segment is ArcPathSegment => segment.kind === 'arc')
    expect(arcs.map((arc) => [arc.radius, arc.anticlockwise])).toEqual([[9.25, true], [2.75, false]])
  })

  it("cuts a 10° wedge apex square, one allowance past the centre", () => {
    const { path } = trimLine(repeatOutline(ring({ repeats: 36 })))
    // Its mitre would reach d / sin 5° = 2.87 in; the limit is 2 × 1/4 in, so a square cut.
    const cut = path[0]!
    expect(cut.kind).toBe('line')
    const bisector: Point = [Math.cos(Math.PI / 36), Math.sin(Math.PI / 36)]
    for (const end of [startOf(cut), endOf(cut)]) {
      expect(end[0] * bisector[0] + end[1] * bisector[1]).toBeCloseTo(-0.25, 12)
    }
  })

  it('lies one allowance from the outline along every line and arc, and closes', () => {
    fc.assert(fc.property(fc.integer({ min: 2, max: 36 }), fc.constantFrom(0, 1, 2.5), fc.double({ min: 4, max: 12, noNaN: true }),
      fc.double({ min: 0.1, max: 0.5, noNaN: true }), (repeats, innerRadius, outerRadius, d) => {
        const outline = repeatOutline(ring({ repeats, innerRadius, outerRadius }))
        const { path, polygon } = trimLine(outline, { seamAllowanceInches: d })
        path.forEach((segment, i) => {
          expect(distance(endOf(segment), startOf(path[(i + 1) % path.length]!))).toBeLessThan(NOISE_INCHES)
        })
        for (const segment of path) {
          const middle = segment.kind === 'line'
            ? [(segment.from[0] + segment.to[0]) / 2, (segment.from[1] + segment.to[1]) / 2] as Point
            : pathToPolygon([{ ...segment, endAngle: segment.startAngle + (segment.anticlockwise ? 1 : -1) * arcSweep(segment) / 2 }, { kind: 'line', from: [0, 0], to: [0, 0] }])[0]!
          // Mitre and square-cut segments stand farther off; every other element is exactly d away.
          expect(distanceToOutline(middle, outline)).toBeGreaterThan(d - NOISE_INCHES)
        }
        expect(polygonArea(polygon)).toBeGreaterThan(0)
      }))
  })

  it('agrees with clipper2-ts 2.0.1 on finely chorded repeats, up to the join slivers', () => {
    for (const [repeats, innerRadius] of [[4, 0], [6, 2], [8, 0], [12, 3], [36, 0]] as const) {
      const outline = repeatOutline(ring({ repeats, innerRadius, outerRadius: 6 }))
      const ours = pathArea(trimLine(outline).path)
      expect(Math.abs(ours - clipperTrimArea(outline, 0.25, 2))).toBeLessThan(CLIPPER_JOIN_SLIVERS_SQ_IN)
    }
  })

  it('falls back to the chorded cutting shape when the inner arc is smaller than the allowance', () => {
    const outline = repeatOutline(ring({ innerRadius: 0.2 }))
    const { path, polygon } = trimLine(outline)
    expect(path.every((segment) => segment.kind === 'line')).toBe(true)
    // The same chords offset by clipper2-ts 2.0.1 (JoinType.Miter, limit 2).
    const chords = pathToPolygon(outline).map(([x, y]) => ({ x, y }))
    const reference = inflatePathsD([chords], 0.25, JoinType.Miter, EndType.Polygon, 2, 8)
      .reduce((sum, p) => sum + polygonArea(p.map(({ x, y }) => [x, y] as Point)), 0)
    expect(Math.abs(polygonArea(polygon) - reference)).toBeLessThan(CLIPPER_SAME_CHORDS_SQ_IN)
  })

  it('closes a notch narrower than two allowances instead of crossing itself', () => {
    const line = (from: Point, to: Point): PathSegment => ({ kind: 'line', from, to })
    const corners: Point[] = [[0, 0], [4, 0], [4, 4], [2.15, 4], [2.15, 2], [1.85, 2], [1.85, 4], [0, 4]]
    const notched = corners.map((corner, i) => line(corner, corners[(i + 1) % corners.length]!))
    const { polygon } = trimLine(notched)
    // 4.5 × 4.5 in: the 0.3 in notch is filled by the allowances on both its walls.
    expect(polygonArea(polygon)).toBeCloseTo(4.5 * 4.5, 9)
  })
})

describe('trim lines of sections given as plan areas', () => {
  it('trims two areas of a repeat exactly as the whole repeat', () => {
    // Repeat 0 of a 4-repeat ring (radii 2 and 9) cut by a seam from (5, 0) to (0, 5).
    const r = ring({ innerRadius: 2 })
    const whole = pathToPolygon(repeatOutline(r))
    const seam: [Point, Point] = [[5, 0], [0, 5]]
    const side = (p: Point): number => (seam[1][0] - seam[0][0]) * (p[1] - seam[0][1]) - (seam[1][1] - seam[0][1]) * (p[0] - seam[0][0])
    // Left of the seam's direction is the centre's side.
    const near = whole.filter((p) => side(p) > 0)
    const far = whole.filter((p) => side(p) < 0)
    // Both halves as the plan would list them, counter-clockwise, sharing the seam.
    const inner: Point[] = [...near.slice(0, 1), [5, 0], [0, 5], ...near.slice(1)]
    const outer: Point[] = [[5, 0], ...far, [0, 5]]
    const { path } = sectionTrimLine([inner, outer], r)
    expect(Math.abs(pathArea(path) - pathArea(trimLine(repeatOutline(r)).path))).toBeLessThan(EXACT_AREA_SQ_IN)
    expect(path.filter((segment) => segment.kind === 'arc')).toHaveLength(2)
  })
})

describe('outlines read back from plan polygons', () => {
  it('finds the arcs among the chords of a repeat', () => {
    for (const innerRadius of [0, 3]) {
      const original = repeatOutline(ring({ innerRadius, repeats: 6 }))
      const read = outlineFromPolygon(pathToPolygon(original), ring({ innerRadius, repeats: 6 }))
      expect(read.map((segment) => segment.kind)).toEqual(original.map((segment) => segment.kind))
      expect(Math.abs(pathArea(read) - pathArea(original))).toBeLessThan(EXACT_AREA_SQ_IN)
    }
  })

  it('moves a seam end snapped onto a chord out onto the circle', () => {
    // Repeat 0 of a quarter ring cut by a seam from (3, 0) to the middle of the outer arc's
    // first chord: the chord's middle is up to 0.005 in inside the circle.
    const chords = pathToPolygon(repeatOutline(ring()))
    const [a, b] = [chords[1]!, chords[2]!]
    const onChord: Point = [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2]
    expect(9 - Math.hypot(...onChord)).toBeGreaterThan(0)
    const read = outlineFromPolygon([[3, 0], [9, 0], onChord], ring())
    expect(read.map((segment) => segment.kind)).toEqual(['line', 'arc', 'line'])
    expect(Math.hypot(...endOf(read[1]!))).toBeCloseTo(9, 12)
    read.forEach((segment, i) => {
      expect(distance(endOf(segment), startOf(read[(i + 1) % read.length]!))).toBeLessThan(NOISE_INCHES)
    })
  })

  it('keeps a seam that crosses a cap of the outer circle as a line', () => {
    // A seam from (9, 0) to a point 60° round the outer circle cuts a cap far deeper than 0.005 in.
    const far: Point = [9 * Math.cos(Math.PI / 3), 9 * Math.sin(Math.PI / 3)]
    const read = outlineFromPolygon([[0, 0], [9, 0], far], ring({ repeats: 6 }))
    expect(read.map((segment) => segment.kind)).toEqual(['line', 'line', 'line'])
  })
})
