/**
 * Areas: the faces of the planar arrangement of repeat 0's outline and its seams.
 *
 * Seam ends are snapped first (seam-snapping.ts); then every seam is split where it meets the
 * outline or another seam, coincident points become one vertex, dangling and floating seam
 * pieces are reported and set aside, and the bounded faces are traced counter-clockwise. Every
 * problem is returned with a place and plain words; nothing here throws for a bad design.
 */
import { orientation } from './orientation'
import { comparePoints, distance, distanceToSegment, interiorPoint, polygonCentroid, signedArea } from './polygon-measure'
import { repeatOutline, type RepeatOutline } from './ring'
import { dropDangling, dropFloating, dropOutside, type Piece } from './seam-pieces'
import { snapOutline, snapSeamEnds } from './seam-snapping'
import { ANGLE_NOISE_DEGREES, ID_DECIMALS, LABEL_ORDER_DIGITS, ON_SEGMENT_INCHES, SHARP_ANGLE_DEGREES, SLIVER_AREA_SQ_IN, VERTEX_MERGE_INCHES } from './tolerances'
import type { Point, Polygon, Problem, Ring, Seam } from './types'
import { mergeVertices } from './vertex-merge'

export interface ArrangementEdge {
  readonly from: number
  readonly to: number
  /** The seams this edge is part of; empty for an edge of the outline. */
  readonly seamIds: readonly string[]
  readonly onOutline: boolean
  /** The area on the left of from → to, or −1 outside the repeat. */
  readonly left: number
  /** The area on the right of from → to, or −1 outside the repeat. */
  readonly right: number
}

export interface Area {
  /**
   * Position in the arrangement's canonical order: by the centroid of the area's true corners
   * (chord joints left out) as a fraction of the outer radius, so the same design at any size,
   * in any units and with its seams listed in any order has its areas in the same order.
   */
  readonly index: number
  /** Stable id from the area's centroid in thousandths of an inch: same design, same id. */
  readonly id: string
  /** Vertex ids of the arrangement, counter-clockwise, including T-junctions on straight sides. */
  readonly vertices: readonly number[]
  /** Counter-clockwise corners, without points where the side runs straight on. */
  readonly polygon: Polygon
  readonly areaSqIn: number
  /** A point well inside the area (deterministic). */
  readonly point: Point
}

export interface Arrangement {
  readonly outline: RepeatOutline
  /** The seams after snapping, in the design's order. */
  readonly seams: readonly Seam[]
  readonly vertices: readonly Point[]
  readonly vertexOnOutline: readonly boolean[]
  readonly edges: readonly ArrangementEdge[]
  /** In canonical order (see `Area.index`): never by list order, size or units. */
  readonly areas: readonly Area[]
  readonly problems: readonly Problem[]
}

interface Segment {
  readonly a: Point
  readonly b: Point
  readonly seamId: string | null
  readonly splits: Point[]
}

const format = (value: number): string => value.toFixed(2)
const at = (p: Point): string => `(${format(p[0])}, ${format(p[1])})`

/**
 * The areas of repeat 0 and the problems of its seams.
 *
 * @example
 * buildArrangement({ innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' },
 *   [{ id: 's1', from: [3, 0], to: [0, 3] }]).areas.length // 2
 */
