/**
 * The finishing arithmetic the booklet prints: the binding of the ring's curved edges (cut width,
 * fabric, one strip per edge with its own joining allowance) and where the folded bias stem ring
 * is sewn so that it lands on the lines traced from the placement guide.
 */
import type { Design, StemRing } from '@/geometry'

/** Double-fold binding strips are cut 2 1/4 to 2 1/2 in wide (common practice); the default, inches. */
export const DEFAULT_BINDING_CUT_WIDTH_INCHES = 2.25
/** The colourway's fabric role binding is cut from when the design names none. */
export const DEFAULT_BINDING_FABRIC = 'binding'
/** Extra length on each binding strip for joining its ends, inches (common practice: about 10 in). */
export const BINDING_JOIN_INCHES = 10
/** A folded bias stem is sewn this far from its raw edges, inches (the 1/4 in seam, common practice). */
export const STEM_SEAM_INCHES = 0.25

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
}

/**
 * The binding of a design: its settings (or the defaults) and a strip for each curved edge.
 *
 * @example bindingPlan(design).edges[0]?.stripLengthIn // 67 for an 18 in ring: 2π × 9 + 10 = 66.5, rounded up
 */
export function bindingPlan(design: Pick<Design, 'ring' | 'binding'>): BindingPlan {
  const { ring } = design
  const radii: [BindingEdge['edge'], number][] = [['outer', ring.outerRadius]]
  if (ring.innerRadius > 0) radii.push(['inner', ring.innerRadius])
  return {
    cutWidthIn: design.binding?.cutWidth ?? DEFAULT_BINDING_CUT_WIDTH_INCHES,
    fabric: design.binding?.fabric ?? DEFAULT_BINDING_FABRIC,
    edges: radii.map(([edge, radiusIn]) => {
      const circumferenceIn = 2 * Math.PI * radiusIn
      return { edge, radiusIn, circumferenceIn, stripLengthIn: Math.ceil(circumferenceIn + BINDING_JOIN_INCHES) }
    }),
  }
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
  const cutWidthIn = 2 * stem.finishedWidth + 2 * STEM_SEAM_INCHES
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
