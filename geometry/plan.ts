/**
 * The sewing plan of a design, exactly as geometry.md defines it: areas with labels, the
 * segment each is sewn along, the leaves to baste before it and its rough-cut rectangle; the
 * sections and their join tree; how the ring's repeats are joined; and every problem. The plan
 * is data: computing it never changes the design and never throws for a bad design.
 */
import { estimatedAreaCount } from './area-count'
import { buildArrangement, type Arrangement } from './arrangement'
import { buildTopology, type Topology } from './area-topology'
import { fewestSections, type SectionTree } from './fewest-sections'
import { checkHandSetOrder } from './hand-set-order'
import { insertConstraints } from './inserts'
import { ringAssembly, type RingAssembly } from './ring-assembly'
import { roughCutPiece, type RoughCut } from './rough-cut'
import { checkSectionOrder, createPeelSearch, type InsertConstraint } from './sewing-order'
import { noPlanProblem, setInSeamProblems } from './sewing-problems'
import { leafMention, leafNames, listInWords, nameLeavesIn } from './leaf-names'
import { MAX_PLAN_AREAS, OUTPUT_DECIMALS } from './tolerances'
import { searchRepairs, type Suggestion } from './repairs'
import type { Judgement } from './repairs-evaluate'
import type { Design, JoinTree, Point, Polygon, Problem, Segment } from './types'

export interface PlanArea {
  readonly id: string
  readonly label: string | null
  readonly section: string | null
  readonly step: number | null
  readonly point: Point
  readonly polygon: Polygon
  readonly areaSqIn: number
  readonly sewnAlong: Segment | null
  readonly leavesBefore: readonly string[]
  readonly roughCut: RoughCut
}

export interface PlanSection {
  readonly label: string
  /** Area ids in sewing order. */
  readonly order: readonly string[]
}

export interface Plan {
  readonly sewable: boolean
  readonly areas: readonly PlanArea[]
  readonly sections: readonly PlanSection[]
  /** The join tree of section labels; empty when there is no plan. */
  readonly assembly: JoinTree | readonly []
  readonly ringAssembly: RingAssembly
  readonly problems: readonly Problem[]
  /**
   * Repairs (`repairs.ts`), ranked: present (possibly empty) whenever `sewable` is false, and
   * when a design sewable in two or more sections could sew in fewer. Absent otherwise, and
   * when the caller asked for none (`suggestions: false`).
   */
  readonly suggestions?: readonly Suggestion[]
  /** True when the repair search stopped at its budget (the list may miss better changes). */
  readonly suggestionsStopped?: boolean
}

export interface PlanOptions {
  /** Default 1/4 in (common practice). */
  readonly seamAllowanceInches?: number
  /** Extra fabric around each rough cut; default 1/4 in. */
  readonly marginInches?: number
  /** Search for repairs (default true); callers that only print (booklet, cutting) skip it. */
  readonly suggestions?: boolean
}

/** One section as the plan numbers it: its label and its areas (arrangement indices) in order. */
export interface LabelledSection {
  readonly label: string
  readonly order: readonly number[]
}

/**
 * Section letters in order: A … Z, then AA, AB, …
 *
 * @example sectionLetter(0) // 'A'; sectionLetter(26) // 'AA'
 */
export function sectionLetter(index: number): string {
  let letters = ''
  let rest = index
  do {
    letters = String.fromCharCode(65 + (rest % 26)) + letters
    rest = Math.floor(rest / 26) - 1
  } while (rest >= 0)
  return letters
}

function labelTree(tree: SectionTree, sections: LabelledSection[]): JoinTree {
  if (tree.kind === 'section') {
    const label = sectionLetter(sections.length)
    sections.push({ label, order: tree.order })
    return label
  }
  const first = labelTree(tree.first, sections)
  const second = labelTree(tree.second, sections)
  return [first, second]
}

/** Proposes the plan with the fewest sections, or explains why there is none. */
function propose(topology: Topology, arrangement: Arrangement, constraints: readonly InsertConstraint[]): { sections: LabelledSection[]; assembly: JoinTree | null; problems: Problem[] } {
  const result = fewestSections(topology, constraints)
  const problems: Problem[] = []
  if (result.tree) {
    const sections: LabelledSection[] = []
    const assembly = labelTree(result.tree, sections)
    if (constraints.length > 0) {
      const free = fewestSections(topology, []).sectionCount
      if (free > 0 && result.sectionCount > free) problems.push(insertConflict(topology, constraints, free, result.sectionCount))
    }
    if (result.gaveUp) {
      problems.push({
        code: 'search-limit',
        severity: 'warning',
        message: `This design is too large to prove that ${result.sectionCount} sections is the fewest; the plan is valid but may not be the smallest.`,
        at: arrangement.areas[0]?.point ?? [0, 0],
      })
    }
    return { sections, assembly, problems }
  }
  const points = arrangement.areas.map((area) => area.point)
  if (result.gaveUp) {
    problems.push({ code: 'search-gave-up', severity: 'error', message: 'This design is too large for the sewing-plan search to finish; split it with more straight seams.', at: points[0] ?? [0, 0] })
  } else {
    problems.push(noPlanProblem(topology, createPeelSearch(topology, []), points))
  }
  return { sections: [], assembly: null, problems }
}

