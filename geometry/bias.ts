/**
 * Bias strips: the folded stem ring and the binding of the ring's curved edges, how long and how
 * wide each strip is cut, and the square of fabric that yields it as one continuous bias strip.
 * The one rule for the booklet, the command line and the fabric tables (lib/booklet imports it).
 *
 * Continuous bias from a square (derivable, references.md "the square's area becomes the strip's
 * area"): cut the square of side s on one diagonal, sew the two triangles into a parallelogram
 * along two straight-grain edges, mark lines w apart parallel to the bias edges, sew the other
 * two straight-grain edges into a tube offset by one strip, and cut round the spiral. Each of the
 * two seams takes one allowance a from both sides, so the usable parallelogram is t = s − 2a on
 * its straight sides; its lines run t√2 long and lie t/√2 across, giving (t/√2) / w strips of
 * t√2 each: t² / w in all. The spiral's two ends are cut off on the bias, together about one
 * strip's length (t√2), so a strip of length L needs t² / w − t√2 ≥ L:
 * t = (√2·w + √(2w² + 4Lw)) / 2, then s = t + 2a, rounded up to the ruler's 1/8 in. For large L
 * that is √(L·w) plus a margin of about 2a + w/√2.
 */
import { roundUpToEighthInch } from './rough-cut'
import type { Design, StemRing } from './types'

/** Double-fold binding strips are cut 2 1/4 to 2 1/2 in wide (common practice); the default, inches. */
export const DEFAULT_BINDING_CUT_WIDTH_INCHES = 2.25
/** The colourway's fabric role binding is cut from when the design names none. */
export const DEFAULT_BINDING_FABRIC = 'binding'
/** Extra length on each binding strip for joining its ends, inches (common practice: about 10 in). */
export const BINDING_JOIN_INCHES = 10
/** A folded bias stem is sewn this far from its raw edges, inches (the 1/4 in seam, common practice). */
export const STEM_SEAM_INCHES = 0.25
/** Extra bias strip for joining the stem ring's ends, inches (common practice: a few inches; a setting). */
export const STEM_JOIN_OVERLAP_INCHES = 4
/** Seam allowance of the two seams that make a square into a continuous bias tube, inches (common practice). */
export const BIAS_TUBE_SEAM_INCHES = 0.25

/** One bound edge: its circumference and the strip it takes. */
export interface BindingEdge {
  readonly edge: 'outer' | 'inner'
  readonly radiusIn: number
  /** 2πr, inches. */
  readonly circumferenceIn: number
  /** 2πr + the joining allowance, rounded up to a whole inch. */
  readonly stripLengthIn: number
}

export interface BindingPlan {
  readonly cutWidthIn: number
  readonly fabric: string
  /** The outer edge; the inner edge too for a ring with a hole. */
  readonly edges: readonly BindingEdge[]
  /** All the strips together, inches: what one continuous bias strip must yield. */
  readonly lengthIn: number
}

export interface BindingOptions {
  /** Joining allowance per edge, inches; default 10 in. */
  readonly joinInches?: number
}

/**
 * The binding of a design: its settings (or the defaults) and a strip for each curved edge.
 *
 * @example bindingPlan({ ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' } }).edges[0]?.stripLengthIn // 67
 */
export function bindingPlan(design: Pick<Design, 'ring' | 'binding'>, options: BindingOptions = {}): BindingPlan {
  const { ring } = design
  const join = options.joinInches ?? BINDING_JOIN_INCHES
  const radii: [BindingEdge['edge'], number][] = [['outer', ring.outerRadius]]
  if (ring.innerRadius > 0) radii.push(['inner', ring.innerRadius])
  const edges = radii.map(([edge, radiusIn]) => {
    const circumferenceIn = 2 * Math.PI * radiusIn
    return { edge, radiusIn, circumferenceIn, stripLengthIn: Math.ceil(circumferenceIn + join) }
  })
  return {
    cutWidthIn: design.binding?.cutWidth ?? DEFAULT_BINDING_CUT_WIDTH_INCHES,
    fabric: design.binding?.fabric ?? DEFAULT_BINDING_FABRIC,
    edges,
    lengthIn: edges.reduce((sum, edge) => sum + edge.stripLengthIn, 0),
  }
}

