/**
 * Leaf inserts as sewing constraints: a leaf lying over area p, caught in the seam between p
 * and q, must be basted on p before q is sewn over it.
 */
import type { Arrangement } from './arrangement'
import type { Topology } from './area-topology'
import { leafMention } from './leaf-names'
import { leafShapeProblem } from './leaf-template'
import type { InsertConstraint } from './sewing-order'
import { distanceToSegment } from './polygon-measure'
import { ON_SEGMENT_INCHES } from './tolerances'
import type { Leaf, Point, Problem } from './types'

/**
 * The constraint of each leaf, and a problem for each leaf whose open end sits on no seam
 * between two areas (its seam was dropped as dangling, or it sits on the outline) and for each
 * leaf that cannot be drawn as a pointed leaf (`impossible-leaf`, at its open end: the maker
 * would get no template for it).
 *
 * @example insertConstraints(arrangement, topology, design.leaves).constraints[0]?.over
 */
export function insertConstraints(
  arrangement: Arrangement,
  topology: Topology,
  leaves: readonly Leaf[],
): { readonly constraints: InsertConstraint[]; readonly problems: Problem[] } {
  const constraints: InsertConstraint[] = []
  const problems: Problem[] = []
  for (const leaf of leaves) {
    const seam = arrangement.seams.find((s) => s.id === leaf.seam)
    if (!seam) continue
    const place: Point = [seam.from[0] + leaf.at * (seam.to[0] - seam.from[0]), seam.from[1] + leaf.at * (seam.to[1] - seam.from[1])]
    const shape = leafShapeProblem(leaf.length, leaf.width)
    if (shape) problems.push({ code: 'impossible-leaf', severity: 'error', message: `${leafMention(leaf.id)} cannot be made as a pointed leaf: ${shape}`, at: place })
    let best = -1
    let bestScore = Infinity
    topology.seamEdges.forEach((edge, id) => {
      if (!edge.seamIds.includes(leaf.seam)) return
      const a = topology.vertices[edge.from] as Point
      const b = topology.vertices[edge.to] as Point
      if (distanceToSegment(place, a, b) > ON_SEGMENT_INCHES) return
      // At a vertex two edges qualify; the one whose middle is nearer holds more of the leaf.
      const score = Math.hypot((a[0] + b[0]) / 2 - place[0], (a[1] + b[1]) / 2 - place[1])
      if (score < bestScore) {
        best = id
        bestScore = score
      }
    })
    const edge = topology.seamEdges[best]
    if (!edge) {
      problems.push({
        code: 'insert-not-caught',
        severity: 'error',
        message: `${leafMention(leaf.id)} sits at (${place[0].toFixed(2)}, ${place[1].toFixed(2)}) on no seam between two areas, so no seam can catch it.`,
        at: place,
      })
      continue
    }
    const a = topology.vertices[edge.from] as Point
    const b = topology.vertices[edge.to] as Point
    const sameWay = (b[0] - a[0]) * (seam.to[0] - seam.from[0]) + (b[1] - a[1]) * (seam.to[1] - seam.from[1]) > 0
    const leftArea = sameWay ? edge.left : edge.right
    const rightArea = sameWay ? edge.right : edge.left
    const over = leaf.side === 'left' ? leftArea : rightArea
    const under = leaf.side === 'left' ? rightArea : leftArea
    constraints.push({ leafId: leaf.id, over, under, at: place })
  }
  return { constraints, problems }
}