/**
 * Inserts never make a design unsewable (any leaf can be caught in a section join instead), but
 * they can cost sections: names a smallest set of leaves that together force the extra ones
 * (deletion filter: drop each leaf whose removal still leaves the count up).
 */
function insertConflict(topology: Topology, constraints: readonly InsertConstraint[], free: number, forced: number): Problem {
  let conflicting = [...constraints]
  // Each trial is a full search; the cap keeps a design with many leaves fast.
  if (constraints.length <= 12) {
    for (const constraint of constraints) {
      const trial = conflicting.filter((c) => c !== constraint)
      if (fewestSections(topology, trial).sectionCount > free) conflicting = trial
    }
  }
  const ids = [...new Set(conflicting.map((c) => c.leafId))].sort()
  const names = `${listInWords(ids.map(leafMention))} ${ids.length === 1 ? 'needs' : 'need'}`
  return {
    code: 'insert-conflict',
    severity: 'warning',
    message: `${names} an order no single foundation allows, so the seam catching them becomes a section join: ${forced} sections instead of ${free}.`,
    at: (conflicting[0] ?? constraints[0])?.at ?? [0, 0],
  }
}

/**
 * The rough cut of an area; a degenerate area the allowance code refuses (it throws for shapes it
 * cannot offset) becomes a warning and an empty rectangle, so a plan is still returned.
 */
function safeRoughCut(polygon: Polygon, sewnAlong: Segment | null, options: PlanOptions, point: Point, problems: Problem[]): RoughCut {
  try {
    return roughCutPiece(polygon, sewnAlong, options)
  } catch (error) {
    problems.push({
      code: 'rough-cut-failed',
      severity: 'warning',
      message: `No rough cut could be sized for the area at (${point[0].toFixed(2)}, ${point[1].toFixed(2)}): ${error instanceof Error ? error.message : String(error)}.`,
      at: point,
    })
    return { widthIn: 0, heightIn: 0, corners: [] }
  }
}

const round = (value: number): number => {
  const scale = 10 ** OUTPUT_DECIMALS
  const rounded = Math.round(value * scale) / scale
  return rounded === 0 ? 0 : rounded
}
const roundPoint = (p: Point): Point => [round(p[0]), round(p[1])]

function severityRank(problem: Problem): number {
  return problem.severity === 'error' ? 0 : 1
}

/**
 * A repeat of more than MAX_PLAN_AREAS areas is not planned: the plan says so at once, without
 * areas, instead of searching for minutes. Counted from the seams' crossings first, before the
 * arrangement (itself seconds long for thousands of areas) is built.
 */
function tooManyAreas(design: Design): Plan | null {
  const estimate = estimatedAreaCount(design.seams, MAX_PLAN_AREAS)
  return estimate > MAX_PLAN_AREAS ? tooManyAreasPlan(design, "This repeat's seams cross each other so often that it would have more areas than the sewing plan works with") : null
}

function tooManyAreasPlan(design: Design, what: string): Plan {
  const ring = ringAssembly(design.ring)
  const seam = design.seams[0]
  const at: Point = seam ? roundPoint([(seam.from[0] + seam.to[0]) / 2, (seam.from[1] + seam.to[1]) / 2]) : [0, 0]
  const message = `${what} (at most ${MAX_PLAN_AREAS}); use fewer seams, or seams that cross fewer others.`
  return {
    sewable: false,
    areas: [],
    sections: [],
    assembly: [],
    ringAssembly: ring.assembly,
    problems: [{ code: 'search-gave-up', severity: 'error', message, at }, ...ring.problems],
  }
}

/**
 * The full sewing plan of a design (in inches, as `parseDesign` returns it).
 *
 * @example
 * const plan = planDesign(design)
 * plan.sewable // false when a problem of severity 'error' stands
 */
