/**
 * The small changes the repair search tries, each one a designer recognises, generated only at
 * the places that stop a design from sewing (see geometry/README.md, "Repairs"):
 *
 * - extend: a seam end moves along the seam's own line to the next seam it meets, or through to
 *   the outline;
 * - straighten: a junction where seams end moves a short way onto the line of two of them, so
 *   those two continue each other in a straight line;
 * - add: a new straight seam through a set-in or bent junction, along the bisector of a gap
 *   between its seams, between the first seams (or the outline) it meets either way.
 */
import type { Judgement } from './repairs-evaluate'
import { distance, distanceToSegment } from './polygon-measure'
import { repeatSpan } from './ring'
import { ALONG_SEAM_RADIANS, ANGLE_NOISE_RADIANS, ON_SEGMENT_INCHES, OUTPUT_DECIMALS, SHORT_MOVE_FRACTION, SNAP_DISTANCE_INCHES } from './tolerances'
import type { Point, Ring, Seam } from './types'

export type SeamEnd = 'from' | 'to'

export type Edit =
  | { readonly kind: 'extend'; readonly seamId: string; readonly end: SeamEnd; readonly to: Point; readonly target: string | null; readonly addedIn: number }
  | { readonly kind: 'straighten'; readonly at: Point; readonly to: Point; readonly ends: readonly { readonly seamId: string; readonly end: SeamEnd }[]; readonly line: readonly [string, string]; readonly movedIn: number; readonly addedIn: number }
  | { readonly kind: 'add'; readonly through: Point; readonly from: Point; readonly to: Point; readonly addedIn: number }

const fixed = (value: number): string => value.toFixed(OUTPUT_DECIMALS)
const round = (value: number): number => {
  const scale = 10 ** OUTPUT_DECIMALS
  const rounded = Math.round(value * scale) / scale
  return rounded === 0 ? 0 : rounded
}
/** New seam ends are written rounded like the plan's outputs (the suggestion is judged as written). */
const roundPoint = (p: Point): Point => [round(p[0]), round(p[1])]
const pointKey = (p: Point): string => `${fixed(p[0])},${fixed(p[1])}`

/** A key that names the change itself (never a list position): the fixed tie-break and the dedupe. */
export function editKey(edit: Edit): string {
  if (edit.kind === 'extend') return `extend ${edit.seamId} ${edit.end} ${pointKey(edit.to)}`
  if (edit.kind === 'straighten') return `straighten ${pointKey(edit.at)} ${edit.line.join(' ')}`
  const [a, b] = [pointKey(edit.from), pointKey(edit.to)].sort()
  return `add ${a} ${b}`
}

/** What the change costs the eye: seam length added plus the distance seam ends move. */
export function visibleChange(edit: Edit): number {
  return edit.addedIn + (edit.kind === 'straighten' ? edit.movedIn : 0)
}

const at = (p: Point): string => `(${p[0].toFixed(2)}, ${p[1].toFixed(2)})`
const inches = (value: number): string => `${value.toFixed(2)} in`

function listOf(ids: readonly string[]): string {
  return ids.length <= 1 ? (ids[0] ?? '') : `${ids.slice(0, -1).join(', ')} and ${ids[ids.length - 1]}`
}

/** The change in plain words, starting with a verb: "Extend seam s3 to the outline". */
export function describeEdit(edit: Edit, newSeamId: string): string {
  if (edit.kind === 'extend') return `Extend seam ${edit.seamId} ${inches(edit.addedIn)} to ${edit.target === null ? 'the outline' : `seam ${edit.target}`}`
  if (edit.kind === 'straighten') {
    const ids = [...new Set(edit.ends.map((end) => end.seamId))].sort()
    return `Move the point where seams ${listOf(ids)} meet ${inches(distance(edit.at, edit.to))}, from ${at(edit.at)} to ${at(edit.to)}, so that ${edit.line[0]} and ${edit.line[1]} run on in one straight line`
  }
  return `Add seam ${newSeamId} through ${at(edit.through)}, from ${at(edit.from)} to ${at(edit.to)}`
}

/**
 * The smallest id of the form s1, s2, … that no seam uses: a function of the set of ids, never
 * of their order, so the same design always names its new seam alike.
 *
 * @example newSeamId([{ id: 's1', from: [0, 0], to: [1, 1] }, { id: 's3', from: [0, 1], to: [1, 0] }]) // 's2'
 */
