/**
 * What a repair changes, for the board to draw as a ghost while the designer points at it: the
 * seams that are new or whose ends moved (with where they were), those it takes away, and the
 * leaves it resizes (with the seams they would lie on). Pure: the design is never touched; the
 * overlay draws the ghost in every repeat. A repair that only drops the hand-set order changes
 * nothing drawn: the panel's words say it.
 */
import type { BoardDesign } from './commands'
import type { BoardLeaf, BoardSeam } from './board-plan'

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
  /** The leaves the repair resizes, at their new size (design units). */
  readonly resizedLeaves: readonly BoardLeaf[]
  /** The whole seams list after the repair, for the resized leaves to lie on. */
  readonly seams: readonly BoardSeam[]
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

/**
 * The preview of a suggestion's seams and leaves (design units), the `index`th for the design on
 * the board. `leaves` is the whole list after the change; absent, the leaves stay as they are.
 */
export function repairPreview(design: BoardDesign, seams: readonly BoardSeam[], index: number, leaves: readonly BoardLeaf[] = design.leaves): RepairPreview {
  const before = new Map(design.leaves.map((leaf) => [leaf.id, leaf]))
  const resizedLeaves = leaves.filter((leaf) => {
    const was = before.get(leaf.id)
    return !was || was.length !== leaf.length || was.width !== leaf.width
  })
  return { base: design, index, changes: seamChanges(design.seams, seams), resizedLeaves, seams }
}
