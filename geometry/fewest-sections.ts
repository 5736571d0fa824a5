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
import { areaMembers, areaSetKey, areaSetOf, hasArea, type AreaSet } from './area-set'
import { boundaryOfEdges, type Topology } from './area-topology'
import { createPeelSearch, findSectionOrder, type InsertConstraint, type PeelSearch } from './sewing-order'
import { MAX_SECTION_UNITS } from './tolerances'
import type { Segment } from './types'

/** A plan of sections: one section in sewing order, or two subtrees joined along one segment. */
export type SectionTree =
  | { readonly kind: 'section'; readonly order: readonly number[] }
  | { readonly kind: 'join'; readonly first: SectionTree; readonly second: SectionTree; readonly along: Segment }

export interface Cut {
  readonly first: AreaSet
  readonly second: AreaSet
  readonly along: Segment
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
  const inCut = new Uint8Array(topology.seamEdges.length)
  const isBoundary = (vertex: number): boolean => (topology.areasAtVertex[vertex] ?? []).some((area) => area < 0 || !hasArea(unit, area))
  const interior = (edge: number): boolean => {
    const e = topology.seamEdges[edge]
    return e !== undefined && hasArea(unit, e.left) && hasArea(unit, e.right)
  }
  const members = areaMembers(unit)
  const seen = new Set<string>()
  for (const line of topology.lines) {
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
      for (let i = 0; i < stops.length; i += 1) {
        for (let j = i + 1; j < stops.length; j += 1) {
          const from = stops[i] as number
          const to = stops[j] as number
          const edges = line.edges.slice(from, to)
          for (const edge of edges) inCut[edge] = 1
          const cut = split(topology, unit, members, edges, inCut)
          for (const edge of edges) inCut[edge] = 0
          if (!cut) continue
          const key = areaSetKey(cut.first)
          if (seen.has(key)) continue
          seen.add(key)
          const along: Segment = [topology.vertices[line.vertices[from] as number]!, topology.vertices[line.vertices[to] as number]!]
          const full = { ...cut, along }
          if (!allowed || allowed(full)) cuts.push(full)
        }
      }
      start = end + 1
    }
  }
  return cuts
}

/** The two parts a cut leaves, or null when it does not split the unit cleanly in two. */
function split(topology: Topology, unit: AreaSet, members: readonly number[], edges: readonly number[], inCut: Uint8Array): { first: AreaSet; second: AreaSet } | null {
  const reach = (seed: number, within: (area: number) => boolean): Set<number> => {
    const seen = new Set<number>([seed])
    const stack = [seed]
    while (stack.length > 0) {
      const area = stack.pop() as number
      for (const neighbour of topology.neighbours[area] ?? []) {
        if (seen.has(neighbour.area) || !within(neighbour.area)) continue
        if (neighbour.edges.every((edge) => inCut[edge] === 1)) continue
        seen.add(neighbour.area)
        stack.push(neighbour.area)
      }
    }
    return seen
  }
  const firstMembers = reach(members[0] as number, (area) => hasArea(unit, area))
  if (firstMembers.size === members.length) return null
  const secondSeed = members.find((area) => !firstMembers.has(area)) as number
  const secondMembers = reach(secondSeed, (area) => hasArea(unit, area) && !firstMembers.has(area))
  if (firstMembers.size + secondMembers.size !== members.length) return null
  for (const edge of edges) {
    const e = topology.seamEdges[edge]
    if (!e || firstMembers.has(e.left) === firstMembers.has(e.right)) return null
  }
  return { first: areaSetOf(topology.areaCount, firstMembers), second: areaSetOf(topology.areaCount, secondMembers) }
}

interface SearchState {
  readonly topology: Topology
  readonly peel: PeelSearch
  readonly exact: Map<string, Solved | null>
  readonly atLeast: Map<string, number>
  units: number
  gaveUp: boolean
}

/** The best plan of `unit` using fewer than `limit` sections, or null when none exists below it. */
function solve(state: SearchState, unit: AreaSet, limit: number): Solved | null {
  if (limit <= 1) return null
  const key = areaSetKey(unit)
  const exact = state.exact.get(key)
  if (exact !== undefined) return exact && exact.count < limit ? exact : null
  if ((state.atLeast.get(key) ?? 1) >= limit) return null
  const order = findSectionOrder(state.peel, unit)
  if (order) {
    const solved: Solved = { tree: { kind: 'section', order }, count: 1 }
    state.exact.set(key, solved)
    return solved
  }
  state.units += 1
  if (state.units > MAX_SECTION_UNITS) {
    state.gaveUp = true
    return null
  }
  let best: Solved | null = null
  let bound = limit
  for (const cut of cutsOf(state.topology, unit)) {
    if (bound <= 2) break
    const first = solve(state, cut.first, bound - 1)
    if (!first) continue
    const second = solve(state, cut.second, bound - first.count)
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
 *
 * @example fewestSections(topology, []).sectionCount // 2 for an X crossing
 */
export function fewestSections(topology: Topology, constraints: readonly InsertConstraint[]): FewestSectionsResult {
  const all = areaSetOf(topology.areaCount, Array.from({ length: topology.areaCount }, (_, index) => index))
  const state: SearchState = { topology, peel: createPeelSearch(topology, constraints), exact: new Map(), atLeast: new Map(), units: 0, gaveUp: false }
  const solved = topology.areaCount === 0 ? null : solve(state, all, Infinity)
  return { tree: solved?.tree ?? null, sectionCount: solved?.count ?? 0, gaveUp: state.gaveUp || state.peel.gaveUp }
}

/** Whether the segment a join is sewn along is one straight segment (used by checks in tests). */
export function isStraightJoin(topology: Topology, edges: readonly number[]): boolean {
  return boundaryOfEdges(topology, edges).kind === 'segment'
}
