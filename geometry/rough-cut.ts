/**
 * Rough-cut pieces: the rectangle of fabric a maker cuts for one area before sewing it.
 *
 * Flip-and-sew: the piece is laid right side down over the areas already sewn, its edge lined up
 * past the sewing line, sewn on the line, then flipped over the new area. So the rectangle is
 * aligned with the sewing line, and after the flip it must cover the area's cutting shape
 * (area + allowance). `corners` describes it after the flip; `roughCutBeforeFlip` gives where it
 * lies before (its mirror image across the sewing line), for the board and the booklet.
 *
 * Where the margin goes:
 * - an area sewn along a line: the seam-side edge lies exactly one allowance past the sewing
 *   line (no margin there: that edge is the one the maker lines up 1/4 in past the printed
 *   line, common practice); the margin is added at both ends along the line and on the far side;
 *   rounding up to 1/8 in adds its extra equally at both ends along the line, and all of it on
 *   the far side across the line, so the seam-side edge never moves;
 * - a size no more than 1/64 in over a 1/8 in step is cut at that step and the margin gives up
 *   that little (`MARGIN_ROUNDING_SLACK_INCHES`; never more than the margin, so the cutting
 *   shape is always covered);
 * - a section's first area (no sewing line): the margin goes on all four sides and each
 *   rounding extra is shared equally by the two opposite sides.
 */
import {
  DUPLICATE_POINT_INCHES, MARGIN_ROUNDING_SLACK_INCHES, RECTANGLE_AREA_TIE_SQ_IN, ROUNDING_SLACK_INCHES,
} from './tolerances'
import { cuttingShape, DEFAULT_SEAM_ALLOWANCE_INCHES } from './offset'
import { orientation } from './orientation'
import type { Point, Polygon, Segment } from './types'
import { cross, dot, subtract } from './vector'

/** Default extra fabric around the cutting shape, inches; a designer's setting. */
export const DEFAULT_ROUGH_CUT_MARGIN_INCHES = 0.25
/** Rotary-cutting rulers are marked in 1/8 in (common practice), so sizes are rounded up to it. */
export const ROUGH_CUT_STEP_INCHES = 1 / 8

export interface RoughCut {
  /** Length of the first edge (along the sewing line), inches, a multiple of 1/8. */
  readonly widthIn: number
  /** Length of the second edge (across the sewing line), inches, a multiple of 1/8. */
  readonly heightIn: number
  /**
   * The rectangle as it lies after the flip, covering the area: counter-clockwise, repeat 0's
   * frame; its first edge is the seam-side edge, parallel to the sewing line.
   */
  readonly corners: readonly Point[]
}

export interface RoughCutOptions {
  /** Default 1/4 in. */
  readonly seamAllowanceInches?: number
  /** Default 1/4 in. */
  readonly marginInches?: number
}

/**
 * Rounds a length up to the next 1/8 in, ignoring floating-point noise below a millionth.
 *
 * @example roundUpToEighthInch(2.854) // 2.875
 */
export function roundUpToEighthInch(inches: number): number {
  return Math.ceil((inches - ROUNDING_SLACK_INCHES) / ROUGH_CUT_STEP_INCHES) * ROUGH_CUT_STEP_INCHES
}

/**
 * Convex hull, counter-clockwise, without collinear points (Andrew's monotone chain).
 *
 * @example convexHull([[0, 0], [1, 1], [2, 0], [1, 2], [0, 2]]) // [[0,0],[2,0],[1,2],[0,2]]
 */
export function convexHull(points: readonly Point[]): Polygon {
  const sorted = [...points].sort((a, b) => a[0] - b[0] || a[1] - b[1])
  const half = (list: readonly Point[]): Point[] => {
    const chain: Point[] = []
    for (const point of list) {
      while (chain.length >= 2 && orientation(chain[chain.length - 2]!, chain[chain.length - 1]!, point) <= 0) chain.pop()
      chain.push(point)
    }
    chain.pop()
    return chain
  }
  return [...half(sorted), ...half([...sorted].reverse())]
}

/** A rectangle in a right-handed frame: `along` is the first edge's direction, `across` its left. */
interface FramedRectangle {
  readonly origin: Point
  readonly along: Point
  readonly minAlong: number
  readonly maxAlong: number
  readonly minAcross: number
  readonly maxAcross: number
}

const leftOf = (direction: Point): Point => [-direction[1], direction[0]]

