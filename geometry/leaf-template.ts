/**
 * Leaf inserts: the template a maker cuts a leaf from, and where a leaf lies on the design.
 *
 * What the leaf is (our assumption, stated plainly): a pointed leaf whose finished shape is a
 * pointed arch, like a prairie point with curved sides. It is widest at its open end, where it is
 * caught in a seam with its raw edge 1/4 in past the seam line (common practice for inserts),
 * and its two sides are circular arcs that leave the open end square to it and meet at the tip.
 * It is made either from two pieces sewn right sides together along the sides and turned (the
 * sew line below is that seam), or folded and pressed to the same outline; either way the
 * template is the flat shape of the finished leaf:
 * - sew line: the finished outline, from the raw edge up one side, round the tip, down the other
 *   side to the raw edge (open at that end);
 * - cut line: the sew line 1/8 in outside (a setting; 1/8 in is common practice for small turned
 *   pieces), closed across the open end by the raw edge;
 * - seam line: where the piecing seam stitches across the leaf, `catch` (1/4 in) inside the raw
 *   edge; the part beyond it is hidden in the seam allowance.
 *
 * Template frame: the seam line on the x axis, the leaf pointing up (+y), the raw edge at
 * y = −catch; inches. Sides: each arc's centre lies on the seam line, on the far side of the axis,
 * at the radius R = (W²/4 + L²)/W that takes it from the open end's corner (±W/2, 0) to the tip
 * (0, L) (a chord of a circle through both, centred on the x axis). A point needs L > W/2.
 */
import { DEFAULT_MITRE_LIMIT } from './offset'
import { pathToPolygon, type ArcPathSegment, type OutlinePath, type PathSegment } from './trim-line'
import type { LayerOffset, Leaf, Point, Polygon, Seam, Segment } from './types'
import { add, cross, scale } from './vector'

/** Cut line outside the sew line, inches (common practice for small turned pieces; a setting). */
export const DEFAULT_LEAF_CUT_ALLOWANCE_INCHES = 1 / 8
/** Raw edge past the seam line, inches (common practice for inserts, references.md). */
export const DEFAULT_LEAF_CATCH_INCHES = 1 / 4

export interface LeafTemplateOptions {
  /** Default 1/8 in. */
  readonly cutAllowanceInches?: number
  /** Default 1/4 in. */
  readonly catchInches?: number
  /** Multiples of the cut allowance; a tip sharper than this is cut square. Default 2. */
  readonly mitreLimit?: number
}

export interface LeafTemplate {
  readonly lengthIn: number
  readonly widthIn: number
  /** Open path: raw edge → right side → tip → left side → raw edge. */
  readonly sewLine: readonly PathSegment[]
  /** Closed, counter-clockwise; its first segment is the raw edge. */
  readonly cutLine: OutlinePath
  /** The open end: the raw edge caught in the seam. */
  readonly rawEdge: Segment
  /** Where the piecing seam crosses the leaf, between the cut line's sides. */
  readonly seamLine: Segment
  /** The visible leaf (seam line to tip) as chords. */
  readonly finishedOutline: Polygon
  /** The cut line as chords. */
  readonly cutPolygon: Polygon
}

/**
 * True when a leaf of this length and width has a point (L > W/2); at L = W/2 it is a half disc.
 *
 * @example isPointedLeaf(1.5, 0.75) // true
 */
export const isPointedLeaf = (length: number, width: number): boolean =>
  width > 0 && Number.isFinite(length) && length > width / 2

/** A length for a message: inches to at most three decimals, trailing zeros dropped (0.5 in, 1.125 in). */
const inchesInWords = (value: number): string => `${Number(value.toFixed(3))} in`

/**
 * Why a leaf of this length and width cannot be drawn as a pointed leaf, in plain words with what
 * would fix it, or null when it can. The one test every caller uses instead of catching an
 * exception: the plan reports the reason as an `impossible-leaf` problem, the board and the
 * booklet simply leave such a leaf out.
 *
 * @example leafShapeProblem(0.5, 3)?.startsWith('it is 3 in wide but only 0.5 in long, and a pointed leaf') // true
 * @example leafShapeProblem(1.5, 0.75) // null
 */
