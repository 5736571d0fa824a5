/**
 * What every part of the booklet reads: the design at its printed size, its plan, the colourway,
 * each area's fabric, the foundations to print and the fabric each repeat needs. Pure data.
 */
import {
  areaUnderLeaf, colorwayFabric, fabricDisplayName, fabricRequirements, fabricsOfAreas, IDENTITY, leafNames, planDesign, printedSideTransform, scaleDesign,
  tryPlaceLeaf, UNASSIGNED_FABRIC, type AffineTransform, type Colorway, type Design, type FabricRequirements, type Leaf, type LeafPlacement, type Plan, type PlanArea,
} from '@/geometry'
import { SAME_SIZE_INCHES } from '@/geometry/tolerances'
import type { BookletOptions } from '@/lib/schemas/booklet'

/** One foundation to print: a section of a kind of repeat, how many to make and how it is mirrored. */
export interface FoundationKind {
  readonly section: string
  /** Which repeats, in the maker's words: "every repeat", "repeats 1, 3, 5". */
  readonly repeatName: string
  /** How many of this foundation to print and sew. */
  readonly count: number
  /** Repeat 0's frame → this repeat's fabric side, kept in repeat 0's sector. */
  readonly fabricSide: AffineTransform
  /** Repeat 0's frame → the printed side of this foundation. */
  readonly printedSide: AffineTransform
  /** True for the mirrored repeats of an alternately mirrored ring. */
  readonly mirroredRepeat: boolean
}

export interface BookletModel {
  readonly design: Design
  readonly plan: Plan
  readonly colorway: Colorway | null
  readonly options: BookletOptions
  /** Fabric role of each area id ("unassigned" when no fill names it). */
  readonly fabricOf: ReadonlyMap<string, string>
  /** Labelled areas in sewing order. */
  readonly labelledAreas: readonly PlanArea[]
  readonly foundations: readonly FoundationKind[]
  readonly finishedDiameterInches: number
  /** Every leaf's plain name by id ("leaf 1 of A2"), from geometry's one naming rule. */
  readonly leafNames: ReadonlyMap<string, string>
}

/** The fabric role for an area nobody filled (the core's rule, geometry/cutting-pieces.ts). */
export { UNASSIGNED_FABRIC }

/**
 * Builds the booklet's model: scales the design, plans it, picks the colourway and lists the
 * foundations (one kind per section in rotate mode; in alternate-mirror mode a second, mirrored
 * kind for the odd repeats).
 *
 * @example bookletModel(design, bookletOptionsSchema.parse({ paper: 'letter' })).foundations[0]?.count // 4
 */
export function bookletModel(original: Design, options: BookletOptions): BookletModel {
  const diameter = options.finishedDiameterInches ?? 2 * original.ring.outerRadius
  const resized = Math.abs(diameter - 2 * original.ring.outerRadius) < SAME_SIZE_INCHES ? original : scaleDesign(original, diameter)
  // Printing at another size draws the ring larger, but binding strips stay as wide as the
  // designer set them (2 1/4 in is right for any ring), so the binding is kept as it was.
  const design = original.binding ? { ...resized, binding: original.binding } : resized
  // The booklet prints the plan; repair suggestions are for the board, so skip their search.
  const plan = planDesign(design, { suggestions: false })
  const colorway = (options.colorway ? design.colorways.find((c) => c.name === options.colorway) : design.colorways[0]) ?? null
  const filled = fabricsOfAreas(design.fills, plan.areas)
  const fabricOf = new Map(plan.areas.map((area) => [area.id, filled.get(area.id) ?? UNASSIGNED_FABRIC]))
  const labelledAreas = plan.areas.filter((area) => area.label !== null)
  const n = design.ring.repeats
  const printed = printedSideTransform(design.ring)
  const kinds: { repeatName: string; count: number; fabricSide: AffineTransform; mirrored: boolean }[] =
    design.ring.repeatMode === 'mirror'
      ? [
        { repeatName: `repeats ${oddNumbers(n, 1)}`, count: n / 2, fabricSide: IDENTITY, mirrored: false },
        // The mirrored repeats, kept in repeat 0's sector: the bisector mirror of repeat 0.
        { repeatName: `repeats ${oddNumbers(n, 2)} (mirror image)`, count: n / 2, fabricSide: printed, mirrored: true },
      ]
      : [{ repeatName: `every repeat (all ${n})`, count: n, fabricSide: IDENTITY, mirrored: false }]
  const foundations: FoundationKind[] = []
  for (const kind of kinds) {
    for (const section of plan.sections) {
      foundations.push({
        section: section.label,
        repeatName: kind.repeatName,
        count: kind.count,
        fabricSide: kind.fabricSide,
        // The printed side is the bisector mirror of the fabric side (common practice: fabric on the unprinted side).
        printedSide: kind.mirrored ? IDENTITY : printed,
        mirroredRepeat: kind.mirrored,
      })
    }
  }
  return { design, plan, colorway, options, fabricOf, labelledAreas, foundations, finishedDiameterInches: diameter, leafNames: leafNames(design, plan) }
}

