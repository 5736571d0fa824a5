import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { bezierPoint, mapSmoothCurve, sampleSmoothCurve, smoothCurve } from './smooth-curve'
import type { Point } from './types'
import { cross, dot, subtract } from './vector'

/** Values computed two ways agree to floating-point noise on lengths of a few inches. */
const NOISE = 1e-9

const distance = (a: Point, b: Point): number => Math.hypot(a[0] - b[0], a[1] - b[1])
const lerp = (a: Point, b: Point, t0: number, t1: number, t: number): Point => {
  const u = (t - t0) / (t1 - t0)
  return [a[0] + (b[0] - a[0]) * u, a[1] + (b[1] - a[1]) * u]
}

/**
 * The centripetal Catmull-Rom point between p1 and p2 by Barry and Goldman's pyramid of linear
 * interpolations over knots t_{i+1} = t_i + |p_{i+1} − p_i|^(1/2) (the standard definition,
 * Barry and Goldman, SIGGRAPH 1988): an independent check of the Bézier conversion.
 */
function pyramidPoint(p0: Point, p1: Point, p2: Point, p3: Point, u: number): Point {
  const t0 = 0
  const t1 = t0 + Math.sqrt(distance(p0, p1))
  const t2 = t1 + Math.sqrt(distance(p1, p2))
  const t3 = t2 + Math.sqrt(distance(p2, p3))
  const t = t1 + (t2 - t1) * u
  const a1 = lerp(p0, p1, t0, t1, t)
  const a2 = lerp(p1, p2, t1, t2, t)
  const a3 = lerp(p2, p3, t2, t3, t)
  const b1 = lerp(a1, a2, t0, t2, t)
  const b2 = lerp(a2, a3, t1, t3, t)
  return lerp(b1, b2, t1, t2, t)
}

const coordinate = fc.double({ min: -10, max: 10, noNaN: true })
const spreadPoints = fc.array(fc.tuple(coordinate, coordinate), { minLength: 2, maxLength: 8 })
  .filter((points) => points.every((p, i) => i === 0 || distance(p, points[i - 1]!) > 0.05))
  // A curl that turns straight back on itself has a zero tangent there (a cusp): left out.
  .filter((points) => points.every((p, i) => {
    if (i === 0 || i + 1 === points.length) return true
    const a = subtract(p, points[i - 1]!)
    const b = subtract(points[i + 1]!, p)
    return dot(a, b) > -0.999 * Math.hypot(...a) * Math.hypot(...b)
  }))

describe('the smooth curve of a curl', () => {
  it('passes through every point, in order', () => {
    fc.assert(fc.property(spreadPoints, (points) => {
      const curve = smoothCurve(points)
      expect(curve.start).toEqual(points[0])
      expect(curve.pieces.map((piece) => piece[2])).toEqual(points.slice(1))
    }))
  })

  it('is tangent-continuous where two pieces meet', () => {
    fc.assert(fc.property(spreadPoints, (points) => {
      const { pieces } = smoothCurve(points)
      for (let i = 0; i + 1 < pieces.length; i += 1) {
        const join = pieces[i]![2]
        const incoming = subtract(join, pieces[i]![1])
        const outgoing = subtract(pieces[i + 1]![0], join)
        const size = Math.hypot(...incoming) * Math.hypot(...outgoing)
        // Same direction: no kink (cross product 0) and no reversal (dot product > 0).
        expect(Math.abs(cross(incoming, outgoing))).toBeLessThanOrEqual(1e-9 * Math.max(1, size))
        expect(dot(incoming, outgoing)).toBeGreaterThan(0)
      }
    }))
  })

  it('is the centripetal Catmull-Rom spline of the pyramid definition', () => {
    const points: Point[] = [[3, 5], [3.4, 5.6], [3.1, 6], [2.2, 6.1]]
    const { start, pieces } = smoothCurve(points)
    // The middle piece has real neighbours on both sides.
    const from = pieces[0]![2]
    for (const u of [0.25, 0.5, 0.75]) {
      expect(distance(bezierPoint(from, pieces[1]!, u), pyramidPoint(points[0]!, points[1]!, points[2]!, points[3]!, u))).toBeLessThan(NOISE)
    }
    // The first piece uses the phantom point 2·P0 − P1.
    const phantom: Point = [2 * points[0]![0] - points[1]![0], 2 * points[0]![1] - points[1]![1]]
    expect(distance(bezierPoint(start, pieces[0]!, 0.5), pyramidPoint(phantom, points[0]!, points[1]!, points[2]!, 0.5))).toBeLessThan(NOISE)
  })

  it('draws two points as the straight segment between them', () => {
    // Control points at thirds: (1/3, 0) and (2/3, 0) on the segment from (0, 0) to (1, 0).
    const { pieces } = smoothCurve([[0, 0], [1, 0]])
    expect(pieces).toHaveLength(1)
    expect(distance(pieces[0]![0], [1 / 3, 0])).toBeLessThan(NOISE)
    expect(distance(pieces[0]![1], [2 / 3, 0])).toBeLessThan(NOISE)
  })

  it('ignores a point clicked twice and gives the same curve every time', () => {
    const points: Point[] = [[0, 0], [1, 1], [1, 1], [2, 0]]
    expect(smoothCurve(points)).toEqual(smoothCurve([[0, 0], [1, 1], [2, 0]]))
    expect(smoothCurve(points)).toEqual(smoothCurve(points.map((p) => [...p] as Point)))
    expect(smoothCurve([]).pieces).toEqual([])
    expect(smoothCurve([[1, 2]])).toEqual({ start: [1, 2], pieces: [] })
  })

  it('moves with its control points under an affine map', () => {
    const points: Point[] = [[3, 5], [3.4, 5.6], [3.1, 6]]
    const turn = ([x, y]: Point): Point => [-y + 1, x - 2]
    const moved = mapSmoothCurve(smoothCurve(points), turn)
    const direct = smoothCurve(points.map(turn))
    moved.pieces.flat().forEach((p, i) => expect(distance(p, direct.pieces.flat()[i]!)).toBeLessThan(NOISE))
  })

  it('samples to a polyline through the same points', () => {
    const curve = smoothCurve([[0, 0], [1, 1], [2, 0]])
    const samples = sampleSmoothCurve(curve, 8)
    expect(samples).toHaveLength(17)
    expect(samples[8]).toEqual([1, 1])
    expect(samples[16]).toEqual([2, 0])
  })
})
