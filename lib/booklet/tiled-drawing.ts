/**
 * A true-scale drawing printed across as many pages as it needs: each page shows one tile of
 * the drawing inside the printable area (clipped there, so nothing reaches the margin), named
 * "sheet 2 of 4" with its row and column in words, with alignment targets in the overlap it shares with each
 * neighbour, a page map of all tiles, and the test squares.
 */
import type { jsPDF } from 'jspdf'
import type { Point, Polygon, Segment } from '@/geometry'
import { POINTS_PER_INCH } from '@/lib/units'
import { drawHeader, drawTestSquares, font, HEADER_HEIGHT_PT, TEST_BAND_HEIGHT_PT } from './chrome'
import { startPage, type BookletContext } from './context'
import { dashedPen, solidPen, toPage, trueScaleView, type View } from './draw'
import type { PageFrame, PageRect } from './paper'
import { layoutTiles, overlapStrips, sheetName, type SheetSegment, type Tile, type TileLayout } from './tiling'

export interface TiledDrawing {
  readonly title: string
  /** A line under the title: which side, what to make. */
  readonly note: string
  /** The design-inch box to print, padding included: [minX, minY, maxX, maxY]. */
  readonly box: readonly [number, number, number, number]
  /** The outline shown on the page map, design inches. */
  readonly outline: Polygon
  /** Draws the content through `view`; `window` is the page rectangle the content is clipped to. */
  readonly draw: (doc: jsPDF, view: View, window: PageRect) => void
  /** Lines to keep out of the tiles' overlaps where a shift can (the seams), design inches. */
  readonly keepClear?: readonly Segment[]
}

/** Space between the drawing window and the test-square band, points. */
const GAP_PT = 6
/** Width of the page map at the foot of a tiled page, points. */
const PAGE_MAP_WIDTH_PT = 150

/**
 * Where the drawing window sits on a page of this frame.
 *
 * @example drawingWindow(pageFrame({ paper: 'letter', orientation: 'portrait', marginInches: 0.4 })).width // 554.4
 */
export function drawingWindow(frame: PageFrame): PageRect {
  const { x, y, width, height } = frame.printable
  return { x, y: y + HEADER_HEIGHT_PT, width, height: height - HEADER_HEIGHT_PT - TEST_BAND_HEIGHT_PT - GAP_PT }
}

/**
 * Design-inch lines of a drawing's box on its sheet: points, origin at the box's top left, y down.
 *
 * @example onSheet([0, 0, 10, 10], [[[1, 10], [1, 0]]]) // [[[72, 0], [72, 720]]]
 */
export function onSheet(box: readonly [number, number, number, number], lines: readonly Segment[]): SheetSegment[] {
  const at = (p: Point): [number, number] => [(p[0] - box[0]) * POINTS_PER_INCH, (box[3] - p[1]) * POINTS_PER_INCH]
  return lines.map(([a, b]) => [at(a), at(b)] as const)
}

/**
 * The tiles of a drawing of the given design-inch box on pages of this frame, shifted to keep the
 * `keepClear` lines (design inches) out of the overlaps where the spare room allows.
 *
 * @example tileDrawing(frame, [0, 0, 12, 12], 36).tiles.length // 4 on Letter portrait
 */
export function tileDrawing(frame: PageFrame, box: readonly [number, number, number, number], overlapPt: number, keepClear: readonly Segment[] = []): TileLayout {
  const window = drawingWindow(frame)
  return layoutTiles((box[2] - box[0]) * POINTS_PER_INCH, (box[3] - box[1]) * POINTS_PER_INCH, window, overlapPt, onSheet(box, keepClear))
}

/**
 * The view that puts the sheet's tile `tile` into the page window (true scale, 72 pt per inch).
 *
 * @example tileView(drawing.box, tile, drawingWindow(frame))
 */
export function tileView(box: readonly [number, number, number, number], tile: Tile, window: PageRect): View {
  return trueScaleView(box[0], box[3], window.x - tile.window.x, window.y - tile.window.y)
}

/**
 * Writes every tile of the drawing on its own page. Returns the layout (for tests and the page map).
 *
 * @example writeTiledDrawing(context, { title: 'Foundation A', note: 'Printed side', box, outline, draw })
 */
export function writeTiledDrawing(context: BookletContext, drawing: TiledDrawing): TileLayout {
  const { doc, frame } = context
  const overlapPt = context.model.options.overlapInches * POINTS_PER_INCH
  const layout = tileDrawing(frame, drawing.box, overlapPt, drawing.keepClear)
  const window = drawingWindow(frame)
  for (const tile of layout.tiles) {
    const page = startPage(context)
    const sheets = layout.tiles.length
    // Sheets are named by number and place in words, never like an area label (A1, B2).
    const tiled = sheets > 1 ? `${sheetName(tile.sheet, sheets)}: ${tile.label} of ${layout.rows} row${layout.rows > 1 ? 's' : ''} × ${layout.columns} column${layout.columns > 1 ? 's' : ''}; ` : ''
    drawHeader(doc, frame, drawing.title, `${drawing.note} ${tiled}booklet page ${page}.`, sheets > 1 ? sheetName(tile.sheet, sheets) : undefined)
    const view = tileView(drawing.box, tile, window)
    doc.saveGraphicsState()
    doc.rect(window.x, window.y, window.width, window.height, null)
    doc.clip()
    doc.discardPath()
    // Targets first, so a label's white ground can cover one it happens to sit on.
    drawAlignment(doc, layout, tile, view)
    drawing.draw(doc, view, window)
    doc.restoreGraphicsState()
    // The window's frame: the line to trim one page along before laying it over its neighbour.
    if (layout.tiles.length > 1) {
      solidPen(doc, 0.3, [150, 150, 150])
      doc.rect(window.x, window.y, window.width, window.height, 'S')
    }
    const bandTop = frame.printable.y + frame.printable.height - TEST_BAND_HEIGHT_PT
    const mapWidth = Math.min(PAGE_MAP_WIDTH_PT, frame.printable.width / 4)
    const textWidth = frame.printable.width - (72 + 10 + 57 + 10) - mapWidth - 16
    drawTestSquares(doc, frame.printable.x, bandTop, textWidth)
    drawPageMap(doc, layout, tile, drawing, { x: frame.printable.x + frame.printable.width - mapWidth, y: bandTop, width: mapWidth, height: TEST_BAND_HEIGHT_PT })
  }
  return layout
}

