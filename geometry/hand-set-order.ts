/**
 * A sewing order set by hand (the design's `order`) is checked, not replaced: each area is
 * named by a point inside it, every failing step is named with its reason and placed on its
 * area, and the join tree is checked (or found, when the designer left it out).
 */
import type { Arrangement } from './arrangement'
import type { Topology } from './area-topology'
import { checkJoinTree, findJoinTree } from './join-tree'
import type { LabelledSection } from './plan'
import { isPointInPolygon } from './polygon-measure'
import { checkSectionOrder, type InsertConstraint } from './sewing-order'
import type { HandSetOrder, JoinTree, Point, Problem } from './types'

const at = (p: Point): string => `(${p[0].toFixed(2)}, ${p[1].toFixed(2)})`

/**
 * Checks a hand-set order and returns its sections (arrangement indices), its join tree and the
 * problems found.
 *
 * @example checkHandSetOrder(topology, arrangement, design.order, constraints).problems // [] when valid
 */
export function checkHandSetOrder(
  topology: Topology,
  arrangement: Arrangement,
  order: HandSetOrder,
  constraints: readonly InsertConstraint[],
): { readonly sections: LabelledSection[]; readonly assembly: JoinTree | null; readonly problems: Problem[] } {
  const problems: Problem[] = []
  const owner = new Map<number, string>()
  const sections: LabelledSection[] = order.sections.map((section) => {
    const areas: number[] = []
    section.areas.forEach((point, index) => {
      const area = arrangement.areas.find((candidate) => isPointInPolygon(point, candidate.polygon))
      const name = `${section.label}${index + 1}`
      if (!area) {
        problems.push({ code: 'order-point-outside', severity: 'error', message: `${name} is named by the point ${at(point)}, which lies in no area.`, at: point })
        return
      }
      const earlier = owner.get(area.index)
      if (earlier !== undefined) {
        problems.push({ code: 'order-area-repeated', severity: 'error', message: `${name} names the same area as ${earlier}.`, at: area.point })
        return
      }
      owner.set(area.index, name)
      areas.push(area.index)
    })
    return { label: section.label, order: areas }
  })
  for (const area of arrangement.areas) {
    if (!owner.has(area.index)) {
      problems.push({ code: 'order-area-missing', severity: 'error', message: `The area at ${at(area.point)} is in no section of the hand-set order.`, at: area.point })
    }
  }
  for (const section of sections) {
    for (const failure of checkSectionOrder(topology, section.order, constraints, section.label).failures) {
      problems.push({ code: failure.code, severity: 'error', message: failure.message, at: arrangement.areas[failure.area]?.point ?? [0, 0] })
    }
  }
  if (problems.length > 0) return { sections, assembly: order.assembly ?? null, problems }
  const byLabel = new Map(sections.map((section) => [section.label, section.order]))
  if (order.assembly) {
    for (const failure of checkJoinTree(topology, order.assembly, byLabel)) {
      problems.push({ code: failure.code, severity: 'error', message: failure.message, at: arrangement.areas[failure.area]?.point ?? [0, 0] })
    }
    return { sections, assembly: order.assembly, problems }
  }
  const found = findJoinTree(topology, sections.map((section) => ({ label: section.label, areas: section.order })))
  if (!found) {
    problems.push({
      code: 'order-no-assembly',
      severity: 'error',
      message: 'The hand-set sections cannot be joined pairwise along straight seams.',
      at: arrangement.areas[sections[0]?.order[0] ?? 0]?.point ?? [0, 0],
    })
  }
  return { sections, assembly: found, problems }
}
