/**
 * Which areas touch along which seam lines: the view of the arrangement that the order checker
 * and the sections search work on. A seam line is a maximal chain of seam edges that run
 * straight on through their shared vertices, whichever seams they came from.
 */
import type { Arrangement } from './arrangement'
import { hasArea, type AreaSet } from './area-set'
import { distanceToSegment } from './polygon-measure'
import { STRAIGHT_LINE_INCHES } from './tolerances'
import type { Point, Segment } from './types'

/** A seam edge between two areas. */
export interface SeamEdge {
  readonly from: number
  readonly to: number
  readonly left: number
  readonly right: number
  readonly line: number
  /** Position along its line: edge k of a line joins the line's vertices k and k + 1. */
  readonly position: number
  readonly seamIds: readonly string[]
}

export interface SeamLine {
  /** Vertex ids in order along the line. */
  readonly vertices: readonly number[]
  /** Seam edge ids in order along the line. */
  readonly edges: readonly number[]
}

export interface Topology {
  readonly areaCount: number
  readonly vertices: readonly Point[]
  readonly vertexOnOutline: readonly boolean[]
  readonly seamEdges: readonly SeamEdge[]
  readonly lines: readonly SeamLine[]
  /** For each area, its neighbours across seam edges and the edges it shares with each. */
  readonly neighbours: readonly (readonly { readonly area: number; readonly edges: readonly number[] }[])[]
  /** For each vertex, the areas around it (including −1 when the vertex is on the outline). */
  readonly areasAtVertex: readonly (readonly number[])[]
  /** For each vertex, the seam edges ending there. */
  readonly edgesAtVertex: readonly (readonly number[])[]
  /**
   * Interior vertices around which no area runs straight through (an X crossing, a Y point):
   * the last of their areas to be sewn would meet the others along two lines, so no section
   * holds all of their areas. Each with the areas around it.
   */
  readonly blockedVertices: readonly { readonly vertex: number; readonly areas: readonly number[] }[]
}

/** Why a boundary is not one straight segment. */
export type BoundaryVerdict =
  | { readonly kind: 'segment'; readonly segment: Segment; readonly line: number }
  | { readonly kind: 'none' }
  | { readonly kind: 'two-lines'; readonly lineCount: number }
  | { readonly kind: 'broken' }

/**
 * Builds the topology of an arrangement.
 *
 * @example buildTopology(buildArrangement(ring, seams)).lines.length
 */
