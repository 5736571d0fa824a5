/**
 * Cutting shapes: an area's polygon grown outward by the seam allowance, with mitred corners
 * and a mitre limit.
 *
 * Why our own offset and not clipper2-ts inside the core: the areas the core offsets are small
 * (tens of corners), nearly always convex (faces of straight seams in a convex sector, the only
 * reflex corners being chords of the inner circle), and we want exact mitre points in inches
 * without a round trip through Clipper's integer grid. The common case is built directly (each
 * edge moved out by the allowance, neighbours joined at their mitre); when that outline is not
 * a simple polygon (a notch narrower than two allowances, an edge swallowed by its neighbours)
 * we fall back to the definition itself: the union of the area, one band per edge and one join
 * cap per convex corner, computed with polygon-clipping (clipper2-ts's union if that fails; see
 * `unitePieces`). The tests compare both paths with
 * clipper2-ts 2.0.1's own mitred offset and with the closed-form area of a convex offset, so
 * the check is always something outside this file.
 *
 * Mitre limit, as Clipper2 defines it: a corner keeps its mitre while the mitre point lies
 * within `mitreLimit` × allowance of the corner; beyond that the point is cut square,
 * perpendicular to the corner's bisector, one allowance out from the corner. That square cut is
 * the least cut that still leaves a full allowance all round the point.
 */
import { FillRule, unionD } from 'clipper2-ts'
import polygonClipping from 'polygon-clipping'
import { orientation } from './orientation'
import { CLIPPER_PRECISION_DIGITS, DUPLICATE_POINT_INCHES, REVERSAL_COSINE, STRAIGHT_TURN_SINE } from './tolerances'
import type { Point, Polygon } from './types'
import { add, cross, dot, scale, subtract, type Vector } from './vector'

/** Quarter-inch seam allowance (common practice, universal in quilt piecing). */
export const DEFAULT_SEAM_ALLOWANCE_INCHES = 0.25
/**
 * Mitre limit in allowances: Clipper2's default, and it keeps a 60° point (mitre at exactly
 * 2 allowances) while trimming sharper ones, as quilters trim the "dog ears" of 45° points.
 */
export const DEFAULT_MITRE_LIMIT = 2

export interface CuttingShapeOptions {
  /** Default 1/4 in. */
  readonly seamAllowanceInches?: number
  /** Multiples of the allowance; Infinity keeps every mitre. Default 2. */
  readonly mitreLimit?: number
}

const length = (a: Vector): number => Math.hypot(a[0], a[1])
const unit = (a: Vector): Point => scale(a, 1 / length(a))

/**
 * Signed area (shoelace), square inches: positive when the polygon is counter-clockwise.
 *
 * @example polygonArea([[0, 0], [2, 0], [2, 2], [0, 2]]) // 4
 */
export function polygonArea(polygon: Polygon): number {
  let sum = 0
  for (let i = 0; i < polygon.length; i += 1) {
    const a = polygon[i]!
    const b = polygon[(i + 1) % polygon.length]!
    sum += a[0] * b[1] - b[0] * a[1]
  }
  return sum / 2
}

/**
 * The polygon without repeated corners or a repeated closing point, counter-clockwise.
 * Designers' areas come counter-clockwise already; a clockwise one is turned round rather than
 * offset inward by mistake.
 *
 * @example normalizeRing([[0, 0], [0, 1], [1, 1], [1, 0], [0, 0]]) // [[1,0],[1,1],[0,1],[0,0]]
 */
export function normalizeRing(polygon: Polygon): Polygon {
  const ring: Point[] = []
  for (const point of polygon) {
    const previous = ring[ring.length - 1]
    if (previous === undefined || length(subtract(point, previous)) > DUPLICATE_POINT_INCHES) ring.push(point)
  }
  while (ring.length > 1 && length(subtract(ring[0]!, ring[ring.length - 1]!)) <= DUPLICATE_POINT_INCHES) ring.pop()
  return polygonArea(ring) < 0 ? ring.reverse() : ring
}

/** Outward unit normal of the edge a → b of a counter-clockwise polygon (its right side). */
const outwardNormal = (a: Point, b: Point): Point => {
  const direction = unit(subtract(b, a))
  return [direction[1], -direction[0]]
}

