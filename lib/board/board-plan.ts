/**
 * The sewing plan of the design on the board. The core plans in inches; this file converts what
 * the board draws and hit-tests (areas, sewing lines, rough-cut pieces, problem markers, section
 * outlines) to the design's own units once, here, so no component converts on its own. Computed
 * from the design; it is never a state of its own and never undone.
 */
import {
  fabricsOfAreas, isPointInPolygon, leafNames, planDesign, roughCutBeforeFlip, sectionOutline, suggestRepairs,
  type Design, type Leaf, type Plan, type PlanArea, type Point, type Problem, type Seam, type Suggestion,
} from '@/geometry'
import { nameLeavesIn } from '@/geometry/leaf-names'
import { parseDesign, type DesignIssue } from '@/lib/schemas/design'
import { unitsPerInch } from '@/lib/units'
import type { BoardDesign } from './commands'

/** An area of the plan as the board draws it: every point in design units. */
export interface BoardArea {
  /** The core's area, in inches: its label, step, rough-cut size and leaves, for the texts. */
  readonly planned: PlanArea
  readonly id: string
  readonly label: string | null
  readonly polygon: readonly Point[]
  /** Where its label goes, inside the area. */
  readonly labelAt: Point
  /** The line it is sewn along, or null for the first area of a section. */
  readonly sewnAlong: readonly Point[] | null
  /** The rough-cut piece as it lies before the flip (after it, for a first area). */
  readonly roughCutPlaced: readonly Point[]
  /** The fabric of the last fill inside it (the core's rule), or null. */
  readonly fabric: string | null
}

/** A problem of the plan with its place in design units. */
export type BoardProblem = Problem & { readonly at: Point }

export interface BoardPlan {
  /** The core's plan, in inches (null when the design is not a valid design file, e.g. an inner radius past the outer). */
  readonly plan: Plan | null
  readonly issues: readonly DesignIssue[]
  /** The plan's areas in design units, in the plan's order. */
  readonly areas: readonly BoardArea[]
  /** The same areas in sewing order: section by section, step by step. */
  readonly steps: readonly BoardArea[]
  readonly problems: readonly BoardProblem[]
  /** Design units per inch: 1 for inches, 2.54 for centimetres (for section outlines, below). */
  readonly unitsPerInch: number
  /** Each leaf's plain name by id ("leaf 2 of A3"): what the board shows instead of ids. */
  readonly leafNames: ReadonlyMap<string, string>
}

const planCache = new WeakMap<BoardDesign, BoardPlan>()

/** The plan of a design, computed once per design value (the store's designs are immutable). */
export function boardPlan(design: BoardDesign): BoardPlan {
  const cached = planCache.get(design)
  if (cached) return cached
  const factor = unitsPerInch(design.units)
  const parsed = parseDesign(design)
  const result: BoardPlan = parsed.ok
    ? // The repair search runs apart (boardSuggestions), after the designer pauses: this plan follows every drag.
      inDesignUnits(planDesign(parsed.design, { suggestions: false }), parsed.design, factor)
    : { plan: null, issues: parsed.issues, areas: [], steps: [], problems: [], unitsPerInch: factor, leafNames: new Map() }
  planCache.set(design, result)
  return result
}

/** The one conversion of the plan's inches to the design's units. */
const toDesignUnits = (point: Point, factor: number): [number, number] => [point[0] * factor, point[1] * factor]

function inDesignUnits(plan: Plan, designInInches: Design, factor: number): BoardPlan {
  const convert = (points: readonly Point[]) => points.map((p) => toDesignUnits(p, factor))
  const fabrics = fabricsOfAreas(designInInches.fills, plan.areas)
  const areas = plan.areas.map((area): BoardArea => ({
    planned: area,
    id: area.id,
    label: area.label,
    polygon: convert(area.polygon),
    labelAt: toDesignUnits(area.point, factor),
    sewnAlong: area.sewnAlong ? convert(area.sewnAlong) : null,
    // Before the flip the piece lies right side down over the sewn areas, mirrored across the sewing line.
    roughCutPlaced: convert(area.sewnAlong ? roughCutBeforeFlip(area.roughCut, area.sewnAlong) : area.roughCut.corners),
    fabric: fabrics.get(area.id) ?? null,
  }))
  const byId = new Map(areas.map((area) => [area.id, area]))
  const steps = plan.sections.flatMap((section) => section.order.flatMap((id) => byId.get(id) ?? []))
  const problems = plan.problems.map((problem) => ({ ...problem, at: toDesignUnits(problem.at, factor) }))
  return { plan, issues: [], areas, steps, problems, unitsPerInch: factor, leafNames: leafNames(designInInches, plan) }
}

