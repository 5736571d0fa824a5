/**
 * The fewest sections: a search, not a greedy guess.
 *
 * Every valid join of two groups of sections meets along one straight segment, so it is a
 * straight cut through the unit being split, along a seam line, from the unit's boundary to its
 * boundary. The search therefore recurses over such cuts only (a binary space partition over the
 * seam lines), memoised by the set of areas, with branch and bound: a unit that is not one
 * section needs at least two, so a two-section split ends the search of that unit, and a cut
 * whose first part already needs as many sections as the best plan is dropped. Inserts only
 * prune: they restrict the order inside a section, never which cuts exist (a leaf caught in a
 * join seam is basted before the join).
 */
import { areaMembers, areaSetKey, areaSetOf, emptyAreaSet, hasArea, type AreaSet } from './area-set'
import type { Topology } from './area-topology'
import { createPeelSearch, findSectionOrder, type InsertConstraint, type PeelSearch } from './sewing-order'
import { MAX_SECTION_UNITS, MAX_SECTION_WORK } from './tolerances'
import type { Segment } from './types'

/** A plan of sections: one section in sewing order, or two subtrees joined along one segment. */
export type SectionTree =
  | { readonly kind: 'section'; readonly order: readonly number[] }
  | { readonly kind: 'join'; readonly first: SectionTree; readonly second: SectionTree; readonly along: Segment }

export interface Cut {
  readonly first: AreaSet
  readonly second: AreaSet
  readonly along: Segment
  /** Memo keys of the two parts. */
  readonly firstKey: string
  readonly secondKey: string
}

export interface FewestSectionsResult {
  /** null when no plan exists (or none was found within the limits: see `gaveUp`). */
  readonly tree: SectionTree | null
  readonly sectionCount: number
  /** True when a limit stopped the search: the plan is valid but maybe not the fewest. */
  readonly gaveUp: boolean
}

interface Solved {
  readonly tree: SectionTree
  readonly count: number
}

/**
 * Every straight cut of a unit into two connected parts along a seam line, boundary to
 * boundary. `allowed` may forbid cuts (the hand-set check keeps whole sections together).
 *
 * @example cutsOf(topology, areaSetOf(4, [0, 1, 2, 3])).length // 2 for an X crossing
 */
export function cutsOf(topology: Topology, unit: AreaSet, allowed?: (cut: Cut) => boolean): Cut[] {
  const cuts: Cut[] = []
  const scratch = scratchFor(topology)
  const isBoundary = (vertex: number): boolean => {
    for (const area of topology.areasAtVertex[vertex] ?? []) if (area < 0 || !hasArea(unit, area)) return true
    return false
  }
  const interior = (edge: number): boolean => {
    const e = topology.seamEdges[edge]
    return e !== undefined && hasArea(unit, e.left) && hasArea(unit, e.right)
  }
  const members = areaMembers(unit)
  const seen = new Set<string>()
  // Only the seam lines with an edge inside the unit can cut it.
  const { lineMark } = scratch
  const lineIds: number[] = []
  for (const area of members) {
    for (const neighbour of topology.neighbours[area] ?? []) {
      if (neighbour.area <= area || !hasArea(unit, neighbour.area)) continue
      for (const edge of neighbour.edges) {
        const line = topology.seamEdges[edge]!.line
        if (lineMark[line] === 0) {
          lineMark[line] = 1
          lineIds.push(line)
        }
      }
    }
  }
  for (const line of lineIds) lineMark[line] = 0
  lineIds.sort((a, b) => a - b)
  for (const lineId of lineIds) {
    const line = topology.lines[lineId]!
    let start = 0
    while (start < line.edges.length) {
      if (!interior(line.edges[start] as number)) {
        start += 1
        continue
      }
      let end = start
      while (end + 1 < line.edges.length && interior(line.edges[end + 1] as number)) end += 1
      const stops: number[] = []
      for (let k = start; k <= end + 1; k += 1) if (isBoundary(line.vertices[k] as number)) stops.push(k)
      // A unit is a disc (the repeat, cut by straight cuts), so a straight run between two of its
      // boundary points splits it in two, and a run passing a third boundary point splits it in
      // three: only consecutive stops can be cuts.
      for (let i = 0; i + 1 < stops.length; i += 1) {
        {
          const from = stops[i] as number
          const to = stops[i + 1] as number
          const edges = line.edges.slice(from, to)
          const cut = split(topology, unit, members, edges, scratch)
          if (!cut) continue
          const key = areaSetKey(cut.first)
          if (seen.has(key)) continue
          seen.add(key)
          const along: Segment = [topology.vertices[line.vertices[from] as number]!, topology.vertices[line.vertices[to] as number]!]
          // Written out, not spread: this object is built for every cut the search sees.
          const full: Cut = { first: cut.first, second: cut.second, along, firstKey: key, secondKey: areaSetKey(cut.second) }
          if (!allowed || allowed(full)) cuts.push(full)
        }
      }
      start = end + 1
    }
  }
  return cuts
}

