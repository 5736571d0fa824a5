/**
 * Tiling a true-scale drawing across pages. The drawing lives on a "sheet": points, origin top
 * left, y down, as large as it needs to be. Each tile is a window of the sheet the size of a
 * page's drawing area; neighbouring windows share `overlap` points, so the printed pages can be
 * laid over each other along the overlap and taped. Nothing is ever scaled to fit.
 */
import { COUNT_SLACK } from '@/geometry/tolerances'
import type { PageRect } from './paper'

export interface Tile {
  /**
   * Where the tile lies, in words: "row 1, column 2". Never of the form of an area label (A1,
   * B12): a page named like an area invites taping and sewing mistakes.
   */
  readonly label: string
  /** The tile's number among its drawing's tiles, from 1, row by row: the "2" of "sheet 2 of 4". */
  readonly sheet: number
  readonly row: number
  readonly column: number
  /** The part of the sheet this page shows, points. */
  readonly window: PageRect
}

export interface TileLayout {
  readonly rows: number
  readonly columns: number
  readonly overlapPt: number
  readonly tiles: readonly Tile[]
  /** The whole sheet the tiles were laid over, points. */
  readonly sheet: PageRect
}

/**
 * A tile's place in words, rows and columns counted from 1. It always holds a space and lower-case
 * words, so it can never be read as an area label (capital letters then digits).
 *
 * @example tileLabel(1, 2) // 'row 2, column 3'
 */
export function tileLabel(row: number, column: number): string {
  return `row ${row + 1}, column ${column + 1}`
}

/**
 * A tile's page name: "sheet 2 of 4" (or "sheet 2" when the count goes without saying, as beside
 * an alignment mark).
 *
 * @example sheetName(2, 4) // 'sheet 2 of 4'
 */
export function sheetName(sheet: number, sheets?: number): string {
  return sheets === undefined ? `sheet ${sheet}` : `sheet ${sheet} of ${sheets}`
}

/** How many windows of `size`, stepping by `size − overlap`, cover `length`. */
function countAlong(length: number, size: number, overlap: number): number {
  if (length <= size) return 1
  return Math.ceil((length - overlap) / (size - overlap) - COUNT_SLACK)
}

/** A straight line on the sheet, points (origin top left, y down). */
export type SheetSegment = readonly [readonly [number, number], readonly [number, number]]

/** Origin shifts tried across the spare room of a row or column: this many steps, ends included. */
const SHIFT_STEPS = 24
/**
 * A seam closer than this to an overlap strip counts as in it, points: the strip's edges are
 * where a page is trimmed and laid, and the targets' crosses reach to them.
 */
const STRIP_CLEARANCE_PT = 4

/** Length of the part of `segment` whose coordinate `axis` lies in [low, high], points. */
function lengthInSlab(segment: SheetSegment, axis: 0 | 1, low: number, high: number): number {
  const [a, b] = segment
  const length = Math.hypot(b[0] - a[0], b[1] - a[1])
  const from = a[axis]
  const to = b[axis]
  if (from === to) return from >= low && from <= high ? length : 0
  const t0 = Math.max(0, Math.min((low - from) / (to - from), (high - from) / (to - from)))
  const t1 = Math.min(1, Math.max((low - from) / (to - from), (high - from) / (to - from)))
  return t1 > t0 ? (t1 - t0) * length : 0
}

/**
 * Where the first window starts along one axis: centred in the spare room, unless another start
 * within it (so the sheet is still covered by the same number of windows) keeps less seam length
 * inside the overlap strips; ties go to the start nearest the centre, then the smaller.
 */
function chooseStart(count: number, step: number, overlap: number, spare: number, keepClear: readonly SheetSegment[], axis: 0 | 1): number {
  const centred = -spare / 2
  if (count < 2 || keepClear.length === 0 || spare <= 0) return centred
  const cost = (start: number): number => {
    let total = 0
    for (let k = 1; k < count; k += 1) {
      const low = start + k * step - STRIP_CLEARANCE_PT
      const high = start + k * step + overlap + STRIP_CLEARANCE_PT
      for (const segment of keepClear) total += lengthInSlab(segment, axis, low, high)
    }
    return total
  }
  let best = { start: centred, cost: cost(centred) }
  for (let i = 0; i <= SHIFT_STEPS; i += 1) {
    const start = -spare * (i / SHIFT_STEPS)
    const here = cost(start)
    const nearer = Math.abs(start - centred) < Math.abs(best.start - centred)
    if (here < best.cost - LENGTH_TIE_PT || (Math.abs(here - best.cost) <= LENGTH_TIE_PT && nearer)) best = { start, cost: here }
  }
  return best.start
}

/** Seam lengths closer than this, points, count as equal when choosing a shift. */
const LENGTH_TIE_PT = 0.01