export function buildArrangement(ring: Ring, seams: readonly Seam[]): Arrangement {
  const problems: Problem[] = []
  const snappedEnds = snapSeamEnds(snapOutline(ring), seams)
  const snapped = snappedEnds.map((s) => s.seam)
  // Ends snapped onto a true arc become corners of the outline, so they lie on it exactly.
  const onArcs = snappedEnds.flatMap((s) => [s.seam.from, s.seam.to].filter((_, end) => s.onArc[end]))
  const outline = repeatOutline(ring, onArcs)
  // A chord joint is where one arc's chords meet, not a point a seam ends on: no true corner.
  const isArc = (part: string | undefined): boolean => part === 'outer-arc' || part === 'inner-arc'
  const chordJoint = outline.polygon.map((p, i) => isArc(outline.parts[i]) && outline.parts[(i - 1 + outline.parts.length) % outline.parts.length] === outline.parts[i] && !onArcs.includes(p))
  const segments: Segment[] = outline.polygon.map((a, i) => ({ a, b: outline.polygon[(i + 1) % outline.polygon.length] as Point, seamId: null, splits: [] }))
  const outlineCount = segments.length
  for (const seam of snapped) {
    if (distance(seam.from, seam.to) <= VERTEX_MERGE_INCHES) {
      problems.push({ code: 'zero-length-seam', severity: 'error', message: `Seam ${seam.id} has no length: both its ends are at ${at(seam.from)}.`, at: seam.from })
      continue
    }
    // One direction per segment, whatever the designer drew, so crossings compute the same bits.
    const [a, b] = comparePoints(seam.from, seam.to) <= 0 ? [seam.from, seam.to] : [seam.to, seam.from]
    segments.push({ a, b, seamId: seam.id, splits: [] })
  }
  const reportedOverlaps = new Set<string>()
  for (let i = outlineCount; i < segments.length; i += 1) {
    for (let j = 0; j < segments.length; j += 1) {
      if (j === i || (j >= outlineCount && j < i)) continue
      const overlap = intersect(segments[i] as Segment, segments[j] as Segment)
      if (!overlap) continue
      const first = segments[i] as Segment
      const second = segments[j] as Segment
      const key = `${first.seamId}|${second.seamId ?? 'outline'}`
      if (reportedOverlaps.has(key)) continue
      reportedOverlaps.add(key)
      problems.push(
        second.seamId === null
          ? { code: 'overlapping-seams', severity: 'error', message: `Seam ${first.seamId} runs along the outline at ${at(overlap)}; the outline is already a cut edge.`, at: overlap }
          : { code: 'overlapping-seams', severity: 'error', message: `Seams ${first.seamId} and ${second.seamId} lie on top of each other at ${at(overlap)}.`, at: overlap },
      )
    }
  }
  return buildFaces(outline, snapped, segments, outlineCount, problems, { chordJoint, unit: ring.outerRadius })
}

/** What the canonical order of areas needs: which outline corners are chord joints, and the length unit. */
interface OrderBasis {
  readonly chordJoint: readonly boolean[]
  /** The outer radius: keys are fractions of it, so they do not change with the design's size. */
  readonly unit: number
}

/** Records where two segments meet; returns a point of their overlap when they run along each other. */
function intersect(first: Segment, second: Segment): Point | null {
  const { a, b } = first
  const { a: c, b: d } = second
  if (
    Math.max(c[0], d[0]) < Math.min(a[0], b[0]) - ON_SEGMENT_INCHES ||
    Math.min(c[0], d[0]) > Math.max(a[0], b[0]) + ON_SEGMENT_INCHES ||
    Math.max(c[1], d[1]) < Math.min(a[1], b[1]) - ON_SEGMENT_INCHES ||
    Math.min(c[1], d[1]) > Math.max(a[1], b[1]) + ON_SEGMENT_INCHES
  ) {
    return null
  }
  // Both ends of one segment clearly on one side of the other: they cannot meet (the common case).
  const lengthFirst = Math.hypot(b[0] - a[0], b[1] - a[1])
  const o1 = orientation(a, b, c)
  const o2 = orientation(a, b, d)
  if (o1 * o2 > 0 && Math.min(Math.abs(o1), Math.abs(o2)) > ON_SEGMENT_INCHES * lengthFirst) return null
  const lengthSecond = Math.hypot(d[0] - c[0], d[1] - c[1])
  const o3 = orientation(c, d, a)
  const o4 = orientation(c, d, b)
  if (o3 * o4 > 0 && Math.min(Math.abs(o3), Math.abs(o4)) > ON_SEGMENT_INCHES * lengthSecond) return null
  const onFirst = [c, d].filter((p) => distanceToSegment(p, a, b) <= ON_SEGMENT_INCHES)
  const onSecond = [a, b].filter((p) => distanceToSegment(p, c, d) <= ON_SEGMENT_INCHES)
  for (const p of onFirst) first.splits.push(p)
  for (const p of onSecond) second.splits.push(p)
  const shared = [...onFirst, ...onSecond]
  if (shared.length >= 2) {
    // Two ends of one lying on the other: they run along each other unless they only meet at one point.
    const [p, q] = shared.sort(comparePoints).filter((point, index, all) => index === 0 || distance(point, all[index - 1] as Point) > VERTEX_MERGE_INCHES)
    if (p && q) return [(p[0] + q[0]) / 2, (p[1] + q[1]) / 2]
  }
  if (shared.length > 0) return null
  if (o1 * o2 >= 0 || o3 * o4 >= 0) return null
  // Compute from the lexicographically smaller segment so swapping the pair changes no bit.
  const [p, p2, q, q2] = comparePoints(a, c) <= 0 ? [a, b, c, d] : [c, d, a, b]
  const rx = p2[0] - p[0]
  const ry = p2[1] - p[1]
  const sx = q2[0] - q[0]
  const sy = q2[1] - q[1]
  const t = ((q[0] - p[0]) * sy - (q[1] - p[1]) * sx) / (rx * sy - ry * sx)
  const point: Point = [p[0] + t * rx, p[1] + t * ry]
  first.splits.push(point)
  second.splits.push(point)
  return null
}

