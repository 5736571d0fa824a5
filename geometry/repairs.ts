/**
 * Repairs: for a design that cannot be sewn (or sews in several sections), small changes to its
 * seams that make it sewable, or sewable in fewer sections. Pure: the design is never changed;
 * each suggestion carries the whole seams list after its change, and only the designer applies it.
 */
import type { Design, Seam } from './types'

/** One proposed change, ranked with the others by `suggestRepairs`. */
export interface Suggestion {
  /** Plain words for the designer: "Extend seam s3 to the outline: sews in 1 section". */
  readonly message: string
  /** The design's whole seams list after the change (ids kept; a new seam has a new id). */
  readonly seams: readonly Seam[]
  /** Sections of the plan of the changed design. */
  readonly sections: number
  /** Seam length added by the change, inches, rounded like other plan outputs. */
  readonly addedLengthIn: number
  /** How far seam ends moved, inches, rounded like other plan outputs. */
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

/**
 * Suggests at most five repairs for an unsewable design, or at most three that save sections
 * for a design that sews in two or more.
 *
 * @example
 * const { suggestions } = suggestRepairs(design)
 * suggestions[0]?.message // "Extend seam s3 to the outline: sews in 1 section"
 */
export function suggestRepairs(design: Design, options: RepairOptions = {}): RepairResult {
  // The search itself is the next commit's work; until then no suggestions, never stopped.
  void design
  void options
  return { suggestions: [], stopped: false }
}