/** The points that join the offsets of the edges before and after `corner`. */
function joinPoints(
  corner: Point,
  normalIn: Point,
  normalOut: Point,
  allowance: number,
  mitreLimit: number,
): Point[] {
  const cosine = dot(normalIn, normalOut)
  const sine = cross(normalIn, normalOut)
  // Convex corners (and reflex ones too: the same formula meets the two offset lines there).
  const mitreFits = 1 + cosine >= 2 / (mitreLimit * mitreLimit)
  if (sine < STRAIGHT_TURN_SINE || mitreFits) {
    return [add(corner, scale(add(normalIn, normalOut), allowance / (1 + cosine)))]
  }
  // Square cut: the bisector as Clipper2 takes it (mean of the incoming edge direction and the
  // reversed outgoing one), robust even for a point turned almost all the way back.
  const directionIn: Point = [-normalIn[1], normalIn[0]]
  const directionOut: Point = [-normalOut[1], normalOut[0]]
  const bisector = unit(subtract(directionIn, directionOut))
  const cutCentre = add(corner, scale(bisector, allowance))
  const onCut = (normal: Point, direction: Point): Point => {
    const base = add(corner, scale(normal, allowance))
    const along = dot(subtract(cutCentre, base), bisector) / dot(direction, bisector)
    return add(base, scale(direction, along))
  }
  return [onCut(normalIn, directionIn), onCut(normalOut, directionOut)]
}

function segmentsCross(a: Point, b: Point, c: Point, d: Point): boolean {
  const side = (p: Point, q: Point, r: Point): number => Math.sign(orientation(p, q, r))
  const d1 = side(c, d, a)
  const d2 = side(c, d, b)
  const d3 = side(a, b, c)
  const d4 = side(a, b, d)
  if (d1 !== d2 && d3 !== d4) return true
  // Collinear overlaps count as crossings: the fallback handles them.
  return (d1 === 0 && d2 === 0 && d3 === 0 && d4 === 0 &&
    Math.max(Math.min(a[0], b[0]), Math.min(c[0], d[0])) <= Math.min(Math.max(a[0], b[0]), Math.max(c[0], d[0])) &&
    Math.max(Math.min(a[1], b[1]), Math.min(c[1], d[1])) <= Math.min(Math.max(a[1], b[1]), Math.max(c[1], d[1])))
}

/**
 * True when no two non-adjacent edges of the ring meet. O(n²): areas have tens of corners.
 *
 * @example isSimpleRing([[0, 0], [2, 2], [2, 0], [0, 2]]) // false: a bow tie
 */
export function isSimpleRing(ring: Polygon): boolean {
  const count = ring.length
  for (let i = 0; i < count; i += 1) {
    for (let j = i + 2; j < count; j += 1) {
      if (i === 0 && j === count - 1) continue
      if (segmentsCross(ring[i]!, ring[(i + 1) % count]!, ring[j]!, ring[(j + 1) % count]!)) return false
    }
  }
  return true
}

/** The direct construction; null when it does not describe the offset (see the file comment). */
function directOffset(ring: Polygon, allowance: number, mitreLimit: number): Polygon | null {
  const count = ring.length
  const normals = ring.map((point, i) => outwardNormal(point, ring[(i + 1) % count]!))
  const joins = ring.map((corner, i) => {
    const normalIn = normals[(i + count - 1) % count]!
    const normalOut = normals[i]!
    // A reflex point turned all the way back cannot be met by intersecting its offset lines.
    if (cross(normalIn, normalOut) < 0 && dot(normalIn, normalOut) < REVERSAL_COSINE) return null
    return joinPoints(corner, normalIn, normalOut, allowance, mitreLimit)
  })
  if (joins.some((join) => join === null)) return null
  const outline: Point[] = []
  for (let i = 0; i < count; i += 1) {
    const start = joins[i]!
    const end = joins[(i + 1) % count]!
    // Each offset edge must run the way its edge runs; reversed, it was swallowed by neighbours.
    const edgeDirection = subtract(ring[(i + 1) % count]!, ring[i]!)
    if (dot(subtract(end[0]!, start[start.length - 1]!), edgeDirection) < 0) return null
    outline.push(...start)
  }
  const cleaned = normalizeRing(outline)
  if (polygonArea(cleaned) <= 0 || !isSimpleRing(cleaned)) return null
  return cleaned
}

