/**
 * The outline of repeat 0: the annular sector between the inner and outer radius from polar
 * angle 0 to 360°/N, counter-clockwise, with its arcs replaced by chords.
 */
import { ARC_CHORD_TOLERANCE_INCHES, VERTEX_MERGE_INCHES } from './tolerances'
import type { Point, Polygon, Ring } from './types'

/** Which part of the outline an outline edge belongs to. Arcs are cut edges, never seams. */
export type OutlinePart = 'start-radial' | 'outer-arc' | 'end-radial' | 'inner-arc'

export interface RepeatOutline {
  /** Counter-clockwise, arcs as chords, no repeated closing point. */
  readonly polygon: Polygon
  /** `parts[i]` names the edge from `polygon[i]` to `polygon[i + 1]` (wrapping). */
  readonly parts: readonly OutlinePart[]
}

/**
 * The angle a repeat spans, in radians: 2π/N.
 *
 * @example repeatSpan({ innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }) // π/2
 */
export function repeatSpan(ring: Ring): number {
  return (2 * Math.PI) / ring.repeats
}

/**
 * How many chords replace an arc of `radius` spanning `span` radians so that no chord is
 * farther than the tolerance from the arc. A chord over angle θ stands r(1 − cos(θ/2)) from
 * the arc at its middle (the sagitta), so θ may be at most 2·acos(1 − t/r).
 *
 * @example chordCount(9, Math.PI / 2) // 24
 */
export function chordCount(radius: number, span: number): number {
  if (radius <= ARC_CHORD_TOLERANCE_INCHES) return 1
  const maximumAngle = 2 * Math.acos(1 - ARC_CHORD_TOLERANCE_INCHES / radius)
  // A radius so large that the angle underflows to 0 is a programmer error upstream (the schema
  // caps radii); never loop forever on it.
  if (!(maximumAngle > 0)) throw new RangeError(`radius ${radius} in is too large to draw as chords`)
  return Math.max(1, Math.ceil(span / maximumAngle))
}

function polar(radius: number, angle: number): Point {
  return [radius * Math.cos(angle), radius * Math.sin(angle)]
}

/** The polar angle of a point in [0, 2π). */
const angleOf = (p: Point): number => {
  const angle = Math.atan2(p[1], p[0])
  return angle < 0 ? angle + 2 * Math.PI : angle
}

/**
 * The inner points of one arc, by increasing angle: the chord joints, with the given points on the
 * arc inserted where they fall (a joint within the vertex-merge distance of one gives way to it).
 */
function arcPoints(radius: number, span: number, onArc: readonly Point[]): Point[] {
  const chords = chordCount(radius, span)
  const joints: { angle: number; point: Point }[] = []
  for (let i = 1; i < chords; i += 1) joints.push({ angle: (span * i) / chords, point: polar(radius, (span * i) / chords) })
  const corners: Point[] = [[radius, 0], polar(radius, span)]
  const extra = onArc
    .filter((p) => corners.every((corner) => Math.hypot(p[0] - corner[0], p[1] - corner[1]) > VERTEX_MERGE_INCHES))
    .map((point) => ({ angle: angleOf(point), point }))
    .filter(({ angle }) => angle > 0 && angle < span)
  const kept = joints.filter((joint) => extra.every(({ point }) => Math.hypot(point[0] - joint.point[0], point[1] - joint.point[1]) > VERTEX_MERGE_INCHES))
  const all = [...kept, ...extra].sort((a, b) => a.angle - b.angle)
  return all.filter((entry, index) => index === 0 || Math.hypot(entry.point[0] - all[index - 1]!.point[0], entry.point[1] - all[index - 1]!.point[1]) > VERTEX_MERGE_INCHES).map(({ point }) => point)
}

/**
 * The outline of repeat 0 as a counter-clockwise polygon with arcs as chords. `onArcs` are points
 * on the true arcs (seam ends snapped onto them, `seam-snapping.ts`) that become corners of the
 * outline, so a seam ending on an arc ends on the outline exactly; inserting a point on the arc
 * only brings the chords nearer to it.
 *
 * @example repeatOutline({ innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }).polygon[0] // [0, 0]
 */
export function repeatOutline(ring: Ring, onArcs: readonly Point[] = []): RepeatOutline {
  const span = repeatSpan(ring)
  const polygon: Point[] = []
  const parts: OutlinePart[] = []
  // Each point goes to the arc it is nearer to.
  const nearerOuter = (p: Point): boolean => Math.abs(Math.hypot(p[0], p[1]) - ring.outerRadius) <= Math.abs(Math.hypot(p[0], p[1]) - ring.innerRadius)
  const outerInner = arcPoints(ring.outerRadius, span, ring.innerRadius > 0 ? onArcs.filter(nearerOuter) : onArcs)
  polygon.push(ring.innerRadius === 0 ? [0, 0] : polar(ring.innerRadius, 0))
  parts.push('start-radial')
  // Exact ends at angle 0 (x axis) and the span, so seams drawn on the radial edges meet them.
  polygon.push([ring.outerRadius, 0])
  parts.push('outer-arc')
  for (const point of outerInner) {
    polygon.push(point)
    parts.push('outer-arc')
  }
  polygon.push(polar(ring.outerRadius, span))
  parts.push('end-radial')
  if (ring.innerRadius > 0) {
    const inner = arcPoints(ring.innerRadius, span, onArcs.filter((p) => !nearerOuter(p)))
    polygon.push(polar(ring.innerRadius, span))
    parts.push('inner-arc')
    for (let i = inner.length - 1; i >= 0; i -= 1) {
      polygon.push(inner[i]!)
      parts.push('inner-arc')
    }
    // The last inner point (angle 0) is polygon[0]; the edge into it closes the inner arc.
  } else {
    parts[parts.length - 1] = 'end-radial'
  }
  return { polygon, parts }
}
