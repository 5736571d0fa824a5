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

/**
 * Windows of `window.width × window.height` points covering a sheet of `sheetWidth × sheetHeight`
 * points, neighbours overlapping by `overlapPt`. When the sheet is smaller than one window it is
 * centred in it (window origins may then be negative). Extra room left by the last row or column
 * is shared equally on both sides, so the drawing sits in the middle of its tiles.
 *
 * @example layoutTiles(1000, 500, { width: 540, height: 700 }, 36).tiles.map((t) => t.label) // ['row 1, column 1', 'row 1, column 2']
 */
export function layoutTiles(sheetWidth: number, sheetHeight: number, window: { width: number; height: number }, overlapPt: number): TileLayout {
  if (!(window.width > overlapPt && window.height > overlapPt)) throw new RangeError('a page must be larger than the overlap')
  const columns = countAlong(sheetWidth, window.width, overlapPt)
  const rows = countAlong(sheetHeight, window.height, overlapPt)
  const stepX = window.width - overlapPt
  const stepY = window.height - overlapPt
  const coveredWidth = columns * stepX + overlapPt
  const coveredHeight = rows * stepY + overlapPt
  // Centre the drawing: spare room split evenly, whether one tile or several.
  const startX = -(Math.max(coveredWidth, window.width) - sheetWidth) / 2
  const startY = -(Math.max(coveredHeight, window.height) - sheetHeight) / 2
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