export function planDesign(design: Design, options: PlanOptions = {}): Plan {
  const noRepairs = options.suggestions === false ? {} : { suggestions: [], suggestionsStopped: false }
  const tooMany = tooManyAreas(design)
  if (tooMany) return { ...tooMany, ...noRepairs }
  const arrangement = buildArrangement(design.ring, design.seams)
  if (arrangement.areas.length > MAX_PLAN_AREAS) return { ...tooManyAreasPlan(design, `This repeat has ${arrangement.areas.length} areas`), ...noRepairs }
  const topology = buildTopology(arrangement)
  const problems: Problem[] = [...arrangement.problems]
  const ring = ringAssembly(design.ring)
  problems.push(...ring.problems)
  const inserts = insertConstraints(arrangement, topology, design.leaves)
  problems.push(...inserts.problems)
  problems.push(...setInSeamProblems(topology))
  const blocked = problems.some((problem) => problem.severity === 'error')
  let sections: LabelledSection[] = []
  let assembly: JoinTree | null = null
  if (design.order) {
    const checked = checkHandSetOrder(topology, arrangement, design.order, inserts.constraints)
    sections = checked.sections
    assembly = checked.assembly
    problems.push(...checked.problems)
  } else if (!blocked && arrangement.areas.length > 0) {
    const proposed = propose(topology, arrangement, inserts.constraints)
    sections = proposed.sections
    assembly = proposed.assembly
    problems.push(...proposed.problems)
  }
  const sewable = !problems.some((problem) => problem.severity === 'error') && sections.length > 0
  const placed = new Map<number, { section: string; step: number; sewnAlong: Segment | null; leavesBefore: string[] }>()
  for (const section of sections) {
    const { steps } = checkSectionOrder(topology, section.order, inserts.constraints, section.label)
    const inSection = new Set(section.order)
    steps.forEach((step, index) => {
      const leavesBefore = inserts.constraints
        .filter((c) => c.under === step.area && inSection.has(c.over) && section.order.indexOf(c.over) < index)
        .map((c) => c.leafId)
        .sort()
      placed.set(step.area, { section: section.label, step: index + 1, sewnAlong: step.sewnAlong, leavesBefore })
    })
  }
  const ordered = [...sections.flatMap((section) => section.order), ...arrangement.areas.map((area) => area.index).filter((index) => !placed.has(index))]
  const roughCutOptions = { seamAllowanceInches: options.seamAllowanceInches, marginInches: options.marginInches }
  const areas: PlanArea[] = ordered.map((index) => {
    const area = arrangement.areas[index]!
    const place = placed.get(index)
    const sewnAlong = place?.sewnAlong ?? null
    const cut = safeRoughCut(area.polygon, sewnAlong, roughCutOptions, area.point, problems)
    return {
      id: area.id,
      label: place ? `${place.section}${place.step}` : null,
      section: place?.section ?? null,
      step: place?.step ?? null,
      point: roundPoint(area.point),
      polygon: area.polygon.map(roundPoint),
      areaSqIn: round(area.areaSqIn),
      sewnAlong: sewnAlong ? [roundPoint(sewnAlong[0]), roundPoint(sewnAlong[1])] : null,
      leavesBefore: place?.leavesBefore ?? [],
      roughCut: { widthIn: round(cut.widthIn), heightIn: round(cut.heightIn), corners: cut.corners.map(roundPoint) },
    }
  })
  // Repairs: whenever the design cannot be sewn, and when it sews in two or more sections.
  let repairs: { suggestions?: readonly Suggestion[]; suggestionsStopped?: boolean } = {}
  if (options.suggestions !== false && (!sewable || sections.length >= 2)) {
    const judged: Judgement = {
      sewable,
      sections: sections.length,
      errors: problems.filter((problem) => problem.severity === 'error'),
      arrangement,
      topology,
      stuck: [],
      searchLimit: problems.some((problem) => problem.code === 'search-limit' || problem.code === 'search-gave-up'),
      overLimit: false,
    }
    const found = searchRepairs(design, judged)
    repairs = { suggestions: found.suggestions, suggestionsStopped: found.stopped }
    // Said in words only where the suggestions are the way forward; a sewable plan keeps its
    // warnings for the maker (`suggestionsStopped` still says the savings search stopped).
    if (found.stopped && !sewable) {
      problems.push({
        code: 'search-limit',
        severity: 'warning',
        message: 'The search for changes that make this design sewable stopped at its limit; the suggestions shown may not be the best there are.',
        at: problems.find((problem) => problem.severity === 'error')?.at ?? arrangement.areas[0]?.point ?? [0, 0],
      })
    }
  }
  // Leaves are named from the labelled areas they lie over, so only now can messages name them.
  const names = leafNames(design, { areas })
  const sortedProblems = problems
    .map((problem) => ({ ...problem, message: nameLeavesIn(problem.message, names), at: roundPoint(problem.at) }))
    .sort((p, q) => severityRank(p) - severityRank(q) || (p.code < q.code ? -1 : p.code > q.code ? 1 : 0) || p.at[0] - q.at[0] || p.at[1] - q.at[1])
  return {
    sewable,
    areas,
    sections: sections.map((section) => ({ label: section.label, order: section.order.map((index) => arrangement.areas[index]!.id) })),
    assembly: assembly ?? [],
    ringAssembly: ring.assembly,
    problems: sortedProblems,
    ...repairs,
    ...(repairs.suggestions && { suggestions: repairs.suggestions.map((suggestion) => ({ ...suggestion, message: nameLeavesIn(suggestion.message, names) })) }),
  }
}
