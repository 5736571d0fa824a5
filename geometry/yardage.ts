/**
 * What to buy: a layout's length plus the extra a maker keeps for mistakes and shrinkage, rounded
 * up to what a shop cuts (1/8 yd in inch shops, 0.1 m in metric ones), and the precuts a layout
 * fits on (fat quarter, fat eighth).
 */
import { layoutStrips, type PieceToCut } from './strip-layout'
import { CUT_FIT_SLACK_INCHES, ROUNDING_SLACK_INCHES } from './tolerances'

/** 1 yd = 36 in exactly (international yard and pound agreement, 1959). */
export const INCHES_PER_YARD = 36
/** 1 in = 0.0254 m exactly (1959 agreement), so 1 yd = 0.9144 m. */
export const METRES_PER_INCH = 0.0254
/** Usable width of quilting cotton between the selvedges, inches (common practice: sold 42–45 in, about 40 usable; a setting). */
export const DEFAULT_WIDTH_OF_FABRIC_INCHES = 40
/** Extra fabric on top of the layout, percent (common practice; a setting). */
export const DEFAULT_EXTRA_PERCENT = 10
/** Yardage is cut in 1/8 yd steps, 4.5 in (common practice). */
export const YARDAGE_STEP_INCHES = INCHES_PER_YARD / 8
/** Metric shops cut in 0.1 m steps (common practice). */
export const METRE_STEP_TENTHS = 1

/** A precut piece of fabric: `widthIn` across, `lengthIn` along (either way round can be used). */
export interface Precut {
  readonly name: string
  readonly widthIn: number
  readonly lengthIn: number
}

/** A fat quarter: half a yard cut in half across the width, 18 × 21 in (common practice: 18 × 21–22 in; a setting). */
export const FAT_QUARTER: Precut = { name: 'fat quarter', widthIn: 21, lengthIn: 18 }
/** A fat eighth: a fat quarter cut in half, 9 × 21 in (common practice: 9 × 21–22 in; a setting). */
export const FAT_EIGHTH: Precut = { name: 'fat eighth', widthIn: 21, lengthIn: 9 }

/** Length with the extra, inches. */
const withExtra = (lengthInches: number, extraPercent: number): number => lengthInches * (1 + extraPercent / 100)

/**
 * Yards to buy: the length plus `extraPercent`, rounded up to 1/8 yd (a length within a millionth
 * of an inch of a step is that step, so noise never buys another eighth).
 *
 * @example yardsToBuy(36, 0) // 1
 * @example yardsToBuy(36, 10) // 1.125: 39.6 in is over 1 yd, so 9/8 yd
 */
export function yardsToBuy(lengthInches: number, extraPercent = DEFAULT_EXTRA_PERCENT): number {
  if (!(lengthInches > 0)) return 0
  const eighths = Math.ceil((withExtra(lengthInches, extraPercent) - ROUNDING_SLACK_INCHES) / YARDAGE_STEP_INCHES)
  return eighths / 8
}

/**
 * Metres to buy: the length plus `extraPercent`, in metres (0.0254 m per inch, exact), rounded up
 * to 0.1 m.
 *
 * @example metresToBuy(36, 0) // 1: 1 yd = 0.9144 m, rounded up
 */
export function metresToBuy(lengthInches: number, extraPercent = DEFAULT_EXTRA_PERCENT): number {
  if (!(lengthInches > 0)) return 0
  const tenths = Math.ceil(((withExtra(lengthInches, extraPercent) - ROUNDING_SLACK_INCHES) * METRES_PER_INCH * 10) / METRE_STEP_TENTHS)
  return (tenths * METRE_STEP_TENTHS) / 10
}

/**
 * True when every piece can be cut from the precut, laid out in strips across either of its
 * sides (the same layout rule as for yardage; no extra: a precut is cut as it comes).
 *
 * @example fitsOnPrecut([{ for: 'A1', widthIn: 6, heightIn: 6, count: 9 }], FAT_QUARTER) // true: three strips of three, 18 × 18 in
 */
export function fitsOnPrecut(pieces: readonly PieceToCut[], precut: Precut): boolean {
  if (!pieces.some((piece) => piece.count > 0)) return true
  // More area than the precut has cannot fit: decided without a layout (most yardage fabrics).
  const area = pieces.reduce((sum, piece) => sum + Math.max(piece.count, 0) * piece.widthIn * piece.heightIn, 0)
  if (area > precut.widthIn * precut.lengthIn + CUT_FIT_SLACK_INCHES) return false
  return [[precut.widthIn, precut.lengthIn], [precut.lengthIn, precut.widthIn]].some(([across, along]) => {
    const layout = layoutStrips(pieces, { widthOfFabricIn: across! })
    return layout.problems.length === 0 && layout.lengthIn <= along! + CUT_FIT_SLACK_INCHES
  })
}
