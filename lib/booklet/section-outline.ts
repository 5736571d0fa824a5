/**
 * A section's trim line from its areas, robust to the plan's rounding.
 *
 * The plan rounds its polygons (to 1e-6 in), so where a seam ends on another seam the end
 * vertex of one area no longer lies exactly on its neighbour's edge: an exact union then leaves a
 * crack a few millionths wide and splits the section in two, and the core's `sectionTrimLine`
 * (which keeps the largest piece) trims around only part of it. Here every vertex lying within
 * a weld distance of another area's edge is inserted into that edge first (a T-junction made
 * exact), so shared edges coincide and the union is one piece.
 */
import {
  normalizeRing, outlineFromPolygon, polygonArea, trimLine, unitePieces, type Point, type Polygon, type Ring, type TrimLine,
} from '@/geometry'

/** Vertices closer than this to an edge are welded onto it, inches: far above rounding, far below any seam. */
export const WELD_DISTANCE_INCHES = 1e-4

/**
 * The areas with each one's edges carrying the other areas' vertices that lie on them.
 *
 * @example weldTJunctions([[[0, 0], [2, 0], [2, 1], [0, 1]], [[1, 1.0000001], [2, 1], [2, 2]]])[0]!.length // 5
 */
export function weldTJunctions(areas: readonly Polygon[]): Polygon[] {
  const all = areas.flatMap((polygon) => polygon)
  return areas.map((polygon) => {
    const welded: Point[] = []
    polygon.forEach((a, i) => {
      const b = polygon[(i + 1) % polygon.length]!
      welded.push(a)
      const dx = b[0] - a[0]
      const dy = b[1] - a[1]
      const lengthSquared = dx * dx + dy * dy
      if (lengthSquared === 0) return
      const inner: { t: number; p: Point }[] = []
      for (const p of all) {
        const t = ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / lengthSquared
        const length = Math.sqrt(lengthSquared)
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
 * The trim line around a section's areas (counter-clockwise polygons, arcs as chords): their
 * welded union's outer boundary read back as lines and arcs, moved out by the allowance.
 *
 * @example weldedSectionTrimLine(plan.areas.filter((a) => a.section === 'A').map((a) => a.polygon), design.ring)
 */
export function weldedSectionTrimLine(areas: readonly Polygon[], ring: Ring): TrimLine {
  if (areas.length === 0) throw new RangeError('a section needs at least one area')
  const pieces = unitePieces(weldTJunctions(areas.map(normalizeRing)).map(normalizeRing)).map(normalizeRing)
  const outline = pieces.reduce((best, piece) => (polygonArea(piece) > polygonArea(best) ? piece : best))
  return trimLine(outlineFromPolygon(outline, ring))
}