export function leafShapeProblem(length: number, width: number): string | null {
  if (!(width > 0) || !Number.isFinite(width) || !(length > 0) || !Number.isFinite(length)) {
    return `its length (${length}) and width (${width}) must both be positive lengths.`
  }
  if (isPointedLeaf(length, width)) return null
  return `it is ${inchesInWords(width)} wide but only ${inchesInWords(length)} long, and a pointed leaf must be longer than half its width. ` +
    `Make it longer than ${inchesInWords(width / 2)} or narrower than ${inchesInWords(2 * length)}.`
}

/** Radius of the side arcs: the circle centred on the seam line through (W/2, 0) and (0, L). */
const sideRadius = (length: number, width: number): number => (width * width / 4 + length * length) / width

/** The two side arcs grown by `grow` (0 for the sew line), from the right corner to the tip and on. */
function sideArcs(length: number, width: number, grow: number): [ArcPathSegment, ArcPathSegment] {
  const radius = sideRadius(length, width)
  const offCentre = radius - width / 2
  const tipAngle = Math.atan2(length, offCentre)
  return [
    { kind: 'arc', center: [-offCentre, 0], radius: radius + grow, startAngle: 0, endAngle: tipAngle, anticlockwise: true },
    { kind: 'arc', center: [offCentre, 0], radius: radius + grow, startAngle: Math.PI - tipAngle, endAngle: Math.PI, anticlockwise: true },
  ]
}

/**
 * The template of a leaf of finished `length` (seam line to tip) and `width` (at the open end),
 * in the template frame (see the file comment). Throws when `leafShapeProblem` refuses the size
 * (a programmer error: callers check first).
 *
 * @example
 * leafTemplate(1.5, 0.75).rawEdge // [[-0.5, -0.25], [0.5, -0.25]]: 0.75 + 2 × 1/8 wide, 1/4 in past the seam
 */
export function leafTemplate(length: number, width: number, options: LeafTemplateOptions = {}): LeafTemplate {
  const cut = options.cutAllowanceInches ?? DEFAULT_LEAF_CUT_ALLOWANCE_INCHES
  const catchDepth = options.catchInches ?? DEFAULT_LEAF_CATCH_INCHES
  const mitreLimit = options.mitreLimit ?? DEFAULT_MITRE_LIMIT
  if (!isPointedLeaf(length, width)) throw new RangeError(`a pointed leaf needs length > width / 2, got ${length} × ${width}`)
  if (!(cut >= 0) || !(catchDepth >= 0)) throw new RangeError('cut allowance and catch must be lengths ≥ 0')
  const half = width / 2
  const [right, left] = sideArcs(length, width, 0)
  const sewLine: PathSegment[] = [
    { kind: 'line', from: [half, -catchDepth], to: [half, 0] },
    right,
    left,
    { kind: 'line', from: [-half, 0], to: [-half, -catchDepth] },
  ]
  const outer = half + cut
  const [grownRight, grownLeft] = sideArcs(length, width, cut)
  // The grown arcs meet on the axis; a tip sharper than the limit is cut square, one allowance out.
  const offCentre = sideRadius(length, width) - half
  const meetingHeight = Math.sqrt(grownRight.radius ** 2 - offCentre ** 2)
  const tipSegments: PathSegment[] = []
  let rightEnd: number
  let leftStart: number
  if (meetingHeight - length > mitreLimit * cut) {
    const cutHeight = length + cut
    const across = Math.sqrt(grownRight.radius ** 2 - cutHeight ** 2) - offCentre
    rightEnd = Math.atan2(cutHeight, across + offCentre)
    leftStart = Math.PI - rightEnd
    tipSegments.push({ kind: 'line', from: [across, cutHeight], to: [-across, cutHeight] })
  } else {
    rightEnd = Math.atan2(meetingHeight, offCentre)
    leftStart = Math.PI - rightEnd
  }
  const rawEdge: Segment = [[-outer, -catchDepth], [outer, -catchDepth]]
  const cutLine: PathSegment[] = [
    { kind: 'line', from: rawEdge[0], to: rawEdge[1] },
    { kind: 'line', from: [outer, -catchDepth], to: [outer, 0] },
    { ...grownRight, endAngle: rightEnd },
    ...tipSegments,
    { ...grownLeft, startAngle: leftStart },
    { kind: 'line', from: [-outer, 0], to: [-outer, -catchDepth] },
  ]
  return {
    lengthIn: length,
    widthIn: width,
    sewLine,
    cutLine,
    rawEdge,
    seamLine: [[-outer, 0], [outer, 0]],
    finishedOutline: pathToPolygon([right, left, { kind: 'line', from: [-half, 0], to: [half, 0] }]),
    cutPolygon: pathToPolygon(cutLine),
  }
}

