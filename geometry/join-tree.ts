/**
 * The join tree: sections joined pairwise, each join along one straight segment (point
 * contacts ignored), as a maker sews four sections laid two by two: pairs first, then the rows.
 */
import { areaSetKey, areaSetOf, hasArea, type AreaSet } from './area-set'
import { boundaryOfEdges, edgesBetweenSets, type Topology } from './area-topology'
import { cutsOf } from './fewest-sections'
import { describeBoundary } from './sewing-order'
import type { JoinTree } from './types'

export interface JoinFailure {
  readonly code: 'join-not-straight' | 'join-unknown-section' | 'join-repeated-section' | 'join-missing-section'
  readonly message: string
  /** An area of the join, to place the problem. */
  readonly area: number
}

function labelsOf(tree: JoinTree): string[] {
  return typeof tree === 'string' ? [tree] : [...labelsOf(tree[0]), ...labelsOf(tree[1])]
}

/** A group of sections in words: `A`, `A+B`, `(A+B)+C`. */
function describeTree(tree: JoinTree, top = true): string {
  if (typeof tree === 'string') return tree
  const inner = `${describeTree(tree[0], false)}+${describeTree(tree[1], false)}`
  return top ? inner : `(${inner})`
}

/**
 * Checks a join tree set by hand: every section exactly once, every join along one straight
 * segment.
 *
 * @example checkJoinTree(topology, ['A', 'B'], new Map([['A', [0, 1]], ['B', [2, 3]]])) // []
 */
export function checkJoinTree(topology: Topology, tree: JoinTree, sections: ReadonlyMap<string, readonly number[]>): JoinFailure[] {
  const failures: JoinFailure[] = []
  const firstArea = (label: string): number => sections.get(label)?.[0] ?? 0
  const labels = labelsOf(tree)
  const seen = new Set<string>()
  for (const label of labels) {
    if (!sections.has(label)) failures.push({ code: 'join-unknown-section', message: `The join tree names section ${label}, which the order does not have.`, area: 0 })
    else if (seen.has(label)) failures.push({ code: 'join-repeated-section', message: `The join tree names section ${label} twice.`, area: firstArea(label) })
    seen.add(label)
  }
  for (const label of sections.keys()) {
    if (!seen.has(label)) failures.push({ code: 'join-missing-section', message: `Section ${label} is in no join of the join tree.`, area: firstArea(label) })
  }
  if (failures.length > 0) return failures
  const visit = (node: JoinTree): number[] => {
    if (typeof node === 'string') return [...(sections.get(node) ?? [])]
    const first = visit(node[0])
    const second = visit(node[1])
    const verdict = boundaryOfEdges(topology, edgesBetweenSets(topology, first, areaSetOf(topology.areaCount, second)))
    if (verdict.kind !== 'segment') {
      failures.push({ code: 'join-not-straight', message: `${describeBoundary(verdict, describeTree(node[0]), describeTree(node[1]))}, so they cannot be joined with one straight seam.`, area: first[0] ?? 0 })
    }
    return [...first, ...second]
  }
  visit(tree)
  return failures
}

/**
 * A join tree for sections fixed by hand, found by straight cuts that keep every section whole;
 * null when the sections cannot be joined pairwise along straight seams.
 *
 * @example findJoinTree(topology, [{ label: 'A', areas: [0, 1] }, { label: 'B', areas: [2, 3] }]) // ['A', 'B']
 */
export function findJoinTree(topology: Topology, sections: readonly { readonly label: string; readonly areas: readonly number[] }[]): JoinTree | null {
  const sectionOf = new Map<number, number>()
  sections.forEach((section, index) => section.areas.forEach((area) => sectionOf.set(area, index)))
  const failed = new Set<string>()
  const solve = (unit: AreaSet, members: readonly number[]): JoinTree | null => {
    const groups = new Set(members.map((area) => sectionOf.get(area)))
    if (groups.size === 1) return sections[[...groups][0] as number]?.label ?? null
    const key = areaSetKey(unit)
    if (failed.has(key)) return null
    // A cut may only run between sections: each section lies wholly on one side.
    const keepsSections = (cut: { first: AreaSet }): boolean =>
      sections.every((section) => section.areas.every((area) => hasArea(cut.first, area)) || section.areas.every((area) => !hasArea(cut.first, area)))
    for (const cut of cutsOf(topology, unit, keepsSections)) {
      const firstMembers = members.filter((area) => hasArea(cut.first, area))
      const secondMembers = members.filter((area) => hasArea(cut.second, area))
      const first = solve(cut.first, firstMembers)
      if (first === null) continue
      const second = solve(cut.second, secondMembers)
      if (second !== null) return [first, second]
    }
    failed.add(key)
    return null
  }
  const all = sections.flatMap((section) => section.areas)
  return solve(areaSetOf(topology.areaCount, all), [...all].sort((p, q) => p - q))
}
