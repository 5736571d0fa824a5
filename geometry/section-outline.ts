/**
 * A section's outline: the edge of its paper, the union of its areas. The plan rounds its
 * polygons, so where a seam ends on another seam the end corner of one area no longer lies exactly
 * on its neighbour's edge; an exact union then leaves a crack a few millionths wide and the
 * section falls apart in two. Every corner lying within a weld distance of another area's edge is
 * first inserted into that edge (the T-junction made exact), so shared edges coincide.
 */
import { normalizeRing, polygonArea, unitePieces } from './offset'
import { WELD_DISTANCE_INCHES } from './tolerances'
import type { Point, Polygon } from './types'

/**
 * The areas with each one's edges carrying the other areas' corners that lie on them.
 *
 * @example weldTJunctions([[[0, 0], [2, 0], [2, 1], [0, 1]], [[1, 1.0000001], [2, 1], [2, 2]]])[0]!.length // 5
 */
export function weldTJunctions(areas: readonly Polygon[]): Polygon[] {
  const corners = areas.flatMap((polygon) => polygon)
  return areas.map((polygon) => {
    const welded: Point[] = []
    polygon.forEach((a, i) => {
      const b = polygon[(i + 1) % polygon.length]!
      welded.push(a)
      const dx = b[0] - a[0]
      const dy = b[1] - a[1]
      const length = Math.hypot(dx, dy)
      if (length === 0) return
      const inner: { t: number; p: Point }[] = []
      for (const p of corners) {
        const t = ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / (length * length)
        if (t * length <= WELD_DISTANCE_INCHES || (1 - t) * length <= WELD_DISTANCE_INCHES) continue
        const distance = Math.abs((p[0] - a[0]) * dy - (p[1] - a[1]) * dx) / length
        if (distance <= WELD_DISTANCE_INCHES && !inner.some((q) => q.p[0] === p[0] && q.p[1] === p[1])) inner.push({ t, p })
      }
      inner.sort((p, q) => p.t - q.t).forEach(({ p }) => welded.push(p))
    })
    return welded
  })
}

/**
 * The outline of a section from its areas (counter-clockwise polygons, arcs as chords): the outer
 * boundary of their welded union. A section is one piece of paper; were its areas ever to enclose
 * a hole, the outline follows the outside only.
 *
 * @example sectionOutline(plan.areas.filter((a) => a.section === 'A').map((a) => a.polygon))
 */
export function sectionOutline(areas: readonly Polygon[]): Polygon {
  if (areas.length === 0) throw new RangeError('a section needs at least one area')
  const pieces = unitePieces(weldTJunctions(areas.map(normalizeRing)).map(normalizeRing)).map(normalizeRing)
  return pieces.reduce((best, piece) => (polygonArea(piece) > polygonArea(best) ? piece : best))
}
