/**
 * Trim lines: a section's outline offset by the seam allowance, with its arcs kept as arcs.
 *
 * The outline of a section is a closed path of straight edges (seams, radial edges) and arcs of
 * the ring's circles. Moving every element out by the allowance keeps lines straight and arcs
 * concentric: the outer arc (travelled anticlockwise, the section on its inside) grows to
 * radius + allowance, the inner arc (travelled clockwise, the section outside it) shrinks to
 * radius − allowance. Neighbouring elements are joined as cutting shapes are (offset.ts): at a
 * convex corner the two moved elements are extended until they meet (a mitre; for an arc, along
 * its circle), unless that point lies farther than the mitre limit from the corner, when the
 * point is cut square one allowance out; at a reflex corner they are cut back to where they
 * cross. A wedge's apex is such a point: at N = 36 its 10° point is cut square.
 *
 * The result is a path a PDF printer and an SVG can both draw (lines and true arcs) and the
 * same path as chords for polygon work.
 *
 * Angles are polar angles in repeat 0's frame (y up, counter-clockwise from +x); `anticlockwise`
 * means the angle increases along the arc. A printer whose page y axis points down must negate
 * the angles and flip the flag (as canvas `arc()` and SVG's sweep flag read it).
 */
import {
  cuttingShape, DEFAULT_MITRE_LIMIT, DEFAULT_SEAM_ALLOWANCE_INCHES, isSimpleRing, polygonArea,
} from './offset'
import { sectionOutline } from './section-outline'
import { ARC_CHORD_TOLERANCE_INCHES, ON_CIRCLE_INCHES, STRAIGHT_TURN_SINE } from './tolerances'
import type { Point, Polygon, Ring } from './types'
import { add, cross, dot, scale, subtract, type Vector } from './vector'

export interface LinePathSegment {
  readonly kind: 'line'
  readonly from: Point
  readonly to: Point
}

export interface ArcPathSegment {
  readonly kind: 'arc'
  readonly center: Point
  readonly radius: number
  /** Radians, polar angle of the arc's start about `center`. */
  readonly startAngle: number
  /** Radians, polar angle of the arc's end about `center`. */
  readonly endAngle: number
  /** True when the polar angle increases from start to end (y-up frame). */
  readonly anticlockwise: boolean
}

export type PathSegment = LinePathSegment | ArcPathSegment

/**
 * A closed outline: each segment starts where the previous one ends and the last ends where
 * the first starts; travelled counter-clockwise (the enclosed region on the left).
 */
export type OutlinePath = readonly PathSegment[]

export interface TrimLine {
  /** The trim line as lines and true arcs, counter-clockwise. */
  readonly path: OutlinePath
  /** The same line as a polygon, arcs as chords within the core's chord tolerance. */
  readonly polygon: Polygon
}

export interface TrimLineOptions {
  /** Default 1/4 in (foundation trim line 1/4 in outside the finished outline, common practice). */
  readonly seamAllowanceInches?: number
  /** Multiples of the allowance; default 2, as for cutting shapes. */
  readonly mitreLimit?: number
}

const distance = (a: Vector, b: Vector): number => Math.hypot(a[0] - b[0], a[1] - b[1])
const unit = (a: Vector): Point => scale(a, 1 / Math.hypot(a[0], a[1]))
const rightOf = (direction: Vector): Point => [direction[1], -direction[0]]
const onCircle = (center: Point, radius: number, angle: number): Point =>
  [center[0] + radius * Math.cos(angle), center[1] + radius * Math.sin(angle)]
const TURN = 2 * Math.PI
const wrap = (angle: number): number => ((angle % TURN) + TURN) % TURN

/** Where a segment starts. @example startOf({ kind: 'line', from: [0, 0], to: [1, 0] }) // [0, 0] */
export const startOf = (segment: PathSegment): Point =>
  segment.kind === 'line' ? segment.from : onCircle(segment.center, segment.radius, segment.startAngle)

