/**
 * Places where a design cannot be sewn, found from the shape of the seams before any search:
 * set-in (Y) points and bent seams; and, after a search fails, the place that stops it.
 */
import { areaSetOf } from './area-set'
import type { Topology } from './area-topology'
import { stuckCore, type PeelSearch } from './sewing-order'
import type { Point, Problem } from './types'

const at = (p: Point): string => `(${p[0].toFixed(2)}, ${p[1].toFixed(2)})`

function seamNames(topology: Topology, edges: readonly number[]): string {
  const ids = [...new Set(edges.flatMap((edge) => topology.seamEdges[edge]?.seamIds ?? []))].sort()
  if (ids.length <= 1) return `Seam ${ids[0] ?? '?'}`
  return `Seams ${ids.slice(0, -1).join(', ')} and ${ids[ids.length - 1]}`
}

/**
 * Interior points where three or more seams meet with no two continuing each other in a
 * straight line (a set-in or "Y" seam: no number of sections can sew it), and interior points
 * where two seams meet at an angle with nothing else there (the areas on either side share a
 * bent line, which no straight seam sews).
 *
 * @example setInSeamProblems(topology)[0]?.code // 'set-in-seam' for a Y junction
 */
export function setInSeamProblems(topology: Topology): Problem[] {
  const problems: Problem[] = []
  topology.edgesAtVertex.forEach((edges, vertex) => {
    if (topology.vertexOnOutline[vertex] || edges.length < 2) return
    const lines = edges.map((edge) => topology.seamEdges[edge]?.line)
    const continues = new Set(lines).size < lines.length
    if (continues) return
    const place = topology.vertices[vertex] as Point
    if (edges.length >= 3) {
      problems.push({
        code: 'set-in-seam',
        severity: 'error',
        message: `${seamNames(topology, edges)} meet at ${at(place)} with none continuing another in a straight line: a set-in (Y) seam that cannot be sewn flip-and-sew in any number of sections.`,
        at: place,
      })
    } else {
      problems.push({
        code: 'bent-seam',
        severity: 'error',
        message: `${seamNames(topology, edges)} meet at ${at(place)} at an angle with nothing else there, so the areas on either side share a bent line that no straight seam can sew.`,
        at: place,
      })
    }
  })
  return problems
}

/**
 * Explains why no plan exists once the search has failed: the areas that remain when nothing
 * more peels form a cycle of seams each ending on the next (a pinwheel) that no straight seam
 * splits. The place is the middle of the seam ends inside that core.
 *
 * @example noPlanProblem(topology, search, areaPoints).code // 'seam-cycle'
 */
export function noPlanProblem(topology: Topology, search: PeelSearch, areaPoints: readonly Point[]): Problem {
  const all = areaSetOf(topology.areaCount, areaPoints.map((_, index) => index))
  const core = new Set(stuckCore(search, all))
  // Seam ends inside the core: interior vertices whose surrounding areas all belong to it.
  const ends: Point[] = []
  topology.areasAtVertex.forEach((areas, vertex) => {
    if (topology.vertexOnOutline[vertex] || areas.length < 3) return
    if (areas.every((area) => core.has(area))) ends.push(topology.vertices[vertex] as Point)
  })
  const pool = ends.length > 0 ? ends : [...core].map((area) => areaPoints[area] as Point)
  const place: Point = [pool.reduce((sum, p) => sum + p[0], 0) / pool.length, pool.reduce((sum, p) => sum + p[1], 0) / pool.length]
  return {
    code: 'seam-cycle',
    severity: 'error',
    message: `The ${core.size} areas around ${at(place)} form a cycle of seams, each ending on the next (a pinwheel): none of them can be sewn last, and no straight seam splits them into sections.`,
    at: place,
  }
}