export function newSeamId(seams: readonly Seam[]): string {
  const used = new Set(seams.map((seam) => seam.id))
  let n = 1
  while (used.has(`s${n}`)) n += 1
  return `s${n}`
}

/**
 * The seams with one edit made: ends moved in place (ids, order and the other ends kept as the
 * designer drew them), a new seam appended with a new id.
 */
export function applyEdit(seams: readonly Seam[], edit: Edit): Seam[] {
  if (edit.kind === 'add') return [...seams, { id: newSeamId(seams), from: roundPoint(edit.from), to: roundPoint(edit.to) }]
  const moves = edit.kind === 'extend' ? [{ seamId: edit.seamId, end: edit.end }] : edit.ends
  const to = roundPoint(edit.to)
  return seams.map((seam) => {
    let next = seam
    for (const move of moves) if (move.seamId === seam.id) next = move.end === 'from' ? { ...next, from: to } : { ...next, to }
    return next
  })
}

interface Hit {
  readonly point: Point
  readonly along: number
  /** The seam hit, or null for the outline. */
  readonly seamId: string | null
}

/** Where the ray origin + t·direction (t > 0) first crosses segment a–b, as t, or null. */
function raySegment(origin: Point, direction: Point, a: Point, b: Point): number | null {
  const sx = b[0] - a[0]
  const sy = b[1] - a[1]
  const denominator = direction[0] * sy - direction[1] * sx
  if (denominator === 0) return null
  const qx = a[0] - origin[0]
  const qy = a[1] - origin[1]
  const t = (qx * sy - qy * sx) / denominator
  const u = (qx * direction[1] - qy * direction[0]) / denominator
  // A ray grazing a segment's end counts: ends meet at junctions and corners.
  const slack = ON_SEGMENT_INCHES / Math.max(Math.hypot(sx, sy), ON_SEGMENT_INCHES)
  return u >= -slack && u <= 1 + slack ? t : null
}

/** Where the ray first meets the outline: its radial edges or its true arcs (never the chords). */
function outlineHit(ring: Ring, origin: Point, direction: Point): Hit | null {
  const span = repeatSpan(ring)
  const radial = (angle: number): [Point, Point] => [
    [ring.innerRadius * Math.cos(angle), ring.innerRadius * Math.sin(angle)],
    [ring.outerRadius * Math.cos(angle), ring.outerRadius * Math.sin(angle)],
  ]
  const ts: number[] = []
  for (const angle of [0, span]) {
    const [a, b] = radial(angle)
    const t = raySegment(origin, direction, a, b)
    if (t !== null) ts.push(t)
  }
  for (const radius of ring.innerRadius > 0 ? [ring.outerRadius, ring.innerRadius] : [ring.outerRadius]) {
    // |origin + t·d| = r, with |d| = 1: t² + 2(o·d)t + |o|² − r² = 0.
    const b = origin[0] * direction[0] + origin[1] * direction[1]
    const c = origin[0] ** 2 + origin[1] ** 2 - radius ** 2
    const discriminant = b * b - c
    if (discriminant < 0) continue
    for (const t of [-b - Math.sqrt(discriminant), -b + Math.sqrt(discriminant)]) {
      const x = origin[0] + t * direction[0]
      const y = origin[1] + t * direction[1]
      const angle = Math.atan2(y, x)
      if (angle >= -ANGLE_NOISE_RADIANS && angle <= span + ANGLE_NOISE_RADIANS) ts.push(t)
    }
  }
  const ahead = ts.filter((t) => t > SNAP_DISTANCE_INCHES).sort((p, q) => p - q)
  const t = ahead[0]
  return t === undefined ? null : { point: [origin[0] + t * direction[0], origin[1] + t * direction[1]], along: t, seamId: null }
}

/**
 * The first seam or outline the ray from `origin` along the unit `direction` meets beyond the
 * snap distance (closer contacts are the junction it starts from).
 */
function firstHit(ring: Ring, seams: readonly Seam[], origin: Point, direction: Point): Hit | null {
  let best = outlineHit(ring, origin, direction)
  for (const seam of seams) {
    const t = raySegment(origin, direction, seam.from, seam.to)
    if (t === null || t <= SNAP_DISTANCE_INCHES || (best && t >= best.along)) continue
    best = { point: [origin[0] + t * direction[0], origin[1] + t * direction[1]], along: t, seamId: seam.id }
  }
  return best
}