/** Where a segment ends. @example endOf({ kind: 'line', from: [0, 0], to: [1, 0] }) // [1, 0] */
export const endOf = (segment: PathSegment): Point =>
  segment.kind === 'line' ? segment.to : onCircle(segment.center, segment.radius, segment.endAngle)

/**
 * The angle an arc turns through, in (0, 2π), in its own direction.
 *
 * @example arcSweep({ kind: 'arc', center: [0, 0], radius: 1, startAngle: 0, endAngle: 1, anticlockwise: true }) // 1
 */
export function arcSweep(arc: ArcPathSegment): number {
  return wrap(arc.anticlockwise ? arc.endAngle - arc.startAngle : arc.startAngle - arc.endAngle)
}

/** Unit direction of travel at an arc's point at polar angle `angle`. */
const arcTangent = (arc: ArcPathSegment, angle: number): Point =>
  arc.anticlockwise ? [-Math.sin(angle), Math.cos(angle)] : [Math.sin(angle), -Math.cos(angle)]

const tangentAtStart = (segment: PathSegment): Point =>
  segment.kind === 'line' ? unit(subtract(segment.to, segment.from)) : arcTangent(segment, segment.startAngle)
const tangentAtEnd = (segment: PathSegment): Point =>
  segment.kind === 'line' ? unit(subtract(segment.to, segment.from)) : arcTangent(segment, segment.endAngle)

/**
 * The outline as a polygon: lines by their ends, arcs by chords no farther than the core's
 * chord tolerance (0.005 in) from the true arc.
 *
 * @example pathToPolygon([{ kind: 'line', from: [0, 0], to: [1, 0] }, { kind: 'line', from: [1, 0], to: [0, 1] }, { kind: 'line', from: [0, 1], to: [0, 0] }])
 * // [[0, 0], [1, 0], [0, 1]]
 */
export function pathToPolygon(path: OutlinePath): Polygon {
  const points: Point[] = []
  for (const segment of path) {
    if (segment.kind === 'line') {
      points.push(segment.from)
      continue
    }
    const sweep = arcSweep(segment)
    // A chord spanning angle θ lies r(1 − cos(θ/2)) from its arc.
    const ratio = Math.min(1, ARC_CHORD_TOLERANCE_INCHES / segment.radius)
    const widest = 2 * Math.acos(1 - ratio)
    const steps = Math.max(1, Math.ceil(sweep / widest))
    const sign = segment.anticlockwise ? 1 : -1
    for (let i = 0; i < steps; i += 1) {
      points.push(onCircle(segment.center, segment.radius, segment.startAngle + (sign * sweep * i) / steps))
    }
  }
  return points
}

/** The infinite line or full circle an offset element lies on. */
type Carrier =
  | { readonly kind: 'line'; readonly point: Point; readonly direction: Point }
  | { readonly kind: 'circle'; readonly center: Point; readonly radius: number }

function offsetCarrier(segment: PathSegment, allowance: number): Carrier {
  if (segment.kind === 'line') {
    const direction = unit(subtract(segment.to, segment.from))
    return { kind: 'line', point: add(segment.from, scale(rightOf(direction), allowance)), direction }
  }
  // Travelling anticlockwise the section is on the circle's inside, so outward is a larger radius.
  return { kind: 'circle', center: segment.center, radius: segment.radius + (segment.anticlockwise ? allowance : -allowance) }
}

function intersections(a: Carrier, b: Carrier): Point[] {
  if (a.kind === 'circle' && b.kind === 'line') return intersections(b, a)
  if (a.kind === 'line' && b.kind === 'line') {
    const denominator = cross(a.direction, b.direction)
    if (Math.abs(denominator) < STRAIGHT_TURN_SINE) return []
    return [add(a.point, scale(a.direction, cross(subtract(b.point, a.point), b.direction) / denominator))]
  }
  if (a.kind === 'line' && b.kind === 'circle') {
    const foot = add(a.point, scale(a.direction, dot(subtract(b.center, a.point), a.direction)))
    const squared = b.radius * b.radius - dot(subtract(foot, b.center), subtract(foot, b.center))
    if (squared < 0) return []
    const half = Math.sqrt(squared)
    return [add(foot, scale(a.direction, -half)), add(foot, scale(a.direction, half))]
  }
  if (a.kind === 'circle' && b.kind === 'circle') {
    const between = distance(a.center, b.center)
    if (between === 0 || between > a.radius + b.radius || between < Math.abs(a.radius - b.radius)) return []
    const along = (a.radius * a.radius - b.radius * b.radius + between * between) / (2 * between)
    const height = Math.sqrt(Math.max(0, a.radius * a.radius - along * along))
    const axis = unit(subtract(b.center, a.center))
    const base = add(a.center, scale(axis, along))
    return [add(base, scale(rightOf(axis), height)), add(base, scale(rightOf(axis), -height))]
  }
  return []
}

