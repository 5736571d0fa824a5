/**
 * Mirroring and repeats: the printed side of a foundation, the transforms that place every repeat
 * of the ring, and scaling a design to another finished size.
 */
import { SIMILARITY_SLACK } from './tolerances'
import { scaleDesignLengths } from './design-lengths'
import type { OutlinePath, PathSegment } from './trim-line'
import type { Design, Point, Polygon, Ring } from './types'

/** x' = xx·x + xy·y + tx, y' = yx·x + yy·y + ty, in repeat 0's frame (inches). */
export interface AffineTransform {
  readonly xx: number
  readonly xy: number
  readonly yx: number
  readonly yy: number
  readonly tx: number
  readonly ty: number
}

export const IDENTITY: AffineTransform = { xx: 1, xy: 0, yx: 0, yy: 1, tx: 0, ty: 0 }

/**
 * Rotation about the ring's centre, counter-clockwise.
 *
 * @example applyTransform(rotationAboutCentre(Math.PI / 2), [1, 0]) // ≈ [0, 1]
 */
export function rotationAboutCentre(angle: number): AffineTransform {
  const cos = Math.cos(angle)
  const sin = Math.sin(angle)
  return { xx: cos, xy: -sin, yx: sin, yy: cos, tx: 0, ty: 0 }
}

/**
 * Reflection across the line through the ring's centre at polar angle `angle`.
 *
 * @example applyTransform(reflectionAcrossRadius(Math.PI / 4), [1, 0]) // ≈ [0, 1]
 */
export function reflectionAcrossRadius(angle: number): AffineTransform {
  const cos = Math.cos(2 * angle)
  const sin = Math.sin(2 * angle)
  return { xx: cos, xy: sin, yx: sin, yy: -cos, tx: 0, ty: 0 }
}

/**
 * `outer ∘ inner`: first `inner`, then `outer`.
 *
 * @example compose(rotationAboutCentre(1), rotationAboutCentre(2)) // rotation by 3 rad
 */
export function compose(outer: AffineTransform, inner: AffineTransform): AffineTransform {
  return {
    xx: outer.xx * inner.xx + outer.xy * inner.yx,
    xy: outer.xx * inner.xy + outer.xy * inner.yy,
    yx: outer.yx * inner.xx + outer.yy * inner.yx,
    yy: outer.yx * inner.xy + outer.yy * inner.yy,
    tx: outer.xx * inner.tx + outer.xy * inner.ty + outer.tx,
    ty: outer.yx * inner.tx + outer.yy * inner.ty + outer.ty,
  }
}

/**
 * True when the transform turns the plane over (a mirror image), so orientations flip.
 *
 * @example isReflection(reflectionAcrossRadius(0)) // true
 */
export const isReflection = (transform: AffineTransform): boolean =>
  transform.xx * transform.yy - transform.xy * transform.yx < 0

/**
 * Applies a transform to one point.
 *
 * @example applyTransform({ xx: 1, xy: 0, yx: 0, yy: 1, tx: 2, ty: 0 }, [1, 1]) // [3, 1]
 */
export function applyTransform(transform: AffineTransform, point: Point): Point {
  return [
    transform.xx * point[0] + transform.xy * point[1] + transform.tx,
    transform.yx * point[0] + transform.yy * point[1] + transform.ty,
  ]
}

/**
 * Applies a transform to points, keeping their order (seams, curls, a segment's ends).
 *
 * @example applyToPoints(rotationAboutCentre(Math.PI), [[1, 0], [2, 0]]) // ≈ [[-1, 0], [-2, 0]]
 */
export function applyToPoints(transform: AffineTransform, points: readonly Point[]): Point[] {
  return points.map((point) => applyTransform(transform, point))
}

/**
 * Applies a transform to a counter-clockwise polygon and returns it counter-clockwise: a
 * reflection reverses the corners' order, so they are read backwards from the first.
 *
 * @example applyToPolygon(reflectionAcrossRadius(0), [[0, 0], [1, 0], [0, 1]]) // [[0, 0], [0, -1], [1, 0]]
 */
export function applyToPolygon(transform: AffineTransform, polygon: Polygon): Polygon {
  const mapped = applyToPoints(transform, polygon)
  if (!isReflection(transform) || mapped.length === 0) return mapped
  return [mapped[0]!, ...mapped.slice(1).reverse()]
}

/**
 * Applies a rotation, reflection or uniform scaling (with any translation) to an outline path of
 * lines and true arcs, and returns it counter-clockwise: a reflection turns arcs the other way
 * and reverses the path, which is then read backwards. Arcs stay arcs only under such
 * transforms, so a shear or an unequal scaling is a programmer error.
 *
 * @example applyToPath(printedSideTransform(ring), trimLine(outline).path) // the printed trim line
 */
