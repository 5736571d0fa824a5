/**
 * The leaf preparation list: per fabric, how many folded leaves to make and of which sizes, so a
 * maker can cut, fold and press them in one batch before sewing. Each folded leaf is two pieces
 * (geometry/cutting-pieces.ts `PIECES_PER_FOLDED_LEAF`); the counts come from the core's
 * `fabricRequirements` (`leaves` for each fabric's total, its "leaf" pieces for the sizes).
 */
import { PIECES_PER_FOLDED_LEAF, type FabricRequirements } from '@/geometry'

export interface LeafSize {
  /** The piece cut for one side of a folded leaf, inches, as asked (before any turning). */
  readonly widthIn: number
  readonly heightIn: number
  readonly leaves: number
  readonly pieces: number
}

export interface LeafBatch {
  readonly fabric: string
  /** The display name from the requirements (never the role where a name exists). */
  readonly name: string
  readonly color: string | null
  /** Folded leaves of this fabric for the whole ring. */
  readonly leaves: number
  /** Pieces to cut: two per folded leaf. */
  readonly pieces: number
  /** By piece size, largest first. */
  readonly sizes: readonly LeafSize[]
}

/**
 * The leaf batches of one colourway's requirements, in the order the fabrics are used.
 *
 * @example leafPreparation(requirements)[0] // { fabric: 'leaf-dark', leaves: 16, pieces: 32, sizes: [{ widthIn: 1, heightIn: 2.125, leaves: 8, pieces: 16 }, …] }
 */
export function leafPreparation(requirements: FabricRequirements): LeafBatch[] {
  return requirements.leaves.map((count) => {
    const fabric = requirements.fabrics.find((candidate) => candidate.fabric === count.fabric)
    const sizes = (fabric?.pieces ?? [])
      .filter((piece) => piece.for === 'leaf')
      .map((piece) => ({ widthIn: piece.widthIn, heightIn: piece.heightIn, leaves: piece.count / PIECES_PER_FOLDED_LEAF, pieces: piece.count }))
      .sort((a, b) => b.widthIn * b.heightIn - a.widthIn * a.heightIn)
    return { fabric: count.fabric, name: fabric?.name ?? count.fabric, color: fabric?.color ?? null, leaves: count.leaves, pieces: count.pieces, sizes }
  })
}
