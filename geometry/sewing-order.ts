/**
 * Valid sewing orders of one section (flip-and-sew on one paper foundation).
 *
 * An order a1, a2, …, an is valid when every a_k (k ≥ 2) shares with a1 ∪ … ∪ a(k−1) exactly one
 * straight segment of positive length; points where areas merely touch do not count. (The
 * criterion of Leake, Bernstein, Davis and Agrawala, "A Mathematical Foundation for Foundation
 * Paper Pieceable Quilts", ACM TOG 40(4), 2021, restated.) Read backwards it peels: the last
 * area lies on a single seam line of the whole; remove it and repeat.
 *
 * Inserts add precedences: a leaf lying over area p, caught in the seam between p and q, must
 * be basted on p before q is sewn, so within one section p comes before q.
 */
import { areaCount, areaMembers, areaSetKey, hasArea, withoutArea, type AreaSet } from './area-set'
import { boundaryOfEdges, edgesBetweenAreaAndSet, type BoundaryVerdict, type Topology } from './area-topology'
import { leafMention } from './leaf-names'
import { MAX_PEEL_STATES } from './tolerances'
import type { Point, Segment } from './types'

/** A leaf insert as a precedence between the two areas of the seam that catches it. */
export interface InsertConstraint {
  readonly leafId: string
  /** The area the leaf lies over: it is sewn first and the leaf is basted onto it. */
  readonly over: number
  /** The area sewn over the leaf's raw edge. */
  readonly under: number
  /** Where the leaf's open end sits on the seam. */
  readonly at: Point
}

export interface SectionStep {
  readonly area: number
  /** The segment along which the area is sewn to the earlier ones; null for the first area. */
  readonly sewnAlong: Segment | null
}

export interface StepFailure {
  readonly area: number
  readonly code: 'step-no-seam' | 'step-two-lines' | 'step-broken-line' | 'insert-order'
  readonly message: string
}

/**
 * Plain words for a boundary that is not one straight segment.
 *
 * @example describeBoundary({ kind: 'two-lines', lineCount: 2 }, 'A3', 'the sewn areas') // 'A3 meets the sewn areas along two lines'
 */
export function describeBoundary(verdict: BoundaryVerdict, subject: string, others: string): string {
  switch (verdict.kind) {
    case 'none':
      return `${subject} does not meet ${others} along a seam`
    case 'two-lines':
      return `${subject} meets ${others} along ${verdict.lineCount === 2 ? 'two lines' : `${verdict.lineCount} lines`}`
    case 'broken':
      return `${subject} meets ${others} along two separate pieces of one line`
    case 'segment':
      return `${subject} meets ${others} along one straight segment`
  }
}

/**
 * Checks one section's order step by step, with the section's label for messages (A1, A2, …).
 * Every failing step is reported, each with its reason.
 *
 * @example
 * checkSectionOrder(topology, [0, 1, 2], [], 'A').failures // [] when the order is valid
 */
export function checkSectionOrder(
  topology: Topology,
  order: readonly number[],
  constraints: readonly InsertConstraint[],
  label: string,
): { readonly steps: SectionStep[]; readonly failures: StepFailure[] } {
  const steps: SectionStep[] = []
  const failures: StepFailure[] = []
  const stepOf = new Map(order.map((area, index) => [area, index]))
  const name = (area: number): string => `${label}${(stepOf.get(area) ?? 0) + 1}`
  const sewn: number[] = []
  order.forEach((area, index) => {
    if (index === 0) {
      steps.push({ area, sewnAlong: null })
    } else {
      const earlier = new Uint32Array(Math.max(1, Math.ceil(topology.areaCount / 32)))
      for (const a of sewn) earlier[a >>> 5] = (earlier[a >>> 5] as number) | (1 << (a & 31))
      const verdict = boundaryOfEdges(topology, edgesBetweenAreaAndSet(topology, area, earlier))
      if (verdict.kind === 'segment') {
        steps.push({ area, sewnAlong: verdict.segment })
      } else {
        steps.push({ area, sewnAlong: null })
        const code = verdict.kind === 'none' ? 'step-no-seam' : verdict.kind === 'two-lines' ? 'step-two-lines' : 'step-broken-line'
        failures.push({ area, code, message: `${describeBoundary(verdict, name(area), 'the sewn areas')}.` })
      }
    }
    for (const constraint of constraints) {
      if (constraint.under !== area) continue
      const overStep = stepOf.get(constraint.over)
      if (overStep !== undefined && overStep > index) {
        failures.push({
          area,
          code: 'insert-order',
          message: `${leafMention(constraint.leafId)} must be basted on ${name(constraint.over)} before ${name(area)} is sewn, but ${name(constraint.over)} comes later.`,
        })
      }
    }
    sewn.push(area)
  })
  return { steps, failures }
}

/** Shared state of the one-section search: memo by set, a budget, and the inserts. */
export interface PeelSearch {
  readonly topology: Topology
  /** For each area p, the areas q that must come after it (a leaf over p caught in the p–q seam). */
  readonly mustPrecede: readonly (readonly number[])[]
  readonly memo: Map<string, readonly number[] | null>
  states: number
  gaveUp: boolean
}

/**
 * A fresh one-section search over a topology with its insert constraints.
 *
 * @example findSectionOrder(createPeelSearch(topology, []), fullSet)
 */
export function createPeelSearch(topology: Topology, constraints: readonly InsertConstraint[]): PeelSearch {
  const mustPrecede = Array.from({ length: topology.areaCount }, (): number[] => [])
  for (const constraint of constraints) mustPrecede[constraint.over]?.push(constraint.under)
  return { topology, mustPrecede, memo: new Map(), states: 0, gaveUp: false }
}