export interface LeafPlacement {
  /** Where the open end's middle sits on the seam. */
  readonly base: Point
  /** The leaf's tip. */
  readonly tip: Point
  /** The visible leaf as it lies on the design, counter-clockwise, as chords. */
  readonly finishedOutline: Polygon
  /** The raw edge, `catch` past the seam line on the far side, parallel to the seam, between the sides. */
  readonly rawEdge: Segment
}

/** A leaf placed on its seam, or the plain-words reason it cannot be drawn. */
export type LeafPlacementResult =
  | { readonly ok: true; readonly placement: LeafPlacement }
  | { readonly ok: false; readonly reason: string }

/**
 * `placeLeaf` for callers that meet leaves as the designer left them (the board, the booklet):
 * never throws, and says why a leaf cannot be drawn (too wide for its length, or its seam has
 * no length). The plan already reports an impossible leaf, so such callers just skip it.
 *
 * @example
 * tryPlaceLeaf({ id: 'l1', seam: 's1', at: 0.5, side: 'left', angle: 0, length: 0.5, width: 3, layers: [] },
 *   { id: 's1', from: [0, 0], to: [4, 0] }).ok // false
 */
export function tryPlaceLeaf(leaf: Leaf, seam: Seam, options: Pick<LeafTemplateOptions, 'catchInches'> = {}): LeafPlacementResult {
  const shape = leafShapeProblem(leaf.length, leaf.width)
  if (shape) return { ok: false, reason: `Leaf ${leaf.id} cannot be drawn as a pointed leaf: ${shape}` }
  if (!(Math.hypot(seam.to[0] - seam.from[0], seam.to[1] - seam.from[1]) > 0)) {
    return { ok: false, reason: `Leaf ${leaf.id} cannot be placed: its seam ${seam.id} has no length.` }
  }
  return { ok: true, placement: placeLeaf(leaf, seam, options) }
}

/** Keeps the part of a polygon on the non-negative side of `side(p)` (one Sutherland–Hodgman pass). */
function clipToSide(polygon: Polygon, side: (p: Point) => number): Point[] {
  const kept: Point[] = []
  polygon.forEach((current, i) => {
    const next = polygon[(i + 1) % polygon.length]!
    const here = side(current)
    const there = side(next)
    if (here >= 0) kept.push(current)
    if ((here >= 0) !== (there >= 0)) {
      const t = here / (here - there)
      kept.push([current[0] + (next[0] - current[0]) * t, current[1] + (next[1] - current[1]) * t])
    }
  })
  return kept
}

/**
 * Where a leaf lies on the design, in repeat 0's frame: its open end at `at` along the seam
 * (from → to), over the seam's `side`, its axis turned `angle` degrees counter-clockwise from the
 * seam's normal on that side. The visible outline stops at the seam line: a tilted leaf's open end
 * still runs along the seam (the maker lays the raw edge along it), so the part of the tilted
 * shape beyond the seam is hidden and the gap on the other side is filled by the straight sides.
 *
 * Throws for a leaf `leafShapeProblem` refuses or a seam of no length (a programmer error: check
 * first, or call `tryPlaceLeaf`).
 *
 * @example
 * placeLeaf({ id: 'l1', seam: 's1', at: 0.5, side: 'left', angle: 0, length: 1.5, width: 0.75, layers: [] },
 *   { id: 's1', from: [0, 0], to: [4, 0] })
 * // base [2, 0], tip [2, 1.5], raw edge from (1.625, −0.25) to (2.375, −0.25)
 */
