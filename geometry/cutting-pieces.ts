/**
 * Every piece a maker cuts for a whole ring, by fabric role: each area's rough-cut rectangle once
 * per repeat, two pieces per folded leaf (every layer of a stacked leaf is a folded leaf of its
 * own size), a square per berry circle, and the squares the stem ring's and the binding's
 * continuous bias strips are cut from. Sizes are rectangles a ruler cuts (1/8 in steps).
 */
import {
  bindingPlan, continuousBiasSquareInches, stemStrip, type BindingOptions, type StemStripOptions,
} from './bias'
import { fabricsOfAreas } from './fills'
import { leafLayers, leafShapeProblem, leafTemplate } from './leaf-template'
import type { Plan } from './plan'
import { roundUpToEighthInch } from './rough-cut'
import type { PieceToCut } from './strip-layout'
import type { Design } from './types'

/** The fabric role of an area no fill names. */
export const UNASSIGNED_FABRIC = 'unassigned'
/** Pieces of fabric in one folded leaf: two, sewn right sides together and turned. */
export const PIECES_PER_FOLDED_LEAF = 2
/**
 * A gathered (stuffed) berry's circle is cut about twice the finished diameter plus a little
 * allowance (from memory, references.md: "check in a sample, keep it a setting"); the allowance
 * beyond twice the diameter, inches.
 */
export const BERRY_EXTRA_INCHES = 0.25
/** Bias squares are never more than this many per strip (a programmer's bound, not a sewing rule). */
const MAX_BIAS_SQUARES = 1000

/**
 * The circle to cut for a berry of this finished diameter: 2 × diameter + the extra (from memory).
 *
 * @example berryCutDiameterInches(0.5) // 1.25: 2 × 1/2 + 1/4
 */
export function berryCutDiameterInches(finishedDiameterInches: number, extraInches = BERRY_EXTRA_INCHES): number {
  return 2 * finishedDiameterInches + extraInches
}

/** The squares one continuous bias strip is cut from: one, or several equal ones when one would be wider than the fabric. */
export interface BiasSquares {
  readonly sideIn: number
  readonly count: number
}

/**
 * The fewest equal squares, none wider than `widestInches`, that together yield a bias strip
 * `lengthInches` long and `widthInches` wide (each square a continuous strip of its share, the
 * strips then joined). When even the smallest share is too wide, one square: the layout reports it.
 *
 * @example biasSquares(53, 1.25, 40) // { sideIn: 9.625, count: 1 }
 */
export function biasSquares(lengthInches: number, widthInches: number, widestInches: number): BiasSquares {
  for (let count = 1; count <= MAX_BIAS_SQUARES; count += 1) {
    const sideIn = continuousBiasSquareInches(lengthInches / count, widthInches)
    if (sideIn <= widestInches) return { sideIn, count }
  }
  return { sideIn: continuousBiasSquareInches(lengthInches, widthInches), count: 1 }
}

/** A stem ring's bias strip and the squares it is cut from. */
export interface StemBias {
  readonly fabric: string
  readonly lengthIn: number
  readonly cutWidthIn: number
  readonly squareIn: number
  readonly squares: number
}

export interface BindingBias {
  readonly fabric: string
  /** Every edge's strip together. */
  readonly lengthIn: number
  readonly cutWidthIn: number
  readonly squareIn: number
  readonly squares: number
}

export interface LeafCount {
  readonly fabric: string
  /** Folded leaves for the whole ring. */
  readonly leaves: number
  /** Pieces to cut: two per folded leaf. */
  readonly pieces: number
}

export interface BerryCount {
  readonly fabric: string
  readonly count: number
  readonly cutDiameterIn: number
}

export interface FabricPieces {
  readonly fabric: string
  readonly pieces: readonly PieceToCut[]
}

export interface CuttingPieces {
  /** In first-seen order: areas (in plan order), leaves, berries, stems, binding. */
  readonly fabrics: readonly FabricPieces[]
  readonly leaves: readonly LeafCount[]
  readonly stems: readonly StemBias[]
  readonly binding: BindingBias
  readonly berries: readonly BerryCount[]
}

export interface CuttingPiecesOptions {
  /** Bias squares are kept no wider than this (the usable width of fabric), inches. */
  readonly widthOfFabricIn: number
  readonly berryExtraInches?: number
  readonly stemJoinOverlapInches?: StemStripOptions['joinOverlapInches']
  readonly bindingJoinInches?: BindingOptions['joinInches']
}

/**
 * The bounding rectangle of a leaf template's cut line, rounded up to 1/8 in: the piece cut for
 * one side of a folded leaf (the template is traced on it and cut on the dashed line).
 *
 * @example leafPieceInches(1.5, 0.75) // { widthIn: 1, heightIn: 2 }
 */