/**
 * Whether `area` can be the last area sewn of `set`: one straight segment with the rest, no insert broken.
 *
 * @example canPeel(search, areaSetOf(3, [0, 1, 2]), 2) // true when area 2 can be sewn last
 */
export function canPeel(search: PeelSearch, set: AreaSet, area: number): boolean {
  for (const later of search.mustPrecede[area] ?? []) if (later !== area && hasArea(set, later)) return false
  // The same test as boundaryOfEdges, without building the edge list: this is the inner loop.
  let line = -1
  let low = Infinity
  let high = -Infinity
  let count = 0
  for (const neighbour of search.topology.neighbours[area] ?? []) {
    if (neighbour.area === area || !hasArea(set, neighbour.area)) continue
    for (const edge of neighbour.edges) {
      const e = search.topology.seamEdges[edge] as { line: number; position: number }
      if (line === -1) line = e.line
      else if (e.line !== line) return false
      if (e.position < low) low = e.position
      if (e.position > high) high = e.position
      count += 1
    }
  }
  return count > 0 && high - low + 1 === count
}

/**
 * Whether the areas of a set are connected through seam edges (a section must be).
 *
 * @example isConnected(topology, areaSetOf(4, [0, 3])) // false when areas 0 and 3 only touch at a corner
 */
export function isConnected(topology: Topology, set: AreaSet): boolean {
  const members = areaMembers(set)
  if (members.length <= 1) return true
  const seen = new Set<number>([members[0] as number])
  const stack = [members[0] as number]
  while (stack.length > 0) {
    const area = stack.pop() as number
    for (const neighbour of topology.neighbours[area] ?? []) {
      if (hasArea(set, neighbour.area) && !seen.has(neighbour.area)) {
        seen.add(neighbour.area)
        stack.push(neighbour.area)
      }
    }
  }
  return seen.size === members.length
}

/**
 * A valid one-section order of the set honouring every insert, or null. Depth-first over peels
 * (the last area first), memoised by the set that remains; each question may explore
 * MAX_PEEL_STATES sets before it gives up (null, with `gaveUp` set), which only happens far
 * beyond the sizes designers draw.
 *
 * @example findSectionOrder(createPeelSearch(topology, []), areaSetOf(3, [0, 1, 2])) // e.g. [0, 1, 2]
 */
export function findSectionOrder(search: PeelSearch, set: AreaSet): readonly number[] | null {
  search.states = 0
  return peel(search, set)
}

/** Whether the set holds every area around a vertex no area runs straight through (see Topology). */
function holdsBlockedVertex(topology: Topology, set: AreaSet): boolean {
  return topology.blockedVertices.some(({ areas }) => areas.every((area) => hasArea(set, area)))
}

function neighboursIn(topology: Topology, set: AreaSet, area: number): number {
  let count = 0
  for (const neighbour of topology.neighbours[area] ?? []) if (neighbour.area !== area && hasArea(set, neighbour.area)) count += 1
  return count
}

function peel(search: PeelSearch, set: AreaSet): readonly number[] | null {
  const key = areaSetKey(set)
  const known = search.memo.get(key)
  if (known !== undefined) return known
  const members = areaMembers(set)
  if (members.length === 1) return members
  if (holdsBlockedVertex(search.topology, set)) {
    search.memo.set(key, null)
    return null
  }
  if (search.states >= MAX_PEEL_STATES) {
    search.gaveUp = true
    return null
  }
  search.states += 1
  // An area touching only one other area of the set can be peeled first without losing any
  // order: every other peel before it is independent of it (they share no edge), and peeling
  // its one neighbour first would strand it. So take it and do not branch; this keeps many
  // independent ears (caps along an arc) from multiplying into every order of them.
  let forced = -1
  for (let i = members.length - 1; i >= 0 && forced < 0; i -= 1) {
    const area = members[i] as number
    if (neighboursIn(search.topology, set, area) === 1 && canPeel(search, set, area)) forced = area
  }
  let found: readonly number[] | null = null
  if (forced >= 0) {
    const before = peel(search, withoutArea(set, forced))
    found = before ? [...before, forced] : null
  } else {
    // Highest index first: a fixed rule, so the same design always gets the same order.
    for (let i = members.length - 1; i >= 0 && !found; i -= 1) {
      const area = members[i] as number
      if (!canPeel(search, set, area)) continue
      const rest = withoutArea(set, area)
      // What remains must stay connected, or it can never be one section: prune before recursing.
      if (!isConnected(search.topology, rest)) continue
      const before = peel(search, rest)
      if (before) found = [...before, area]
    }
  }
  // A failure is only known when this question still had budget left (the count only grows).
  if (found || search.states < MAX_PEEL_STATES) search.memo.set(key, found)
  return found
}

/**
 * What is left after peeling greedily until nothing peels: the core that stops a set from being
 * one section (a Y point, a pinwheel cycle, a crossing), used to place the explanation.
 *
 * @example stuckCore(search, fullSet) // the areas around a pinwheel's centre
 */
export function stuckCore(search: PeelSearch, set: AreaSet): number[] {
  let current = set
  for (;;) {
    if (areaCount(current) <= 1) return areaMembers(current)
    const peelable = areaMembers(current).find((area) => canPeel(search, current, area))
    if (peelable === undefined) return areaMembers(current)
    current = withoutArea(current, peelable)
  }
}