export function placeLeaf(leaf: Leaf, seam: Seam, options: Pick<LeafTemplateOptions, 'catchInches'> = {}): LeafPlacement {
  const catchDepth = options.catchInches ?? DEFAULT_LEAF_CATCH_INCHES
  if (!isPointedLeaf(leaf.length, leaf.width)) throw new RangeError(`leaf ${leaf.id}: a pointed leaf needs length > width / 2`)
  const seamVector: Point = [seam.to[0] - seam.from[0], seam.to[1] - seam.from[1]]
  const seamLength = Math.hypot(seamVector[0], seamVector[1])
  if (!(seamLength > 0)) throw new RangeError(`leaf ${leaf.id}: its seam ${seam.id} has no length`)
  const along = scale(seamVector, 1 / seamLength)
  const normal: Point = leaf.side === 'left' ? [-along[1], along[0]] : [along[1], -along[0]]
  const tilt = (leaf.angle * Math.PI) / 180
  const axis: Point = [normal[0] * Math.cos(tilt) - normal[1] * Math.sin(tilt), normal[0] * Math.sin(tilt) + normal[1] * Math.cos(tilt)]
  const across: Point = [axis[1], -axis[0]]
  const base = add(seam.from, scale(seamVector, leaf.at))
  const toDesign = (p: Point): Point => add(base, add(scale(across, p[0]), scale(axis, p[1])))
  // Signed distance from the seam line, positive on the leaf's side.
  const fromSeam = (p: Point): number => {
    const value = cross(along, [p[0] - base[0], p[1] - base[1]])
    return leaf.side === 'left' ? value : -value
  }
  const half = leaf.width / 2
  // Straight sides long enough to reach past the raw-edge line at any tilt up to ±75°.
  const reach = half * Math.abs(Math.tan(tilt)) + catchDepth + leaf.width
  const [right, left] = sideArcs(leaf.length, leaf.width, 0)
  const extended = pathToPolygon([
    { kind: 'line', from: [half, -reach], to: [half, 0] }, right, left,
    { kind: 'line', from: [-half, 0], to: [-half, -reach] }, { kind: 'line', from: [-half, -reach], to: [half, -reach] },
  ]).map(toDesign)
  // The leaf frame (across, axis) is right-handed, so the outline stays counter-clockwise.
  const finishedOutline = clipToSide(extended, fromSeam)
  // The raw edge: where the straight sides cross the line `catch` past the seam.
  const sideCrossing = (x: number): Point => {
    const start = toDesign([x, 0])
    const height = fromSeam(start)
    const risePerInch = fromSeam(add(start, axis)) - height
    return add(start, scale(axis, -(height + catchDepth) / risePerInch))
  }
  return {
    base,
    tip: toDesign([0, leaf.length]),
    finishedOutline,
    rawEdge: [sideCrossing(-half), sideCrossing(half)],
  }
}

/** A leaf's tilt from its seam's normal stays within ±75° (the design format's range). */
export const LEAF_ANGLE_LIMIT_DEGREES = 75
/** A layer turns at most this far from the leaf as drawn, degrees (the design format's range). */
export const LAYER_TURN_LIMIT_DEGREES = 45
/** A layer's scale lies in this range, a ratio (the design format's range). */
export const LAYER_SCALE_RANGE = [0.25, 1.5] as const

/**
 * The default fan of stacked layers: layer k of n (bottom k = 0) turns ±10°·⌈k/2⌉, alternately
 * counter-clockwise and clockwise, and is 10 % smaller than the one below it (never under half).
 * Why: the bottom layer keeps the size and angle the designer drew. Each layer above is smaller,
 * so its tip stops short of every layer beneath and each layer shows at least its tip; turning
 * them to alternate sides, as a spray of leaves lies, also shows each lower layer along one side.
 * 10° and 10 % show about 1/8 in of a 1 3/4 in leaf beneath, enough to read in fabric without
 * the stack looking like separate leaves.
 */
