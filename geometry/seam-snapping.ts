/**
 * Snapping seam ends, the first step of the arrangement. A hand-drawn end that stops just short
 * of the outline or of another seam leaves an area unclosed, so ends within the snap distance
 * are moved onto what they nearly touch. Every rule below looks at all ends at once and breaks
 * ties by coordinates, never by list position, so the order in which seams are listed cannot
 * change the result.
 */
import { comparePoints, distance, nearestOnSegment } from './polygon-measure'
import { repeatOutline, repeatSpan } from './ring'
import { SNAP_DISTANCE_INCHES } from './tolerances'
import type { Point, Ring, Seam } from './types'

/** How a seam end was attached after snapping. */
export type EndAttachment = 'outline' | 'seam-end' | 'seam' | 'free'

export interface SnappedSeam {
  readonly seam: Seam
  readonly attachments: readonly [EndAttachment, EndAttachment]
  /** Whether each end lies on one of the outline's true arcs (not at a corner). */
  readonly onArc: readonly [boolean, boolean]
}

/**
 * What seam ends snap onto: the outline's true corners, its straight (radial) edges and its true
 * arcs, centred on the origin from angle 0 to `span`. Never the chords: they lie up to the chord
 * tolerance inside an outer arc (and outside an inner one), so measuring to them would snap an end
 * beyond the outer arc at one angle and not at another, and leave one near the inner arc dangling.
 */
export interface SnapOutline {
  readonly corners: readonly Point[]
  readonly edges: readonly (readonly [Point, Point])[]
  readonly arcs: readonly { readonly radius: number; readonly span: number }[]
}

/**
 * The snap targets of a ring's repeat 0.
 *
 * @example snapOutline({ innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }).corners // [[0, 0], [9, 0], ≈ [0, 9]]
 */
export function snapOutline(ring: Ring): SnapOutline {
  const { polygon, parts } = repeatOutline(ring)
  const span = repeatSpan(ring)
  // Only where the outline changes part (radial edge to arc) is a corner; chord joints are not.
  const corners = polygon.filter((_, i) => parts[i] !== parts[(i - 1 + parts.length) % parts.length])
  const edges = polygon
    .map((a, i): readonly [Point, Point] => [a, polygon[(i + 1) % polygon.length]!])
    .filter((_, i) => parts[i] === 'start-radial' || parts[i] === 'end-radial')
  const arcs = [{ radius: ring.outerRadius, span }, ...(ring.innerRadius > 0 ? [{ radius: ring.innerRadius, span }] : [])]
  return { corners, edges, arcs }
}

interface End {
  point: Point
  attachment: EndAttachment
  onArc: boolean
  /** Ends snapped together share a cluster number (the index of one of them). */
  cluster: number
  /** For an end snapped onto another seam's middle: that seam's index, to re-project. */
  target: number
}

/**
 * Snaps seam ends onto the outline (its true corners first: the joints between radial edges and
 * arcs, not the joints between chords; then its radial edges and its true arcs), onto each other,
 * then onto the nearest seam (a crossing of two seams first). Returns the seams in the input order
 * with moved ends.
 *
 * @example snapSeamEnds(snapOutline(ring), [{ id: 's1', from: [0.004, 1], to: [3, 2.999] }])
 */
export function snapSeamEnds(outline: SnapOutline, seams: readonly Seam[]): SnappedSeam[] {
  const ends: End[] = []
  for (const seam of seams) {
    ends.push(snapToOutline(seam.from, seam.to, outline), snapToOutline(seam.to, seam.from, outline))
  }
  clusterEnds(ends)
  snapToSeams(ends, seams.length)
  return seams.map((seam, index) => {
    const from = ends[2 * index] as End
    const to = ends[2 * index + 1] as End
    return { seam: { id: seam.id, from: from.point, to: to.point }, attachments: [from.attachment, to.attachment], onArc: [from.onArc, to.onArc] }
  })
}