export function buildTopology(arrangement: Arrangement): Topology {
  const { vertices } = arrangement
  const interior = arrangement.edges.filter((edge) => edge.left >= 0 && edge.right >= 0)
  const edgesAtVertex = vertices.map((): number[] => [])
  interior.forEach((edge, id) => {
    edgesAtVertex[edge.from]?.push(id)
    edgesAtVertex[edge.to]?.push(id)
  })
  // Pair up edges that run straight on through a vertex: they belong to one seam line.
  const partner = interior.map(() => [-1, -1] as [number, number])
  const far = (edge: number, vertex: number): number => {
    const e = interior[edge]
    return e ? (e.from === vertex ? e.to : e.from) : -1
  }
  edgesAtVertex.forEach((list, vertex) => {
    const slot = (edge: number): 0 | 1 => ((interior[edge] as { from: number }).from === vertex ? 0 : 1)
    const candidates: { e1: number; e2: number; deviation: number }[] = []
    for (let i = 0; i < list.length; i += 1) {
      for (let j = i + 1; j < list.length; j += 1) {
        const e1 = list[i] as number
        const e2 = list[j] as number
        const a = vertices[far(e1, vertex)] as Point
        const b = vertices[far(e2, vertex)] as Point
        const v = vertices[vertex] as Point
        const behind = (a[0] - v[0]) * (b[0] - v[0]) + (a[1] - v[1]) * (b[1] - v[1]) < 0
        const deviation = distanceToSegment(v, a, b)
        if (behind && deviation <= STRAIGHT_LINE_INCHES) candidates.push({ e1, e2, deviation })
      }
    }
    // One partner per edge end, straightest pairs first: three nearly straight edges at a vertex
    // (seams drawn within the tolerance of each other) must still make simple chains.
    candidates.sort((p, q) => p.deviation - q.deviation || p.e1 - q.e1 || p.e2 - q.e2)
    for (const { e1, e2 } of candidates) {
      if (partner[e1]![slot(e1)] !== -1 || partner[e2]![slot(e2)] !== -1) continue
      partner[e1]![slot(e1)] = e2
      partner[e2]![slot(e2)] = e1
    }
  })
  const slotAt = (edge: number, vertex: number): 0 | 1 => ((interior[edge] as { from: number }).from === vertex ? 0 : 1)
  const lineOf = interior.map(() => -1)
  const positionOf = interior.map(() => 0)
  const lines: SeamLine[] = []
  interior.forEach((_, start) => {
    if (lineOf[start] !== -1) return
    // Walk to one end of the chain (a straight chain cannot loop; the guard is for bad input).
    let edge = start
    let vertex = (interior[start] as { from: number }).from
    const guard = new Set<number>([start])
    for (;;) {
      const back = partner[edge]![slotAt(edge, vertex)] as number
      if (back < 0 || guard.has(back)) break
      guard.add(back)
      edge = back
      vertex = far(back, vertex)
    }
    // `edge` is an end edge and `vertex` the chain's end vertex on it.
    const lineVertices = [vertex]
    const lineEdges: number[] = []
    let current: number = edge
    let at = vertex
    while (current >= 0 && lineOf[current] === -1) {
      lineOf[current] = lines.length
      positionOf[current] = lineEdges.length
      lineEdges.push(current)
      at = far(current, at)
      lineVertices.push(at)
      current = partner[current]![slotAt(current, at)] as number
    }
    lines.push({ vertices: lineVertices, edges: lineEdges })
  })
  const seamEdges: SeamEdge[] = interior.map((edge, id) => ({
    from: edge.from,
    to: edge.to,
    left: edge.left,
    right: edge.right,
    line: lineOf[id] as number,
    position: positionOf[id] as number,
    seamIds: edge.seamIds,
  }))
  const neighbourMaps = arrangement.areas.map(() => new Map<number, number[]>())
  seamEdges.forEach((edge, id) => {
    for (const [a, b] of [[edge.left, edge.right], [edge.right, edge.left]] as const) {
      const map = neighbourMaps[a] as Map<number, number[]>
      const list = map.get(b) ?? []
      list.push(id)
      map.set(b, list)
    }
  })
  const areasAtVertex = vertices.map((): number[] => [])
  for (const edge of arrangement.edges) {
    for (const vertex of [edge.from, edge.to]) {
      const list = areasAtVertex[vertex] as number[]
      for (const area of [edge.left, edge.right]) if (!list.includes(area)) list.push(area)
    }
  }
  const blockedVertices: { vertex: number; areas: number[] }[] = []
  edgesAtVertex.forEach((edges, vertex) => {
    const around = areasAtVertex[vertex] ?? []
    if (arrangement.vertexOnOutline[vertex] || around.length < 3 || around.includes(-1)) return
    // An area runs straight through the vertex when its two sides there lie on one seam line.
    const sidesOf = around.map((area) => edges.filter((edge) => seamEdges[edge]?.left === area || seamEdges[edge]?.right === area))
    // An area meeting the vertex more than once (a pinched face) breaks the argument: skip it.
    if (sidesOf.some((sides) => sides.length !== 2)) return
    const straight = sidesOf.some((sides) => seamEdges[sides[0] as number]?.line === seamEdges[sides[1] as number]?.line)
    if (!straight) blockedVertices.push({ vertex, areas: [...around].sort((p, q) => p - q) })
  })
  return {
    areaCount: arrangement.areas.length,
    vertices,
    vertexOnOutline: arrangement.vertexOnOutline,
    seamEdges,
    lines,
    neighbours: neighbourMaps.map((map) => [...map.entries()].sort((p, q) => p[0] - q[0]).map(([area, edges]) => ({ area, edges }))),
    areasAtVertex,
    edgesAtVertex,
    blockedVertices,
  }
}

/**
 * Whether a set of seam edges is one straight segment of positive length: all on one seam line
 * and consecutive along it. Point contacts never enter: only edges are counted.
 *
 * @example boundaryOfEdges(topology, [3, 4]).kind // 'segment' when edges 3 and 4 continue each other
 */
export function boundaryOfEdges(topology: Topology, edges: readonly number[]): BoundaryVerdict {
  if (edges.length === 0) return { kind: 'none' }
  const first = topology.seamEdges[edges[0] as number] as SeamEdge
  let low = first.position
  let high = first.position
  const lines = new Set<number>([first.line])
  for (let i = 1; i < edges.length; i += 1) {
    const edge = topology.seamEdges[edges[i] as number] as SeamEdge
    lines.add(edge.line)
    if (edge.position < low) low = edge.position
    if (edge.position > high) high = edge.position
  }
  if (lines.size > 1) return { kind: 'two-lines', lineCount: lines.size }
  // Edges are distinct and on one chain, so they are consecutive exactly when they fill low..high.
  if (high - low + 1 !== new Set(edges).size) return { kind: 'broken' }
  const line = topology.lines[first.line] as SeamLine
  const from = topology.vertices[line.vertices[low] as number] as Point
  const to = topology.vertices[line.vertices[high + 1] as number] as Point
  return { kind: 'segment', segment: [from, to], line: first.line }
}

/**
 * The seam edges between one area and a set of areas.
 *
 * @example boundaryOfEdges(topology, edgesBetweenAreaAndSet(topology, 3, sewn)).kind // 'segment' when 3 can be sewn next
 */
export function edgesBetweenAreaAndSet(topology: Topology, area: number, set: AreaSet): number[] {
  const edges: number[] = []
  for (const neighbour of topology.neighbours[area] ?? []) if (hasArea(set, neighbour.area)) edges.push(...neighbour.edges)
  return edges
}

/**
 * The seam edges between two disjoint sets of areas.
 *
 * @example boundaryOfEdges(topology, edgesBetweenSets(topology, [0, 1], second)).kind // 'segment' when the groups can be joined
 */
export function edgesBetweenSets(topology: Topology, first: readonly number[], second: AreaSet): number[] {
  const edges: number[] = []
  for (const area of first) edges.push(...edgesBetweenAreaAndSet(topology, area, second))
  return edges
}
