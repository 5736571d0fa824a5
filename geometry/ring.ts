/**
 * The outline of repeat 0: the annular sector between the inner and outer radius from polar
 * angle 0 to 360°/N, counter-clockwise, with its arcs replaced by chords.
 */
import { ARC_CHORD_TOLERANCE_INCHES } from './tolerances'
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

/**
 * The outline of repeat 0 as a counter-clockwise polygon with arcs as chords.
 *
 * @example repeatOutline({ innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }).polygon[0] // [0, 0]
 */
export function repeatOutline(ring: Ring): RepeatOutline {
  const span = repeatSpan(ring)
  const polygon: Point[] = []
  const parts: OutlinePart[] = []
  const outerChords = chordCount(ring.outerRadius, span)
  if (ring.innerRadius === 0) {
    polygon.push([0, 0])
    parts.push('start-radial')
  } else {
    polygon.push(polar(ring.innerRadius, 0))
    parts.push('start-radial')
  }
  for (let i = 0; i <= outerChords; i += 1) {
    // Exact ends at angle 0 (x axis) and the span, so seams drawn on the radial edges meet them.
    polygon.push(i === 0 ? [ring.outerRadius, 0] : polar(ring.outerRadius, (span * i) / outerChords))
    parts.push(i === outerChords ? 'end-radial' : 'outer-arc')
  }
  if (ring.innerRadius > 0) {
    const innerChords = chordCount(ring.innerRadius, span)
    for (let i = innerChords; i >= 1; i -= 1) {
      polygon.push(polar(ring.innerRadius, (span * i) / innerChords))
      parts.push('inner-arc')
    }
    // The last inner point (angle 0) is polygon[0]; the edge into it closes the inner arc.
  } else {
    parts[parts.length - 1] = 'end-radial'
  }
  return { polygon, parts }
}
