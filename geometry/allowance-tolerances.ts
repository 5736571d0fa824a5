/**
 * Tolerances of the allowance code (cutting shapes, trim lines, rough cuts, leaf templates).
 *
 * They live here, not in geometry/tolerances.ts, only because that file did not exist when the
 * allowance code was written; each value is named once, with its unit and its reason, and can
 * move there unchanged. Values the whole core shares (the arc chord tolerance) are imported
 * from geometry/tolerances.ts instead.
 */

/**
 * Two consecutive polygon corners closer than this are one corner: the edge between them has
 * no usable direction, so its offset would point anywhere. Inches.
 */
export const DUPLICATE_POINT_INCHES = 1e-9

/**
 * A turn whose sine (cross product of the two unit edge directions) is smaller than this is
 * treated as straight when deciding between a mitre and a reflex join; far below anything a
 * designer draws, far above floating-point noise on lengths of a few inches. Unitless.
 */
export const STRAIGHT_TURN_SINE = 1e-12

/**
 * A reflex corner whose edges turn back on each other further than this cosine (about 177.4°,
 * Clipper2's own threshold) has offset lines too nearly parallel to intersect reliably; the
 * offset is then built by its definition (a union) instead. Unitless.
 */
export const REVERSAL_COSINE = -0.999

/**
 * A computed size within this of a 1/8 in step is taken as that step before rounding up, so
 * floating-point noise (2.5000000000004 in) does not add a whole 1/8 in of fabric. Inches;
 * a millionth of an inch is far below any cut a quilter can make.
 */
export const ROUNDING_SLACK_INCHES = 1e-6

/**
 * Two candidate rectangles (rotating calipers) whose areas differ by less than this are a tie,
 * broken by a deterministic rule so the same area always gets the same rectangle. Square inches.
 */
export const RECTANGLE_AREA_TIE_SQ_IN = 1e-9

/**
 * A plan polygon's corner within this of one of the ring's circles lies on it (outlineFromPolygon).
 * Inches; the plan rounds coordinates to 6 decimals (5e-7 in), twenty times less than this.
 */
export const ON_CIRCLE_INCHES = 1e-5

/**
 * A size at most this over a 1/8 in step is cut at that step, the excess taken out of the margin
 * (never out of the cutting shape). Inches. Chords of the ring's arcs push mitred corners out by
 * up to about 0.01 in (a 9 in arc's corner: 1/4 in × half the chord angle = 0.008 in), which
 * would otherwise add a whole 1/8 in; a rotary cut is not more accurate than 1/64 in anyway.
 */
export const MARGIN_ROUNDING_SLACK_INCHES = 1 / 64

/**
 * Decimal digits of clipper2-ts's integer grid when it unites offset pieces (offset.ts): 10^−8 in,
 * far below a needle's width and far above floating-point noise on lengths of inches.
 */
export const CLIPPER_PRECISION_DIGITS = 8

/**
 * How far a transform's two columns may differ in length or squareness, relative to their
 * length, and still count as a similarity (arcs stay arcs). Unitless; sines and cosines of
 * repeat angles leave about 1e-16.
 */
export const SIMILARITY_SLACK = 1e-9