function buildFaces(outline: RepeatOutline, seams: readonly Seam[], segments: readonly Segment[], outlineCount: number, problems: Problem[], basis: OrderBasis): Arrangement {
  const allPoints: Point[] = []
  for (const segment of segments) allPoints.push(segment.a, segment.b, ...segment.splits)
  const merged = mergeVertices(allPoints, basis.unit)
  const vertices = merged.vertices
  const vertexOnOutline = vertices.map(() => false)
  const vertexIsChordJoint = vertices.map(() => false)
  const edgeByKey = new Map<string, { from: number; to: number; seamIds: string[]; onOutline: boolean }>()
  let pointIndex = 0
  for (let s = 0; s < segments.length; s += 1) {
    const segment = segments[s] as Segment
    const count = 2 + segment.splits.length
    const ids = merged.ids.slice(pointIndex, pointIndex + count)
    pointIndex += count
    const dx = segment.b[0] - segment.a[0]
    const dy = segment.b[1] - segment.a[1]
    const along = (id: number): number => ((vertices[id] as Point)[0] - segment.a[0]) * dx + ((vertices[id] as Point)[1] - segment.a[1]) * dy
    const ordered = [...new Set(ids)].sort((p, q) => along(p) - along(q))
    if (s < outlineCount) for (const id of ordered) vertexOnOutline[id] = true
    // Outline segment s starts at outline corner s.
    if (s < outlineCount && basis.chordJoint[s]) vertexIsChordJoint[ids[0] as number] = true
    for (let k = 0; k + 1 < ordered.length; k += 1) {
      const from = ordered[k] as number
      const to = ordered[k + 1] as number
      const key = from < to ? `${from}-${to}` : `${to}-${from}`
      const existing = edgeByKey.get(key)
      if (existing) {
        if (segment.seamId !== null && !existing.seamIds.includes(segment.seamId)) existing.seamIds.push(segment.seamId)
        if (s < outlineCount) existing.onOutline = true
      } else {
        edgeByKey.set(key, { from, to, seamIds: segment.seamId === null ? [] : [segment.seamId], onOutline: s < outlineCount })
      }
    }
  }
  // Vertex ids are sorted by position, so sorting pieces by them gives an order no seam list can change.
  let pieces = [...edgeByKey.values()].sort((p, q) => Math.min(p.from, p.to) - Math.min(q.from, q.to) || Math.max(p.from, p.to) - Math.max(q.from, q.to))
  pieces = dropOutside(pieces, vertices, vertexOnOutline, outline.polygon, problems)
  pieces = dropDangling(pieces, vertices, vertexOnOutline, problems)
  pieces = dropFloating(pieces, vertices, vertexOnOutline, problems)
  return traceFaces(outline, seams, vertices, vertexOnOutline, pieces, problems, orderKey(vertices, vertexIsChordJoint, basis.unit))
}