export function applyToPath(transform: AffineTransform, path: OutlinePath): OutlinePath {
  const columnX = Math.hypot(transform.xx, transform.yx)
  const columnY = Math.hypot(transform.xy, transform.yy)
  const skew = transform.xx * transform.xy + transform.yx * transform.yy
  if (Math.abs(columnX - columnY) > SIMILARITY_SLACK * columnX || Math.abs(skew) > SIMILARITY_SLACK * columnX * columnX) {
    throw new RangeError('arcs stay arcs only under rotations, reflections and uniform scaling')
  }
  const turnAngle = (angle: number): number => {
    const [x, y] = applyTransform({ ...transform, tx: 0, ty: 0 }, [Math.cos(angle), Math.sin(angle)])
    return Math.atan2(y, x)
  }
  const reflect = isReflection(transform)
  const mapped: PathSegment[] = path.map((segment) => segment.kind === 'line'
    ? { kind: 'line', from: applyTransform(transform, segment.from), to: applyTransform(transform, segment.to) }
    : {
      kind: 'arc',
      center: applyTransform(transform, segment.center),
      radius: segment.radius * columnX,
      startAngle: turnAngle(segment.startAngle),
      endAngle: turnAngle(segment.endAngle),
      anticlockwise: segment.anticlockwise !== reflect,
    })
  if (!reflect) return mapped
  return mapped.reverse().map((segment): PathSegment => segment.kind === 'line'
    ? { kind: 'line', from: segment.to, to: segment.from }
    : { ...segment, startAngle: segment.endAngle, endAngle: segment.startAngle, anticlockwise: !segment.anticlockwise })
}

/**
 * For each repeat k (0 … N−1), the transform that carries repeat 0 onto it. Rotate mode: a
 * rotation by k·360°/N. Alternate-mirror mode (N even): repeat k+1 is the mirror image of repeat
 * k across the radial edge they share, so even repeats are rotations by k·360°/N and odd ones
 * are reflections across the radius at (k+1)·180°/N (which carries repeat 0's sector
 * [0, 360°/N] onto [k·360°/N, (k+1)·360°/N]).
 *
 * @example repeatTransforms({ innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'mirror' })[1]
 * // reflection across the radius at 90°: the mirror of repeat 0 across the y axis
 */
export function repeatTransforms(ring: Ring): AffineTransform[] {
  const step = (2 * Math.PI) / ring.repeats
  return Array.from({ length: ring.repeats }, (_, k) => {
    if (k === 0) return IDENTITY
    if (ring.repeatMode === 'mirror' && k % 2 === 1) return reflectionAcrossRadius(((k + 1) * step) / 2)
    return rotationAboutCentre(k * step)
  })
}

/**
 * The printed side's mirror: across repeat 0's bisector (the radius at 180°/N). The printed side
 * of a foundation is the mirror image of the fabric side (common practice: the fabric is sewn on
 * the unprinted side, through the paper). Mirroring across the bisector keeps the repeat in its
 * own sector, so the printed foundation uses the same outline, the same trim line and the same
 * page layout as the fabric side; only its two radial edges trade places. Mirroring across x
 * would move it to [−360°/N, 0], off every layout computed for repeat 0.
 *
 * @example applyTransform(printedSideTransform({ innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }), [1, 0]) // ≈ [0, 1]
 */
export function printedSideTransform(ring: Pick<Ring, 'repeats'>): AffineTransform {
  return reflectionAcrossRadius(Math.PI / ring.repeats)
}

/**
 * Points of repeat 0 as they are printed on the foundation (see `printedSideTransform`), in
 * their given order; a counter-clockwise polygon comes back clockwise, so use
 * `applyToPolygon(printedSideTransform(ring), polygon)` for polygons.
 *
 * @example printedSide([[1, 0]], { repeats: 4 }) // ≈ [[0, 1]]
 */
export function printedSide(points: readonly Point[], ring: Pick<Ring, 'repeats'>): Point[] {
  return applyToPoints(printedSideTransform(ring), points)
}

/**
 * The design scaled so its finished diameter (twice the outer radius) is `finishedDiameterInches`:
 * every length scales, through `scaleDesignLengths` (the one list of a design's lengths);
 * fractions and angles (a leaf's `at` and `angle`) and colourways do not. A new design; the
 * input is never changed.
 *
 * @example scaleDesign(design, 24).ring.outerRadius // 12
 */
export function scaleDesign(design: Design, finishedDiameterInches: number): Design {
  if (!(finishedDiameterInches > 0) || !Number.isFinite(finishedDiameterInches)) {
    throw new RangeError(`finished diameter must be a positive length, got ${finishedDiameterInches}`)
  }
  return scaleDesignLengths(design, finishedDiameterInches / (2 * design.ring.outerRadius))
}
