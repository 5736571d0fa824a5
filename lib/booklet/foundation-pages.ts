/**
 * Foundation pages: every section of every kind of repeat, printed side up (the mirror image of
 * the finished quilt), at true scale, tiled across the paper. Seam lines solid, the trim line
 * dashed one allowance outside, arcs as true arcs, each area labelled with its fabric, leaf
 * basting marks on their seams with the layer fabrics beside them.
 *
 * Text is never mirrored: the geometry goes through the printed-side transform and the labels are
 * written, upright, at the transformed places.
 */
import type { jsPDF } from 'jspdf'
import {
  applyToPolygon, applyTransform, compose, convexHull, outlineFromPolygon, rotationAboutCentre, sectionTrimLine,
  type AffineTransform, type Point, type Polygon, type Segment,
} from '@/geometry'
import { SHEET_AREA_TIE_SQ_IN } from '@/geometry/tolerances'
import { POINTS_PER_INCH } from '@/lib/units'
import { font } from './chrome'
import type { BookletContext } from './context'
import { dashedPen, solidPen, toPage, tracePath, tracePolygon, type View } from './draw'
import { leafName } from './leaves'
import { fabricName, leavesInBooklet, sectionAreas, type BookletModel, type FoundationKind } from './model'
import { pageFrame, type PageRect } from './paper'
import { tileDrawing, writeTiledDrawing, type TiledDrawing } from './tiled-drawing'
import type { TileLayout } from './tiling'

/** Room around the trim line on the sheet, inches, so labels and marks near it stay on paper. */
const SHEET_PADDING_INCHES = 0.2

/** One foundation as drawn: its kind, areas and trim line on the printed side. */
export interface FoundationSheet {
  readonly kind: FoundationKind
  /**
   * From repeat 0's frame to the sheet: the printed-side mirror, then a turn about the ring's
   * centre that lays the foundation across the fewest pages.
   */
  readonly placement: AffineTransform
  readonly title: string
  /** Design-inch box of the sheet (padding included). */
  readonly box: readonly [number, number, number, number]
  /** The trim line as chords, printed side, design inches. */
  readonly trimPolygon: Polygon
  readonly drawing: TiledDrawing
}

/**
 * The sheets of every foundation to print, before any page is written.
 *
 * @example foundationSheets(model).map((sheet) => sheet.title) // ['Hollyberry Wreath - Foundation A - every repeat (all 4): make 4', …]
 */
export function foundationSheets(model: BookletModel): FoundationSheet[] {
  return model.foundations.map((kind) => foundationSheet(model, kind))
}

/** The sheet's box around a trim outline, padding included, design inches. */
function sheetBox(outline: readonly Point[]): readonly [number, number, number, number] {
  const xs = outline.map((p) => p[0])
  const ys = outline.map((p) => p[1])
  return [
    Math.min(...xs) - SHEET_PADDING_INCHES, Math.min(...ys) - SHEET_PADDING_INCHES,
    Math.max(...xs) + SHEET_PADDING_INCHES, Math.max(...ys) + SHEET_PADDING_INCHES,
  ] as const
}

/**
 * The turn about the ring's centre that puts a foundation on the fewest pages: the smallest
 * covering rectangle has a side along an edge of the outline's hull, so each hull edge is tried
 * lying along the page and across it. A turn keeps the printed side's handedness and the arcs'
 * centre, so nothing else about the foundation changes. Ties keep the outline as it lies in the
 * ring (no turn), then the smaller sheet.
 */
function fewestPagesTurn(model: BookletModel, outline: readonly Point[]): number {
  const frame = pageFrame(model.options)
  const overlapPt = model.options.overlapInches * POINTS_PER_INCH
  const hull = convexHull(outline)
  const turns = [0, ...hull.flatMap((a, i) => {
    const b = hull[(i + 1) % hull.length]!
    const along = -Math.atan2(b[1] - a[1], b[0] - a[0])
    return [along, along + Math.PI / 2]
  })]
  let best = { turn: 0, pages: Infinity, area: Infinity }
  for (const turn of turns) {
    const box = sheetBox(applyToPolygon(rotationAboutCentre(turn), outline))
    const pages = tileDrawing(frame, box, overlapPt).tiles.length
    const area = (box[2] - box[0]) * (box[3] - box[1])
    if (pages < best.pages || (pages === best.pages && area < best.area - SHEET_AREA_TIE_SQ_IN && best.turn !== 0)) best = { turn, pages, area }
  }
  return best.turn
}