const unit = (from: Point, to: Point): Point | null => {
  const length = distance(from, to)
  return length > 0 ? [(to[0] - from[0]) / length, (to[1] - from[1]) / length] : null
}

/** A seam end of the snapped seams: which seam, which end, where, and where the seam's other end is. */
interface EndAt {
  readonly seamId: string
  readonly end: SeamEnd
  readonly point: Point
  readonly other: Point
}

function endsOf(seams: readonly Seam[]): EndAt[] {
  return seams.flatMap((seam): EndAt[] => [
    { seamId: seam.id, end: 'from', point: seam.from, other: seam.to },
    { seamId: seam.id, end: 'to', point: seam.to, other: seam.from },
  ])
}

/** Extending one end: to the first seam it meets, and through to the outline when that is farther. */
function extensions(ring: Ring, seams: readonly Seam[], end: EndAt): Edit[] {
  const direction = unit(end.other, end.point)
  if (!direction) return []
  const edits: Edit[] = []
  const hit = firstHit(ring, seams, end.point, direction)
  if (hit) edits.push({ kind: 'extend', seamId: end.seamId, end: end.end, to: hit.point, target: hit.seamId, addedIn: hit.along })
  const outline = outlineHit(ring, end.point, direction)
  if (outline && hit && hit.seamId !== null) edits.push({ kind: 'extend', seamId: end.seamId, end: end.end, to: outline.point, target: null, addedIn: outline.along })
  return edits
}

/**
 * Moving a junction where only seam ends meet onto the line between the far ends of two of
 * them, when the move is short (SHORT_MOVE_FRACTION of the outer radius).
 */
function straightenings(ring: Ring, seams: readonly Seam[], vertex: Point, ends: readonly EndAt[]): Edit[] {
  if (ends.length < 2) return []
  const passing = seams.some((seam) => distanceToSegment(vertex, seam.from, seam.to) <= ON_SEGMENT_INCHES && distance(seam.from, vertex) > ON_SEGMENT_INCHES && distance(seam.to, vertex) > ON_SEGMENT_INCHES)
  if (passing) return []
  const edits: Edit[] = []
  for (let i = 0; i < ends.length; i += 1) {
    for (let j = i + 1; j < ends.length; j += 1) {
      const a = ends[i] as EndAt
      const b = ends[j] as EndAt
      if (a.seamId === b.seamId) continue
      const dx = b.other[0] - a.other[0]
      const dy = b.other[1] - a.other[1]
      const lengthSquared = dx * dx + dy * dy
      if (lengthSquared === 0) continue
      const t = ((vertex[0] - a.other[0]) * dx + (vertex[1] - a.other[1]) * dy) / lengthSquared
      if (t <= 0 || t >= 1) continue
      const to: Point = [a.other[0] + t * dx, a.other[1] + t * dy]
      const move = distance(vertex, to)
      if (move <= ON_SEGMENT_INCHES || move > SHORT_MOVE_FRACTION * ring.outerRadius) continue
      const before = ends.reduce((sum, end) => sum + distance(end.other, end.point), 0)
      const after = ends.reduce((sum, end) => sum + distance(end.other, to), 0)
      const line: [string, string] = [a.seamId, b.seamId].sort() as [string, string]
      edits.push({ kind: 'straighten', at: vertex, to, ends: ends.map(({ seamId, end }) => ({ seamId, end })), line, movedIn: move * ends.length, addedIn: Math.max(0, after - before) })
    }
  }
  return edits
}

/**
 * New straight seams through a junction, one per gap between neighbouring seams there, along the
 * gap's bisector and on through the junction, between the first seams (or the outline) it meets
 * either way: a line through the point that no seam of the junction lies on.
 */