const nearest = (points: readonly Point[], to: Point): Point | undefined =>
  [...points].sort((p, q) => distance(p, to) - distance(q, to))[0]

/** The points joining the offsets of `before` (ending at the corner) and `after` (starting there). */
function joinPoints(before: PathSegment, after: PathSegment, allowance: number, mitreLimit: number): Point[] {
  const corner = endOf(before)
  const directionIn = tangentAtEnd(before)
  const directionOut = tangentAtStart(after)
  const endIn = add(corner, scale(rightOf(directionIn), allowance))
  const startOut = add(corner, scale(rightOf(directionOut), allowance))
  const sine = cross(directionIn, directionOut)
  const cosine = dot(directionIn, directionOut)
  if (Math.abs(sine) < STRAIGHT_TURN_SINE && cosine > 0) return [endIn]
  const carrierIn = offsetCarrier(before, allowance)
  const carrierOut = offsetCarrier(after, allowance)
  // Where the tangent lines' offsets would meet: the right one of two circle crossings is near it.
  const estimate = add(corner, scale(add(rightOf(directionIn), rightOf(directionOut)), allowance / (1 + cosine)))
  const meeting = nearest(intersections(carrierIn, carrierOut), estimate)
  if (sine < 0) return meeting === undefined ? [endIn, startOut] : [meeting]
  if (meeting !== undefined && distance(meeting, corner) <= mitreLimit * allowance) return [meeting]
  const bisector = unit(subtract(directionIn, directionOut))
  const cutCentre = add(corner, scale(bisector, allowance))
  const cut: Carrier = { kind: 'line', point: cutCentre, direction: rightOf(bisector) }
  return [
    nearest(intersections(cut, carrierIn), cutCentre) ?? endIn,
    nearest(intersections(cut, carrierOut), cutCentre) ?? startOut,
  ]
}

function movedSegment(segment: PathSegment, allowance: number, from: Point, to: Point): PathSegment {
  if (segment.kind === 'line') return { kind: 'line', from, to }
  const carrier = offsetCarrier(segment, allowance)
  const radius = carrier.kind === 'circle' ? carrier.radius : segment.radius
  const angleOf = (p: Point): number => Math.atan2(p[1] - segment.center[1], p[0] - segment.center[0])
  return { ...segment, radius, startAngle: angleOf(from), endAngle: angleOf(to) }
}

/**
 * The trim line of a section: its outline moved out by the seam allowance, lines kept straight
 * and arcs concentric (outer radius + allowance, inner radius − allowance), corners mitred with
 * the mitre limit. The outline must be closed and counter-clockwise. In the rare case where the
 * moved elements would cross (a notch narrower than two allowances, an inner radius no larger
 * than the allowance) the trim line is the cutting shape of the outline's chords, all lines.
 *
 * @example
 * // Repeat 0 of a 4-repeat wedge ring of radius 9 in:
 * trimLine(repeatOutline({ innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' })).path
 * // line (−0.25, −0.25) → (9.2466, −0.25); arc of radius 9.25 to (−0.25, 9.2466);
 * // line back to (−0.25, −0.25): the 90° apex keeps its mitre (d√2 = 1.41 d, within 2 d)
 */
