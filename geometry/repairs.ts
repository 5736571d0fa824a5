/**
 * Repairs: for a design that cannot be sewn (or sews in several sections), small changes to its
 * seams that make it sewable, or sewable in fewer sections; for a wrong hand-set order, the order
 * Wreathwright chooses; for an impossible leaf, the leaf resized. Pure: the design is never
 * changed; each suggestion carries the whole seams list after its change (and the leaves list
 * when it resizes one, and `clearsOrder` when it drops the hand-set order), and only the designer
 * applies it.
 *
 * The search tries one edit, then a second edit on top of each one that still does not sew, at
 * the places that stop the design (`repairs-candidates.ts`); every candidate is planned by the
 * planner's own steps (`repairs-evaluate.ts`). It is bounded by a count of candidates planned
 * (deterministic) and by a time as a safety net; `stopped` says when either ran out.
 */
import { applyEdit, candidateEdits, describeEdit, editKey, newSeamId, visibleChange, type Edit } from './repairs-candidates'
import { leafMention } from './leaf-names'
import { isPointedLeaf, leafShapeProblem } from './leaf-template'
import { judgeHandSetOrder, judgePrepared, judgeSeams, prepareSeams, stuckAreas, type Judgement, type Prepared } from './repairs-evaluate'
import { LEAF_RESIZE_STEP_INCHES, MAX_REPAIR_STATES, OUTPUT_DECIMALS, REPAIR_BUDGET_MS, SNAP_DISTANCE_INCHES } from './tolerances'
import type { Design, Leaf, ProblemCode, Seam } from './types'

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
  /**
   * The design's whole leaves list after the change, when the change resizes a leaf (ids, seams
   * and places kept; only a leaf's length or width changes). Absent: the leaves stay as they are.
   */
  readonly leaves?: readonly Leaf[]
  /**
   * True when the change drops the designer's hand-set order (the plan then proposes the order,
   * as it does for a design with none). Absent: the order, if any, stays.
   */
  readonly clearsOrder?: true
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
  /** The change in words, without what it gives ("Extend seam s3 1.90 in to the outline"). */
  readonly words: string
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
 * for a design that sews in two or more. Beyond changes of seams:
 * - a wrong hand-set order: "Let Wreathwright choose the order: sews in N sections", the seams
 *   unchanged and `clearsOrder` set, when the order the planner proposes sews; otherwise the
 *   changes of seams of the design without its order, each with `clearsOrder` (the order names
 *   areas a change of seams would move). A design that sews in its hand-set order gets none: its
 *   sections are the designer's choice.
 * - an impossible leaf (a pointed leaf must be longer than half its width): the leaf resized to
 *   the nearest size that fits, longer or narrower, with `leaves` the whole list after the change.
 * Messages name leaves by `leafMention`; `planDesign` puts their plain names in.
 *
 * @example
 * const { suggestions } = suggestRepairs(design)
 * suggestions[0]?.message // "Extend seam s3 1.90 in to the outline: sews in 1 section"
 */
export function suggestRepairs(design: Design, options: RepairOptions = {}): RepairResult {
  return searchRepairs(design, judgeSeams(design.ring, design.seams, design.leaves), options)
}

/**
 * The search of `suggestRepairs` from a design already judged (the planner passes what it has
 * computed, so the design is not planned twice). A design with a hand-set order or an impossible
 * leaf is judged again here, without its order and with its leaves resized.
 *
 * @example searchRepairs(design, judgeSeams(design.ring, design.seams, design.leaves)).suggestions
 */
export function searchRepairs(design: Design, judged: Judgement, options: RepairOptions = {}): RepairResult {
  if (!design.order && !design.leaves.some(impossibleLeaf)) {
    const { found, stopped } = searchSeams(design, judged, options)
    return { suggestions: found.map((f) => ({ message: f.message, seams: f.seams, sections: f.sections, addedLengthIn: f.addedIn, movedIn: f.movedIn })), stopped }
  }
  return searchBeyondSeams(design, options)
}

const impossibleLeaf = (leaf: Leaf): boolean => leafShapeProblem(leaf.length, leaf.width) !== null

/** A length in words: inches to at most three decimals, trailing zeros dropped (0.5 in, 1.625 in). */
const inchesInWords = (value: number): string => `${Number(value.toFixed(3))} in`

