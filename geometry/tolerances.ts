/**
 * Every tolerance of the core, named once, with its unit and its reason. No other file of the
 * arrangement and sewing code writes a bare epsilon.
 */

/** Seam ends closer than this to the outline, a seam or a seam end are snapped onto it. Inches. */
export const SNAP_DISTANCE_INCHES = 0.01

/**
 * Arcs of the outline become chords no farther than this from the true arc (geometry.md).
 * Inches; far below what a needle can follow, and the printed booklet draws true arcs anyway.
 */
export const ARC_CHORD_TOLERANCE_INCHES = 0.005

/** An area smaller than this is a sliver too small to sew: a warning. Square inches. */
export const SLIVER_AREA_SQ_IN = 0.1

/** An area corner sharper than this is hard to sew accurately: a warning. Degrees. */
export const SHARP_ANGLE_DEGREES = 10

/**
 * Angles computed from coordinates carry rounding noise; a corner within this of the limit is
 * taken as on it (a 36-repeat wedge's 10° point is not "under 10°"). Degrees.
 */
export const ANGLE_NOISE_DEGREES = 1e-6

/**
 * After snapping, two computed points closer than this are one vertex of the arrangement.
 * Inches; far above floating-point noise on coordinates of a few inches (about 1e-15) and far
 * below anything a designer can draw or a maker can sew.
 */
export const VERTEX_MERGE_INCHES = 1e-7

/**
 * A point within this of a segment lies on it (a seam end sitting on a seam it was snapped to,
 * whose own ends were snapped in turn). Inches; snapping leaves residues near 1e-16, a designer
 * who meant "not touching" leaves at least the snap distance.
 */
export const ON_SEGMENT_INCHES = 1e-7

/**
 * Two edges meeting at a vertex continue one straight seam line when the vertex lies within
 * this of the chord joining their far ends. Inches; a thousandth of an inch is invisible on a
 * printed foundation and a needle cannot follow a kink that small.
 */
export const STRAIGHT_LINE_INCHES = 1e-3

/**
 * Areas are ordered (and so labelled) by the mean of their true corners, and vertices numbered by
 * their position, as fractions of the outer radius rounded to this many decimals: far coarser
 * than floating-point noise (about 1e-15 of the radius, from scaling a design or reading it in
 * centimetres), so coordinates equal on paper compare equal; far finer than any two corners a
 * designer draws differ. Unitless (decimal digits).
 */
export const LABEL_ORDER_DIGITS = 9

/** Ids and fixture output round coordinates to this many decimals (a thousandth of an inch for ids). */
export const ID_DECIMALS = 3
/** Plan output rounds coordinates and areas to this many decimals: stable fixtures, no noise. */
export const OUTPUT_DECIMALS = 6

/**
 * The one-section check explores at most this many sets of areas per question before it gives
 * up and answers "not one section" (so the search cuts the unit further: a valid plan, maybe
 * not the fewest). Count; far above what the designs people draw need (a 80-area peel uses 80).
 */
export const MAX_PEEL_STATES = 20_000

/**
 * The fewest-sections search visits at most this many distinct units (sets of areas) before it
 * stops refining and keeps the best plan found so far. Count.
 */
export const MAX_SECTION_UNITS = 50_000

/**
 * Area corners closer than this to another area's edge are welded into that edge before areas are
 * united into a section's outline, inches. The plan rounds corners (OUTPUT_DECIMALS), so where a
 * seam ends on another the corner sits a few millionths off the neighbour's edge; far above that
 * rounding, far below any real seam.
 */
export const WELD_DISTANCE_INCHES = 1e-4
