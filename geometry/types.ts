/**
 * The core's shared vocabulary. Every length is in inches, every point is in repeat 0's frame
 * (origin at the ring's centre, x right, y up) unless its documentation says otherwise. Lengths
 * and angles are plain numbers: their unit is in their name (`seamAllowanceInches`, `widthIn`) or
 * their doc comment, not in a brand no caller used.
 */

/**
 * The one point type of the code base: (x, y) in repeat 0's frame, in inches inside the core;
 * the drafting board (lib/board) uses it for the design's own units, the booklet for page points.
 */
export type Point = readonly [x: number, y: number]
/** A straight segment from one point to another. */
export type Segment = readonly [from: Point, to: Point]
/** A simple polygon, counter-clockwise, without the closing point repeated. */
export type Polygon = readonly Point[]

export type RepeatMode = 'rotate' | 'mirror'

export interface Ring {
  /** 0 makes each repeat a wedge. */
  readonly innerRadius: number
  readonly outerRadius: number
  /** 2 to 36. */
  readonly repeats: number
  readonly repeatMode: RepeatMode
}

export interface Seam {
  readonly id: string
  readonly from: Point
  readonly to: Point
}

export interface Fill {
  readonly at: Point
  readonly fabric: string
}

export interface Leaf {
  readonly id: string
  /** The id of the seam whose stitching catches the leaf's raw edge. */
  readonly seam: string
  /** Fraction (0..1) of the seam's length, from `from`, where the open end sits. */
  readonly at: number
  /** The side of the directed seam (from → to) the leaf lies over. */
  readonly side: 'left' | 'right'
  /** Degrees, −75..75: tilt of the leaf from the seam's normal. */
  readonly angle: number
  readonly length: number
  readonly width: number
  /** Stacked leaves, bottom first, each a fabric role. */
  readonly layers: readonly string[]
  /**
   * How each layer (same order as `layers`) lies against the leaf as drawn: `turn` degrees
   * counter-clockwise on top of the leaf's angle, `scale` its size as a ratio of length × width.
   * Absent, or a member absent, takes the default that fans the layers (`leafLayers`).
   */
  readonly layerOffsets?: readonly LayerOffset[]
}

/** One stacked layer's offset from the leaf as drawn: an angle and a ratio, never a length. */
export interface LayerOffset {
  /** Degrees, counter-clockwise, added to the leaf's angle. */
  readonly turn?: number
  /** Ratio of the layer's length and width to the leaf's. */
  readonly scale?: number
}

export interface StemRing {
  readonly radius: number
  readonly finishedWidth: number
  readonly fabric: string
}

export interface Berry {
  readonly at: Point
  readonly finishedDiameter: number
  readonly fabric: string
}

export interface Curl {
  readonly points: readonly Point[]
}

/** The fabric a colourway gives one role, as the maker buys it. */
export interface ColorwayFabric {
  /** What the maker reads and buys: "Cream tone-on-tone". */
  readonly name: string
  /** #rrggbb, how the board and the booklet draw it. */
  readonly color: string
  /** An uploaded swatch image, by its upload id (what `POST /api/uploads?kind=swatch` answers). */
  readonly swatch?: string
}

/**
 * One way to colour the design (the same seams in other fabrics): every fabric role the design
 * uses (background, leaf-dark, stem …) gets a fabric. Roles are the keys; the areas, leaves,
 * stems and berries name roles, never fabrics, so a colourway changes without touching them.
 */
export interface Colorway {
  readonly name: string
  /** Fabric role → the fabric this colourway gives it. */
  readonly fabrics: Readonly<Record<string, ColorwayFabric>>
}

/** A join tree: a section label, or two subtrees joined along one straight seam. */
export type JoinTree = string | readonly [JoinTree, JoinTree]

export interface HandSetOrder {
  readonly sections: readonly { readonly label: string; readonly areas: readonly Point[] }[]
  readonly assembly?: JoinTree | null
}

/**
 * How the ring's curved edges are bound: double-fold bias strips. Both fields are optional; the
 * defaults are filled by `bindingPlan` (geometry/bias.ts: 2 1/4 in wide, cut from the "binding" role).
 */
export interface Binding {
  /** Cut width of the strips, inches (a length: scaled with the design). */
  readonly cutWidth?: number
  /** The colourway's fabric role the strips are cut from. */
  readonly fabric?: string
}

/**
 * A design as the core sees it: already validated and converted to inches.
 * The file format (`wreathwright-design`, version 2; version 1 is upgraded on read) is parsed by
 * lib/schemas/design.ts.
 */
export interface Design {
  readonly name: string
  readonly ring: Ring
  readonly seams: readonly Seam[]
  readonly fills: readonly Fill[]
  readonly leaves: readonly Leaf[]
  readonly stems: readonly StemRing[]
  readonly berries: readonly Berry[]
  readonly curls: readonly Curl[]
  readonly colorways: readonly Colorway[]
  readonly order: HandSetOrder | null
  /** Absent in designs that never set it: the defaults apply. */
  readonly binding?: Binding
}

export type ProblemSeverity = 'error' | 'warning'

/**
 * Every problem code the plan can report, exactly the list in geometry/README.md
 * (`problem-codes.test.ts` checks the two agree). Errors first, then the six warnings.
 */
export const PROBLEM_CODES = [
  'dangling-seam-end', 'seam-outside', 'overlapping-seams', 'zero-length-seam', 'floating-seams',
  'set-in-seam', 'bent-seam', 'seam-cycle', 'insert-not-caught', 'impossible-leaf',
  'order-point-outside', 'order-area-repeated', 'order-area-missing', 'order-no-assembly',
  'step-no-seam', 'step-two-lines', 'step-broken-line', 'insert-order',
  'join-not-straight', 'join-unknown-section', 'join-repeated-section', 'join-missing-section',
  'search-gave-up',
  'small-area', 'sharp-angle', 'odd-wedge-centre', 'insert-conflict', 'search-limit', 'rough-cut-failed',
] as const

export type ProblemCode = (typeof PROBLEM_CODES)[number]

/** An unsewable or doubtful place in a design: a result, never an exception. */
export interface Problem {
  readonly code: ProblemCode
  readonly severity: ProblemSeverity
  /** Plain words a designer understands, naming the place. */
  readonly message: string
  readonly at: Point
}
