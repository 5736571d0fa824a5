/**
 * Repairs: for a design that cannot be sewn (or sews in several sections), small changes to its
 * seams that make it sewable, or sewable in fewer sections. Pure: the design is never changed;
 * each suggestion carries the whole seams list after its change, and only the designer applies it.
 *
 * The search tries one edit, then a second edit on top of each one that still does not sew, at
 * the places that stop the design (`repairs-candidates.ts`); every candidate is planned by the
 * planner's own steps (`repairs-evaluate.ts`). It is bounded by a count of candidates planned
 * (deterministic) and by a time as a safety net; `stopped` says when either ran out.
 */
import { applyEdit, candidateEdits, describeEdit, editKey, newSeamId, visibleChange, type Edit } from './repairs-candidates'
import { judgePrepared, judgeSeams, prepareSeams, stuckAreas, type Judgement, type Prepared } from './repairs-evaluate'
import { MAX_REPAIR_STATES, OUTPUT_DECIMALS, REPAIR_BUDGET_MS, SNAP_DISTANCE_INCHES } from './tolerances'
import type { Design, ProblemCode, Seam } from './types'

/** One proposed change, ranked with the others by `suggestRepairs`. */
export interface Suggestion {
  /** Plain words for the designer: "Extend seam s3 1.90 in to the outline: sews in 1 section". */
  readonly message: string
  /** The design's whole seams list after the change (ids kept; a new seam has a new id). */
  readonly seams: readonly Seam[]
  /** Sections of the plan of the changed design. */
  readonly sections: number
  /** Seam length added by the change, inches, rounded like other plan outputs. */
  readonly addedLengthIn: number
  /** How far seam ends moved, inches (summed over the ends), rounded like other plan outputs. */
  readonly movedIn: number
}

export interface RepairOptions {
  /** Candidate designs planned before the search stops (deterministic budget). */
  readonly maxStates?: number
  /** Wall-clock safety budget, milliseconds. */
  readonly budgetMs?: number
}

export interface RepairResult {
  readonly suggestions: readonly Suggestion[]
  /** True when a budget ran out before every candidate was tried. */
  readonly stopped: boolean
}

/** At most this many suggestions for a design that cannot be sewn (issue 16). */
const MOST_REPAIRS = 5
/** At most this many for a sewable design that could sew in fewer sections. */
const MOST_SAVINGS = 3

/** Errors a change of seams can clear; any other error stands whatever the seams do. */
const REPAIRABLE: ReadonlySet<ProblemCode> = new Set<ProblemCode>(['dangling-seam-end', 'set-in-seam', 'bent-seam', 'seam-cycle', 'insert-not-caught'])

/**
 * The section limits of the passes over clean candidates: first only one-section plans, then up
 * to two, four, and any number (each pass only where no plan was found below the last).
 */
const SECTION_PASSES = [2, 3, 5, Infinity] as const

interface Candidate {
  readonly seams: Seam[]
  readonly edits: Edit[]
  /** The id a new seam of each edit gets. */
  readonly names: string[]
  readonly change: number
  readonly key: string
  readonly designKey: string
}

interface Found {
  readonly edits: readonly Edit[]
  readonly seams: readonly Seam[]
  readonly sections: number
  readonly addedIn: number
  readonly movedIn: number
  readonly change: number
  readonly key: string
  readonly message: string
}

const round = (value: number): number => {
  const scale = 10 ** OUTPUT_DECIMALS
  const rounded = Math.round(value * scale) / scale
  return rounded === 0 ? 0 : rounded
}

/** Ranks found changes: fewest sections, least visible change, fewer edits, then the key of the change. */
function compareFound(p: Found, q: Found): number {
  return p.sections - q.sections || p.change - q.change || p.edits.length - q.edits.length || (p.key < q.key ? -1 : p.key > q.key ? 1 : 0)
}

/** The resulting seams in an order-free form: two routes to the same design count once. */
function seamsKey(seams: readonly Seam[]): string {
  return seams
    .map((seam) => `${seam.id}:${seam.from.map((v) => v.toFixed(6)).join(',')}:${seam.to.map((v) => v.toFixed(6)).join(',')}`)
    .sort()
    .join(' ')
}

function sectionsInWords(count: number): string {
  return `${count} ${count === 1 ? 'section' : 'sections'}`
}

/**
 * Suggests at most five repairs for an unsewable design, or at most three that save sections
 * for a design that sews in two or more. A design with a hand-set order gets none: its order
 * names areas that a change of seams would move.
 *
 * @example
 * const { suggestions } = suggestRepairs(design)
 * suggestions[0]?.message // "Extend seam s3 1.90 in to the outline: sews in 1 section"
 */
