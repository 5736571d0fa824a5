/**
 * Small measurements of points, segments and simple polygons used by the arrangement and the
 * plan: signed area, centroid, containment, distances, and a point well inside an area.
 */
import { CLEARANCE_TIE_FRACTION } from './tolerances'
import type { Point, Polygon } from './types'

/**
 * Signed area of a simple polygon: positive when counter-clockwise (y up). Square inches.
 *
 * @example signedArea([[0, 0], [1, 0], [1, 1], [0, 1]]) // 1
 */
export function signedArea(polygon: Polygon): number {
  let twice = 0
  for (let i = 0; i < polygon.length; i += 1) {
    const a = polygon[i] as Point
    const b = polygon[(i + 1) % polygon.length] as Point
    twice += a[0] * b[1] - b[0] * a[1]
  }
  return twice / 2
}

/**
 * Centroid of the polygon's surface (not of its corners).
 *
 * @example polygonCentroid([[0, 0], [2, 0], [2, 2], [0, 2]]) // [1, 1]
 */
export function polygonCentroid(polygon: Polygon): Point {
  let twice = 0
  let cx = 0
  let cy = 0
  // Relative to the first corner, so far-from-origin polygons keep their precision.
  const origin = polygon[0] as Point
  for (let i = 0; i < polygon.length; i += 1) {
    const a = polygon[i] as Point
    const b = polygon[(i + 1) % polygon.length] as Point
    const ax = a[0] - origin[0]
    const ay = a[1] - origin[1]
    const bx = b[0] - origin[0]
    const by = b[1] - origin[1]
    const cross = ax * by - bx * ay
    twice += cross
    cx += (ax + bx) * cross
    cy += (ay + by) * cross
  }
  if (twice === 0) return origin
  return [origin[0] + cx / (3 * twice), origin[1] + cy / (3 * twice)]
}

/**
 * Whether a point lies inside a simple polygon (even-odd rule; points on the boundary may fall
 * either way, callers test points well inside or well outside).
 *
 * @example isPointInPolygon([0.5, 0.5], [[0, 0], [1, 0], [1, 1], [0, 1]]) // true
 */
export function isPointInPolygon(point: Point, polygon: Polygon): boolean {
  let inside = false
  const [x, y] = point
  for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i, i += 1) {
    const a = polygon[i] as Point
    const b = polygon[j] as Point
    if (a[1] > y !== b[1] > y) {
      const crossingX = a[0] + ((y - a[1]) * (b[0] - a[0])) / (b[1] - a[1])
      if (x < crossingX) inside = !inside
    }
  }
  return inside
}

/**
 * The point of segment a–b nearest to p, and its parameter t in [0, 1] from a.
 *
 * @example nearestOnSegment([1, 1], [0, 0], [2, 0]) // { point: [1, 0], t: 0.5 }
 */
export function nearestOnSegment(p: Point, a: Point, b: Point): { readonly point: Point; readonly t: number } {
  const dx = b[0] - a[0]
  const dy = b[1] - a[1]
  const lengthSquared = dx * dx + dy * dy
  if (lengthSquared === 0) return { point: a, t: 0 }
  const t = Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / lengthSquared))
  return { point: [a[0] + t * dx, a[1] + t * dy], t }
}

/**
 * Distance between two points.
 *
 * @example distance([0, 0], [3, 4]) // 5
 */
export function distance(a: Point, b: Point): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1])
}

/**
 * Distance from p to the segment a–b.
 *
 * @example distanceToSegment([1, 1], [0, 0], [2, 0]) // 1
 */
export function distanceToSegment(p: Point, a: Point, b: Point): number {
  return distance(p, nearestOnSegment(p, a, b).point)
}

/**
 * Distance from p to the polygon's boundary.
 *
 * @example distanceToBoundary([1, 1], [[0, 0], [2, 0], [2, 2], [0, 2]]) // 1
 */
export function distanceToBoundary(p: Point, polygon: Polygon): number {
  let best = Infinity
  for (let i = 0; i < polygon.length; i += 1) {
    const d = distanceToSegment(p, polygon[i] as Point, polygon[(i + 1) % polygon.length] as Point)
    if (d < best) best = d
  }
  return best
}

/**
 * Lexicographic comparison of points (x, then y): the tie-break that keeps results deterministic.
 *
 * @example [[1, 2], [0, 5]].sort(comparePoints) // [[0, 5], [1, 2]]
 */
export function comparePoints(a: Point, b: Point): number {
  return a[0] - b[0] || a[1] - b[1]
}

/**
 * A point well inside a simple polygon, found deterministically: the middle of the widest
 * horizontal run at a few heights (the centroid's and the quarters of the height), keeping the
 * one farthest from the boundary (candidates as clear as the best, to a millionth, lose to the
 * earlier one, so the same area at another size gets the same point, scaled). Cheaper than a
 * pole of inaccessibility and always inside.
 *
 * @example interiorPoint([[0, 0], [4, 0], [4, 1], [0, 1]]) // [2, 0.5]
 */
export function interiorPoint(polygon: Polygon): Point {
  let minY = Infinity
  let maxY = -Infinity
  for (const p of polygon) {
    if (p[1] < minY) minY = p[1]
    if (p[1] > maxY) maxY = p[1]
  }
  const centroid = polygonCentroid(polygon)
  const heights = [centroid[1], minY + (maxY - minY) * 0.5, minY + (maxY - minY) * 0.25, minY + (maxY - minY) * 0.75]
  let best: Point = centroid
  let bestClearance = isPointInPolygon(centroid, polygon) ? distanceToBoundary(centroid, polygon) : -1
  for (const y of heights) {
    const crossings: number[] = []
    for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i, i += 1) {
      const a = polygon[i] as Point
      const b = polygon[j] as Point
      if (a[1] > y !== b[1] > y) crossings.push(a[0] + ((y - a[1]) * (b[0] - a[0])) / (b[1] - a[1]))
    }
    crossings.sort((p, q) => p - q)
    for (let k = 0; k + 1 < crossings.length; k += 2) {
      const candidate: Point = [((crossings[k] as number) + (crossings[k + 1] as number)) / 2, y]
      const clearance = distanceToBoundary(candidate, polygon)
      // A tie keeps the earlier candidate: noise from the design's size must not move the point.
      if (clearance > bestClearance * (1 + CLEARANCE_TIE_FRACTION)) {
        best = candidate
        bestClearance = clearance
      }
    }
  }
  return best
}
