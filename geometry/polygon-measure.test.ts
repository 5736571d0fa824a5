import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { interiorPoint, isPointInPolygon } from './polygon-measure'
import type { Point } from './types'

describe('interiorPoint', () => {
  it('stands in the middle of a 4 × 1 in strip', () => {
    expect(interiorPoint([[0, 0], [4, 0], [4, 1], [0, 1]])).toEqual([2, 0.5])
  })

  it('picks the same point of a shape at any size (equally clear candidates tie, noise does not decide)', () => {
    // A band between two parallel seams, as quilts have many: every candidate height is equally
    // clear of the two long sides (half the band's width), so only floating-point noise told them apart.
    fc.assert(
      fc.property(
        fc.double({ min: 2, max: 8, noNaN: true }),
        fc.double({ min: 0.5, max: 2, noNaN: true }),
        fc.double({ min: -1, max: 1, noNaN: true }),
        fc.double({ min: 0.3, max: 5, noNaN: true }),
        (length, width, lean, factor) => {
          const band: Point[] = [[0, 0], [width, 0], [width + lean, length], [lean, length]]
          const point = interiorPoint(band)
          const scaled = interiorPoint(band.map(([x, y]): Point => [x * factor, y * factor]))
          expect(isPointInPolygon(point, band)).toBe(true)
          expect(Math.hypot(scaled[0] / factor - point[0], scaled[1] / factor - point[1])).toBeLessThan(1e-9)
        },
      ),
      { numRuns: 300 },
    )
  })
})
