/**
 * What a repair changes, for the board to draw as a ghost while the designer points at it: the
 * seams that are new or whose ends moved (with where they were), and those it takes away. Pure:
 * the design is never touched; the overlay draws the ghost in every repeat.
 */
import type { BoardDesign } from './commands'
import type { BoardSeam } from './board-plan'

type Ends = readonly [readonly [number, number], readonly [number, number]]

/** One seam a repair changes, in design units. */
export interface SeamChange {
  readonly id: string
  /** Where it lies now, or null for a seam the repair adds. */
  readonly before: Ends | null
  /** Where the repair puts it, or null for a seam it removes. */
  readonly after: Ends | null
}

/** A repair being pointed at: the design it was made for, and its changes. */
export interface RepairPreview {
  /** The design the suggestion belongs to; the ghost is drawn only while this is on the board. */
  readonly base: BoardDesign
  /** Its place in the list of suggestions for that design. */
  readonly index: number
  readonly changes: readonly SeamChange[]
}

const sameEnd = (a: readonly number[], b: readonly number[]) => a[0] === b[0] && a[1] === b[1]

/**
 * The seams that differ between two seam lists, matched by id, in the order of `after` and then
 * the removed ones in the order of `before`.
 *
 * @example seamChanges([{ id: 's1', from: [0, 0], to: [1, 0] }], [{ id: 's1', from: [0, 0], to: [2, 0] }]).map((c) => c.id) // ['s1']
 */
export function seamChanges(before: readonly BoardSeam[], after: readonly BoardSeam[]): SeamChange[] {
  const old = new Map(before.map((seam) => [seam.id, seam]))
  const kept = new Set(after.map((seam) => seam.id))
  const changed: SeamChange[] = []
  for (const seam of after) {
    const was = old.get(seam.id)
    if (was && sameEnd(was.from, seam.from) && sameEnd(was.to, seam.to)) continue
    changed.push({ id: seam.id, before: was ? [was.from, was.to] : null, after: [seam.from, seam.to] })
  }
  for (const seam of before) if (!kept.has(seam.id)) changed.push({ id: seam.id, before: [seam.from, seam.to], after: null })
  return changed
}

/** The preview of a suggestion's seams (design units), the `index`th for the design on the board. */
export function repairPreview(design: BoardDesign, seams: readonly BoardSeam[], index: number): RepairPreview {
  return { base: design, index, changes: seamChanges(design.seams, seams) }
}