function cornersOf(rectangle: FramedRectangle): Point[] {
  const { origin, along, minAlong, maxAlong, minAcross, maxAcross } = rectangle
  const across = leftOf(along)
  const at = (a: number, b: number): Point =>
    [origin[0] + along[0] * a + across[0] * b, origin[1] + along[1] * a + across[1] * b]
  return [at(minAlong, minAcross), at(maxAlong, minAcross), at(maxAlong, maxAcross), at(minAlong, maxAcross)]
}

function bounds(points: readonly Point[], origin: Point, along: Point) {
  const across = leftOf(along)
  const alongValues = points.map((p) => dot(subtract(p, origin), along))
  const acrossValues = points.map((p) => dot(subtract(p, origin), across))
  return {
    minAlong: Math.min(...alongValues), maxAlong: Math.max(...alongValues),
    minAcross: Math.min(...acrossValues), maxAcross: Math.max(...acrossValues),
  }
}

/**
 * Grows [min, max] to a rounded-up length, sharing the extra between the ends as asked. A span
 * at most `slack` over a 1/8 in step is cut at that step, the excess taken from the margin.
 */
function roundedSpan(min: number, max: number, shareAtMin: number, slack: number): [number, number] {
  const extra = roundUpToEighthInch(max - min - slack) - (max - min)
  return [min - extra * shareAtMin, max + extra * (1 - shareAtMin)]
}

/**
 * Every rectangle that can be the smallest around the points: a minimum rectangle has a side on
 * a hull edge (the rotating-calipers theorem), so each hull edge gives one candidate. Hulls have
 * tens of corners, so trying each (O(n²)) is simpler than walking the calipers.
 */
function caliperRectangles(points: readonly Point[]): FramedRectangle[] {
  const hull = convexHull(points)
  const candidates: FramedRectangle[] = []
  for (let i = 0; i < hull.length; i += 1) {
    const edge = subtract(hull[(i + 1) % hull.length]!, hull[i]!)
    const edgeLength = Math.hypot(edge[0], edge[1])
    if (edgeLength <= DUPLICATE_POINT_INCHES) continue
    const along: Point = [edge[0] / edgeLength, edge[1] / edgeLength]
    candidates.push({ origin: hull[i]!, along, ...bounds(hull, hull[i]!, along) })
  }
  if (candidates.length === 0) throw new RangeError('a rough cut needs an area with a positive size')
  return candidates
}

/**
 * A section's first piece: of the caliper rectangles grown by the margin and rounded up, the one
 * whose cut piece is smallest. Choosing by the rounded size (what the maker actually cuts), with
 * the shorter long side as the tie-break, keeps the answer the same however the area is turned;
 * choosing by the unrounded area flipped between two near-equal rectangles of different sizes.
 */
function firstPieceRectangle(shape: readonly Point[], margin: number, slack: number): FramedRectangle {
  let best: { rectangle: FramedRectangle; area: number; longSide: number } | null = null
  for (const candidate of caliperRectangles(shape)) {
    const [minAlong, maxAlong] = roundedSpan(candidate.minAlong - margin, candidate.maxAlong + margin, 0.5, slack)
    const [minAcross, maxAcross] = roundedSpan(candidate.minAcross - margin, candidate.maxAcross + margin, 0.5, slack)
    const width = roundUpToEighthInch(maxAlong - minAlong)
    const height = roundUpToEighthInch(maxAcross - minAcross)
    const area = width * height
    const longSide = Math.max(width, height)
    const better =
      !best || area < best.area - RECTANGLE_AREA_TIE_SQ_IN || (Math.abs(area - best.area) <= RECTANGLE_AREA_TIE_SQ_IN && longSide < best.longSide - RECTANGLE_AREA_TIE_SQ_IN)
    if (better) best = { rectangle: { ...candidate, minAlong, maxAlong, minAcross, maxAcross }, area, longSide }
  }
  const chosen = best!.rectangle
  // The first edge is a long side, so `widthIn ≥ heightIn` for first areas.
  if (chosen.maxAcross - chosen.minAcross <= chosen.maxAlong - chosen.minAlong) return chosen
  const along = leftOf(chosen.along)
  const corners = cornersOf(chosen)
  return { origin: chosen.origin, along, ...bounds(corners, chosen.origin, along) }
}