/**
 * Reusable marks for `split`, and the neighbour lists flattened into typed arrays, one set per
 * topology: cutting is the search's inner loop.
 */
interface Scratch {
  readonly inCut: Uint8Array
  readonly side: Uint8Array
  readonly stack: Int32Array
  readonly lineMark: Uint8Array
  /** Neighbour pairs of area a are neighbourStart[a] … neighbourStart[a + 1] − 1. */
  readonly neighbourStart: Int32Array
  readonly neighbourArea: Int32Array
  /** Edges of neighbour pair k are edgeStart[k] … edgeStart[k + 1] − 1 in `edgeList`. */
  readonly edgeStart: Int32Array
  readonly edgeList: Int32Array
}

const scratchByTopology = new WeakMap<Topology, Scratch>()

function scratchFor(topology: Topology): Scratch {
  let scratch = scratchByTopology.get(topology)
  if (!scratch) {
    const pairs = topology.neighbours.reduce((sum, list) => sum + list.length, 0)
    const neighbourStart = new Int32Array(topology.areaCount + 1)
    const neighbourArea = new Int32Array(pairs)
    const edgeStart = new Int32Array(pairs + 1)
    const edgeList = new Int32Array(topology.neighbours.reduce((sum, list) => sum + list.reduce((inner, n) => inner + n.edges.length, 0), 0))
    let pair = 0
    let edgeAt = 0
    topology.neighbours.forEach((list, area) => {
      neighbourStart[area] = pair
      for (const neighbour of list) {
        neighbourArea[pair] = neighbour.area
        edgeStart[pair] = edgeAt
        for (const edge of neighbour.edges) edgeList[edgeAt++] = edge
        pair += 1
      }
    })
    neighbourStart[topology.areaCount] = pair
    edgeStart[pair] = edgeAt
    scratch = {
      inCut: new Uint8Array(topology.seamEdges.length),
      side: new Uint8Array(topology.areaCount),
      stack: new Int32Array(topology.areaCount + 1),
      lineMark: new Uint8Array(topology.lines.length),
      neighbourStart,
      neighbourArea,
      edgeStart,
      edgeList,
    }
    scratchByTopology.set(topology, scratch)
  }
  return scratch
}

/** Marks with `mark` every area of the unit reachable from `seed` without crossing a cut edge or a marked area. */
function flood(unit: AreaSet, seed: number, mark: number, scratch: Scratch): number {
  const { inCut, side, stack, neighbourStart, neighbourArea, edgeStart, edgeList } = scratch
  let top = 0
  let count = 1
  side[seed] = mark
  stack[top++] = seed
  while (top > 0) {
    const area = stack[--top] as number
    const end = neighbourStart[area + 1] as number
    for (let pair = neighbourStart[area] as number; pair < end; pair += 1) {
      const next = neighbourArea[pair] as number
      if (side[next] !== 0 || (((unit[next >>> 5] as number) >>> (next & 31)) & 1) === 0) continue
      let open = false
      const last = edgeStart[pair + 1] as number
      for (let k = edgeStart[pair] as number; k < last; k += 1) {
        if (inCut[edgeList[k] as number] === 0) {
          open = true
          break
        }
      }
      if (!open) continue
      side[next] = mark
      stack[top++] = next
      count += 1
    }
  }
  return count
}

/** The two parts a cut leaves, or null when it does not split the unit cleanly in two. */
function split(topology: Topology, unit: AreaSet, members: readonly number[], edges: readonly number[], scratch: Scratch): { first: AreaSet; second: AreaSet } | null {
  const { inCut, side } = scratch
  for (const edge of edges) inCut[edge] = 1
  let result: { first: AreaSet; second: AreaSet } | null = null
  const firstCount = flood(unit, members[0] as number, 1, scratch)
  if (firstCount < members.length) {
    let secondSeed = -1
    for (const area of members) {
      if (side[area] === 0) {
        secondSeed = area
        break
      }
    }
    const secondCount = flood(unit, secondSeed, 2, scratch)
    let clean = firstCount + secondCount === members.length
    for (const edge of edges) {
      const e = topology.seamEdges[edge]
      if (!e || side[e.left] === side[e.right]) clean = false
    }
    if (clean) {
      const first = emptyAreaSet(topology.areaCount)
      const second = emptyAreaSet(topology.areaCount)
      for (const area of members) {
        const target = side[area] === 1 ? first : second
        target[area >>> 5] = (target[area >>> 5] as number) | (1 << (area & 31))
      }
      result = { first, second }
    }
  }
  for (const edge of edges) inCut[edge] = 0
  for (const area of members) side[area] = 0
  return result
}

