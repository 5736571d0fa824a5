/**
 * Every tolerance of the core, named once, with its unit and its reason. No other file of
 * geometry/ or lib/ writes a bare epsilon: they import it from here.
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

/**
 * An area's label point (`interiorPoint`) moves to a later candidate only when that one is clearer
 * of the boundary by more than this fraction: candidates equally clear on paper (the middle of a
 * band between two parallel seams) differ only by noise, which a change of size would reorder.
 * Unitless (a fraction of the clearance).
 */
export const CLEARANCE_TIE_FRACTION = 1e-6

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
 * The fewest-sections search also stops when units visited × areas in the repeat pass this: each
 * unit's cuts and bounds take time in proportion to the areas, so a repeat of 800 areas visits at
 * most 2,500 units, about a second here, where MAX_SECTION_UNITS alone let it run for ten. Count
 * (area-units); equal to MAX_SECTION_UNITS for a repeat of 40 areas, so smaller designs are
 * searched as before.
 */
export const MAX_SECTION_WORK = 2_000_000

/**
 * The planner plans a repeat of at most this many areas. A repeat with more (400 seams crossing
 * each other make about 40,000) gets a `search-gave-up` error at once, without its areas: the
 * search over such a repeat would run for minutes, and no foundation-pieced design has that many
 * areas in a repeat. Count; lib/limits.ts MAX_AREAS, the areas a file may name, is the same.
 */
export const MAX_PLAN_AREAS = 1000

/**
 * Area corners closer than this to another area's edge are welded into that edge before areas are
 * united into a section's outline, inches. The plan rounds corners (OUTPUT_DECIMALS), so where a
 * seam ends on another the corner sits a few millionths off the neighbour's edge; far above that
 * rounding, far below any real seam.
 */
export const WELD_DISTANCE_INCHES = 1e-4

// The allowance code: cutting shapes, trim lines, rough cuts, leaf templates, symmetry.
// (Once geometry/allowance-tolerances.ts, merged here: one file, one policy.)

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

// The drafting board and the booklet (lib/), which import them from here.

/**
 * An angle computed with atan2 from coordinates within this of a limit lies on it: a point on a
 * radial edge reads as −1e−16 rad as often as 0. Radians; far below a visible turn.
 */
export const ANGLE_NOISE_RADIANS = 1e-9

/**
 * A count computed as a ratio (Bézier pieces of an arc, tiles along a drawing) within this of a
 * whole number is that number, so noise (2.0000000001) never adds a whole piece or page. Unitless.
 */
export const COUNT_SLACK = 1e-9

/**
 * A finished diameter asked for within this of the design's own is the design's own size: the
 * booklet then draws the design as it is, not scaled by 1.0000000001. Inches.
 */
export const SAME_SIZE_INCHES = 1e-9

/**
 * A drawing box thinner than this is fitted to its frame as if it were this thick (a single point
 * or a straight line still gets a finite scale). Inches.
 */
export const DEGENERATE_EXTENT_INCHES = 1e-9

/**
 * Two turns of a foundation whose sheets differ in area by less than this are a tie when choosing
 * the turn that prints on the fewest pages (the turn that keeps the foundation as it lies wins).
 * Square inches; far below any difference in paper.
 */
export const SHEET_AREA_TIE_SQ_IN = 1e-6

// Fabric: the cutting layout (strip-layout.ts).

/**
 * A piece fits in the room left across a strip, or along it, when it is at most this much larger:
 * sums of sides computed in floating point (leaf pieces are not multiples of 1/8 in) must not turn
 * a piece exactly the width of fabric into one too wide. Inches; far below any rotary cut.
 */
export const CUT_FIT_SLACK_INCHES = 1e-9

/**
 * Repairs (`repairs.ts`): a junction is moved onto the line of two of its seams only when it
 * moves at most this fraction of the outer radius (0.45 in on an 18 in ring): a designer reads a
 * larger move as a different design, not a repair. Unitless (a ratio, so the same design at
 * another size gets the same suggestions).
 */
export const SHORT_MOVE_FRACTION = 0.05

/**
 * Repairs: candidate designs planned before the search stops, one- and two-edit changes
 * together. A count, not a time, so the same design always gets the same list; about 100 ms for
 * a 40-area design on the 2-core development machine (`npm run bench`).
 */
export const MAX_REPAIR_STATES = 40

/**
 * Repairs: a wall-clock safety net on top of the state budget, so a slow machine never freezes
 * the board while it waits. Milliseconds.
 */
export const REPAIR_BUDGET_MS = 400

/**
 * Repairs: a new seam through a junction within this angle of one of the junction's seams would
 * run along that seam (overlapping it), so it is not tried. Radians (about 0.06°).
 */
export const ALONG_SEAM_RADIANS = 1e-3

/**
 * Repairs: an impossible leaf (a pointed leaf must be longer than half its width) is resized to
 * the nearest size on this step that fits, strictly: 1/8 in, the finest mark of a common quilting
 * ruler (common practice), so the new size is one a maker can measure. Inches.
 */
export const LEAF_RESIZE_STEP_INCHES = 1 / 8