/** "1, 3, 5" (from 1) or "2, 4, 6" (from 2): the repeats of one kind, counted from 1. */
function oddNumbers(n: number, first: number): string {
  const list: number[] = []
  for (let k = first; k <= n; k += 2) list.push(k)
  return list.join(', ')
}

/**
 * The name the maker reads for a fabric role: the fabric the model's colourway gives it, or the
 * role in words (`fabricDisplayName`). Every page that names a fabric asks here, never prints a role.
 *
 * @example fabricName(model, 'leaf-dark') // 'Holly green batik'
 */
export function fabricName(model: BookletModel, fabric: string): string {
  return fabricDisplayName(model.colorway, fabric)
}

/**
 * The colour of a fabric role in the model's colourway (grey when it has none).
 *
 * @example fabricColour(model, 'background') // '#f4ecd8'
 */
export function fabricColour(model: BookletModel, fabric: string): string | undefined {
  return colorwayFabric(model.colorway, fabric)?.color
}

const requirementsOfModel = new WeakMap<BookletModel, FabricRequirements>()

/**
 * What to buy and how to cut it in the model's colourway, at the options' usable width of fabric
 * and extra (geometry's `fabricRequirements`), worked out once per booklet: the fabric page and
 * the cutting diagrams read the same result.
 *
 * @example bookletRequirements(model).widthOfFabricIn // 40
 */
export function bookletRequirements(model: BookletModel): FabricRequirements {
  let requirements = requirementsOfModel.get(model)
  if (!requirements) {
    const { widthOfFabricIn, extraPercent } = model.options
    requirements = fabricRequirements(model.design, model.plan, model.colorway, { widthOfFabricIn, extraPercent })
    requirementsOfModel.set(model, requirements)
  }
  return requirements
}

/**
 * The areas of one section, in sewing order.
 *
 * @example sectionAreas(model, 'A').map((area) => area.label) // ['A1', 'A2', …]
 */
export function sectionAreas(model: BookletModel, section: string): PlanArea[] {
  return model.labelledAreas.filter((area) => area.section === section).sort((a, b) => (a.step ?? 0) - (b.step ?? 0))
}

/** A leaf as the booklet needs it: where it lies, over which section, and when it is basted. */
export interface LeafInBooklet {
  readonly leaf: Leaf
  readonly placement: LeafPlacement
  /** The section of the area it lies over (null when it lies over none). */
  readonly section: string | null
  /** The area sewn right after it is basted, or null when a section join catches it. */
  readonly basteBefore: string | null
  /** The labelled area it lies over, or null. */
  readonly over: PlanArea | null
  /** The labelled area whose seam catches it, or null when a section join does. */
  readonly catcher: PlanArea | null
}

/**
 * Every leaf that can be placed, with its section and the step that catches it.
 *
 * @example leavesInBooklet(model)[0]?.basteBefore // 'A3', or null for a leaf caught in a join
 */
export function leavesInBooklet(model: BookletModel): LeafInBooklet[] {
  const { design } = model
  const result: LeafInBooklet[] = []
  for (const leaf of design.leaves) {
    const seam = design.seams.find((s) => s.id === leaf.seam)
    if (!seam) continue
    const placed = tryPlaceLeaf(leaf, seam)
    if (!placed.ok) continue // an impossible leaf is the plan's problem to report, not a reason to stop printing
    const { placement } = placed
    // The same rule that names the leaf says which area it lies over.
    const over = areaUnderLeaf(leaf, seam, model.labelledAreas)
    const caught = model.labelledAreas.find((area) => area.leavesBefore.includes(leaf.id)) ?? null
    result.push({ leaf, placement, section: over?.section ?? null, basteBefore: caught?.label ?? null, over, catcher: caught })
  }
  return result
}