/** Sheet points (origin top left of the box, y down) to the page, for the tile's view. */
const sheetToPage = (view: View, x: number, y: number): [number, number] => [view.left + x, view.top + y]

/**
 * Targets in each overlap strip (the same sheet positions on both pages, so they land on each
 * other when the pages are laid together) and a dotted line where the neighbour's window ends.
 */
function drawAlignment(doc: jsPDF, layout: TileLayout, tile: Tile, view: View): void {
  const spacing = 2 * POINTS_PER_INCH
  for (const strip of overlapStrips(layout, tile)) {
    const { rect } = strip
    const along = strip.vertical ? rect.height : rect.width
    const count = Math.max(2, Math.floor(along / spacing))
    for (let i = 0; i < count; i += 1) {
      const t = (i + 0.5) / count
      const [x, y] = strip.vertical ? sheetToPage(view, rect.x + rect.width / 2, rect.y + t * rect.height) : sheetToPage(view, rect.x + t * rect.width, rect.y + rect.height / 2)
      solidPen(doc, 0.5)
      doc.circle(x, y, 6, 'S')
      doc.line(x - 10, y, x + 10, y)
      doc.line(x, y - 10, x, y + 10)
    }
    // Where the neighbour's window edge falls: the far side of the strip from this page's edge.
    const neighbourIsAfter = strip.vertical ? rect.x > tile.window.x + 1 : rect.y > tile.window.y + 1
    dashedPen(doc, 0.5, [1.5, 2.5], [90, 90, 90])
    const [x0, y0] = sheetToPage(view, rect.x, rect.y)
    const [x1, y1] = sheetToPage(view, rect.x + rect.width, rect.y + rect.height)
    if (strip.vertical) {
      const edge = neighbourIsAfter ? x0 : x1
      doc.line(edge, y0, edge, y1)
      font(doc, 6, 'bold', 70)
      doc.text(strip.neighbour, (x0 + x1) / 2, y0 + 12, { align: 'center' })
    } else {
      const edge = neighbourIsAfter ? y0 : y1
      doc.line(x0, edge, x1, edge)
      font(doc, 6, 'bold', 70)
      doc.text(strip.neighbour, x0 + 14, (y0 + y1) / 2 + 2, { align: 'center' })
    }
    doc.setLineDashPattern([], 0)
  }
}

/** A small map of all tiles over the drawing's outline, this page's tile shaded. */
function drawPageMap(doc: jsPDF, layout: TileLayout, current: Tile, drawing: TiledDrawing, into: PageRect): void {
  const first = layout.tiles[0]!.window
  const last = layout.tiles[layout.tiles.length - 1]!.window
  const covered = { x: first.x, y: first.y, width: last.x + last.width - first.x, height: last.y + last.height - first.y }
  const labelRoom = 9
  const factor = Math.min(into.width / covered.width, (into.height - labelRoom) / covered.height)
  const left = into.x + into.width - covered.width * factor
  const top = into.y + labelRoom
  const toMap = (x: number, y: number): [number, number] => [left + (x - covered.x) * factor, top + (y - covered.y) * factor]
  font(doc, 6.5, 'normal', 60)
  doc.text('Page map', left, into.y + 6)
  for (const tile of layout.tiles) {
    const [x, y] = toMap(tile.window.x, tile.window.y)
    solidPen(doc, 0.4, [120, 120, 120])
    if (tile === current) {
      doc.setFillColor(225, 225, 225)
      doc.rect(x, y, tile.window.width * factor, tile.window.height * factor, 'FD')
    } else {
      doc.rect(x, y, tile.window.width * factor, tile.window.height * factor, 'S')
    }
  }
  const sheetView: View = { scale: POINTS_PER_INCH, originX: drawing.box[0], originY: drawing.box[3], left: 0, top: 0 }
  solidPen(doc, 0.6)
  drawing.outline.forEach((point: Point, index) => {
    const [sx, sy] = toPage(sheetView, point)
    const [x, y] = toMap(sx, sy)
    if (index === 0) doc.moveTo(x, y)
    else doc.lineTo(x, y)
  })
  doc.close()
  doc.stroke()
  font(doc, 6, 'bold', 30)
  // Each cell carries its sheet number alone: a number can never be read as an area label.
  for (const tile of layout.tiles) {
    const [x, y] = toMap(tile.window.x + tile.window.width / 2, tile.window.y + tile.window.height / 2)
    doc.text(String(tile.sheet), x, y + 2, { align: 'center' })
  }
}