/** The area of the plan that contains a point (design units), if any. */
export function areaAt(result: BoardPlan, point: Point): BoardArea | null {
  return result.areas.find((area) => isPointInPolygon(point, area.polygon)) ?? null
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

/** A seam as the board keeps it: the design file's seam, in the design's units. */
export type BoardSeam = BoardDesign['seams'][number]

/** Rounds like every board command does (to 1/10 000 of a unit), so a seam end is stored the same way. */
const roundUnit = (value: number) => Math.round(value * 10_000) / 10_000

/**
 * A suggestion's seams (core inches) in the design's units: the one conversion of a repair.
 * An end the suggestion left where it was (equal at the board's precision) keeps the design's own
 * value, so applying a suggestion changes only what it changes, even in centimetres; every other
 * end is converted with the exact factor and rounded as the board's commands round.
 *
 * @example suggestedSeamsInDesignUnits({ units: 'cm', seams: [] }, [{ id: 's1', from: [1, 0], to: [0, 1] }]) // [{ id: 's1', from: [2.54, 0], to: [0, 2.54] }]
 */
export function suggestedSeamsInDesignUnits(design: Pick<BoardDesign, 'units' | 'seams'>, seams: readonly Seam[]): BoardSeam[] {
  const factor = unitsPerInch(design.units)
  const before = new Map(design.seams.map((seam) => [seam.id, seam]))
  const end = (point: Point, old: readonly [number, number] | undefined): [number, number] => {
    const converted = toDesignUnits(point, factor).map(roundUnit) as [number, number]
    return old && roundUnit(old[0]) === converted[0] && roundUnit(old[1]) === converted[1] ? [old[0], old[1]] : converted
  }
  return seams.map((seam) => {
    const old = before.get(seam.id)
    const next = { id: seam.id, from: end(seam.from, old?.from), to: end(seam.to, old?.to) }
    // An untouched seam stays the very object it was (nothing to redraw, nothing to save).
    return old && next.from[0] === old.from[0] && next.from[1] === old.from[1] && next.to[0] === old.to[0] && next.to[1] === old.to[1] ? old : next
  })
}

/** A leaf as the board keeps it: the design file's leaf, its length and width in the design's units. */
export type BoardLeaf = BoardDesign['leaves'][number]

/**
 * A suggestion's leaves (core inches) in the design's units, in the board's order: only a leaf's
 * length and width can differ, and a size the suggestion left as it was (equal at the board's
 * precision) keeps the design's own value and the leaf its very object, as for seams.
 *
 * @example suggestedLeavesInDesignUnits({ units: 'cm', leaves: [leaf] }, [{ ...leaf, length: 1.625 }])[0].length // 4.1275
 */
export function suggestedLeavesInDesignUnits(design: Pick<BoardDesign, 'units' | 'leaves'>, leaves: readonly Leaf[]): BoardLeaf[] {
  const factor = unitsPerInch(design.units)
  const suggested = new Map(leaves.map((leaf) => [leaf.id, leaf]))
  return design.leaves.map((leaf) => {
    const next = suggested.get(leaf.id)
    if (!next) return leaf
    const size = (old: number, inches: number): number => {
      const converted = roundUnit(inches * factor)
      return roundUnit(old) === converted ? old : converted
    }
    const length = size(leaf.length, next.length)
    const width = size(leaf.width, next.width)
    return length === leaf.length && width === leaf.width ? leaf : { ...leaf, length, width }
  })
}

/** A repair suggested for the design on the board. */
export interface BoardSuggestion {
  /**
   * The core's suggestion: message (leaves named as the board names them), sections, added
   * length and moved distance (inches), and the leaves it resizes and whether it drops the
   * hand-set order.
   */
  readonly suggestion: Suggestion
  /** Its seams in the design's units, as applying it would leave them. */
  readonly seams: readonly BoardSeam[]
  /** Its leaves in the design's units, as applying it would leave them. */
  readonly leaves: readonly BoardLeaf[]
}

export interface BoardSuggestions {
  readonly suggestions: readonly BoardSuggestion[]
  /** The search stopped at its budget: better changes may exist. */
  readonly stopped: boolean
  /** How long the search took, milliseconds (for the speed benchmark; not shown). */
  readonly elapsedMs: number
}

/**
 * The repair search runs on the main thread, so it gets a wall-clock budget: a quarter second,
 * between the 0.1 s that feels instant and the 1 s that keeps a designer's train of thought
 * (response-time limits, Nielsen, Usability Engineering, 1993; recalled from memory). It starts
 * only once the designer has paused (components/board/use-repair-suggestions.ts) and runs once
 * per design value. Measured on the 2-core machine, warm: 1–75 ms for the demo designs with a
 * seam end pulled off line and the unsewable fixtures, about 200 ms for the demo wreath of 11
 * areas in two sections; the core's own safety net is 400 ms (REPAIR_BUDGET_MS).
 */
export const BOARD_REPAIR_BUDGET_MS = 250

const NO_SUGGESTIONS: BoardSuggestions = { suggestions: [], stopped: false, elapsedMs: 0 }
const suggestionsCache = new WeakMap<BoardDesign, BoardSuggestions>()

/** Whether the design gets suggestions: it cannot be sewn, or it sews in two sections or more. */
export function wantsSuggestions(design: BoardDesign): boolean {
  const plan = boardPlan(design).plan
  return plan !== null && (!plan.sewable || plan.sections.length >= 2)
}

/** The repairs already found for this design value, without searching. */
export function cachedBoardSuggestions(design: BoardDesign): BoardSuggestions | undefined {
  return suggestionsCache.get(design)
}

/**
 * The repairs suggested for a design, computed once per design value, within the board's budget.
 * Nothing for a design that is not valid, or sews in one section.
 */
export function boardSuggestions(design: BoardDesign): BoardSuggestions {
  const cached = suggestionsCache.get(design)
  if (cached) return cached
  const parsed = wantsSuggestions(design) ? parseDesign(design) : null
  let result = NO_SUGGESTIONS
  if (parsed?.ok) {
    const started = performance.now()
    const found = suggestRepairs(parsed.design, { budgetMs: BOARD_REPAIR_BUDGET_MS })
    result = {
      suggestions: found.suggestions.map((suggestion) => ({
        suggestion: { ...suggestion, message: nameLeavesIn(suggestion.message, boardPlan(design).leafNames) },
        seams: suggestedSeamsInDesignUnits(design, suggestion.seams),
        leaves: suggestion.leaves ? suggestedLeavesInDesignUnits(design, suggestion.leaves) : design.leaves,
      })),
      stopped: found.stopped,
      elapsedMs: performance.now() - started,
    }
  }
  suggestionsCache.set(design, result)
  return result
}