/** Whether p is farther than the snap distance outside the bounding box of a–b (a cheap early out). */
function isOutsideBox(p: Point, a: Point, b: Point): boolean {
  return (
    p[0] < Math.min(a[0], b[0]) - SNAP_DISTANCE_INCHES ||
    p[0] > Math.max(a[0], b[0]) + SNAP_DISTANCE_INCHES ||
    p[1] < Math.min(a[1], b[1]) - SNAP_DISTANCE_INCHES ||
    p[1] > Math.max(a[1], b[1]) + SNAP_DISTANCE_INCHES
  )
}

/**
 * Where the seam's own line (through `point`, coming from `other`) meets segment a–b, if within
 * the segment: snapping along the seam keeps its direction, so a seam drawn at 90° stays at 90°
 * and two seams drawn in line stay in line. Null when parallel or outside the segment.
 */
function alongSeam(point: Point, other: Point, a: Point, b: Point): Point | null {
  const rx = point[0] - other[0]
  const ry = point[1] - other[1]
  const sx = b[0] - a[0]
  const sy = b[1] - a[1]
  const denominator = rx * sy - ry * sx
  if (denominator === 0) return null
  const u = ((a[0] - other[0]) * ry - (a[1] - other[1]) * rx) / denominator
  if (u < 0 || u > 1) return null
  return [a[0] + u * sx, a[1] + u * sy]
}

/** The point of a–b a seam end snaps to: along the seam's line when that is near, else the nearest. */
function snapOnto(point: Point, other: Point, a: Point, b: Point): Point {
  return snapCandidate(point, other, a, b).point
}

/** As `snapOnto`, saying whether the seam keeps its direction (such a candidate is preferred). */
function snapCandidate(point: Point, other: Point, a: Point, b: Point): { readonly point: Point; readonly alongSeam: boolean } {
  const along = alongSeam(point, other, a, b)
  if (along && distance(along, point) <= SNAP_DISTANCE_INCHES) return { point: along, alongSeam: true }
  return { point: nearestOnSegment(point, a, b).point, alongSeam: false }
}

/**
 * The point of a true arc (centred on the origin, angles 0 to span) a seam end snaps to: where the
 * seam's own line meets the circle when that is near, else straight out along the radius. Null
 * when the end is farther than the snap distance from the arc (or beyond its ends).
 */
function arcCandidate(point: Point, other: Point, radius: number, span: number): { readonly point: Point; readonly alongSeam: boolean } | null {
  const onArc = (p: Point): boolean => {
    const angle = Math.atan2(p[1], p[0])
    return (angle >= 0 ? angle : angle + 2 * Math.PI) <= span
  }
  const r = Math.hypot(point[0], point[1])
  if (!(r > 0) || Math.abs(r - radius) > SNAP_DISTANCE_INCHES) return null
  // The seam's line other + t·(point − other) meets the circle where |…| = radius: t² a + 2 t b + c = 0.
  const dx = point[0] - other[0]
  const dy = point[1] - other[1]
  const a = dx * dx + dy * dy
  const b = other[0] * dx + other[1] * dy
  const c = other[0] * other[0] + other[1] * other[1] - radius * radius
  const discriminant = b * b - a * c
  if (a > 0 && discriminant >= 0) {
    const root = Math.sqrt(discriminant)
    // The crossing nearest the end (t = 1).
    const t = [(-b - root) / a, (-b + root) / a].sort((p, q) => Math.abs(p - 1) - Math.abs(q - 1))[0]!
    const along: Point = [other[0] + t * dx, other[1] + t * dy]
    if (distance(along, point) <= SNAP_DISTANCE_INCHES && onArc(along)) return { point: along, alongSeam: true }
  }
  const radial: Point = [(point[0] * radius) / r, (point[1] * radius) / r]
  return onArc(radial) ? { point: radial, alongSeam: false } : null
}

