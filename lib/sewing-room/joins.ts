/**
 * How a repeat's sections are joined (the plan's join tree, pairs first) and which step catches
 * each leaf: the area step whose seam catches it, or, for a leaf on a seam between sections, the
 * join of those sections. The checklist and the picture both ask here, so a leaf appears in the
 * picture with the step that sews it in.
 */
import { isPointInPolygon, type JoinTree, type Point } from '@/geometry'
import { leavesInBooklet, type BookletModel, type LeafInBooklet } from '@/lib/booklet/model'

/** How far past the seam the other side is looked for, inches: well inside any area that can be sewn. */
const ACROSS_SEAM_INCHES = 0.05

/** One join of a join tree: the two groups of sections it sews together, each as its letters. */
export interface SectionJoin {
  readonly first: string
  readonly second: string
  readonly firstSections: readonly string[]
  readonly secondSections: readonly string[]
}

/**
 * The joins of a join tree in sewing order, pairs first.
 *
 * @example sectionJoins([['A', 'B'], 'C']).map((join) => `${join.first}+${join.second}`) // ['A+B', 'AB+C']
 */
export function sectionJoins(tree: JoinTree | readonly []): SectionJoin[] {
  const joins: SectionJoin[] = []
  const visit = (node: JoinTree): string[] => {
    if (typeof node === 'string') return [node]
    const first = visit(node[0])
    const second = visit(node[1])
    joins.push({ first: first.join(''), second: second.join(''), firstSections: first, secondSections: second })
    return [...first, ...second]
  }
  if (typeof tree === 'string' || tree.length === 2) visit(tree as JoinTree)
  return joins
}

/** The section on the other side of the seam from the area a leaf lies over (a section join catches such a leaf). */
export function sectionBeyondLeaf(model: BookletModel, entry: LeafInBooklet): string | null {
  const seam = model.design.seams.find((s) => s.id === entry.leaf.seam)
  if (!seam || !entry.over) return null
  // A point just past the seam's middle stretch along the leaf, on the other side.
  const [dx, dy] = [seam.to[0] - seam.from[0], seam.to[1] - seam.from[1]]
  const length = Math.hypot(dx, dy) || 1
  const base: Point = [seam.from[0] + dx * entry.leaf.at, seam.from[1] + dy * entry.leaf.at]
  const normal: Point = [-dy / length, dx / length] // left of from → to
  const sign = entry.leaf.side === 'left' ? -1 : 1
  const probe: Point = [base[0] + sign * normal[0] * ACROSS_SEAM_INCHES, base[1] + sign * normal[1] * ACROSS_SEAM_INCHES]
  const beyond = model.labelledAreas.find((area) => area.section !== entry.over?.section && isPointInPolygon(probe, area.polygon))
  return beyond?.section ?? null
}

/** The join (of `sectionJoins`) that catches a leaf lying over one section on a seam shared with another. */
export function joinCatching(joins: readonly SectionJoin[], over: string | null, beyond: string | null): SectionJoin | null {
  if (!over) return null
  return (
    joins.find((join) =>
      beyond
        ? (join.firstSections.includes(over) && join.secondSections.includes(beyond)) || (join.secondSections.includes(over) && join.firstSections.includes(beyond))
        : join.firstSections.includes(over) || join.secondSections.includes(over),
    ) ?? null
  )
}

/**
 * Where each leaf is caught, per repeat: the id of the step after which it is in the quilt (the
 * area step whose seam catches it, or the section join), by leaf id. Leaves that cannot be placed
 * or are caught nowhere are left out.
 *
 * @example leafSteps(model, 2).get('leaf-1') // 'r2:area:A2'
 */
export function leafSteps(model: BookletModel, repeat: number): Map<string, string> {
  const joins = sectionJoins(model.plan.assembly)
  const steps = new Map<string, string>()
  for (const entry of leavesInBooklet(model)) {
    if (entry.catcher?.label) {
      steps.set(entry.leaf.id, `r${repeat}:area:${entry.catcher.label}`)
      continue
    }
    const join = joinCatching(joins, entry.section, sectionBeyondLeaf(model, entry))
    if (join) steps.set(entry.leaf.id, `join:r${repeat}:${join.first}+${join.second}`)
  }
  return steps
}