export const DEFAULT_LAYER_TURN_DEGREES = 10
export const DEFAULT_LAYER_SCALE_STEP = 0.1
export const SMALLEST_DEFAULT_LAYER_SCALE = 0.5

/**
 * The offset layer `index` (bottom 0) takes when the design sets none.
 *
 * @example defaultLayerOffset(1) // { turn: 10, scale: 0.9 }
 * @example defaultLayerOffset(2) // { turn: -10, scale: 0.8 }
 */
export function defaultLayerOffset(index: number): Required<LayerOffset> {
  const side = index % 2 === 1 ? 1 : -1
  return {
    turn: index === 0 ? 0 : side * DEFAULT_LAYER_TURN_DEGREES * Math.ceil(index / 2),
    scale: Math.max(SMALLEST_DEFAULT_LAYER_SCALE, Number((1 - DEFAULT_LAYER_SCALE_STEP * index).toFixed(6))),
  }
}

/** One stacked layer of a leaf, as it is cut and laid: its fabric and its own size and angle. */
export interface LeafLayer {
  readonly fabric: string
  /** Degrees added to the leaf's angle, and the ratio of its size to the leaf's. */
  readonly turn: number
  readonly scale: number
  /** This layer's finished length and width (the leaf's, times `scale`) and its tilt in degrees. */
  readonly length: number
  readonly width: number
  readonly angle: number
}

/**
 * The layers of a leaf, bottom first, each with its offset resolved (the design's, else the
 * default fan) and its own size and angle; the angle stays within ±75°.
 *
 * @example
 * leafLayers({ id: 'l1', seam: 's1', at: 0.5, side: 'left', angle: 0, length: 2, width: 1, layers: ['dark', 'light'] })
 * // [{ fabric: 'dark', turn: 0, scale: 1, length: 2, width: 1, angle: 0 },
 * //  { fabric: 'light', turn: 10, scale: 0.9, length: 1.8, width: 0.9, angle: 10 }]
 */
export function leafLayers(leaf: Leaf): LeafLayer[] {
  return leaf.layers.map((fabric, index) => {
    const fallback = defaultLayerOffset(index)
    const offset = leaf.layerOffsets?.[index]
    const turn = offset?.turn ?? fallback.turn
    const layerScale = offset?.scale ?? fallback.scale
    const angle = Math.max(-LEAF_ANGLE_LIMIT_DEGREES, Math.min(LEAF_ANGLE_LIMIT_DEGREES, (leaf.angle ?? 0) + turn))
    return { fabric, turn, scale: layerScale, length: leaf.length * layerScale, width: leaf.width * layerScale, angle }
  })
}

/** Every layer of a leaf placed on its seam, bottom first, or why the leaf cannot be drawn. */
export type LeafLayersPlacementResult =
  | { readonly ok: true; readonly layers: readonly (LeafLayer & { readonly placement: LeafPlacement })[] }
  | { readonly ok: false; readonly reason: string }

/**
 * Where each stacked layer of a leaf lies, bottom first: each is a leaf of its own size caught at
 * the same place on the same seam, turned by its own angle (as a maker lays a smaller folded leaf
 * on a larger one). Never throws; a leaf `tryPlaceLeaf` refuses is refused whole.
 *
 * @example
 * const placed = tryPlaceLeafLayers(leaf, seam)
 * if (placed.ok) placed.layers.map((layer) => layer.placement.finishedOutline)
 */
export function tryPlaceLeafLayers(leaf: Leaf, seam: Seam, options: Pick<LeafTemplateOptions, 'catchInches'> = {}): LeafLayersPlacementResult {
  const whole = tryPlaceLeaf(leaf, seam, options)
  if (!whole.ok) return whole
  const layers: (LeafLayer & { placement: LeafPlacement })[] = []
  for (const layer of leafLayers(leaf)) {
    const placed = tryPlaceLeaf({ ...leaf, length: layer.length, width: layer.width, angle: layer.angle }, seam, options)
    if (!placed.ok) return placed
    layers.push({ ...layer, placement: placed.placement })
  }
  return { ok: true, layers }
}