/**
 * The cut width of a folded bias stem: fold in half, sew `seamInches` from the raw edges, press
 * over, so the strip covers 2 × (finished width + seam) (derivable, references.md).
 *
 * @example stemCutWidthInches(0.375) // 1.25: 2 × 3/8 + 1/2
 */
export function stemCutWidthInches(finishedWidthInches: number, seamInches = STEM_SEAM_INCHES): number {
  return 2 * finishedWidthInches + 2 * seamInches
}

export interface StemStripOptions {
  /** Joining overlap, inches; default 4 in. */
  readonly joinOverlapInches?: number
}

/** The bias strip one stem ring takes. */
export interface StemStrip {
  readonly fabric: string
  /** 2πr of the stem's centre line, inches. */
  readonly circumferenceIn: number
  /** Circumference + joining overlap, rounded up to a whole inch. */
  readonly lengthIn: number
  readonly cutWidthIn: number
}

/**
 * The strip of a stem ring: its circumference (2πr at the stem's radius) plus the joining
 * overlap, rounded up to a whole inch, cut 2 × finished width + 1/2 in wide.
 *
 * @example stemStrip({ radius: 7.75, finishedWidth: 0.375, fabric: 'stem' }).lengthIn // 53: 2π × 7.75 + 4 = 52.7, rounded up
 */
export function stemStrip(stem: StemRing, options: StemStripOptions = {}): StemStrip {
  const circumferenceIn = 2 * Math.PI * stem.radius
  return {
    fabric: stem.fabric,
    circumferenceIn,
    lengthIn: Math.ceil(circumferenceIn + (options.joinOverlapInches ?? STEM_JOIN_OVERLAP_INCHES)),
    cutWidthIn: stemCutWidthInches(stem.finishedWidth),
  }
}

/**
 * The side of the square of fabric that yields one continuous bias strip `lengthInches` long and
 * `widthInches` wide (see the file comment for the derivation), rounded up to 1/8 in.
 *
 * @example continuousBiasSquareInches(53, 1.25) // 9.625: √(53 × 1.25) = 8.14, plus the seams and the spiral's ends
 */
export function continuousBiasSquareInches(lengthInches: number, widthInches: number, seamInches = BIAS_TUBE_SEAM_INCHES): number {
  if (!(lengthInches > 0) || !(widthInches > 0)) return 0
  const w = widthInches
  const usable = (Math.SQRT2 * w + Math.sqrt(2 * w * w + 4 * lengthInches * w)) / 2
  return roundUpToEighthInch(usable + 2 * seamInches)
}

/**
 * Where a folded bias stem is sewn so it covers the band the placement guide draws (radius ± half
 * the finished width). The strip, cut 2w + 1/2 in and folded in half, is w + 1/4 in wide. It is
 * laid on the centre side of the inner traced circle with its raw edges 1/4 in beyond it and sewn
 * 1/4 in from them, so the stitching runs on that circle; pressed over toward the outer edge it
 * covers w from the stitching, so its fold lies on the outer traced circle and hides the raw edges
 * (when w ≥ 1/4 in; a narrower stem needs its allowance trimmed first).
 *
 * @example stemSewing({ radius: 7.75, finishedWidth: 0.375, fabric: 'stem' }).foldRadiusIn // 7.9375
 */
export function stemSewing(stem: StemRing): {
  readonly cutWidthIn: number
  readonly foldedWidthIn: number
  readonly stitchRadiusIn: number
  readonly rawEdgeRadiusIn: number
  readonly foldRadiusIn: number
  readonly trimAllowance: boolean
} {
  const cutWidthIn = stemCutWidthInches(stem.finishedWidth)
  const foldedWidthIn = cutWidthIn / 2
  const stitchRadiusIn = stem.radius - stem.finishedWidth / 2
  return {
    cutWidthIn,
    foldedWidthIn,
    stitchRadiusIn,
    rawEdgeRadiusIn: stitchRadiusIn + STEM_SEAM_INCHES,
    // Pressed over the stitching: what lay between the stitching and the fold now lies beyond it.
    foldRadiusIn: stitchRadiusIn + (foldedWidthIn - STEM_SEAM_INCHES),
    trimAllowance: stem.finishedWidth < STEM_SEAM_INCHES,
  }
}
