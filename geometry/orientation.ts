/**
 * The one place the core asks which side of a line a point lies on.
 *
 * robust-predicates' `orient2d` calls "counter-clockwise" what is counter-clockwise on a screen,
 * with y pointing down; in our y-up frame the same value has the opposite sign. The wrapper
 * flips it once, here, so every caller reads "positive = left turn = counter-clockwise".
 */
import { orient2d } from 'robust-predicates'
import type { Point } from './types'

/**
 * Twice the signed area of triangle a, b, c in the y-up frame: positive when c lies to the left
 * of the directed line a → b (a counter-clockwise turn), negative to the right, exactly 0 when
 * the three points are collinear (robust: no rounding error decides the sign).
 *
 * @example orientation([0, 0], [1, 0], [0, 1]) // > 0: (0,1) is left of the x axis, y up
 */
export function orientation(a: Point, b: Point, c: Point): number {
  return -orient2d(a[0], a[1], b[0], b[1], c[0], c[1])
}

/**
 * Signed distance of c from the line through a and b, in the units of the points (inches):
 * positive on the left. 0 when a and b coincide.
 *
 * @example signedDistanceToLine([0, 0], [2, 0], [1, 0.5]) // 0.5
 */
export function signedDistanceToLine(a: Point, b: Point, c: Point): number {
  const length = Math.hypot(b[0] - a[0], b[1] - a[1])
  return length === 0 ? 0 : orientation(a, b, c) / length
}