export function trimLine(outline: OutlinePath, options: TrimLineOptions = {}): TrimLine {
  const allowance = options.seamAllowanceInches ?? DEFAULT_SEAM_ALLOWANCE_INCHES
  const mitreLimit = options.mitreLimit ?? DEFAULT_MITRE_LIMIT
  if (!(allowance >= 0) || !Number.isFinite(allowance)) throw new RangeError(`seam allowance must be ≥ 0, got ${allowance}`)
  if (outline.length < 2) throw new RangeError('an outline needs at least two segments')
  return movedOutline(outline, allowance, mitreLimit) ?? chordedTrimLine(outline, allowance, mitreLimit)
}

/** Each element moved out and joined to its neighbours; null when that does not give the offset. */
function movedOutline(outline: OutlinePath, allowance: number, mitreLimit: number): TrimLine | null {
  // An inner arc no larger than the allowance vanishes: the offset is no longer element by element.
  if (outline.some((segment) => segment.kind === 'arc' && !segment.anticlockwise && segment.radius <= allowance)) return null
  const count = outline.length
  const joins = outline.map((segment, i) => joinPoints(outline[(i + count - 1) % count]!, segment, allowance, mitreLimit))
  const path: PathSegment[] = []
  for (let i = 0; i < count; i += 1) {
    const join = joins[i]!
    const next = joins[(i + 1) % count]!
    if (join.length === 2) path.push({ kind: 'line', from: join[0]!, to: join[1]! })
    const moved = movedSegment(outline[i]!, allowance, join[join.length - 1]!, next[0]!)
    if (runsBackwards(outline[i]!, moved)) return null
    path.push(moved)
  }
  const polygon = pathToPolygon(path)
  return isSimpleRing(polygon) && polygonArea(polygon) > 0 ? { path, polygon } : null
}

/** True when a moved element was swallowed by its neighbours and now runs the other way. */
function runsBackwards(original: PathSegment, moved: PathSegment): boolean {
  if (original.kind === 'line' || moved.kind === 'line') {
    const was = subtract(endOf(original), startOf(original))
    return dot(subtract(endOf(moved), startOf(moved)), was) < 0
  }
  // A reversed arc goes the long way round: its middle faces away from the original's middle.
  const middle = (arc: ArcPathSegment): number => arc.startAngle + ((arc.anticlockwise ? 1 : -1) * arcSweep(arc)) / 2
  return Math.cos(middle(moved) - middle(original)) < 0
}

/**
 * The rare outline whose moved elements cross (a notch narrower than two allowances, an inner
 * radius no larger than the allowance): the cutting shape of its chords, every edge a line.
 */
function chordedTrimLine(outline: OutlinePath, allowance: number, mitreLimit: number): TrimLine {
  const polygon = cuttingShape(pathToPolygon(outline), { seamAllowanceInches: allowance, mitreLimit })
  const path: PathSegment[] = polygon.map((from, i) => ({ kind: 'line', from, to: polygon[(i + 1) % polygon.length]! }))
  return { path, polygon }
}

/**
 * Repeat 0's outline as a path: the annular sector between the inner and outer radius over
 * [0, 360°/N], counter-clockwise (a wedge when the inner radius is 0).
 *
 * @example repeatOutline({ innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' })
 * // [line (0,0)→(9,0), arc r 9 from 0 to π/2 anticlockwise, line (0,9)→(0,0)]
 */
export function repeatOutline(ring: Ring): OutlinePath {
  const span = TURN / ring.repeats
  const centre: Point = [0, 0]
  const outer: ArcPathSegment = { kind: 'arc', center: centre, radius: ring.outerRadius, startAngle: 0, endAngle: span, anticlockwise: true }
  if (ring.innerRadius <= 0) {
    return [{ kind: 'line', from: centre, to: endOf({ ...outer, endAngle: 0 }) }, outer, { kind: 'line', from: endOf(outer), to: centre }]
  }
  const inner: ArcPathSegment = { kind: 'arc', center: centre, radius: ring.innerRadius, startAngle: span, endAngle: 0, anticlockwise: false }
  return [
    { kind: 'line', from: endOf(inner), to: startOf(outer) },
    outer,
    { kind: 'line', from: endOf(outer), to: startOf(inner) },
    inner,
  ]
}

