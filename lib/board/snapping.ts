/**
 * Where a seam end lands when the designer lets go: on an existing seam end or outline corner,
 * on the outline or another seam, along a 15° direction from the seam's other end, or on the
 * grid — in that order of preference. All in design units (the file's inches or centimetres).
 */
import type { Point } from '@/geometry'
import { ANGLE_NOISE_RADIANS } from '@/geometry/tolerances'
import type { BoardDesign } from './commands'
import type { Snapping } from './store'

export type SnapKind = 'point' | 'outline' | 'seam' | 'angle' | 'grid' | 'none'

export interface SnapResult {
  readonly point: Point
  readonly kind: SnapKind
}

export interface SnapContext {
  readonly design: BoardDesign
  readonly snapping: Snapping
  /** How far (in design units) the pointer may be from a target and still snap: a few pixels. */
  readonly tolerance: number
  /** The fixed other end of the seam being drawn or changed, for angle snapping. */
  readonly anchor?: Point
  /** The seam being changed, which must not snap onto itself. */
  readonly ignoreSeam?: string
}

/** Directions offered from a seam's other end: every 15°. */
export const SNAP_ANGLE_STEP_DEGREES = 15

type Shape =
  | { kind: 'segment'; from: Point; to: Point; source: 'outline' | 'seam' }
  | { kind: 'arc'; radius: number; sweep: number }

const distance = (a: Point, b: Point) => Math.hypot(a[0] - b[0], a[1] - b[1])

function closestOnSegment(p: Point, a: Point, b: Point): Point {
  const dx = b[0] - a[0]
  const dy = b[1] - a[1]
  const lengthSquared = dx * dx + dy * dy
  if (lengthSquared === 0) return a
  const t = Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / lengthSquared))
  return [a[0] + t * dx, a[1] + t * dy]
}

function closestOnArc(p: Point, radius: number, sweep: number): Point {
  const angle = Math.atan2(p[1], p[0])
  const clamped = Math.max(0, Math.min(sweep, angle < -Math.PI / 2 ? angle + 2 * Math.PI : angle))
  return [radius * Math.cos(clamped), radius * Math.sin(clamped)]
}

/** The outline of repeat 0: two radial edges and the outer (and inner) arc. */
export function outlineShapes(design: BoardDesign): Shape[] {
  const { innerRadius, outerRadius, repeats } = design.ring
  const sweep = (2 * Math.PI) / repeats
  const direction: Point = [Math.cos(sweep), Math.sin(sweep)]
  const shapes: Shape[] = [
    { kind: 'segment', from: [innerRadius, 0], to: [outerRadius, 0], source: 'outline' },
    {
      kind: 'segment',
      from: [innerRadius * direction[0], innerRadius * direction[1]],
      to: [outerRadius * direction[0], outerRadius * direction[1]],
      source: 'outline',
    },
    { kind: 'arc', radius: outerRadius, sweep },
  ]
  if (innerRadius > 0) shapes.push({ kind: 'arc', radius: innerRadius, sweep })
  return shapes
}

function outlineCorners(design: BoardDesign): Point[] {
  const { innerRadius, outerRadius, repeats } = design.ring
  const sweep = (2 * Math.PI) / repeats
  const corners: Point[] = [
    [outerRadius, 0],
    [outerRadius * Math.cos(sweep), outerRadius * Math.sin(sweep)],
  ]
  if (innerRadius > 0) corners.push([innerRadius, 0], [innerRadius * Math.cos(sweep), innerRadius * Math.sin(sweep)])
  else corners.push([0, 0])
  return corners
}

function segmentIntersection(a: Point, b: Point, c: Point, d: Point): Point | null {
  const r: Point = [b[0] - a[0], b[1] - a[1]]
  const s: Point = [d[0] - c[0], d[1] - c[1]]
  const denominator = r[0] * s[1] - r[1] * s[0]
  if (denominator === 0) return null
  const t = ((c[0] - a[0]) * s[1] - (c[1] - a[1]) * s[0]) / denominator
  const u = ((c[0] - a[0]) * r[1] - (c[1] - a[1]) * r[0]) / denominator
  if (t < 0 || t > 1 || u < 0 || u > 1) return null
  return [a[0] + t * r[0], a[1] + t * r[1]]
}

/** Where a ray from `origin` in `direction` meets a circle of `radius` about the centre (first hit ahead). */
function rayCircle(origin: Point, direction: Point, radius: number): Point[] {
  const b = origin[0] * direction[0] + origin[1] * direction[1]
  const c = origin[0] ** 2 + origin[1] ** 2 - radius ** 2
  const discriminant = b * b - c
  if (discriminant < 0) return []
  const root = Math.sqrt(discriminant)
  return [-b - root, -b + root].filter((t) => t > 0).map((t) => [origin[0] + t * direction[0], origin[1] + t * direction[1]] as Point)
}