/**
 * The key that orders areas: the mean of an area's true corners (its chord joints dropped, so the
 * number of chords an arc gets at this size changes nothing) as a fraction of the outer radius,
 * rounded to LABEL_ORDER_DIGITS so that coordinates equal but for floating-point noise (a design
 * scaled by 1.37, or read in cm) compare equal and the next coordinate decides. The mean of the
 * corners, not the centroid of their polygon: a cap cut off an arc by one straight seam has all
 * its true corners on that seam, a polygon of no area whose centroid is noise.
 */
function orderKey(vertices: readonly Point[], isChordJoint: readonly boolean[], unit: number): (ids: readonly number[]) => readonly [number, number] {
  const scale = 10 ** LABEL_ORDER_DIGITS / unit
  return (ids) => {
    const corners = ids.filter((id) => !isChordJoint[id]).map((id) => vertices[id] as Point)
    const mean = corners.reduce<Point>((sum, p) => [sum[0] + p[0], sum[1] + p[1]], [0, 0])
    return [Math.round((mean[0] / corners.length) * scale), Math.round((mean[1] / corners.length) * scale)]
  }
}

function areaId(centroid: Point): string {
  const scale = 10 ** ID_DECIMALS
  const part = (value: number): string => {
    const rounded = Math.round(value * scale)
    return rounded < 0 ? `n${-rounded}` : `${rounded}`
  }
  return `area-${part(centroid[0])}-${part(centroid[1])}`
}

function traceFaces(
  outline: RepeatOutline, seams: readonly Seam[], vertices: readonly Point[], vertexOnOutline: boolean[], pieces: readonly Piece[], problems: Problem[],
  keyOf: (ids: readonly number[]) => readonly [number, number],
): Arrangement {
  // Half-edge 2e runs from → to, 2e + 1 runs back; each face lies on the left of its half-edges.
  const outgoing = vertices.map((): number[] => [])
  pieces.forEach((piece, e) => {
    outgoing[piece.from]?.push(2 * e)
    outgoing[piece.to]?.push(2 * e + 1)
  })
  const origin = (h: number): number => ((h & 1) === 0 ? (pieces[h >> 1] as Piece).from : (pieces[h >> 1] as Piece).to)
  const target = (h: number): number => origin(h ^ 1)
  const position = new Array<number>(pieces.length * 2).fill(0)
  // Each half-edge's direction, computed once rather than inside the sort's comparisons.
  const angle = new Float64Array(pieces.length * 2)
  for (let h = 0; h < pieces.length * 2; h += 1) {
    const p = vertices[origin(h)] as Point
    const q = vertices[target(h)] as Point
    angle[h] = Math.atan2(q[1] - p[1], q[0] - p[0])
  }
  for (let v = 0; v < vertices.length; v += 1) {
    const list = outgoing[v] as number[]
    if (list.length > 1) list.sort((p, q) => (angle[p] as number) - (angle[q] as number))
    for (let index = 0; index < list.length; index += 1) position[list[index] as number] = index
  }
  const faceOf = new Array<number>(pieces.length * 2).fill(-2)
  const cycles: number[][] = []
  for (let start = 0; start < pieces.length * 2; start += 1) {
    if (faceOf[start] !== -2) continue
    const cycle: number[] = []
    let h = start
    while (faceOf[h] === -2) {
      faceOf[h] = cycles.length
      cycle.push(h)
      const list = outgoing[target(h)] as number[]
      // The next side of the same face leaves the vertex just clockwise of the way back.
      h = list[((position[h ^ 1] as number) - 1 + list.length) % list.length] as number
    }
    cycles.push(cycle)
  }
  const bounded: { cycle: number; vertices: number[]; polygon: Point[]; area: number; centroid: Point }[] = []
  cycles.forEach((cycle, index) => {
    const ids = cycle.map(origin)
    const polygon = ids.map((id) => vertices[id] as Point)
    const area = signedArea(polygon)
    if (area > 0) bounded.push({ cycle: index, vertices: ids, polygon, area, centroid: polygonCentroid(polygon) })
  })
  const withIds = bounded.map((face) => ({ ...face, id: areaId(face.centroid), key: keyOf(face.vertices) }))
  // Never by id: ids are thousandths of an inch compared as strings, which a change of size reorders.
  withIds.sort((p, q) => p.key[0] - q.key[0] || p.key[1] - q.key[1] || comparePoints(p.centroid, q.centroid))
  const seen = new Map<string, number>()
  const areaOfCycle = new Map<number, number>()
  const areas: Area[] = withIds.map((face, index) => {
    const repeats = seen.get(face.id) ?? 0
    seen.set(face.id, repeats + 1)
    areaOfCycle.set(face.cycle, index)
    const polygon = simplify(face.polygon)
    return {
      index,
      id: repeats === 0 ? face.id : `${face.id}-${repeats + 1}`,
      vertices: face.vertices,
      polygon,
      areaSqIn: face.area,
      point: interiorPoint(polygon),
    }
  })
  const edges: ArrangementEdge[] = pieces.map((piece, e) => ({
    from: piece.from,
    to: piece.to,
    seamIds: [...piece.seamIds].sort(),
    onOutline: piece.onOutline,
    left: areaOfCycle.get(faceOf[2 * e] as number) ?? -1,
    right: areaOfCycle.get(faceOf[2 * e + 1] as number) ?? -1,
  }))
  problems.push(...areaWarnings(areas))
  return { outline, seams, vertices, vertexOnOutline, edges, areas, problems }
}

