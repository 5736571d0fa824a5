/**
 * Merging computed points into the vertices of the arrangement: points closer than
 * VERTEX_MERGE_INCHES are one vertex, represented by the cluster's lowest point (x, then y), so
 * the result does not depend on the order the points arrive in. Vertices are numbered by position
 * as a fraction of a length unit (the outer radius), rounded to LABEL_ORDER_DIGITS: two points on
 * one vertical seam keep their order by height whatever noise scaling the design or reading it in
 * centimetres leaves in their x, so the numbering, and the search that follows it, does not
 * change with the design's size or units.
 */
import { comparePoints } from './polygon-measure'
import { LABEL_ORDER_DIGITS, VERTEX_MERGE_INCHES } from './tolerances'
import type { Point } from './types'

/**
 * Merges near-coincident points. `ids[i]` is the vertex of `points[i]`; vertices are sorted by
 * position in units of `unit` inches (see the file comment).
 *
 * @example mergeVertices([[0, 0], [1, 1], [1e-9, 0]]) // { vertices: [[0, 0], [1, 1]], ids: [0, 1, 0] }
 */
export function mergeVertices(points: readonly Point[], unit = 1): { readonly vertices: Point[]; readonly ids: number[] } {
  const order = points.map((_, index) => index).sort((a, b) => comparePoints(points[a] as Point, points[b] as Point))
  const parent = points.map((_, index) => index)
  const find = (i: number): number => {
    while (parent[i] !== i) {
      parent[i] = parent[parent[i] as number] as number
      i = parent[i] as number
    }
    return i
  }
  for (let i = 0; i < order.length; i += 1) {
    const a = points[order[i] as number] as Point
    for (let j = i + 1; j < order.length; j += 1) {
      const b = points[order[j] as number] as Point
      if (b[0] - a[0] > VERTEX_MERGE_INCHES) break
      if (Math.abs(b[1] - a[1]) <= VERTEX_MERGE_INCHES && Math.hypot(b[0] - a[0], b[1] - a[1]) <= VERTEX_MERGE_INCHES) {
        const rootA = find(order[i] as number)
        const rootB = find(order[j] as number)
        if (rootA !== rootB) parent[Math.max(rootA, rootB)] = Math.min(rootA, rootB)
      }
    }
  }
  // Representative: the lowest point of each cluster; vertex ids follow the sorted order.
  const lowest = new Map<number, number>()
  for (const index of order) {
    const root = find(index)
    if (!lowest.has(root)) lowest.set(root, index)
  }
  const scale = 10 ** LABEL_ORDER_DIGITS / unit
  const keyed = [...lowest.entries()].map(([root, index]) => {
    const point = points[index] as Point
    return { root, point, x: Math.round(point[0] * scale), y: Math.round(point[1] * scale) }
  })
  keyed.sort((p, q) => p.x - q.x || p.y - q.y || comparePoints(p.point, q.point))
  const vertexOfRoot = new Map(keyed.map(({ root }, id) => [root, id]))
  return { vertices: keyed.map(({ point }) => point), ids: points.map((_, index) => vertexOfRoot.get(find(index)) as number) }
}
