import { describe, expect, it } from 'vitest'
import { layoutTiles, overlapStrips, sheetName, tileLabel } from './tiling'

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
})
