/**
 * Where a test report sits on the pattern, and whether the design has changed there since. Pure:
 * the server uses it when a report is filed and listed, the drafting board when it draws the pins
 * of the design being edited. Everything here is in design inches, the ring's frame (y up).
 */
import { applyTransform, isPointInPolygon, repeatTransforms, type Plan, type Point, type Ring } from '@/geometry'

/** Where a report's pin goes and the area label under it when the report was filed. */
export interface ReportPin {
  readonly point: readonly [number, number]
  /** The area label at the point then; null for a point outside every labelled area. */
  readonly area: string | null
}

/** What a place may name (lib/schemas/report.ts). */
export interface PlaceFacts {
  readonly area?: string
  readonly step?: number
  readonly page?: number
  readonly point?: readonly [number, number]
}

type PlanFacts = Pick<Plan, 'areas' | 'sections'>

/** The labels of the plan's areas in sewing order: step 1 is the first area sewn. */
export function stepLabels(plan: PlanFacts): string[] {
  const labelOf = new Map(plan.areas.map((area) => [area.id, area.label]))
  return plan.sections.flatMap((section) => section.order.flatMap((id) => labelOf.get(id) ?? []))
}

/**
 * The label of the labelled area under a point of the ring, in whichever repeat the point lies
 * (every repeat is a copy of repeat 0, turned or mirrored); null outside them all.
 *
 * @example areaLabelAt({ areas: [{ label: 'A1', polygon: [[0, 0], [4, 0], [0, 4]] }] }, { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }, [1, 1]) // 'A1'
 */
export function areaLabelAt(plan: { readonly areas: readonly { readonly label: string | null; readonly polygon: readonly Point[] }[] }, ring: Ring, point: Point): string | null {
  const transforms = repeatTransforms(ring)
  for (const area of plan.areas) {
    if (!area.label) continue
    for (const transform of transforms) {
      const polygon = area.polygon.map((corner) => applyTransform(transform, corner))
      if (isPointInPolygon(point, polygon)) return area.label
    }
  }
  return null
}

/**
 * The pin of a place on the plan it was filed against: a point stays where it was clicked; an area
 * (or a step, through its area) is pinned at its label's point in the first repeat; a page alone
 * has no pin.
 */
export function pinOf(place: PlaceFacts, plan: PlanFacts, ring: Ring): ReportPin | null {
  if (place.point) return { point: [place.point[0], place.point[1]], area: areaLabelAt(plan, ring, place.point) }
  const label = place.area ?? (place.step !== undefined ? stepLabels(plan)[place.step - 1] : undefined)
  const area = label ? plan.areas.find((candidate) => candidate.label === label) : undefined
  return area ? { point: [area.point[0], area.point[1]], area: label! } : null
}

/**
 * Whether the design has changed at a pin since its report was filed: the area it pointed at is
 * gone (its label no longer exists) or the point is no longer inside the area of the same label.
 * A pin filed outside every area never counts as changed.
 */
export function changedAtPin(pin: ReportPin | null, plan: PlanFacts, ring: Ring): boolean {
  if (!pin?.area) return false
  return areaLabelAt(plan, ring, pin.point) !== pin.area
}