/** One way to make every impossible leaf a pointed leaf. */
interface LeafChange {
  /** The design's whole leaves list after the change (in the design's order). */
  readonly leaves: readonly Leaf[]
  /** One phrase per resized leaf, by leaf id: "Lengthen {leaf:l1} from 0.5 in to 1.625 in". */
  readonly words: readonly string[]
  /** How much the sizes change, inches, summed over the resized leaves. */
  readonly change: number
  readonly key: string
}

interface Resize {
  readonly leaf: Leaf
  readonly size: { readonly length: number; readonly width: number }
  readonly words: string
  readonly change: number
}

/**
 * The nearest sizes on the `LEAF_RESIZE_STEP_INCHES` step that make a leaf pointed (length
 * strictly more than half the width): longer at its width, or narrower at its length (none when
 * even one step is too wide).
 *
 * @example leafResizes({ id: 'l1', seam: 's1', at: 0.5, side: 'left', angle: 0, length: 0.5, width: 3, layers: [] })
 * // longer: 1.625 × 3 (1.125 in of change); narrower: 0.5 × 0.875 (2.125 in)
 */
export function leafResizes(leaf: Leaf): { readonly longer: Resize | null; readonly narrower: Resize | null } {
  const step = LEAF_RESIZE_STEP_INCHES
  const finite = (value: number): boolean => value > 0 && Number.isFinite(value)
  let longer: Resize | null = null
  if (finite(leaf.width)) {
    let length = round(step * (Math.floor(leaf.width / 2 / step) + 1))
    while (!isPointedLeaf(length, leaf.width)) length = round(length + step)
    const from = finite(leaf.length) ? ` from ${inchesInWords(leaf.length)}` : ''
    longer = { leaf, size: { length, width: leaf.width }, words: `Lengthen ${leafMention(leaf.id)}${from} to ${inchesInWords(length)}`, change: round(Math.abs(length - (finite(leaf.length) ? leaf.length : 0))) }
  }
  let narrower: Resize | null = null
  if (finite(leaf.length)) {
    let width = round(step * (Math.ceil((2 * leaf.length) / step) - 1))
    while (width > 0 && !isPointedLeaf(leaf.length, width)) width = round(width - step)
    if (width > 0) {
      const from = finite(leaf.width) ? ` from ${inchesInWords(leaf.width)}` : ''
      narrower = { leaf, size: { length: leaf.length, width }, words: `Narrow ${leafMention(leaf.id)}${from} to ${inchesInWords(width)} wide`, change: round(Math.abs((finite(leaf.width) ? leaf.width : 0) - width)) }
    }
  }
  return { longer, narrower }
}

/**
 * The ways to make every impossible leaf pointed, least change first: all longer, all narrower,
 * and each by its own smaller change (when that differs from both). One way that changes nothing
 * for a design with no impossible leaf; none when some leaf cannot be resized at all.
 */
function leafChanges(leaves: readonly Leaf[]): LeafChange[] {
  const impossible = leaves.filter(impossibleLeaf).sort((p, q) => (p.id < q.id ? -1 : p.id > q.id ? 1 : 0))
  if (impossible.length === 0) return [{ leaves, words: [], change: 0, key: '' }]
  const options = impossible.map(leafResizes)
  const ways: (readonly (Resize | null)[])[] = [
    options.map((option) => option.longer),
    options.map((option) => option.narrower),
    options.map(({ longer, narrower }) => (longer && narrower ? (narrower.change < longer.change ? narrower : longer) : (longer ?? narrower))),
  ]
  const changes = new Map<string, LeafChange>()
  for (const way of ways) {
    if (way.some((resize) => resize === null)) continue
    const resizes = way as readonly Resize[]
    const sizes = new Map(resizes.map((resize) => [resize.leaf.id, resize.size]))
    const key = resizes.map((resize) => `${resize.leaf.id} ${resize.size.length}x${resize.size.width}`).join(' ')
    if (changes.has(key)) continue
    changes.set(key, {
      leaves: leaves.map((leaf) => {
        const size = sizes.get(leaf.id)
        return size ? { ...leaf, ...size } : leaf
      }),
      words: resizes.map((resize) => resize.words),
      change: round(resizes.reduce((sum, resize) => sum + resize.change, 0)),
      key,
    })
  }
  return [...changes.values()].sort((p, q) => p.change - q.change || (p.key < q.key ? -1 : p.key > q.key ? 1 : 0))
}