/**
 * The rough-cut rectangle for an area sewn along `sewnAlong` (null for a section's first area):
 * aligned with the sewing line with its seam-side edge one allowance past it, covering the
 * cutting shape after the flip, plus the margin (see the file comment for where it goes), both
 * sides rounded up to 1/8 in.
 *
 * @example
 * // A 2 × 1 in area sewn along its bottom edge:
 * roughCutPiece([[0, 0], [2, 0], [2, 1], [0, 1]], [[0, 0], [2, 0]])
 * // { widthIn: 3, heightIn: 1.75, corners: [[-0.5, -0.25], [2.5, -0.25], [2.5, 1.5], [-0.5, 1.5]] }
 * // width: 2 + 2 × 1/4 allowance + 2 × 1/4 margin = 3; height: 1 + 2 × 1/4 allowance + 1/4 margin = 1.75
 */
export function roughCutPiece(area: Polygon, sewnAlong: Segment | null, options: RoughCutOptions = {}): RoughCut {
  const allowance = options.seamAllowanceInches ?? DEFAULT_SEAM_ALLOWANCE_INCHES
  const margin = options.marginInches ?? DEFAULT_ROUGH_CUT_MARGIN_INCHES
  if (!(margin >= 0) || !Number.isFinite(margin)) throw new RangeError(`margin must be a finite length ≥ 0, got ${margin}`)
  const shape = cuttingShape(area, { seamAllowanceInches: allowance })
  // Never more than the margin itself, so the cutting shape is always covered.
  const slack = Math.min(MARGIN_ROUNDING_SLACK_INCHES, margin)

  if (sewnAlong === null) {
    return toRoughCut(firstPieceRectangle(shape, margin, slack))
  }

  const [from, to] = sewnAlong
  const line = subtract(to, from)
  const lineLength = Math.hypot(line[0], line[1])
  if (lineLength <= DUPLICATE_POINT_INCHES) throw new RangeError('the sewing line must have a length')
  const direction: Point = [line[0] / lineLength, line[1] / lineLength]
  // The area lies on one side of its sewing line; the frame is turned so that side is "across".
  const acrossValues = area.map((p) => cross(direction, subtract(p, from)))
  const areaOnLeft = Math.max(...acrossValues) >= -Math.min(...acrossValues)
  const along: Point = areaOnLeft ? direction : [-direction[0], -direction[1]]
  const box = bounds(shape, from, along)
  // The seam-side edge is one allowance past the line; only an area that reaches back over its
  // own sewing line (never a convex one) would push it farther, and then it covers that too.
  const seamSide = Math.min(-allowance, box.minAcross)
  const [minAlong, maxAlong] = roundedSpan(box.minAlong - margin, box.maxAlong + margin, 0.5, slack)
  const [minAcross, maxAcross] = roundedSpan(seamSide, box.maxAcross + margin, 0, slack)
  return toRoughCut({ origin: from, along, minAlong, maxAlong, minAcross, maxAcross })
}

function toRoughCut(rectangle: FramedRectangle): RoughCut {
  return {
    widthIn: roundUpToEighthInch(rectangle.maxAlong - rectangle.minAlong),
    heightIn: roundUpToEighthInch(rectangle.maxAcross - rectangle.minAcross),
    corners: cornersOf(rectangle),
  }
}

/**
 * Mirror image of a point across the line through a segment.
 *
 * @example mirrorAcross([1, 1], [[0, 0], [2, 0]]) // [1, -1]
 */
export function mirrorAcross(point: Point, line: Segment): Point {
  const [from, to] = line
  const direction = subtract(to, from)
  const offset = subtract(point, from)
  const t = dot(offset, direction) / dot(direction, direction)
  const foot: Point = [from[0] + direction[0] * t, from[1] + direction[1] * t]
  return [2 * foot[0] - point[0], 2 * foot[1] - point[1]]
}

/**
 * Where the piece lies before the flip: right side down over the areas already sewn, the mirror
 * image of `corners` across the sewing line (the line to pre-fold the paper on). Counter-clockwise;
 * its first edge is again the seam-side edge, now one allowance past the line on the new area's
 * side.
 *
 * @example
 * roughCutBeforeFlip(roughCutPiece([[0, 0], [2, 0], [2, 1], [0, 1]], [[0, 0], [2, 0]]), [[0, 0], [2, 0]])
 * // [[2.5, 0.25], [-0.5, 0.25], [-0.5, -1.5], [2.5, -1.5]]
 */
export function roughCutBeforeFlip(cut: RoughCut, sewnAlong: Segment): Polygon {
  const mirrored = cut.corners.map((corner) => mirrorAcross(corner, sewnAlong))
  // A mirror turns the order clockwise; reading it backwards from the second corner restores
  // counter-clockwise order and keeps the seam-side edge first.
  const [a, b, c, d] = mirrored as [Point, Point, Point, Point]
  return [b, a, d, c]
}