function foundationSheet(model: BookletModel, kind: FoundationKind): FoundationSheet {
  const { design } = model
  const areas = sectionAreas(model, kind.section)
  const mirroredOutline = sectionTrimLine(areas.map((area) => applyToPolygon(kind.printedSide, area.polygon)), design.ring).polygon
  const placement = compose(rotationAboutCentre(fewestPagesTurn(model, mirroredOutline)), kind.printedSide)
  const printed = areas.map((area) => ({ area, polygon: applyToPolygon(placement, area.polygon) }))
  const trim = sectionTrimLine(printed.map((p) => p.polygon), design.ring)
  const box = sheetBox(trim.polygon)
  const title = `Foundation ${kind.section} - ${kind.repeatName}: make ${kind.count}`
  const leaves = leavesOfSection(model, kind, placement)
  const draw = (doc: jsPDF, view: View, window: PageRect): void => {
    dashedPen(doc, 0.75, [6, 3])
    tracePath(doc, view, trim.path)
    doc.stroke()
    solidPen(doc, 0.8)
    for (const { polygon } of printed) {
      tracePath(doc, view, outlineFromPolygon(polygon, design.ring))
      doc.stroke()
    }
    // Area labels are placed first, so the leaf notes can keep clear of them.
    const labels = printed.flatMap(({ area }) => {
      const at = toPage(view, applyTransform(placement, area.point))
      font(doc, 6.5)
      const fabric = fittingName(fabricName(model, model.fabricOf.get(area.id) ?? ''), (text) => fitsIn(window, at, Math.max(doc.getTextWidth(text), 20) / 2 + 2, 12))
      if (fabric === null) return []
      const fabricWidth = doc.getTextWidth(fabric)
      font(doc, 10, 'bold')
      const groundWidth = Math.max(fabricWidth, doc.getTextWidth(area.label ?? '')) + 4
      const ground: PageRect = { x: at[0] - groundWidth / 2, y: at[1] - 9, width: groundWidth, height: 19.5 }
      return [{ label: area.label ?? '', fabric, at, ground }]
    })
    const taken = labels.map((label) => label.ground)
    for (const leaf of leaves) drawLeafMarks(doc, view, window, leaf, taken)
    for (const { label, fabric, at, ground } of labels) {
      // A white ground keeps the label legible over a seam or an alignment target.
      doc.setFillColor(255, 255, 255)
      doc.rect(ground.x, ground.y, ground.width, ground.height, 'F')
      font(doc, 10, 'bold')
      doc.text(label, at[0], at[1], { align: 'center' })
      font(doc, 6.5, 'normal', 50)
      doc.text(fabric, at[0], at[1] + 8, { align: 'center' })
    }
  }
  const note = kind.mirroredRepeat
    ? 'Printed side of the mirrored repeats. Solid: seams; dashed: trim line.'
    : 'Printed side (mirror image of the quilt). Solid: seams; dashed: trim line.'
  return {
    kind,
    placement,
    title: `${design.name} - ${title}`,
    box,
    trimPolygon: trim.polygon,
    drawing: { title: `${design.name} - ${title}`, note, box, outline: trim.polygon, draw, keepClear: seamLines(printed.map((p) => p.polygon)) },
  }
}

/**
 * Every solid line of a foundation (each area's edges, arcs as their chords), each shared edge
 * once: the lines the tiling keeps out of the overlaps.
 */
function seamLines(polygons: readonly Polygon[]): Segment[] {
  const seen = new Set<string>()
  const key = (p: Point): string => `${p[0].toFixed(4)},${p[1].toFixed(4)}`
  const lines: Segment[] = []
  for (const polygon of polygons) {
    polygon.forEach((a, i) => {
      const b = polygon[(i + 1) % polygon.length]!
      const id = [key(a), key(b)].sort().join(' ')
      if (seen.has(id)) return
      seen.add(id)
      lines.push([a, b])
    })
  }
  return lines
}

/** A leaf as printed on a foundation: its outline, the marks on its seam, its layers. */
interface PrintedLeaf {
  /** Its plain name ("leaf 1 of A2"), never its id. */
  readonly name: string
  /** Its layers' fabrics by name in the booklet's colourway, bottom first. */
  readonly layers: readonly string[]
  readonly outline: Polygon
  readonly ticks: readonly [Point, Point][]
  readonly tip: Point
}

/** The leaves lying over an area of this section, placed as the sheet is. */
function leavesOfSection(model: BookletModel, kind: FoundationKind, sheetPlacement: AffineTransform): PrintedLeaf[] {
  return leavesInBooklet(model)
    .filter((entry) => entry.section === kind.section)
    .map(({ leaf, placement }) => {
      const { base, rawEdge } = placement
      // A tick across the seam at each end of the open edge: from the raw edge, through the seam, as far again.
      const mid: Point = [(rawEdge[0][0] + rawEdge[1][0]) / 2, (rawEdge[0][1] + rawEdge[1][1]) / 2]
      const toSeam: Point = [base[0] - mid[0], base[1] - mid[1]]
      const ticks = rawEdge.map((end): [Point, Point] => [end, [end[0] + 2 * toSeam[0], end[1] + 2 * toSeam[1]]])
      const t = sheetPlacement
      return {
        name: leafName(model, leaf.id),
        layers: leaf.layers.map((fabric) => fabricName(model, fabric)),
        outline: applyToPolygon(t, placement.finishedOutline),
        ticks: ticks.map(([a, b]): [Point, Point] => [applyTransform(t, a), applyTransform(t, b)]),
        tip: applyTransform(t, placement.tip),
      }
    })
}

