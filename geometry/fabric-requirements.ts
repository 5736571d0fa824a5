/**
 * What to buy and how to cut it, per fabric of one colourway: the pieces (cutting-pieces.ts), their
 * layout in strips across the width of fabric (strip-layout.ts), the length it takes, the yards
 * and metres to buy with the extra (yardage.ts), and whether a fat quarter or a fat eighth will do.
 * The command line's `cutting` prints this; the fabric table, the cutting diagrams and the booklet
 * read the same result (each fabric's `strips` is what a diagram draws).
 */
import {
  cuttingPieces, type BerryCount, type BindingBias, type CuttingPiecesOptions, type LeafCount, type StemBias,
} from './cutting-pieces'
import type { Plan } from './plan'
import { layoutStrips, type CuttingProblem, type CuttingStrip, type PieceToCut, type PlacedCut } from './strip-layout'
import type { Colorway, ColorwayFabric, Design } from './types'
import {
  DEFAULT_EXTRA_PERCENT, DEFAULT_WIDTH_OF_FABRIC_INCHES, FAT_EIGHTH, FAT_QUARTER, fitsOnPrecut, metresToBuy, yardsToBuy, type Precut,
} from './yardage'

export interface CuttingSettings extends Partial<Omit<CuttingPiecesOptions, 'widthOfFabricIn'>> {
  /** Usable width of fabric, inches; default 40 in. */
  readonly widthOfFabricIn?: number
  /** Extra on top of the layout's length, percent; default 10 %. */
  readonly extraPercent?: number
  /** Default 18 × 21 in. */
  readonly fatQuarter?: Precut
  /** Default 9 × 21 in. */
  readonly fatEighth?: Precut
}

export interface FabricRequirement {
  /** The fabric role. */
  readonly fabric: string
  /** What the maker reads: `fabricDisplayName`. */
  readonly name: string
  /** The colourway's #rrggbb, or null when it gives this role none. */
  readonly color: string | null
  readonly pieces: readonly PieceToCut[]
  /** Every straight-grain piece placed (bias squares included; the bias strips are `stems` and `binding`). */
  readonly cuts: readonly PlacedCut[]
  /** The strips the cuts lie in, for a cutting diagram. */
  readonly strips: readonly CuttingStrip[]
  /** The layout's length before the extra, inches. */
  readonly lengthIn: number
  /** The layout's lower bound (piece area / width), inches: how close the packing is. */
  readonly lowerBoundIn: number
  readonly yards: number
  readonly metres: number
  readonly fatQuarter: boolean
  readonly fatEighth: boolean
}

export interface FabricRequirements {
  readonly colorway: string | null
  readonly widthOfFabricIn: number
  readonly extraPercent: number
  readonly fabrics: readonly FabricRequirement[]
  readonly leaves: readonly LeafCount[]
  /** One per stem ring, in the design's order. */
  readonly stems: readonly StemBias[]
  readonly binding: BindingBias
  readonly berries: readonly BerryCount[]
  /** Pieces that cannot be cut from the width of fabric, in plain words. */
  readonly problems: readonly CuttingProblem[]
}

/**
 * A fabric role in words, for a role no colourway names yet and for a version 1 file's fabrics
 * (which had no names): dashes and underscores become spaces, the first letter a capital.
 *
 * @example fabricRoleInWords('leaf-dark') // 'Leaf dark'
 */
export function fabricRoleInWords(fabric: string): string {
  const words = fabric.replace(/[-_\s]+/g, ' ').trim()
  return words.charAt(0).toUpperCase() + words.slice(1)
}

/**
 * The fabric a colourway gives a role, if it gives one (its own keys only: a role named
 * "constructor" is not Object's).
 *
 * @example colorwayFabric({ name: 'Autumn', fabrics: { stem: { name: 'Bark brown', color: '#4a3a2a' } } }, 'stem')?.color // '#4a3a2a'
 */
export function colorwayFabric(colorway: Colorway | null | undefined, fabric: string): ColorwayFabric | undefined {
  return colorway && Object.hasOwn(colorway.fabrics, fabric) ? colorway.fabrics[fabric] : undefined
}

/**
 * The name a maker reads for a fabric role in a colourway: the fabric's display name the
 * colourway gives it, or the role in words when it gives none (or there is no colourway). The one
 * place it is decided: the board, the tables, the booklet and the command line all ask here.
 *
 * @example fabricDisplayName({ name: 'Autumn', fabrics: { background: { name: 'Cream tone-on-tone', color: '#f4ecd8' } } }, 'background') // 'Cream tone-on-tone'
 */
export function fabricDisplayName(colorway: Colorway | null | undefined, fabric: string): string {
  return colorwayFabric(colorway, fabric)?.name ?? fabricRoleInWords(fabric)
}

/**
 * The fabric requirements of a design in one colourway (null: no colourway, no colours).
 *
 * @example fabricRequirements(design, planDesign(design), design.colorways[0] ?? null).fabrics[0]?.yards // 0.375
 */
export function fabricRequirements(design: Design, plan: Plan, colorway: Colorway | null, settings: CuttingSettings = {}): FabricRequirements {
  const widthOfFabricIn = settings.widthOfFabricIn ?? DEFAULT_WIDTH_OF_FABRIC_INCHES
  const extraPercent = settings.extraPercent ?? DEFAULT_EXTRA_PERCENT
  if (!(widthOfFabricIn > 0) || !Number.isFinite(widthOfFabricIn)) throw new RangeError(`the width of fabric must be a positive length, got ${widthOfFabricIn}`)
  if (!(extraPercent >= 0) || !Number.isFinite(extraPercent)) throw new RangeError(`the extra must be a percentage ≥ 0, got ${extraPercent}`)
  const all = cuttingPieces(design, plan, { ...settings, widthOfFabricIn })
  const problems: CuttingProblem[] = []
  const fabrics = all.fabrics.map(({ fabric, pieces }): FabricRequirement => {
    const layout = layoutStrips(pieces, { widthOfFabricIn })
    problems.push(...layout.problems)
    return {
      fabric,
      name: fabricDisplayName(colorway, fabric),
      color: colorwayFabric(colorway, fabric)?.color ?? null,
      pieces,
      cuts: layout.cuts,
      strips: layout.strips,
      lengthIn: layout.lengthIn,
      lowerBoundIn: layout.lowerBoundIn,
      yards: yardsToBuy(layout.lengthIn, extraPercent),
      metres: metresToBuy(layout.lengthIn, extraPercent),
      fatQuarter: fitsOnPrecut(pieces, settings.fatQuarter ?? FAT_QUARTER),
      fatEighth: fitsOnPrecut(pieces, settings.fatEighth ?? FAT_EIGHTH),
    }
  })
  return { colorway: colorway?.name ?? null, widthOfFabricIn, extraPercent, fabrics, leaves: all.leaves, stems: all.stems, binding: all.binding, berries: all.berries, problems }
}
