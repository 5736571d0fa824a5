import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { askAgainMs, BOOKLET_ASK_AGAIN_MS } from './booklet-builds'

describe('askAgainMs', () => {
  it('stays within a quarter of the state’s wait, either way', () => {
    fc.assert(
      fc.property(fc.constantFrom('queued' as const, 'building' as const), fc.double({ min: 0, max: 1, maxExcluded: true, noNaN: true }), (state, draw) => {
        const wait = askAgainMs(state, () => draw)
        const middle = BOOKLET_ASK_AGAIN_MS[state]
        expect(Number.isInteger(wait)).toBe(true)
        expect(wait).toBeGreaterThanOrEqual(middle * 0.75)
        expect(wait).toBeLessThanOrEqual(middle * 1.25)
      }),
    )
  })

  it('spreads buyers who asked together: twenty draws give many different waits', () => {
    const waits = new Set(Array.from({ length: 20 }, () => askAgainMs('queued')))
    // 20 draws over 1,000 possible waits: a repeat is possible, ten distinct values all but certain.
    expect(waits.size).toBeGreaterThan(10)
    expect(askAgainMs('queued', () => 0)).toBe(1500)
    expect(askAgainMs('queued', () => 0.999_999)).toBe(2500)
  })
})