function snapToOutline(point: Point, other: Point, outline: SnapOutline): End {
  let nearestCorner: Point | null = null
  let cornerDistance = SNAP_DISTANCE_INCHES
  for (const corner of outline.corners) {
    if (Math.abs(corner[0] - point[0]) > SNAP_DISTANCE_INCHES || Math.abs(corner[1] - point[1]) > SNAP_DISTANCE_INCHES) continue
    const d = distance(point, corner)
    if (d <= cornerDistance) {
      nearestCorner = corner
      cornerDistance = d
    }
  }
  if (nearestCorner) return { point: nearestCorner, attachment: 'outline', onArc: false, target: -1, cluster: -1 }
  // Keeping the seam's direction beats being nearest: an end near a radial edge and an arc at
  // once goes where its own line takes it.
  let nearest: { point: Point; onArc: boolean } | null = null
  let nearestRank = Infinity
  const consider = (candidate: { readonly point: Point; readonly alongSeam: boolean }, onArc: boolean): void => {
    const rank = (candidate.alongSeam ? 0 : SNAP_DISTANCE_INCHES * 2) + distance(point, candidate.point)
    if (rank < nearestRank) {
      nearest = { point: candidate.point, onArc }
      nearestRank = rank
    }
  }
  for (const [a, b] of outline.edges) {
    if (isOutsideBox(point, a, b)) continue
    if (distance(point, nearestOnSegment(point, a, b).point) > SNAP_DISTANCE_INCHES) continue
    consider(snapCandidate(point, other, a, b), false)
  }
  for (const { radius, span } of outline.arcs) {
    const candidate = arcCandidate(point, other, radius, span)
    if (candidate) consider(candidate, true)
  }
  const chosen = nearest as { point: Point; onArc: boolean } | null
  return chosen
    ? { point: chosen.point, attachment: 'outline', onArc: chosen.onArc, target: -1, cluster: -1 }
    : { point, attachment: 'free', onArc: false, target: -1, cluster: -1 }
}

/** Ends within the snap distance of each other become one point: an outline end if any, else the lowest. */
function clusterEnds(ends: End[]): void {
  const parent = ends.map((_, index) => index)
  const find = (i: number): number => {
    while (parent[i] !== i) {
      parent[i] = parent[parent[i] as number] as number
      i = parent[i] as number
    }
    return i
  }
  // Sorting by x lets the sweep stop early; the clusters do not depend on the order found.
  const byX = ends.map((_, index) => index).sort((a, b) => comparePoints((ends[a] as End).point, (ends[b] as End).point))
  for (let i = 0; i < byX.length; i += 1) {
    const a = ends[byX[i] as number] as End
    for (let j = i + 1; j < byX.length; j += 1) {
      const b = ends[byX[j] as number] as End
      if (b.point[0] - a.point[0] > SNAP_DISTANCE_INCHES) break
      if (distance(a.point, b.point) <= SNAP_DISTANCE_INCHES) parent[find(byX[i] as number)] = find(byX[j] as number)
    }
  }
  const clusters = new Map<number, number[]>()
  ends.forEach((end, index) => {
    const root = find(index)
    end.cluster = root
    const members = clusters.get(root) ?? []
    members.push(index)
    clusters.set(root, members)
  })
  for (const members of clusters.values()) {
    if (members.length < 2) continue
    const onOutline = members.filter((i) => (ends[i] as End).attachment === 'outline')
    const pool = onOutline.length > 0 ? onOutline : members
    const chosenEnd = [...pool].sort((p, q) => comparePoints((ends[p] as End).point, (ends[q] as End).point))[0] as number
    const chosen = (ends[chosenEnd] as End).point
    const chosenOnArc = (ends[chosenEnd] as End).onArc
    for (const i of members) {
      const end = ends[i] as End
      end.point = chosen
      end.onArc = chosenOnArc
      if (end.attachment !== 'outline') end.attachment = onOutline.length > 0 ? 'outline' : 'seam-end'
    }
  }
}

function crossing(a: readonly [Point, Point], b: readonly [Point, Point]): Point | null {
  const [p, p2] = a
  const [q, q2] = b
  const rx = p2[0] - p[0]
  const ry = p2[1] - p[1]
  const sx = q2[0] - q[0]
  const sy = q2[1] - q[1]
  const denominator = rx * sy - ry * sx
  if (denominator === 0) return null
  const t = ((q[0] - p[0]) * sy - (q[1] - p[1]) * sx) / denominator
  const u = ((q[0] - p[0]) * ry - (q[1] - p[1]) * rx) / denominator
  if (t < 0 || t > 1 || u < 0 || u > 1) return null
  return [p[0] + t * rx, p[1] + t * ry]
}

