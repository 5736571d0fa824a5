/**
 * Drawing design geometry (inches, y up) onto a jsPDF page (points, y down) through a view.
 *
 * Arcs are drawn as true arcs: jsPDF has no arc operator, so each arc becomes cubic Bézier
 * pieces of at most 90°, with control points k = 4/3·tan(θ/4) radii along the tangents. The
 * largest radial error of that approximation is about 2.7e-4 of the radius at 90° (under
 * 0.003 in on a 12 in arc, below any home printer's dot), and the path stays smooth. We draw
 * directly with jsPDF rather than through svg2pdf.js: the same code then runs in the browser and
 * in Node without a DOM, and every operator lands in the PDF as we wrote it (the tests read the
 * test squares back from the operator list).
 */
import type { jsPDF } from 'jspdf'
import { arcSweep, type ArcPathSegment, type OutlinePath, type Point, type Polygon, type SmoothCurve } from '@/geometry'
import { COUNT_SLACK, DEGENERATE_EXTENT_INCHES } from '@/geometry/tolerances'
import { POINTS_PER_INCH } from '@/lib/units'

/** Where design inches land on the page: `scale` points per inch (72 at true scale). */
export interface View {
  /** Points per inch: 72 for true scale, less for previews. */
  readonly scale: number
  /** Design x at the page position `left`. */
  readonly originX: number
  /** Design y at the page position `top` (y up in the design, down on the page). */
  readonly originY: number
  readonly left: number
  readonly top: number
}

/**
 * A view at true scale: 72 points per design inch.
 *
 * @example trueScaleView(0, 10, 36, 36) // design (0, 10) at page (36, 36)
 */
export function trueScaleView(originX: number, originY: number, left: number, top: number): View {
  return { scale: POINTS_PER_INCH, originX, originY, left, top }
}

/**
 * A view that fits the design box `[minX, minY, maxX, maxY]` into a page box, keeping proportions.
 *
 * @example fitView([0, 0, 10, 10], { x: 0, y: 0, width: 144, height: 144 }).scale // 14.4
 */
export function fitView(box: readonly [number, number, number, number], into: { x: number; y: number; width: number; height: number }): View {
  const [minX, minY, maxX, maxY] = box
  const scale = Math.min(into.width / Math.max(maxX - minX, DEGENERATE_EXTENT_INCHES), into.height / Math.max(maxY - minY, DEGENERATE_EXTENT_INCHES))
  const left = into.x + (into.width - (maxX - minX) * scale) / 2
  const top = into.y + (into.height - (maxY - minY) * scale) / 2
  return { scale, originX: minX, originY: maxY, left, top }
}

/**
 * A design point on the page.
 *
 * @example toPage(trueScaleView(0, 0, 0, 0), [1, -1]) // [72, 72]
 */
export function toPage(view: View, p: Point): [number, number] {
  return [view.left + (p[0] - view.originX) * view.scale, view.top + (view.originY - p[1]) * view.scale]
}

/**
 * Bézier pieces (each ≤ 90°) of an arc, in design coordinates: [control1, control2, end] each.
 *
 * @example arcToBeziers({ kind: 'arc', center: [0, 0], radius: 1, startAngle: 0, endAngle: Math.PI / 2, anticlockwise: true })
 * // one piece: [[1, 0.5523], [0.5523, 1], [0, 1]]
 */
export function arcToBeziers(arc: ArcPathSegment): [Point, Point, Point][] {
  const sweep = arcSweep(arc)
  const pieces = Math.max(1, Math.ceil(sweep / (Math.PI / 2) - COUNT_SLACK))
  const step = ((arc.anticlockwise ? 1 : -1) * sweep) / pieces
  const k = (4 / 3) * Math.tan(step / 4)
  const [cx, cy] = arc.center
  const r = arc.radius
  const result: [Point, Point, Point][] = []
  for (let i = 0; i < pieces; i += 1) {
    const a0 = arc.startAngle + step * i
    const a1 = a0 + step
    const p0: Point = [cx + r * Math.cos(a0), cy + r * Math.sin(a0)]
    const p3: Point = [cx + r * Math.cos(a1), cy + r * Math.sin(a1)]
    result.push([
      [p0[0] - k * r * Math.sin(a0), p0[1] + k * r * Math.cos(a0)],
      [p3[0] + k * r * Math.sin(a1), p3[1] - k * r * Math.cos(a1)],
      p3,
    ])
  }
  return result
}

/** Adds an outline path (lines and arcs) to the current PDF path, closed. */
export function tracePath(doc: jsPDF, view: View, path: OutlinePath, close = true): void {
  let first = true
  for (const segment of path) {
    const start = segment.kind === 'line' ? segment.from : ([segment.center[0] + segment.radius * Math.cos(segment.startAngle), segment.center[1] + segment.radius * Math.sin(segment.startAngle)] as Point)
    if (first) {
      doc.moveTo(...toPage(view, start))
      first = false
    }
    if (segment.kind === 'line') {
      doc.lineTo(...toPage(view, segment.to))
    } else {
      for (const [c1, c2, end] of arcToBeziers(segment)) {
        doc.curveTo(...toPage(view, c1), ...toPage(view, c2), ...toPage(view, end))
      }
    }
  }
  if (close && !first) doc.close()
}

/** Adds a polygon (or an open polyline when `close` is false) to the current PDF path. */
export function tracePolygon(doc: jsPDF, view: View, polygon: Polygon, close = true): void {
  polygon.forEach((point, index) => {
    if (index === 0) doc.moveTo(...toPage(view, point))
    else doc.lineTo(...toPage(view, point))
  })
  if (close && polygon.length > 0) doc.close()
}

/**
 * Adds a curl's smooth curve (`smoothCurve` of geometry, design coordinates) to the current PDF
 * path as the same cubic Bézier pieces the board draws, open.
 *
 * @example traceCurve(doc, view, smoothCurve(curl.points)); doc.stroke()
 */
export function traceCurve(doc: jsPDF, view: View, curve: SmoothCurve): void {
  if (curve.pieces.length === 0) return
  doc.moveTo(...toPage(view, curve.start))
  for (const [c1, c2, end] of curve.pieces) doc.curveTo(...toPage(view, c1), ...toPage(view, c2), ...toPage(view, end))
}

/**
 * '#rrggbb' to jsPDF's three numbers; an unknown fabric is drawn a neutral grey.
 *
 * @example rgb('#ff8000') // [255, 128, 0]
 */
export function rgb(colour: string | undefined): [number, number, number] {
  if (!colour || !/^#[0-9a-fA-F]{6}$/.test(colour)) return [210, 210, 210]
  return [parseInt(colour.slice(1, 3), 16), parseInt(colour.slice(3, 5), 16), parseInt(colour.slice(5, 7), 16)]
}

/** Solid lines, the given width in points, black unless told. */
export function solidPen(doc: jsPDF, widthPt: number, colour: [number, number, number] = [0, 0, 0]): void {
  doc.setLineDashPattern([], 0)
  doc.setLineWidth(widthPt)
  doc.setDrawColor(...colour)
}

/** Dashed lines (trim lines, cut lines). */
export function dashedPen(doc: jsPDF, widthPt: number, dash: number[] = [6, 3], colour: [number, number, number] = [0, 0, 0]): void {
  doc.setLineWidth(widthPt)
  doc.setDrawColor(...colour)
  doc.setLineDashPattern(dash, 0)
}
