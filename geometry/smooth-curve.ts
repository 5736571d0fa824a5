/**
 * The smooth curve through a curl's points, drawn the same on the board, on the booklet's cover
 * and on the placement guide: a centripetal Catmull-Rom spline (α = 1/2) through every point,
 * written as cubic Bézier pieces, one per pair of neighbouring points.
 *
 * Why centripetal: the designer clicks a few points, often unevenly spaced; the uniform spline
 * overshoots and can loop between close points, the centripetal one never forms a cusp or a
 * self-intersection within a piece (Yuksel, Schaefer and Keyser, "Parameterization and
 * applications of Catmull-Rom curves", Computer-Aided Design 43(7), 2011). The Bézier control
 * points are that paper's conversion, the one d3-shape's `curveCatmullRom` uses (common practice).
 * The ends have no outer neighbour: a phantom point mirrored through the end (P₋₁ = 2P₀ − P₁)
 * gives the end piece a natural start without a zero-length knot interval.
 *
 * Béziers are affine-invariant, so a caller moves a curve to another repeat, to the screen or to
 * the page by transforming its control points: the curve drawn is the same curve.
 */
import { VERTEX_MERGE_INCHES } from './tolerances'
import type { Point } from './types'
import { add, scale, subtract } from './vector'

/** One cubic Bézier piece after the previous piece's end: [first control, second control, end]. */
export type BezierPiece = readonly [control1: Point, control2: Point, end: Point]

export interface SmoothCurve {
  readonly start: Point
  /** Empty for a curve of a single point. */
  readonly pieces: readonly BezierPiece[]
}

/** Catmull-Rom exponent: 0 uniform, 1/2 centripetal, 1 chordal. */
const CENTRIPETAL_ALPHA = 0.5

const distance = (a: Point, b: Point): number => Math.hypot(a[0] - b[0], a[1] - b[1])

/** The points without consecutive repeats (a double click adds the same point twice). */
function distinctPoints(points: readonly Point[]): Point[] {
  const kept: Point[] = []
  for (const point of points) {
    const last = kept[kept.length - 1]
    if (!last || distance(last, point) > VERTEX_MERGE_INCHES) kept.push(point)
  }
  return kept
}

/**
 * The control point after `from` of the piece from → to, with `before` the point preceding
 * `from` (Yuksel et al. 2011, §3, with d = |Δ|^α):
 * (d₁²·to − d₂²·before + (2d₁² + 3d₁d₂ + d₂²)·from) / (3d₁(d₁ + d₂)).
 */
function controlAfter(before: Point, from: Point, to: Point): Point {
  const d1 = distance(before, from) ** CENTRIPETAL_ALPHA
  const d2 = distance(from, to) ** CENTRIPETAL_ALPHA
  const weight = 2 * d1 * d1 + 3 * d1 * d2 + d2 * d2
  const denominator = 3 * d1 * (d1 + d2)
  return [
    (d1 * d1 * to[0] - d2 * d2 * before[0] + weight * from[0]) / denominator,
    (d1 * d1 * to[1] - d2 * d2 * before[1] + weight * from[1]) / denominator,
  ]
}

/**
 * The smooth curve through the points, in the points' own frame and units. It passes through
 * every point in order, is tangent-continuous at each of them (except where the points turn
 * straight back on themselves: the tangent there is zero, a cusp), and is a straight segment for two.
 *
 * @example
 * smoothCurve([[0, 0], [1, 0]])
 * // { start: [0, 0], pieces: [[[1/3, 0], [2/3, 0], [1, 0]]] }
 */
export function smoothCurve(points: readonly Point[]): SmoothCurve {
  const distinct = distinctPoints(points)
  const first = distinct[0]
  if (!first) return { start: [0, 0], pieces: [] }
  const pieces: BezierPiece[] = []
  for (let i = 0; i + 1 < distinct.length; i += 1) {
    const from = distinct[i]!
    const to = distinct[i + 1]!
    // Phantom neighbours at the ends, mirrored through the end point.
    const before = distinct[i - 1] ?? subtract(scale(from, 2), to)
    const after = distinct[i + 2] ?? subtract(scale(to, 2), from)
    pieces.push([controlAfter(before, from, to), controlAfter(after, to, from), to])
  }
  return { start: first, pieces }
}

/**
 * The point at parameter t (0..1) of the Bézier piece that starts at `from`.
 *
 * @example bezierPoint([0, 0], [[0, 1], [1, 1], [1, 0]], 0.5) // [0.5, 0.75]
 */
export function bezierPoint(from: Point, piece: BezierPiece, t: number): Point {
  const u = 1 - t
  const [c1, c2, end] = piece
  return add(add(scale(from, u * u * u), scale(c1, 3 * u * u * t)), add(scale(c2, 3 * u * t * t), scale(end, t * t * t)))
}

/**
 * The curve as a polyline: `steps` points per piece after the start (for hit tests and
 * polygon work; drawing uses the Bézier pieces themselves).
 *
 * @example sampleSmoothCurve(smoothCurve([[0, 0], [1, 0]]), 4).length // 5
 */
export function sampleSmoothCurve(curve: SmoothCurve, steps = 16): Point[] {
  const points: Point[] = [curve.start]
  let from = curve.start
  for (const piece of curve.pieces) {
    for (let k = 1; k <= steps; k += 1) points.push(k === steps ? piece[2] : bezierPoint(from, piece, k / steps))
    from = piece[2]
  }
  return points
}

/**
 * The curve with every control point moved by `transform` (exact for affine maps: rotations,
 * reflections, the screen and the page).
 *
 * @example mapSmoothCurve(smoothCurve([[0, 0], [1, 0]]), ([x, y]) => [2 * x, y]).pieces[0]![2] // [2, 0]
 */
export function mapSmoothCurve(curve: SmoothCurve, transform: (p: Point) => Point): SmoothCurve {
  return {
    start: transform(curve.start),
    pieces: curve.pieces.map(([c1, c2, end]) => [transform(c1), transform(c2), transform(end)] as const),
  }
}