/** Phrases joined as one change: "Lengthen leaf 1 from 0.5 in to 1.625 in and let Wreathwright choose the order". */
function joinWords(parts: readonly string[]): string {
  const lowered = parts.map((part, index) => (index === 0 ? part : `${part.charAt(0).toLowerCase()}${part.slice(1)}`))
  return lowered.length <= 1 ? (lowered[0] ?? '') : `${lowered.slice(0, -1).join(', ')} and ${lowered[lowered.length - 1]}`
}

/** The words that say the hand-set order is dropped. */
const CHOOSE_ORDER = 'Let Wreathwright choose the order'

/**
 * Repairs of a design with a hand-set order or an impossible leaf: each way of resizing its
 * leaves, with the hand-set order kept where it sews, else dropped; where the seams still do not
 * sew, the seam search of the design without its order, with the least leaf change. Ranked by
 * sections, the seams' visible change, the leaves' change, then the words.
 */
function searchBeyondSeams(design: Design, options: RepairOptions): RepairResult {
  const started = performance.now()
  const budgetMs = options.budgetMs ?? REPAIR_BUDGET_MS
  const ranked: { suggestion: Suggestion; seamChange: number; leafChange: number; key: string }[] = []
  let stopped = false
  const add = (leafChange: LeafChange, parts: readonly string[], sections: number, clearsOrder: boolean, seams?: Found): void => {
    const suggestion: Suggestion = {
      message: `${joinWords(parts)}: sews in ${sectionsInWords(sections)}`,
      seams: seams?.seams ?? design.seams,
      sections,
      addedLengthIn: seams?.addedIn ?? 0,
      movedIn: seams?.movedIn ?? 0,
      ...(leafChange.words.length > 0 && { leaves: leafChange.leaves }),
      ...(clearsOrder && { clearsOrder: true }),
    }
    ranked.push({ suggestion, seamChange: seams?.change ?? 0, leafChange: leafChange.change, key: `${leafChange.key} | ${seams?.key ?? ''}` })
  }
  leafChanges(design.leaves).forEach((leafChange, index) => {
    const { leaves } = leafChange
    if (design.order) {
      const kept = judgeHandSetOrder(design.ring, design.seams, leaves, design.order)
      if (kept.sewable) {
        // Sewable in the designer's own order: only a resized leaf is a change to suggest.
        if (leafChange.words.length > 0) add(leafChange, leafChange.words, kept.sections, false)
        return
      }
    }
    const clearsOrder = Boolean(design.order)
    const parts = clearsOrder ? [...leafChange.words, CHOOSE_ORDER] : leafChange.words
    const free = judgeSeams(design.ring, design.seams, leaves)
    if (free.sewable) {
      add(leafChange, parts, free.sections, clearsOrder)
      return
    }
    // Seams that do not sew in any order: the seam search, once, with the least leaf change.
    if (index > 0) return
    const left = Math.max(0, budgetMs - (performance.now() - started))
    const searched = searchSeams({ ...design, leaves, order: null }, free, { ...options, budgetMs: left })
    stopped ||= searched.stopped
    for (const found of searched.found) add(leafChange, [...parts, found.words], found.sections, clearsOrder, found)
  })
  ranked.sort((p, q) => p.suggestion.sections - q.suggestion.sections || p.seamChange - q.seamChange || p.leafChange - q.leafChange || (p.key < q.key ? -1 : p.key > q.key ? 1 : 0))
  return { suggestions: ranked.slice(0, MOST_REPAIRS).map((entry) => entry.suggestion), stopped }
}

/** The seam search of one design with no hand-set order: what it found, best first, and whether a budget stopped it. */
function searchSeams(design: Design, judged: Judgement, options: RepairOptions): { found: Found[]; stopped: boolean } {
  const maxStates = options.maxStates ?? MAX_REPAIR_STATES
  const budgetMs = options.budgetMs ?? REPAIR_BUDGET_MS
  const started = performance.now()
  const none = { found: [], stopped: false }
  // The planner reports a cycle of seams as an error; the search wants the areas of that cycle.
  const cycle = !judged.sewable && judged.errors.every((problem) => problem.code === 'seam-cycle') && judged.stuck.length === 0 && !judged.searchLimit
  const base = cycle ? { ...judged, stuck: stuckAreas(judged.topology) } : judged
  if (base.sewable && base.sections < 2) return none
  // A design too large for the sections search to finish is too large to search for changes.
  if (base.searchLimit || base.errors.some((problem) => !REPAIRABLE.has(problem.code))) return none
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
      words: joined as string,
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
  return { found, stopped }
}