/**
 * Free ends go to the nearest crossing of two other seams, else the nearest point of a seam.
 * Ends already clustered together (two seams meeting at a point) move as one, so a junction
 * drawn just off a seam lands on it whole.
 */
function snapToSeams(ends: End[], seamCount: number): void {
  const groups = new Map<number, number[]>()
  ends.forEach((end, index) => {
    if (end.attachment !== 'free' && end.attachment !== 'seam-end') return
    const members = groups.get(end.cluster) ?? []
    members.push(index)
    groups.set(end.cluster, members)
  })
  if (groups.size === 0) return
  const frozen = ends.map((end) => end.point)
  const frozenSegment = (seam: number): readonly [Point, Point] => [frozen[2 * seam] as Point, frozen[2 * seam + 1] as Point]
  for (const members of groups.values()) {
    const point = (ends[members[0] as number] as End).point
    const own = members.map((index) => index >> 1)
    const near: number[] = []
    for (let seam = 0; seam < seamCount; seam += 1) {
      if (own.includes(seam)) continue
      const a = frozen[2 * seam] as Point
      const b = frozen[2 * seam + 1] as Point
      if (isOutsideBox(point, a, b)) continue
      if (distance(point, nearestOnSegment(point, a, b).point) <= SNAP_DISTANCE_INCHES) near.push(seam)
    }
    let best: { point: Point; distance: number; target: number } | null = null
    const consider = (candidate: Point, target: number, penalty = 0): void => {
      if (distance(point, candidate) > SNAP_DISTANCE_INCHES) return
      const d = distance(point, candidate) + penalty
      if (!best || d < best.distance || (d === best.distance && comparePoints(candidate, best.point) < 0)) best = { point: candidate, distance: d, target }
    }
    for (let i = 0; i < near.length; i += 1) {
      for (let j = i + 1; j < near.length; j += 1) {
        const candidate = crossing(frozenSegment(near[i] as number), frozenSegment(near[j] as number))
        if (candidate) consider(candidate, -1)
      }
    }
    // A single end keeps its seam's direction; a junction of several ends cannot, so it projects.
    const single = members.length === 1 ? (members[0] as number) : -1
    const otherEnd = single >= 0 ? (frozen[single ^ 1] as Point) : null
    if (!best) {
      for (const seam of near) {
        const [a, b] = frozenSegment(seam)
        const candidate = otherEnd ? snapCandidate(point, otherEnd, a, b) : { point: nearestOnSegment(point, a, b).point, alongSeam: true }
        consider(candidate.point, seam, candidate.alongSeam ? 0 : SNAP_DISTANCE_INCHES * 2)
      }
    }
    const chosen = best as { point: Point; distance: number; target: number } | null
    for (const index of members) {
      const end = ends[index] as End
      if (chosen) {
        end.point = chosen.point
        end.attachment = 'seam'
        end.target = chosen.target
      } else {
        end.attachment = members.length > 1 ? 'seam-end' : 'free'
      }
    }
  }
  // Two ends snapped onto each other's seams both moved; re-project a few times (all at once,
  // from the previous positions) so each lies on its target seam as it finally stands.
  const targeted = ends.map((end, index) => index).filter((index) => (ends[index] as End).target >= 0)
  if (targeted.length === 0) return
  // Ends of one cluster moved together onto one seam are a junction: they project as one point.
  const sharing = new Map<number, number>()
  for (const index of targeted) sharing.set((ends[index] as End).cluster, (sharing.get((ends[index] as End).cluster) ?? 0) + 1)
  const junction = new Set(targeted.filter((index) => (sharing.get((ends[index] as End).cluster) ?? 0) > 1))
  for (let round = 0; round < 4; round += 1) {
    const previous = ends.map((end) => end.point)
    for (const index of targeted) {
      const end = ends[index] as End
      const a = previous[2 * end.target] as Point
      const b = previous[2 * end.target + 1] as Point
      end.point = junction.has(index) ? nearestOnSegment(end.point, a, b).point : snapOnto(end.point, previous[index ^ 1] as Point, a, b)
    }
  }
}