/**
 * A polygon of the plan (arcs as chords) read back as an outline path: runs of edges whose ends
 * lie on the ring's outer circle (travelled anticlockwise) or inner circle (clockwise), or on one
 * of its chords (a seam end snapped onto a chord), and whose middles lie within the chord
 * tolerance of it become one arc each; every other edge is a line. The corners of an arc are
 * moved out onto the true circle (by at most the chord tolerance, 0.005 in) and the lines that
 * meet them follow, so the path stays closed. A real seam joining two points of a circle with so
 * shallow a cap (under 0.005 in) would be read as an arc too; such a cap is a sliver the plan
 * already warns about.
 *
 * @example outlineFromPolygon(pathToPolygon(repeatOutline(ring)), ring) // ≈ repeatOutline(ring)
 */
export function outlineFromPolygon(polygon: Polygon, ring: Ring): OutlinePath {
  const count = polygon.length
  // Chords lie inside their circle, so a chord's points are 0 to 0.005 in inside it.
  const nearCircle = (p: Point, radius: number): boolean => {
    const inside = radius - Math.hypot(p[0], p[1])
    return inside >= -ON_CIRCLE_INCHES && inside <= ARC_CHORD_TOLERANCE_INCHES + ON_CIRCLE_INCHES
  }
  const circleOf = (a: Point, b: Point): { radius: number; anticlockwise: boolean } | null => {
    const turnsAnticlockwise = cross(a, b) > 0
    const radius = turnsAnticlockwise ? ring.outerRadius : ring.innerRadius
    if (radius <= 0) return null
    if (!nearCircle(a, radius) || !nearCircle(b, radius) || !nearCircle(scale(add(a, b), 0.5), radius)) return null
    return { radius, anticlockwise: turnsAnticlockwise }
  }
  const kinds = polygon.map((point, i) => circleOf(point, polygon[(i + 1) % count]!))
  // Corners of arcs move onto their circle; the neighbouring lines use the moved corner too.
  const corners = polygon.map((point, i) => {
    const kind = kinds[i] ?? kinds[(i + count - 1) % count]
    if (kind === null || kind === undefined) return point
    const factor = kind.radius / Math.hypot(point[0], point[1])
    return [point[0] * factor, point[1] * factor] as Point
  })
  // Start at an edge that begins a run, so no arc is split across the polygon's first corner.
  const sameCircle = (i: number, j: number): boolean =>
    kinds[i] !== null && kinds[j] !== null && kinds[i]!.anticlockwise === kinds[j]!.anticlockwise
  let first = 0
  while (first < count && sameCircle((first + count - 1) % count, first)) first += 1
  if (first === count) first = 0
  const path: PathSegment[] = []
  const angle = (p: Point): number => Math.atan2(p[1], p[0])
  for (let step = 0; step < count; ) {
    const i = (first + step) % count
    const kind = kinds[i]
    if (kind === null || kind === undefined) {
      path.push({ kind: 'line', from: corners[i]!, to: corners[(i + 1) % count]! })
      step += 1
      continue
    }
    let run = 1
    while (step + run < count && sameCircle(i, (i + run) % count)) run += 1
    path.push({
      kind: 'arc', center: [0, 0], radius: kind.radius, anticlockwise: kind.anticlockwise,
      startAngle: angle(corners[i]!), endAngle: angle(corners[(i + run) % count]!),
    })
    step += run
  }
  return path
}

/**
 * The trim line of a section given its areas as the plan gives them (counter-clockwise
 * polygons, arcs as chords): its outline (see section-outline.ts), read back into lines and arcs,
 * moved out by the allowance.
 *
 * @example sectionTrimLine(plan.areas.filter((a) => a.section === 'A').map((a) => a.polygon), design.ring)
 */
export function sectionTrimLine(areas: readonly Polygon[], ring: Ring, options: TrimLineOptions = {}): TrimLine {
  return trimLine(outlineFromPolygon(sectionOutline(areas), ring), options)
}
