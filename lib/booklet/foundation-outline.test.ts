import polygonClipping from 'polygon-clipping'
import { describe, expect, it } from 'vitest'
import { bookletOptionsSchema } from '@/lib/schemas/booklet'
import { foundationSheets } from './foundation-pages'
import { bookletModel, sectionAreas } from './model'
import { designFrom, medallionFile, wreathFile } from './test-support/designs'
import { applyToPolygon, polygonArea, type Polygon } from '@/geometry'

const ring = (polygon: Polygon): [number, number][][] => [polygon.map((p) => [p[0], p[1]] as [number, number])]

describe('section trim lines', () => {
  it.each([['medallion (a seam ending on a chord seam)', medallionFile()], ['wreath', wreathFile()]])('encloses every area of its section: %s (polygon-clipping)', (_, file) => {
    const model = bookletModel(designFrom(file), bookletOptionsSchema.parse({ paper: 'letter', finishedDiameterInches: 24 }))
    for (const sheet of foundationSheets(model)) {
      for (const area of sectionAreas(model, sheet.kind.section)) {
        const printed = applyToPolygon(sheet.kind.printedSide, area.polygon)
        const outside = polygonClipping.difference(ring(printed), ring(sheet.trimPolygon))
        const outsideArea = outside.reduce((sum, piece) => sum + polygonArea(piece[0]!.map((p) => [p[0], p[1]] as const)), 0)
        // Chords and arcs differ by at most 0.005 in (geometry.md); nothing else may stick out.
        expect(outsideArea, `${area.label} of ${sheet.title}`).toBeLessThan(1e-3)
      }
    }
  })
})
