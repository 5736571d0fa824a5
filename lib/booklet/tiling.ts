/**
 * Tiling a true-scale drawing across pages. The drawing lives on a "sheet": points, origin top
 * left, y down, as large as it needs to be. Each tile is a window of the sheet the size of a
 * page's drawing area; neighbouring windows share `overlap` points, so the printed pages can be
 * laid over each other along the overlap and taped. Nothing is ever scaled to fit.
 */
import type { PageRect } from './paper'

export interface Tile {
  /** Row letter + column number, as maps and atlases name their squares: A1, A2, B1 … */
  readonly label: string
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
 * A1, A2 …: the row as letters (A … Z, AA …), the column as a number from 1.
 *
 * @example tileLabel(1, 2) // 'B3'
 */
export function tileLabel(row: number, column: number): string {
  let letters = ''
  let rest = row
  do {
    letters = String.fromCharCode(65 + (rest % 26)) + letters
    rest = Math.floor(rest / 26) - 1
  } while (rest >= 0)
  return `${letters}${column + 1}`
}

/** How many windows of `size`, stepping by `size − overlap`, cover `length`. */
function countAlong(length: number, size: number, overlap: number): number {
  if (length <= size) return 1
  return Math.ceil((length - overlap) / (size - overlap) - 1e-9)
}

/**
 * Windows of `window.width × window.height` points covering a sheet of `sheetWidth × sheetHeight`
 * points, neighbours overlapping by `overlapPt`. When the sheet is smaller than one window it is
 * centred in it (window origins may then be negative). Extra room left by the last row or column
 * is shared equally on both sides, so the drawing sits in the middle of its tiles.
 *
 * @example layoutTiles(1000, 500, { width: 540, height: 700 }, 36).tiles.map((t) => t.label) // ['A1', 'A2']
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
 * @example overlapStrips(layout, layout.tiles[0]!) // [{ neighbour: 'A2', rect: … }, { neighbour: 'B1', rect: … }]
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
    strips.push({ neighbour: tileLabel(row, column), rect, vertical })
  }
  return strips
}