/** The offset by definition: area ∪ edge bands ∪ convex join caps, outer boundary only. */
function unionOffset(ring: Polygon, allowance: number, mitreLimit: number): Polygon {
  const count = ring.length
  const pieces: [number, number][][] = [ring.map(([x, y]) => [x, y])]
  for (let i = 0; i < count; i += 1) {
    const a = ring[i]!
    const b = ring[(i + 1) % count]!
    const normal = outwardNormal(a, b)
    pieces.push([a, add(a, scale(normal, allowance)), add(b, scale(normal, allowance)), b].map(([x, y]) => [x, y]))
    const normalIn = normals(ring, (i + count - 1) % count)
    const normalOut = normal
    if (cross(normalIn, normalOut) > STRAIGHT_TURN_SINE) {
      const cap = [a, add(a, scale(normalIn, allowance)), ...joinPoints(a, normalIn, normalOut, allowance, mitreLimit),
        add(a, scale(normalOut, allowance))]
      pieces.push(cap.map(([x, y]) => [x, y]))
    }
  }
  const outerRings = unitePieces(pieces)
  let best: Polygon = ring
  let bestArea = -Infinity
  for (const outerRing of outerRings) {
    // A cutting shape is one piece of fabric: holes (a nearly closed C) are filled.
    const outer = normalizeRing(outerRing)
    const area = polygonArea(outer)
    if (area > bestArea) {
      best = outer
      bestArea = area
    }
  }
  return best
}

/**
 * Outer rings of the union of counter-clockwise pieces (holes dropped). polygon-clipping works in
 * floating point and keeps our exact coordinates, but 0.15.7 can fail to close a ring on
 * near-degenerate input (seen about once in 500 unions of spiky polygons); clipper2-ts then
 * unites on its 1e-8 in integer grid, which cannot fail that way.
 *
 * @example unitePieces([[[0, 0], [1, 0], [1, 1], [0, 1]], [[1, 0], [2, 0], [2, 1], [1, 1]]])
 * // one ring: the 2 × 1 in rectangle
 */
export function unitePieces(pieces: readonly (readonly Point[])[]): Point[][] {
  const asRings = pieces.map((piece): polygonClipping.Polygon => [piece.map(([x, y]): [number, number] => [x, y])])
  try {
    const [first, ...rest] = asRings
    return polygonClipping.union(first!, ...rest).map((polygon) => (polygon[0] ?? []).map(([x, y]): Point => [x, y]))
  } catch {
    const united = unionD(pieces.map((piece) => piece.map(([x, y]) => ({ x, y }))), [], FillRule.NonZero, CLIPPER_PRECISION_DIGITS)
    return united.map((path) => path.map(({ x, y }): Point => [x, y]))
  }
}

const normals = (ring: Polygon, i: number): Point => outwardNormal(ring[i]!, ring[(i + 1) % ring.length]!)

/**
 * The cutting shape of an area: its polygon offset outward by the seam allowance, corners
 * mitred, points sharper than the mitre limit cut square one allowance from the corner.
 * Input and output are counter-clockwise, in inches; the input is never changed.
 *
 * @example
 * cuttingShape([[0, 0], [2, 0], [2, 2], [0, 2]])
 * // [[-0.25, -0.25], [2.25, -0.25], [2.25, 2.25], [-0.25, 2.25]]: a 2 in square cuts at 2.5 in
 */
export function cuttingShape(area: Polygon, options: CuttingShapeOptions = {}): Polygon {
  const allowance = options.seamAllowanceInches ?? DEFAULT_SEAM_ALLOWANCE_INCHES
  const mitreLimit = options.mitreLimit ?? DEFAULT_MITRE_LIMIT
  if (!(allowance >= 0) || !Number.isFinite(allowance)) {
    throw new RangeError(`seam allowance must be a finite length ≥ 0, got ${allowance}`)
  }
  if (!(mitreLimit >= 1)) throw new RangeError(`mitre limit must be ≥ 1 allowance, got ${mitreLimit}`)
  const ring = normalizeRing(area)
  if (ring.length < 3) throw new RangeError('an area needs at least three distinct corners')
  if (allowance === 0) return ring
  return directOffset(ring, allowance, mitreLimit) ?? unionOffset(ring, allowance, mitreLimit)
}