export function suggestRepairs(design: Design, options: RepairOptions = {}): RepairResult {
  if (design.order) return { suggestions: [], stopped: false }
  return searchRepairs(design, judgeSeams(design.ring, design.seams, design.leaves), options)
}

/**
 * The search of `suggestRepairs` from a design already judged (the planner passes what it has
 * computed, so the design is not planned twice).
 *
 * @example searchRepairs(design, judgeSeams(design.ring, design.seams, design.leaves)).suggestions
 */
export function searchRepairs(design: Design, judged: Judgement, options: RepairOptions = {}): RepairResult {
  const maxStates = options.maxStates ?? MAX_REPAIR_STATES
  const budgetMs = options.budgetMs ?? REPAIR_BUDGET_MS
  const started = performance.now()
  if (design.order) return { suggestions: [], stopped: false }
  // The planner reports a cycle of seams as an error; the search wants the areas of that cycle.
  const cycle = !judged.sewable && judged.errors.every((problem) => problem.code === 'seam-cycle') && judged.stuck.length === 0 && !judged.searchLimit
  const base = cycle ? { ...judged, stuck: stuckAreas(judged.topology) } : judged
  if (base.sewable && base.sections < 2) return { suggestions: [], stopped: false }
  // A design too large for the sections search to finish is too large to search for changes.
  if (base.searchLimit || base.errors.some((problem) => !REPAIRABLE.has(problem.code))) return { suggestions: [], stopped: false }
  const mode = base.sewable ? 'fewer' : 'repair'
  const limit = mode === 'fewer' ? MOST_SAVINGS : MOST_REPAIRS
  const found: Found[] = []
  const foundDesigns = new Set<string>()
  const tried = new Set<string>([seamsKey(design.seams)])
  let states = 0
  let stopped = false
  /** Whether a change this visible can still enter the list (nothing needs fewer than 1 section). */
  const canEnter = (change: number): boolean => {
    if (found.length < limit) return true
    const last = found[found.length - 1] as Found
    return last.sections > 1 || change < last.change
  }
  /**
   * Plans worth finding have fewer sections than this: fewer than the design has (saving mode);
   * no more than the last of a full list; at most one more than the best found (a change that
   * needs two sections more than another is never shown). It keeps bad candidates cheap: the
   * sections search need not prove how many a poor change needs.
   */
  const sectionsBelow = (): number => {
    let below = mode === 'fewer' ? base.sections : Infinity
    if (found.length > 0) below = Math.min(below, (found[0] as Found).sections + 2)
    if (found.length >= limit) below = Math.min(below, (found[found.length - 1] as Found).sections + 1)
    return below
  }
  const outOfBudget = (): boolean => {
    if (states >= maxStates || performance.now() - started > budgetMs) stopped = true
    return stopped
  }
  const record = (candidate: Candidate, judgement: Judgement): void => {
    if (foundDesigns.has(candidate.designKey)) return
    foundDesigns.add(candidate.designKey)
    const { edits, names } = candidate
    const words = edits.map((edit, index) => describeEdit(edit, names[index] as string))
    const joined = words.length === 1 ? words[0] : `${words[0]}, then ${(words[1] as string).charAt(0).toLowerCase()}${(words[1] as string).slice(1)}`
    const saving = mode === 'fewer' ? ` instead of ${base.sections}` : ''
    found.push({
      edits,
      seams: candidate.seams,
      sections: judgement.sections,
      addedIn: round(edits.reduce((sum, edit) => sum + edit.addedIn, 0)),
      movedIn: round(edits.reduce((sum, edit) => sum + (edit.kind === 'straighten' ? edit.movedIn : 0), 0)),
      change: candidate.change,
      key: candidate.key,
      message: `${joined}: sews in ${sectionsInWords(judgement.sections)}${saving}`,
    })
    found.sort(compareFound)
    if (found.length > limit) found.length = limit
  }
  /**
   * Plans a batch of candidates: each is arranged once (one state), then the clean ones are
   * searched for sections in passes of growing limits, so a change that sews in one section is
   * found before any candidate pays for proving that it needs many. Returns the candidates that
   * still do not sew, with what stops them, for a second edit.
   */
  const evaluate = (candidates: Iterable<Candidate>): { candidate: Candidate; judgement: Judgement }[] => {
    const stuck: { candidate: Candidate; judgement: Judgement }[] = []
    const clean: { candidate: Candidate; prepared: Prepared; done: boolean }[] = []
    for (const candidate of candidates) {
      if (!canEnter(candidate.change) || tried.has(candidate.designKey)) continue
      if (outOfBudget()) break
      tried.add(candidate.designKey)
      states += 1
      const prepared = prepareSeams(design.ring, candidate.seams, design.leaves)
      if (prepared.unplannable) continue
      if (prepared.errors.length > 0) stuck.push({ candidate, judgement: judgePrepared(prepared) })
      else clean.push({ candidate, prepared, done: false })
    }
    let searched = 1
    for (const pass of SECTION_PASSES) {
      for (const entry of clean) {
        if (entry.done) continue
        if (performance.now() - started > budgetMs) {
          stopped = true
          return stuck
        }
        const below = Math.min(pass, sectionsBelow())
        // Plans of fewer than `searched` sections were looked for already; none above `below` count.
        if (!canEnter(entry.candidate.change) || below <= searched) {
          entry.done = true
          continue
        }
        const judgement = judgePrepared(entry.prepared, below)
        if (judgement.overLimit) continue
        entry.done = true
        if (judgement.sewable && (mode === 'repair' || judgement.sections < base.sections)) record(entry.candidate, judgement)
        else if (!judgement.sewable && !judgement.searchLimit) stuck.push({ candidate: entry.candidate, judgement })
      }
      searched = pass
    }
    return stuck
  }
  const candidate = (seams: Seam[], edits: Edit[], names: string[]): Candidate => ({
    seams,
    edits,
    names,
    change: round(edits.reduce((sum, edit) => sum + visibleChange(edit), 0)),
    key: edits.map(editKey).join(' + '),
    designKey: seamsKey(seams),
  })
  // Straightenings first (they tend to keep a design in one section, which bounds the rest of
  // the search early), then by visible change, then by the change's key.
  const byChange = (edits: Edit[]): Edit[] =>
    edits
      .map((edit) => ({ edit, first: edit.kind === 'straighten' ? 0 : 1, change: visibleChange(edit), key: editKey(edit) }))
      .sort((p, q) => p.first - q.first || p.change - q.change || (p.key < q.key ? -1 : p.key > q.key ? 1 : 0))
      .map(({ edit }) => edit)
  // One edit.
  const name = newSeamId(design.seams)
  const ones = byChange(candidateEdits(design.ring, base, mode)).map((edit) => candidate(applyEdit(design.seams, edit), [edit], [name]))
  // The likely cheap fix first, in a batch of its own: a junction pulled off line (a set-in or
  // bent junction) moved back so two of its seams run on straight. Judged before the extensions
  // at every loose end it left can spend the state budget (a demo wreath with a junction pulled
  // sideways leaves five loose ends, twenty candidates).
  const problemPoints = base.errors.filter((problem) => problem.code === 'set-in-seam' || problem.code === 'bent-seam').map((problem) => problem.at)
  const atProblem = (entry: Candidate): boolean => {
    const edit = entry.edits[0] as Edit
    return edit.kind === 'straighten' && problemPoints.some((at) => Math.hypot(at[0] - edit.at[0], at[1] - edit.at[1]) <= SNAP_DISTANCE_INCHES)
  }
  const unsewable = [...evaluate(ones.filter(atProblem)), ...evaluate(ones.filter((entry) => !atProblem(entry)))]
  // Two edits: a second change where the first left the design unsewable, closest to sewing first;
  // not when one edit already sews in one section (a second edit cannot beat that by sections).
  if (mode === 'repair' && !stopped && !(found.length > 0 && (found[0] as Found).sections === 1)) {
    const firsts = unsewable
      .filter(({ judgement }) => judgement.errors.every((problem) => REPAIRABLE.has(problem.code)))
      .sort((p, q) => p.judgement.errors.length - q.judgement.errors.length || p.candidate.change - q.candidate.change || (p.candidate.key < q.candidate.key ? -1 : 1))
    // Made as they are judged: the state budget stops long before every pair is written out.
    function* seconds(): Generator<Candidate> {
      for (const { candidate: first, judgement } of firsts) {
        const next = newSeamId(first.seams)
        for (const edit of byChange(candidateEdits(design.ring, judgement, 'repair'))) yield candidate(applyEdit(first.seams, edit), [...first.edits, edit], [...first.names, next])
      }
    }
    evaluate(seconds())
  }
  return {
    suggestions: found.map((f) => ({ message: f.message, seams: f.seams, sections: f.sections, addedLengthIn: f.addedIn, movedIn: f.movedIn })),
    stopped,
  }
}
