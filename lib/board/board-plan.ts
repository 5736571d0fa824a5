/**
 * The sewing plan of the design on the board, in the design's own units for drawing. Computed by
 * the geometry core from the design; it is never a state of its own and never undone.
 */
import { fabricsOfAreas, planDesign, sectionOutline, type Plan } from '@/geometry'
import { parseDesign, type DesignIssue } from '@/lib/schemas/design'
import type { BoardDesign } from './commands'

type Point = readonly [number, number]

export interface BoardPlan {
  /** Null when the design itself is not a valid design file (e.g. an inner radius past the outer). */
  readonly plan: Plan | null
  readonly issues: readonly DesignIssue[]
  /** Design units per inch: 1 for inches, 2.54 for centimetres. */
  readonly unitsPerInch: number
}

const planCache = new WeakMap<BoardDesign, BoardPlan>()

/** The plan of a design, computed once per design value (the store's designs are immutable). */
export function boardPlan(design: BoardDesign): BoardPlan {
  const cached = planCache.get(design)
  if (cached) return cached
  const unitsPerInch = design.units === 'cm' ? 2.54 : 1
  const parsed = parseDesign(design)
  const result: BoardPlan = parsed.ok
    ? { plan: planDesign(parsed.design), issues: [], unitsPerInch }
    : { plan: null, issues: parsed.issues, unitsPerInch }
  planCache.set(design, result)
  return result
}

/** Converts a point of the plan (inches) to the design's units. */
export const toDesignUnits = (point: Point, unitsPerInch: number): [number, number] => [point[0] * unitsPerInch, point[1] * unitsPerInch]

/** The area of the plan that contains a point (design units), if any. */
export function areaAt(result: BoardPlan, point: Point): Plan['areas'][number] | null {
  if (!result.plan) return null
  const inches: Point = [point[0] / result.unitsPerInch, point[1] / result.unitsPerInch]
  return result.plan.areas.find((area) => isInside(inches, area.polygon)) ?? null
}

function isInside(point: Point, polygon: readonly Point[]): boolean {
  let inside = false
  for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i++) {
    const [xi, yi] = polygon[i]!
    const [xj, yj] = polygon[j]!
    if (yi > point[1] !== yj > point[1] && point[0] < ((xj - xi) * (point[1] - yi)) / (yj - yi) + xi) inside = !inside
  }
  return inside
}

/** Every sewing step of the plan in order: section by section, area by area. */
export function sewingSteps(plan: Plan) {
  const byId = new Map(plan.areas.map((area) => [area.id, area]))
  return plan.sections.flatMap((section) => section.order.map((id) => byId.get(id)!).filter(Boolean))
}

/** The design's fills with their points in inches, as the plan's areas are. */
export function inchFills(design: BoardDesign, result: BoardPlan) {
  return design.fills.map((fill) => ({ ...fill, at: [fill.at[0] / result.unitsPerInch, fill.at[1] / result.unitsPerInch] as const }))
}

/** The fabric of an area (the core's rule: the last fill inside it). */
export function fabricOfArea(design: BoardDesign, result: BoardPlan, areaId: string): string | null {
  return result.plan ? fabricsOfAreas(inchFills(design, result), result.plan.areas).get(areaId) ?? null : null
}

export interface SectionOutline {
  readonly label: string
  /** Outer rings of the section's areas united, in design units. */
  readonly rings: readonly (readonly Point[])[]
}

const outlineCache = new WeakMap<BoardPlan, readonly SectionOutline[]>()

/**
 * Each section's outline (the edge of its foundation paper before the trim allowance), for the
 * board to draw around the areas sewn on one paper.
 */
export function sectionOutlines(result: BoardPlan): readonly SectionOutline[] {
  const cached = outlineCache.get(result)
  if (cached) return cached
  const plan = result.plan
  const byId = new Map(plan?.areas.map((area) => [area.id, area]) ?? [])
  const outlines = (plan?.sections ?? []).map((section) => {
    const polygons = section.order.map((id) => byId.get(id)!.polygon)
    // A plan's section always holds at least one area, and sectionOutline falls back on its own
    // when polygon-clipping fails, so there is nothing to catch here.
    const rings = [sectionOutline(polygons).map((p) => toDesignUnits(p, result.unitsPerInch))]
    return { label: section.label, rings }
  })
  outlineCache.set(result, outlines)
  return outlines
}