function isOnArcSweep(p: Point, sweep: number): boolean {
  const angle = Math.atan2(p[1], p[0])
  return angle >= -ANGLE_NOISE_RADIANS && angle <= sweep + ANGLE_NOISE_RADIANS
}

/**
 * Snaps a pointer position (design units) for a seam end.
 *
 * @example snapSeamEnd([4.02, 0.03], context) // { point: [4.02, 0], kind: 'outline' }
 */
export function snapSeamEnd(raw: Point, context: SnapContext): SnapResult {
  const { design, snapping, tolerance, anchor, ignoreSeam } = context
  if (!snapping.enabled) return { point: raw, kind: 'none' }
  const seams = design.seams.filter((seam) => seam.id !== ignoreSeam)
  const shapes: Shape[] = [
    ...outlineShapes(design),
    ...seams.map((seam): Shape => ({ kind: 'segment', from: seam.from, to: seam.to, source: 'seam' })),
  ]

  // 1. Points: seam ends, outline corners, seams crossing each other or the radial edges.
  const points: Point[] = [...seams.flatMap((seam) => [seam.from, seam.to]), ...outlineCorners(design)]
  const segments = shapes.filter((shape): shape is Extract<Shape, { kind: 'segment' }> => shape.kind === 'segment')
  for (let i = 0; i < segments.length; i += 1) {
    for (let j = i + 1; j < segments.length; j += 1) {
      const crossing = segmentIntersection(segments[i]!.from, segments[i]!.to, segments[j]!.from, segments[j]!.to)
      if (crossing) points.push(crossing)
    }
  }
  const nearestPoint = nearest(raw, points)
  if (nearestPoint && distance(nearestPoint, raw) <= tolerance) return { point: nearestPoint, kind: 'point' }

  // 2. A 15° direction from the anchor, stopped where it meets the outline or a seam.
  const angled = anchor && snapping.angles ? angleSnap(raw, anchor, tolerance) : null
  if (angled && anchor) {
    const direction: Point = [(angled[0] - anchor[0]) / distance(angled, anchor), (angled[1] - anchor[1]) / distance(angled, anchor)]
    const far: Point = [anchor[0] + direction[0] * 1e6, anchor[1] + direction[1] * 1e6]
    const hits: Point[] = []
    for (const shape of shapes) {
      if (shape.kind === 'segment') {
        const hit = segmentIntersection(anchor, far, shape.from, shape.to)
        if (hit) hits.push(hit)
      } else {
        hits.push(...rayCircle(anchor, direction, shape.radius).filter((p) => isOnArcSweep(p, shape.sweep)))
      }
    }
    const hit = nearest(angled, hits)
    if (hit && distance(hit, angled) <= tolerance) return { point: hit, kind: 'angle' }
  }

  // 3. Onto the outline or a seam.
  let best: { point: Point; kind: SnapKind; gap: number } | null = null
  for (const shape of shapes) {
    const point = shape.kind === 'segment' ? closestOnSegment(raw, shape.from, shape.to) : closestOnArc(raw, shape.radius, shape.sweep)
    const gap = distance(point, raw)
    if (gap <= tolerance && (!best || gap < best.gap)) {
      best = { point, kind: shape.kind === 'segment' && shape.source === 'seam' ? 'seam' : 'outline', gap }
    }
  }
  if (best) return { point: best.point, kind: best.kind }

  if (angled) return { point: angled, kind: 'angle' }
  if (snapping.grid && snapping.gridSize > 0) {
    const step = snapping.gridSize
    return { point: [Math.round(raw[0] / step) * step, Math.round(raw[1] / step) * step], kind: 'grid' }
  }
  return { point: raw, kind: 'none' }
}

/** The pointer moved onto the nearest 15° ray from the anchor, if it lies within tolerance of it. */
function angleSnap(raw: Point, anchor: Point, tolerance: number): Point | null {
  const length = distance(raw, anchor)
  if (length < tolerance) return null
  const step = (SNAP_ANGLE_STEP_DEGREES * Math.PI) / 180
  const angle = Math.round(Math.atan2(raw[1] - anchor[1], raw[0] - anchor[0]) / step) * step
  const projected: Point = [anchor[0] + length * Math.cos(angle), anchor[1] + length * Math.sin(angle)]
  return distance(projected, raw) <= tolerance ? projected : null
}

function nearest(target: Point, candidates: readonly Point[]): Point | null {
  let best: Point | null = null
  let bestDistance = Infinity
  for (const candidate of candidates) {
    const d = distance(candidate, target)
    if (d < bestDistance) {
      best = candidate
      bestDistance = d
    }
  }
  return best
}