function seamsThrough(ring: Ring, seams: readonly Seam[], vertex: Point, ends: readonly EndAt[]): Edit[] {
  const arms = ends.map((end) => Math.atan2(end.other[1] - vertex[1], end.other[0] - vertex[0])).sort((p, q) => p - q)
  const bisectors = arms.map((angle, index) => (angle + (index + 1 < arms.length ? (arms[index + 1] as number) : (arms[0] as number) + 2 * Math.PI)) / 2)
  // A line through the junction along one of its seams is that seam's extension (tried as one):
  // where a bisector runs back along a seam (a symmetric Y), the line square to a seam stands in.
  const square = arms.map((angle) => angle + Math.PI / 2)
  const clear = (angle: number): boolean => arms.every((arm) => Math.abs(Math.sin(angle - arm)) > ALONG_SEAM_RADIANS)
  const directions = [...bisectors.filter(clear), ...square.filter(clear)].slice(0, arms.length)
  const edits: Edit[] = []
  const seen = new Set<string>()
  for (const angle of directions) {
    const direction: Point = [Math.cos(angle), Math.sin(angle)]
    const forward = firstHit(ring, seams, vertex, direction)
    const back = firstHit(ring, seams, vertex, [-direction[0], -direction[1]])
    if (!forward || !back) continue
    const [from, to] = [back.point, forward.point].sort((p, q) => p[0] - q[0] || p[1] - q[1]) as [Point, Point]
    const key = `${pointKey(from)} ${pointKey(to)}`
    if (seen.has(key)) continue
    seen.add(key)
    edits.push({ kind: 'add', through: vertex, from, to, addedIn: distance(from, to) })
  }
  return edits
}

/** Interior vertices where two or more seam edges meet and none continues another: set-in and bent junctions. */
function junctionsThatBlock(judgement: Judgement): number[] {
  const { topology } = judgement
  const found: number[] = []
  topology.edgesAtVertex.forEach((edges, vertex) => {
    if (topology.vertexOnOutline[vertex] || edges.length < 2) return
    const lines = edges.map((edge) => topology.seamEdges[edge]?.line)
    if (new Set(lines).size === lines.length) found.push(vertex)
  })
  return found
}

/** Interior vertices whose areas all lie in the stuck core (a pinwheel's seam ends). */
function coreVertices(judgement: Judgement): number[] {
  const core = new Set(judgement.stuck)
  const { topology } = judgement
  const found: number[] = []
  topology.areasAtVertex.forEach((areas, vertex) => {
    if (!topology.vertexOnOutline[vertex] && areas.length >= 3 && areas.every((area) => core.has(area))) found.push(vertex)
  })
  return found
}

/** Interior vertices where a seam ends on another (T-junctions): where a design in several sections might save one. */
function seamEndJunctions(judgement: Judgement, ends: readonly EndAt[]): number[] {
  const { topology } = judgement
  const found: number[] = []
  topology.vertices.forEach((vertex, index) => {
    if (!topology.vertexOnOutline[index] && ends.some((end) => distance(end.point, vertex) <= ON_SEGMENT_INCHES)) found.push(index)
  })
  return found
}

/**
 * The candidate edits for a judged design, in a fixed order (by place, then by seam id), never
 * by the order the seams are listed in. `mode` 'fewer' asks for changes that might save a
 * section of a sewable design.
 */
export function candidateEdits(ring: Ring, judgement: Judgement, mode: 'repair' | 'fewer'): Edit[] {
  const seams = [...judgement.arrangement.seams].sort((p, q) => (p.id < q.id ? -1 : p.id > q.id ? 1 : 0))
  const ends = endsOf(seams)
  const { topology } = judgement
  const endsAtVertex = (vertex: Point): EndAt[] => ends.filter((end) => distance(end.point, vertex) <= ON_SEGMENT_INCHES)
  const edits: Edit[] = []
  const extended = new Set<string>()
  const extend = (end: EndAt): void => {
    const key = `${end.seamId} ${end.end}`
    if (extended.has(key)) return
    extended.add(key)
    edits.push(...extensions(ring, seams, end))
  }
  if (mode === 'fewer') {
    for (const vertex of seamEndJunctions(judgement, ends)) for (const end of endsAtVertex(topology.vertices[vertex] as Point)) extend(end)
    return edits
  }
  // Dangling ends: where the problem stands (its place is the loose end).
  const loose = judgement.errors.filter((problem) => problem.code === 'dangling-seam-end').map((problem) => problem.at)
  for (const place of [...loose].sort((p, q) => p[0] - q[0] || p[1] - q[1])) {
    for (const end of ends) if (distance(end.point, place) <= SNAP_DISTANCE_INCHES) extend(end)
  }
  for (const vertex of junctionsThatBlock(judgement)) {
    const point = topology.vertices[vertex] as Point
    const here = endsAtVertex(point)
    for (const end of here) extend(end)
    edits.push(...straightenings(ring, seams, point, here))
    edits.push(...seamsThrough(ring, seams, point, here))
  }
  for (const vertex of coreVertices(judgement)) for (const end of endsAtVertex(topology.vertices[vertex] as Point)) extend(end)
  return edits
}
