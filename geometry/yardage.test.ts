import { describe, expect, it } from 'vitest'
import {
  DEFAULT_EXTRA_PERCENT, DEFAULT_WIDTH_OF_FABRIC_INCHES, FAT_EIGHTH, FAT_QUARTER, fitsOnPrecut, INCHES_PER_YARD, METRES_PER_INCH,
  metresToBuy, YARDAGE_STEP_INCHES, yardsToBuy,
} from './yardage'

describe('yardsToBuy', () => {
  it('buys in 1/8 yd steps of 4 1/2 in (common practice; 36 in = 1 yd, 1959 agreement)', () => {
    expect(INCHES_PER_YARD).toBe(36)
    expect(YARDAGE_STEP_INCHES).toBe(4.5)
    expect(yardsToBuy(36, 0)).toBe(1)
    // 36 in + 10 % = 39.6 in, over 1 yd by 3.6 in: one more eighth, 1 1/8 yd.
    expect(yardsToBuy(36, 10)).toBe(1.125)
    // 4.5 in exactly is one eighth; a hair more is two.
    expect(yardsToBuy(4.5, 0)).toBe(0.125)
    expect(yardsToBuy(4.51, 0)).toBe(0.25)
    // 12 in + 10 % = 13.2 in: 13.2 / 4.5 = 2.93 eighths, so 3/8 yd.
    expect(yardsToBuy(12, 10)).toBe(0.375)
    expect(yardsToBuy(0, 10)).toBe(0)
  })

  it('does not buy another eighth for floating-point noise', () => {
    // 0.1 + 0.2 = 0.30000000000000004: 45 in built from such sums is still 10 eighths.
    expect(yardsToBuy(45 + 1e-12, 0)).toBe(1.25)
  })

  it('defaults to 10 % extra and 40 in usable width (common practice)', () => {
    expect(DEFAULT_EXTRA_PERCENT).toBe(10)
    expect(DEFAULT_WIDTH_OF_FABRIC_INCHES).toBe(40)
    expect(yardsToBuy(36)).toBe(yardsToBuy(36, 10))
  })
})

describe('metresToBuy', () => {
  it('converts at 0.0254 m per inch, so 1 yd = 0.9144 m exactly (1959 agreement), and rounds up to 0.1 m', () => {
    expect(36 * METRES_PER_INCH).toBeCloseTo(0.9144, 12)
    expect(metresToBuy(36, 0)).toBe(1)
    // 1 m = 39.3700787… in: 39.37 in is just under 1 m, 39.38 in just over.
    expect(metresToBuy(39.37, 0)).toBe(1)
    expect(metresToBuy(39.38, 0)).toBe(1.1)
    // 12 in + 10 % = 13.2 in = 0.33528 m → 0.4 m.
    expect(metresToBuy(12, 10)).toBe(0.4)
  })
})

describe('precuts', () => {
  it('knows a fat quarter as 18 × 21 in and a fat eighth as 9 × 21 in (common practice)', () => {
    expect([FAT_QUARTER.widthIn, FAT_QUARTER.lengthIn].sort((a, b) => a - b)).toEqual([18, 21])
    expect([FAT_EIGHTH.widthIn, FAT_EIGHTH.lengthIn].sort((a, b) => a - b)).toEqual([9, 21])
  })

  it('decides by laying the pieces out on the precut, either way round', () => {
    // Nine 6 in squares: three strips of three across 18 in, 18 in long, fill a fat quarter; their
    // 324 sq in are more than a fat eighth's 9 × 21 = 189 sq in.
    const nine = [{ for: 'A1', widthIn: 6, heightIn: 6, count: 9 }]
    expect(fitsOnPrecut(nine, FAT_QUARTER)).toBe(true)
    expect(fitsOnPrecut(nine, FAT_EIGHTH)).toBe(false)
    // A 20 × 8 in piece fits a fat eighth lying 20 in along its 21 in side.
    expect(fitsOnPrecut([{ for: 'A1', widthIn: 20, heightIn: 8, count: 1 }], FAT_EIGHTH)).toBe(true)
    // Two 10 × 9 in pieces: 20 in across the 21 in side, 9 in along — exactly a fat eighth.
    expect(fitsOnPrecut([{ for: 'A1', widthIn: 10, heightIn: 9, count: 2 }], FAT_EIGHTH)).toBe(true)
    // A 22 in piece fits neither side of a fat quarter.
    expect(fitsOnPrecut([{ for: 'A1', widthIn: 22, heightIn: 1, count: 1 }], FAT_QUARTER)).toBe(false)
    // Area alone would allow 19 × 19 in (361 sq in < 378), but no side of a fat quarter takes 19 in twice.
    expect(fitsOnPrecut([{ for: 'A1', widthIn: 19, heightIn: 19, count: 1 }], FAT_QUARTER)).toBe(false)
  })
})
