import polygonClipping from 'polygon-clipping'
import { describe, expect, it } from 'vitest'
import { bookletOptionsSchema } from '@/lib/schemas/booklet'
import { foundationSheets } from './foundation-pages'
import { pageFrame } from './paper'
import { tileDrawing } from './tiled-drawing'
import { bookletModel, sectionAreas } from './model'
import { designFrom, medallionFile, wreathFile } from './test-support/designs'
import { applyToPolygon, polygonArea, type Polygon } from '@/geometry'

const ring = (polygon: Polygon): [number, number][][] => [polygon.map((p) => [p[0], p[1]] as [number, number])]

describe('section trim lines', () => {
  it.each([['medallion (a seam ending on a chord seam)', medallionFile()], ['wreath', wreathFile()]])('encloses every area of its section: %s (polygon-clipping)', (_, file) => {
    const model = bookletModel(designFrom(file), bookletOptionsSchema.parse({ paper: 'letter', finishedDiameterInches: 24 }))
    for (const sheet of foundationSheets(model)) {
      for (const area of sectionAreas(model, sheet.kind.section)) {
        const printed = applyToPolygon(sheet.placement, area.polygon)
        const outside = polygonClipping.difference(ring(printed), ring(sheet.trimPolygon))
        const outsideArea = outside.reduce((sum, piece) => sum + polygonArea(piece[0]!.map((p) => [p[0], p[1]] as const)), 0)
        // Chords and arcs differ by at most 0.005 in (geometry.md); nothing else may stick out.
        expect(outsideArea, `${area.label} of ${sheet.title}`).toBeLessThan(1e-3)
      }
    }
  })
})

describe('laying foundations on the paper', () => {
  const pagesOf = (file: Parameters<typeof designFrom>[0], paper: 'letter' | 'a3', orientation: 'portrait' | 'landscape') => {
    const options = bookletOptionsSchema.parse({ paper, orientation })
    const model = bookletModel(designFrom(file), options)
    const frame = pageFrame(options)
    return foundationSheets(model).map((sheet) => tileDrawing(frame, sheet.box, options.overlapInches * 72).tiles.length)
  }

  it('turns a sixth of a 20 in medallion upright so each foundation fits one A3 landscape page (ISO 216: 420 × 297 mm)', () => {
    // As it lies in the ring, the sixth's box is about 8.5 × 9 in, taller than the 9 in or so of
    // drawing room below the header; upright it is about 10 × 7.7 in and fits.
    expect(pagesOf(medallionFile(), 'a3', 'landscape').every((pages) => pages === 1)).toBe(true)
  })

  it('keeps the pieces and their handedness: the placement is a turn of the printed side', () => {
    const model = bookletModel(designFrom(medallionFile()), bookletOptionsSchema.parse({ paper: 'a3', orientation: 'landscape' }))
    for (const sheet of foundationSheets(model)) {
      const { xx, xy, yx, yy } = sheet.placement
      const { xx: px, xy: pxy, yx: pyx, yy: py } = sheet.kind.printedSide
      // Same determinant sign as the printed-side mirror, and lengths kept (a rotation composed with it).
      expect(Math.sign(xx * yy - xy * yx)).toBe(Math.sign(px * py - pxy * pyx))
      expect(Math.hypot(xx, yx)).toBeCloseTo(1, 12)
    }
  })
})