export function leafPieceInches(lengthInches: number, widthInches: number): { widthIn: number; heightIn: number } {
  const { cutPolygon } = leafTemplate(lengthInches, widthInches)
  const xs = cutPolygon.map((p) => p[0])
  const ys = cutPolygon.map((p) => p[1])
  return {
    widthIn: roundUpToEighthInch(Math.max(...xs) - Math.min(...xs)),
    heightIn: roundUpToEighthInch(Math.max(...ys) - Math.min(...ys)),
  }
}

/**
 * Every piece to cut for the whole ring, by fabric (see the file comment). Leaves that cannot be
 * drawn (the plan's `impossible-leaf`) are left out, as the board and the booklet leave them out.
 *
 * @example cuttingPieces(design, planDesign(design), { widthOfFabricIn: 40 }).fabrics[0]?.pieces[0] // { for: 'A1', widthIn: 4, heightIn: 4, count: 4 }
 */
export function cuttingPieces(design: Design, plan: Plan, options: CuttingPiecesOptions): CuttingPieces {
  const repeats = design.ring.repeats
  const byFabric = new Map<string, Map<string, { for: string; widthIn: number; heightIn: number; count: number }>>()
  const add = (fabric: string, piece: PieceToCut): void => {
    const pieces = byFabric.get(fabric) ?? new Map()
    byFabric.set(fabric, pieces)
    const key = `${piece.for}\u0000${piece.widthIn}\u0000${piece.heightIn}`
    const entry = pieces.get(key) ?? { ...piece, count: 0 }
    entry.count += piece.count
    pieces.set(key, entry)
  }
  const filled = fabricsOfAreas(design.fills, plan.areas)
  for (const area of plan.areas) {
    // An area the allowance code could not size has an empty rough cut and a plan warning saying why.
    if (!(area.roughCut.widthIn > 0 && area.roughCut.heightIn > 0)) continue
    add(filled.get(area.id) ?? UNASSIGNED_FABRIC, { for: area.label ?? area.id, widthIn: area.roughCut.widthIn, heightIn: area.roughCut.heightIn, count: repeats })
  }
  const leafCounts = new Map<string, number>()
  for (const leaf of design.leaves) {
    if (leafShapeProblem(leaf.length, leaf.width)) continue
    for (const layer of leafLayers(leaf)) {
      add(layer.fabric, { for: 'leaf', ...leafPieceInches(layer.length, layer.width), count: PIECES_PER_FOLDED_LEAF * repeats })
      leafCounts.set(layer.fabric, (leafCounts.get(layer.fabric) ?? 0) + repeats)
    }
  }
  const berryCounts = new Map<string, BerryCount>()
  for (const berry of design.berries) {
    const cutDiameterIn = berryCutDiameterInches(berry.finishedDiameter, options.berryExtraInches)
    add(berry.fabric, { for: 'berry', widthIn: roundUpToEighthInch(cutDiameterIn), heightIn: roundUpToEighthInch(cutDiameterIn), count: repeats })
    const key = `${berry.fabric}\u0000${cutDiameterIn}`
    const entry = berryCounts.get(key) ?? { fabric: berry.fabric, count: 0, cutDiameterIn }
    berryCounts.set(key, { ...entry, count: entry.count + repeats })
  }
  const stems = design.stems.map((stem): StemBias => {
    const strip = stemStrip(stem, { joinOverlapInches: options.stemJoinOverlapInches })
    const squares = biasSquares(strip.lengthIn, strip.cutWidthIn, options.widthOfFabricIn)
    add(stem.fabric, { for: 'stem', widthIn: squares.sideIn, heightIn: squares.sideIn, count: squares.count })
    return { fabric: stem.fabric, lengthIn: strip.lengthIn, cutWidthIn: strip.cutWidthIn, squareIn: squares.sideIn, squares: squares.count }
  })
  // One continuous strip for all the binding, cut into a strip per edge.
  const plannedBinding = bindingPlan(design, { joinInches: options.bindingJoinInches })
  const bindingSquares = biasSquares(plannedBinding.lengthIn, plannedBinding.cutWidthIn, options.widthOfFabricIn)
  add(plannedBinding.fabric, { for: 'binding', widthIn: bindingSquares.sideIn, heightIn: bindingSquares.sideIn, count: bindingSquares.count })
  return {
    fabrics: [...byFabric].map(([fabric, pieces]) => ({ fabric, pieces: [...pieces.values()] })),
    leaves: [...leafCounts].map(([fabric, leaves]) => ({ fabric, leaves, pieces: PIECES_PER_FOLDED_LEAF * leaves })),
    stems,
    binding: {
      fabric: plannedBinding.fabric,
      lengthIn: plannedBinding.lengthIn,
      cutWidthIn: plannedBinding.cutWidthIn,
      squareIn: bindingSquares.sideIn,
      squares: bindingSquares.count,
    },
    berries: [...berryCounts.values()],
  }
}
