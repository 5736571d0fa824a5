import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import type { View } from './store'
import { toScreen, toWorld, zoomAt } from './view'

const view = (overrides: Partial<View> = {}): View => ({ zoom: 40, centre: [400, 300], side: 'fabric', ...overrides })

describe('the board view', () => {
  it('draws y up: a point above the centre appears higher on the screen', () => {
    expect(toScreen([0, 2], view(), 4)).toEqual([400, 220])
  })

  it('round-trips screen and world on both sides', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -20, max: 20, noNaN: true }),
        fc.double({ min: -20, max: 20, noNaN: true }),
        fc.constantFrom('fabric' as const, 'printed' as const),
        fc.integer({ min: 2, max: 36 }),
        (x, y, side, repeats) => {
          const back = toWorld(toScreen([x, y], view({ side }), repeats), view({ side }), repeats)
          expect(back[0]).toBeCloseTo(x, 9)
          expect(back[1]).toBeCloseTo(y, 9)
        },
      ),
    )
  })

  it('shows the printed side mirrored: repeat 0 stays in place, its edges swap', () => {
    // Quarters: the bisector is at 45°, so the point on the +x edge lands on the +y edge.
    const fabric = toScreen([5, 0], view(), 4)
    const printed = toScreen([5, 0], view({ side: 'printed' }), 4)
    expect(fabric).toEqual([600, 300])
    expect(printed[0]).toBeCloseTo(400, 9)
    expect(printed[1]).toBeCloseTo(100, 9)
  })

  it('zooms about the cursor', () => {
    const zoomed = zoomAt(view(), [500, 300], 2)
    expect(toWorld([500, 300], zoomed, 4)).toEqual(toWorld([500, 300], view(), 4))
    expect(zoomed.zoom).toBe(80)
  })
})
