/**
 * Judging one candidate of the repair search: the planner's own steps (arrangement, topology,
 * inserts, set-in points, fewest sections), without rough cuts or labels, so a candidate costs
 * little more than the arrangement of its seams.
 */
import { buildArrangement, type Arrangement } from './arrangement'
import { areaSetOf } from './area-set'
import { buildTopology, type Topology } from './area-topology'
import { fewestSections } from './fewest-sections'
import { checkHandSetOrder } from './hand-set-order'
import { insertConstraints } from './inserts'
import { createPeelSearch, stuckCore, type InsertConstraint } from './sewing-order'
import { setInSeamProblems } from './sewing-problems'
import { MAX_PLAN_AREAS } from './tolerances'
import type { HandSetOrder, Leaf, Problem, Ring, Seam } from './types'

export interface Judgement {
  readonly sewable: boolean
  /** Sections of the proposed plan (0 when not sewable). */
  readonly sections: number
  /** The errors that stand (empty when sewable). */
  readonly errors: readonly Problem[]
  readonly arrangement: Arrangement
  readonly topology: Topology
  /** When the seams are clean but no plan exists: the areas left when nothing more peels. */
  readonly stuck: readonly number[]
  /** A limit of the sections search stopped it (a plan found is valid, maybe not the fewest). */
  readonly searchLimit: boolean
  /** The seams are clean but no plan of fewer than `below` sections exists (one with more may). */
  readonly overLimit: boolean
}

/** A candidate's arrangement, topology, inserts and errors: everything but the sections search. */
export interface Prepared {
  readonly arrangement: Arrangement
  readonly topology: Topology
  readonly constraints: readonly InsertConstraint[]
  readonly errors: readonly Problem[]
  /** No areas to plan, or more than the planner plans. */
  readonly unplannable: boolean
}

/**
 * The arrangement of a ring with these seams and the errors that stand before any search.
 *
 * @example prepareSeams(ring, seams, []).errors // [] when nothing dangles, sets in or bends
 */
export function prepareSeams(ring: Ring, seams: readonly Seam[], leaves: readonly Leaf[]): Prepared {
  const arrangement = buildArrangement(ring, seams)
  const topology = buildTopology(arrangement)
  if (arrangement.areas.length === 0 || arrangement.areas.length > MAX_PLAN_AREAS) return { arrangement, topology, constraints: [], errors: [], unplannable: true }
  const inserts = insertConstraints(arrangement, topology, leaves)
  const errors = [...arrangement.problems, ...inserts.problems, ...setInSeamProblems(topology)].filter((problem) => problem.severity === 'error')
  return { arrangement, topology, constraints: inserts.constraints, errors, unplannable: false }
}

/**
 * Says whether a prepared candidate sews, and in how many sections (every insert honoured).
 * `below` limits the sections looked for: a plan needing that many or more is not searched for
 * (`overLimit`), which keeps poor candidates cheap.
 *
 * @example judgePrepared(prepareSeams(ring, seams, []), 2).sewable // true only for one section
 */
export function judgePrepared(prepared: Prepared, below = Infinity): Judgement {
  const { arrangement, topology, errors } = prepared
  const fail = (stuck: readonly number[] = [], searchLimit = false, overLimit = false): Judgement => ({ sewable: false, sections: 0, errors, arrangement, topology, stuck, searchLimit, overLimit })
  if (prepared.unplannable || errors.length > 0) return fail()
  const result = fewestSections(topology, prepared.constraints, below)
  if (!result.tree && !result.gaveUp && below !== Infinity) return fail([], false, true)
  if (!result.tree) return fail(result.gaveUp ? [] : stuckAreas(topology), result.gaveUp)
  return { sewable: true, sections: result.sectionCount, errors: [], arrangement, topology, stuck: [], searchLimit: result.gaveUp, overLimit: false }
}

/**
 * Both steps at once: plans a ring with these seams and leaves far enough to say whether it sews.
 *
 * @example judgeSeams(ring, seams, []).sections // 1 for a design of cut-off areas
 */
export function judgeSeams(ring: Ring, seams: readonly Seam[], leaves: readonly Leaf[], below = Infinity): Judgement {
  return judgePrepared(prepareSeams(ring, seams, leaves), below)
}

/**
 * The areas left when nothing more peels (greedy, no inserts): the core of a cycle of seams.
 *
 * @example stuckAreas(topology) // the five areas of a pinwheel around its centre square
 */
export function stuckAreas(topology: Topology): number[] {
  const all = areaSetOf(topology.areaCount, Array.from({ length: topology.areaCount }, (_, index) => index))
  return stuckCore(createPeelSearch(topology, []), all)
}

/**
 * Whether a design sews in the designer's hand-set order, as the planner checks it: the seams'
 * errors and the order's own (a step that meets the sewn areas along no seam or along two lines,
 * a join that is not one straight seam, …). `sections` is the order's count of sections.
 *
 * @example judgeHandSetOrder(ring, seams, leaves, design.order).sewable // false when the order is wrong
 */
export function judgeHandSetOrder(ring: Ring, seams: readonly Seam[], leaves: readonly Leaf[], order: HandSetOrder): { readonly sewable: boolean; readonly sections: number } {
  const prepared = prepareSeams(ring, seams, leaves)
  if (prepared.unplannable) return { sewable: false, sections: 0 }
  const checked = checkHandSetOrder(prepared.topology, prepared.arrangement, order, prepared.constraints)
  const sewable = prepared.errors.length === 0 && checked.sections.length > 0 && !checked.problems.some((problem) => problem.severity === 'error')
  return { sewable, sections: sewable ? checked.sections.length : 0 }
}