/** Drops corners where the side runs straight on (T-junctions of seams ending on this side). */
function simplify(polygon: readonly Point[]): Point[] {
  const kept = polygon.filter((p, i) => {
    const previous = polygon[(i - 1 + polygon.length) % polygon.length] as Point
    const next = polygon[(i + 1) % polygon.length] as Point
    return distanceToSegment(p, previous, next) > VERTEX_MERGE_INCHES
  })
  return kept.length >= 3 ? kept : [...polygon]
}

function areaWarnings(areas: readonly Area[]): Problem[] {
  const warnings: Problem[] = []
  // Corners are the arrangement's own vertex objects, so the point itself is the key.
  const sharpest = new Map<Point, { angle: number; point: Point }>()
  for (const area of areas) {
    if (area.areaSqIn < SLIVER_AREA_SQ_IN) {
      warnings.push({
        code: 'small-area',
        severity: 'warning',
        message: `The area at ${at(area.point)} is ${area.areaSqIn.toFixed(3)} sq in, a sliver under ${SLIVER_AREA_SQ_IN} sq in that is hard to sew.`,
        at: area.point,
      })
    }
    const polygon = area.polygon
    polygon.forEach((corner, i) => {
      const previous = polygon[(i - 1 + polygon.length) % polygon.length] as Point
      const next = polygon[(i + 1) % polygon.length] as Point
      const inX = corner[0] - previous[0]
      const inY = corner[1] - previous[1]
      const outX = next[0] - corner[0]
      const outY = next[1] - corner[1]
      const turn = Math.atan2(inX * outY - inY * outX, inX * outX + inY * outY)
      const interior = ((Math.PI - turn) * 180) / Math.PI
      if (interior >= SHARP_ANGLE_DEGREES - ANGLE_NOISE_DEGREES) return
      const known = sharpest.get(corner)
      if (!known || interior < known.angle) sharpest.set(corner, { angle: interior, point: corner })
    })
  }
  const corners = [...sharpest.values()].sort((p, q) => comparePoints(p.point, q.point))
  for (const corner of corners) {
    warnings.push({
      code: 'sharp-angle',
      severity: 'warning',
      message: `A corner of ${corner.angle.toFixed(1)}° at ${at(corner.point)} is sharper than ${SHARP_ANGLE_DEGREES}°; it is hard to sew accurately.`,
      at: corner.point,
    })
  }
  return warnings
}