/** Room around a leaf note kept clear of area labels and other notes, points. */
const NOTE_CLEARANCE_PT = 1.5
/** How far from a leaf's tip its note may be written, nearest first, points. */
const NOTE_GAPS_PT = [3, 16, 32, 56] as const

const overlaps = (a: PageRect, b: PageRect): boolean =>
  a.x < b.x + b.width + NOTE_CLEARANCE_PT && b.x < a.x + a.width + NOTE_CLEARANCE_PT
  && a.y < b.y + b.height + NOTE_CLEARANCE_PT && b.y < a.y + a.height + NOTE_CLEARANCE_PT

/**
 * The leaf's dashed outline and tick marks, and its note (name and layers) beside its tip at the
 * first place that stays inside the window and clear of every rectangle in `taken` (area labels,
 * earlier notes); no place, no note (the sewing steps say the same in full). The note's box is
 * added to `taken`.
 */
function drawLeafMarks(doc: jsPDF, view: View, window: PageRect, leaf: PrintedLeaf, taken: PageRect[]): void {
  dashedPen(doc, 0.5, [2, 1.5], [80, 80, 80])
  tracePolygon(doc, view, leaf.outline)
  doc.stroke()
  solidPen(doc, 1.4)
  for (const [a, b] of leaf.ticks) doc.line(...toPage(view, a), ...toPage(view, b))
  doc.setLineDashPattern([], 0)
  const at = toPage(view, leaf.tip)
  font(doc, 6, 'italic', 30)
  const lines = [`${leaf.name}: baste`, leaf.layers.length > 1 ? `${leaf.layers.join(', ')} (bottom first)` : (leaf.layers[0] ?? '')]
  const width = Math.max(...lines.map((line) => doc.getTextWidth(line)))
  // Two lines of 6 pt: from the first cap height to below the second baseline's descenders.
  const height = 6 + 7 + 2
  // Beside the tip first, then farther out (with a leader line back to the tip) when labels crowd it.
  for (const gap of NOTE_GAPS_PT) {
    const candidates: [number, number][] = [
      [at[0] + gap, at[1] - 6], [at[0] - gap - width, at[1] - 6], [at[0] - width / 2, at[1] - gap - height], [at[0] - width / 2, at[1] + gap],
      [at[0] + gap, at[1] - gap - height], [at[0] - gap - width, at[1] - gap - height], [at[0] + gap, at[1] + gap], [at[0] - gap - width, at[1] + gap],
    ]
    for (const [x, top] of candidates) {
      const box: PageRect = { x, y: top, width, height }
      const inside = x > window.x && x + width < window.x + window.width - 2 && top > window.y && top + height < window.y + window.height
      if (!inside || taken.some((other) => overlaps(box, other))) continue
      taken.push(box)
      if (gap > NOTE_GAPS_PT[0]!) {
        solidPen(doc, 0.3, [90, 90, 90])
        const nearX = Math.max(box.x, Math.min(at[0], box.x + box.width))
        const nearY = Math.max(box.y, Math.min(at[1], box.y + box.height))
        doc.line(at[0], at[1], nearX, nearY)
      }
      font(doc, 6, 'italic', 30)
      doc.text(lines, x, top + 6)
      return
    }
  }
}

/**
 * A fabric's name as it fits under an area label: whole, or cut short with "..." (a long display
 * name must not cost the area its label); null when not even a short one fits.
 *
 * @example fittingName('Snowberry white tone-on-tone', (text) => text.length <= 12) // 'Snowberry...'
 */
export function fittingName(name: string, fits: (text: string) => boolean): string | null {
  if (fits(name)) return name
  for (let length = name.length - 1; length >= 4; length -= 1) {
    const short = `${name.slice(0, length).trimEnd()}...`
    if (fits(short)) return short
  }
  return null
}

/** True when a box of half-width `halfWidth` and `height` below the baseline-ish point fits the window. */
function fitsIn(window: PageRect, at: [number, number], halfWidth: number, height: number): boolean {
  return at[0] - halfWidth > window.x && at[0] + halfWidth < window.x + window.width && at[1] - height > window.y && at[1] + height < window.y + window.height
}

/**
 * Writes every foundation, each tiled across as many pages as it needs.
 *
 * @example writeFoundationPages(context) // one layout per foundation
 */
export function writeFoundationPages(context: BookletContext): { sheet: FoundationSheet; layout: TileLayout }[] {
  return foundationSheets(context.model).map((sheet) => ({ sheet, layout: writeTiledDrawing(context, sheet.drawing) }))
}