/**
 * Windows of `window.width × window.height` points covering a sheet of `sheetWidth × sheetHeight`
 * points, neighbours overlapping by `overlapPt`. When the sheet is smaller than one window it is
 * centred in it (window origins may then be negative). Extra room left by the last row or column
 * is shared equally on both sides, so the drawing sits in the middle of its tiles, unless
 * `keepClear` lines (the seams, sheet points) would then run inside an overlap strip, where a
 * page is trimmed and the targets sit: the windows are then shifted within the spare room to keep
 * the least seam length in the strips. Never more windows than the sheet needs.
 *
 * @example layoutTiles(1000, 500, { width: 540, height: 700 }, 36).tiles.map((t) => t.label) // ['row 1, column 1', 'row 1, column 2']
 */
export function layoutTiles(
  sheetWidth: number, sheetHeight: number, window: { width: number; height: number }, overlapPt: number, keepClear: readonly SheetSegment[] = [],
): TileLayout {
  if (!(window.width > overlapPt && window.height > overlapPt)) throw new RangeError('a page must be larger than the overlap')
  const columns = countAlong(sheetWidth, window.width, overlapPt)
  const rows = countAlong(sheetHeight, window.height, overlapPt)
  const stepX = window.width - overlapPt
  const stepY = window.height - overlapPt
  const coveredWidth = columns * stepX + overlapPt
  const coveredHeight = rows * stepY + overlapPt
  // Centre the drawing (spare room split evenly), or shift it within the spare room to keep seams out of the overlaps.
  const startX = chooseStart(columns, stepX, overlapPt, Math.max(coveredWidth, window.width) - sheetWidth, keepClear, 0)
  const startY = chooseStart(rows, stepY, overlapPt, Math.max(coveredHeight, window.height) - sheetHeight, keepClear, 1)
  const tiles: Tile[] = []
  for (let row = 0; row < rows; row += 1) {
    for (let column = 0; column < columns; column += 1) {
      tiles.push({
        label: tileLabel(row, column),
        sheet: row * columns + column + 1,
        row,
        column,
        window: { x: startX + column * stepX, y: startY + row * stepY, width: window.width, height: window.height },
      })
    }
  }
  return { rows, columns, overlapPt, tiles, sheet: { x: 0, y: 0, width: sheetWidth, height: sheetHeight } }
}

/**
 * Seam length inside the overlap strips of a layout (strips widened by the clearance), points: what
 * `layoutTiles` keeps as small as its spare room allows.
 *
 * @example seamLengthInOverlaps(layoutTiles(1000, 500, { width: 540, height: 700 }, 36), [[[500, 0], [500, 500]]]) // 500: the centred strip is 482 to 518
 */
export function seamLengthInOverlaps(layout: TileLayout, keepClear: readonly SheetSegment[]): number {
  let total = 0
  const first = layout.tiles[0]
  if (!first) return 0
  const step = (axis: 0 | 1): number => (axis === 0 ? first.window.width : first.window.height) - layout.overlapPt
  for (const [axis, count, origin] of [[0, layout.columns, first.window.x], [1, layout.rows, first.window.y]] as const) {
    for (let k = 1; k < count; k += 1) {
      const low = origin + k * step(axis) - STRIP_CLEARANCE_PT
      for (const segment of keepClear) total += lengthInSlab(segment, axis, low, low + layout.overlapPt + 2 * STRIP_CLEARANCE_PT)
    }
  }
  return total
}

/**
 * The overlap strips a tile shares with its right and lower neighbours, for alignment marks.
 *
 * @example overlapStrips(layout, layout.tiles[0]!) // [{ neighbour: 'sheet 2', rect: … }, { neighbour: 'sheet 3', rect: … }] on 2 × 2 tiles
 */
export function overlapStrips(layout: TileLayout, tile: Tile): { neighbour: string; rect: PageRect; vertical: boolean }[] {
  const strips: { neighbour: string; rect: PageRect; vertical: boolean }[] = []
  const { window } = tile
  const o = layout.overlapPt
  const neighbours: [number, number][] = [[tile.row, tile.column - 1], [tile.row, tile.column + 1], [tile.row - 1, tile.column], [tile.row + 1, tile.column]]
  for (const [row, column] of neighbours) {
    if (row < 0 || column < 0 || row >= layout.rows || column >= layout.columns) continue
    const vertical = row === tile.row
    const rect: PageRect = vertical
      ? { x: column > tile.column ? window.x + window.width - o : window.x, y: window.y, width: o, height: window.height }
      : { x: window.x, y: row > tile.row ? window.y + window.height - o : window.y, width: window.width, height: o }
    strips.push({ neighbour: sheetName(row * layout.columns + column + 1), rect, vertical })
  }
  return strips
}
