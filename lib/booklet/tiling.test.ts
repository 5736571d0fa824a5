import { describe, expect, it } from 'vitest'
import { layoutTiles, overlapStrips, seamLengthInOverlaps, sheetName, tileLabel, type SheetSegment } from './tiling'

describe('tile layout', () => {
  it('names tiles so no name can be read as an area label (capital letters then digits)', () => {
    expect(tileLabel(0, 0)).toBe('row 1, column 1')
    expect(tileLabel(1, 2)).toBe('row 2, column 3')
    expect(sheetName(2, 4)).toBe('sheet 2 of 4')
    const layout = layoutTiles(3000, 3000, { width: 540, height: 700 }, 36)
    expect(layout.tiles.map((tile) => tile.sheet)).toEqual(layout.tiles.map((_, index) => index + 1))
    for (const tile of layout.tiles) {
      for (const name of [tile.label, sheetName(tile.sheet), sheetName(tile.sheet, layout.tiles.length), String(tile.sheet), ...overlapStrips(layout, tile).map((strip) => strip.neighbour)]) {
        expect(name).not.toMatch(/^[A-Z]+\d+$/)
      }
    }
  })

  it('keeps a small sheet on one tile, centred', () => {
    const layout = layoutTiles(100, 200, { width: 500, height: 600 }, 36)
    expect(layout.tiles).toHaveLength(1)
    expect(layout.tiles[0]!.window.x).toBe(-200)
    expect(layout.tiles[0]!.window.y).toBe(-200)
  })

  it('steps by the page minus the overlap, so neighbours share exactly the overlap', () => {
    // 0.5 in overlap = 36 pt; a window of 540 pt covers a 1000 pt sheet in ceil((1000 − 36) / 504) = 2 columns
    const layout = layoutTiles(1000, 1300, { width: 540, height: 700 }, 36)
    expect(layout.columns).toBe(2)
    expect(layout.rows).toBe(2)
    const [a1, a2, b1] = [layout.tiles[0]!, layout.tiles[1]!, layout.tiles[2]!]
    expect(a1.window.x + a1.window.width - a2.window.x).toBeCloseTo(36, 9)
    expect(a1.window.y + a1.window.height - b1.window.y).toBeCloseTo(36, 9)
    expect(overlapStrips(layout, a1).map((strip) => strip.neighbour)).toEqual(['sheet 2', 'sheet 3'])
  })

  it('shifts the tiles within their spare room to keep a seam out of an overlap, on as many pages', () => {
    // 2 columns of 540 pt stepping 504 pt cover 2 × 504 + 36 = 1044 pt: 44 pt spare on a 1000 pt sheet.
    // Centred, the overlap strip runs from −22 + 504 = 482 pt to 518 pt: a seam along x = 485 lies in it
    // (within the first row: rows step 664 pt from −32 pt, so the row overlap starts at 632 pt).
    const seam: SheetSegment = [[485, 50], [485, 550]]
    const centred = layoutTiles(1000, 1300, { width: 540, height: 700 }, 36)
    expect(centred.tiles[1]!.window.x).toBe(482)
    expect(seamLengthInOverlaps(centred, [seam])).toBe(500)
    const shifted = layoutTiles(1000, 1300, { width: 540, height: 700 }, 36, [seam])
    expect(seamLengthInOverlaps(shifted, [seam])).toBe(0)
    expect(shifted.tiles).toHaveLength(centred.tiles.length)
    // Still covers the sheet, and neighbours still share exactly the overlap.
    const [first, second] = [shifted.tiles[0]!.window, shifted.tiles[1]!.window]
    expect(first.x).toBeLessThanOrEqual(0)
    expect(second.x + second.width).toBeGreaterThanOrEqual(1000)
    expect(first.x + first.width - second.x).toBeCloseTo(36, 9)
    // The seam is clear of the strip and of its 4 pt margin where the targets' crosses reach.
    expect(second.x - 4 > 485 || first.x + first.width + 4 < 485).toBe(true)
  })

  it('stays centred when no shift helps, and on one page', () => {
    expect(layoutTiles(1000, 1300, { width: 540, height: 700 }, 36, [[[0, 650], [1000, 650]]]).tiles[0]!.window.x).toBe(-22)
    expect(layoutTiles(100, 200, { width: 500, height: 600 }, 36, [[[50, 0], [50, 200]]]).tiles[0]!.window.x).toBe(-200)
  })
})