interface SearchState {
  readonly topology: Topology
  readonly peel: PeelSearch
  readonly exact: Map<string, Solved | null>
  readonly atLeast: Map<string, number>
  readonly cuts: Map<string, Cut[]>
  /** Crossing lower bounds by unit key (see crossingBound). */
  readonly floor: Map<string, number>
  units: number
  gaveUp: boolean
}

/**
 * A lower bound from the vertices no area runs straight through (X crossings): every such vertex
 * inside the unit must lie on some join's cut, each cut lies on one seam line, so vertices that
 * share no seam line need a cut each. The unit needs at least one section more than a greedy
 * set of such vertices. For a grid of w × h cells this is min(w, h): exact.
 */
function crossingBound(state: SearchState, unit: AreaSet, key: string): number {
  const known = state.floor.get(key)
  if (known !== undefined) return known
  const { topology } = state
  const used = new Set<number>()
  let count = 0
  for (const { vertex, areas } of topology.blockedVertices) {
    if (!areas.every((area) => hasArea(unit, area))) continue
    const lines = (topology.edgesAtVertex[vertex] ?? []).map((edge) => topology.seamEdges[edge]!.line)
    if (lines.some((line) => used.has(line))) continue
    for (const line of lines) used.add(line)
    count += 1
  }
  state.floor.set(key, 1 + count)
  return 1 + count
}

function lowerBound(state: SearchState, unit: AreaSet, key: string): number {
  const exact = state.exact.get(key)
  if (exact) return exact.count
  return Math.max(state.atLeast.get(key) ?? 1, crossingBound(state, unit, key))
}

/** The best plan of `unit` using fewer than `limit` sections, or null when none exists below it. */
function solve(state: SearchState, unit: AreaSet, limit: number, key = areaSetKey(unit)): Solved | null {
  if (limit <= 1) return null
  const exact = state.exact.get(key)
  if (exact !== undefined) return exact && exact.count < limit ? exact : null
  const floor = lowerBound(state, unit, key)
  if (floor >= limit) return null
  // A unit holding a crossing is never one section: skip the peel search for it.
  const order = floor > 1 ? null : findSectionOrder(state.peel, unit)
  if (order) {
    const solved: Solved = { tree: { kind: 'section', order }, count: 1 }
    state.exact.set(key, solved)
    return solved
  }
  state.units += 1
  // A unit's cuts and bounds cost time in proportion to the areas, so large repeats visit fewer.
  if (state.units > MAX_SECTION_UNITS || state.units * state.topology.areaCount > MAX_SECTION_WORK) {
    state.gaveUp = true
    return null
  }
  let best: Solved | null = null
  let bound = limit
  // A unit can be searched again under a larger limit; its cuts do not change, so keep them.
  let cuts = state.cuts.get(key)
  if (!cuts) {
    cuts = cutsOf(state.topology, unit)
    state.cuts.set(key, cuts)
  }
  for (const cut of cuts) {
    // Not one section, so at least two; and never fewer than the crossing bound: stop on reaching it.
    if (bound <= Math.max(2, floor)) break
    // Each part needs at least its lower bound; skip cuts that cannot beat the best plan.
    if (lowerBound(state, cut.first, cut.firstKey) + lowerBound(state, cut.second, cut.secondKey) >= bound) continue
    const first = solve(state, cut.first, bound - 1, cut.firstKey)
    if (!first) continue
    const second = solve(state, cut.second, bound - first.count, cut.secondKey)
    if (!second) continue
    best = { tree: { kind: 'join', first: first.tree, second: second.tree, along: cut.along }, count: first.count + second.count }
    bound = best.count
  }
  if (best) state.exact.set(key, best)
  else if (!state.gaveUp) state.atLeast.set(key, limit)
  return best
}

/**
 * The plan with the fewest sections that honours every insert, deterministic for a design.
 * `below` (default: no limit) looks only for plans of fewer sections than that, so a caller
 * that only wants small plans (the repair search) does not pay for proving large ones; none
 * below it gives a null tree without `gaveUp`.
 *
 * @example fewestSections(topology, []).sectionCount // 2 for an X crossing
 */
export function fewestSections(topology: Topology, constraints: readonly InsertConstraint[], below = Infinity): FewestSectionsResult {
  const all = areaSetOf(topology.areaCount, Array.from({ length: topology.areaCount }, (_, index) => index))
  const state: SearchState = { topology, peel: createPeelSearch(topology, constraints), exact: new Map(), atLeast: new Map(), cuts: new Map(), floor: new Map(), units: 0, gaveUp: false }
  const solved = topology.areaCount === 0 ? null : solve(state, all, below)
  return { tree: solved?.tree ?? null, sectionCount: solved?.count ?? 0, gaveUp: state.gaveUp || state.peel.gaveUp }
}
