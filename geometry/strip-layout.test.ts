import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { firstFitDecreasingHeightInches, layoutStrips, type PieceToCut, type StripLayout } from './strip-layout'

/** Floating-point noise on sums of sides (leaf pieces are not multiples of 1/8 in). */
const NOISE_INCHES = 1e-9

interface Rectangle { readonly x: number; readonly y: number; readonly w: number; readonly h: number }

/**
 * True when the rectangles inside `region` can be cut apart by straight cuts from edge to edge
 * (guillotine cuts). Written from the definition, sharing nothing with the layout: look for a line
 * across the region, at some rectangle's edge, that no rectangle straddles and that leaves
 * rectangles on both sides; cut there and check both halves. A guillotine pattern stays one when
 * restricted to either side of any such cut, so the first cut found is as good as any.
 */
function isGuillotine(rectangles: readonly Rectangle[], region: Rectangle): boolean {
  if (rectangles.length <= 1) return true
  for (const axis of ['x', 'y'] as const) {
    const size = axis === 'x' ? 'w' : 'h'
    const lines = new Set(rectangles.flatMap((r) => [r[axis], r[axis] + r[size]]))
    for (const line of lines) {
      if (line <= region[axis] + NOISE_INCHES || line >= region[axis] + region[size] - NOISE_INCHES) continue
      const before = rectangles.filter((r) => r[axis] + r[size] <= line + NOISE_INCHES)
      const after = rectangles.filter((r) => r[axis] >= line - NOISE_INCHES)
      if (before.length + after.length !== rectangles.length || before.length === 0 || after.length === 0) continue
      const first = axis === 'x' ? { ...region, w: line - region.x } : { ...region, h: line - region.y }
      const second = axis === 'x' ? { ...region, x: line, w: region.x + region.w - line } : { ...region, y: line, h: region.y + region.h - line }
      return isGuillotine(before, first) && isGuillotine(after, second)
    }
  }
  return false
}

/** The independent checker: inside the width and the length, no overlaps, every piece present once, guillotine-cuttable. */
function checkLayout(layout: StripLayout, pieces: readonly PieceToCut[], width: number): void {
  const cuts = layout.cuts
  for (const cut of cuts) {
    expect(cut.xIn).toBeGreaterThanOrEqual(-NOISE_INCHES)
    expect(cut.yIn).toBeGreaterThanOrEqual(-NOISE_INCHES)
    expect(cut.xIn + cut.widthIn).toBeLessThanOrEqual(width + NOISE_INCHES)
    expect(cut.yIn + cut.heightIn).toBeLessThanOrEqual(layout.lengthIn + NOISE_INCHES)
  }
  for (let i = 0; i < cuts.length; i += 1) {
    for (let j = i + 1; j < cuts.length; j += 1) {
      const a = cuts[i]!
      const b = cuts[j]!
      const overlapX = Math.min(a.xIn + a.widthIn, b.xIn + b.widthIn) - Math.max(a.xIn, b.xIn)
      const overlapY = Math.min(a.yIn + a.heightIn, b.yIn + b.heightIn) - Math.max(a.yIn, b.yIn)
      expect(overlapX > NOISE_INCHES && overlapY > NOISE_INCHES, `cuts ${i} and ${j} overlap`).toBe(false)
    }
  }
  // Every piece that fits the width, once, at its size either way round.
  const sizeKey = (forWhat: string, a: number, b: number) => `${forWhat} ${Math.max(a, b)} ${Math.min(a, b)}`
  const asked = pieces
    .filter((piece) => Math.min(piece.widthIn, piece.heightIn) <= width)
    .flatMap((piece) => Array.from({ length: piece.count }, () => sizeKey(piece.for, piece.widthIn, piece.heightIn)))
    .sort()
  expect(cuts.map((cut) => sizeKey(cut.for, cut.widthIn, cut.heightIn)).sort()).toEqual(asked)
  const rectangles = cuts.map((cut) => ({ x: cut.xIn, y: cut.yIn, w: cut.widthIn, h: cut.heightIn }))
  expect(isGuillotine(rectangles, { x: 0, y: 0, w: width, h: layout.lengthIn })).toBe(true)
}

/** First-fit decreasing height, written again here from its textbook definition: the floor the layout must meet. */
function firstFitDecreasingHeightLength(pieces: readonly PieceToCut[], width: number): number {
  const items = pieces.flatMap((piece) => {
    const long = Math.max(piece.widthIn, piece.heightIn)
    const short = Math.min(piece.widthIn, piece.heightIn)
    const [across, along] = long <= width ? [long, short] : [short, long]
    return Array.from({ length: piece.count }, () => ({ across, along }))
  }).sort((a, b) => b.along - a.along || b.across - a.across)
  const shelves: { height: number; used: number }[] = []
  for (const item of items) {
    const shelf = shelves.find((s) => item.along <= s.height && s.used + item.across <= width + NOISE_INCHES)
    if (shelf) shelf.used += item.across
    else shelves.push({ height: item.along, used: item.across })
  }
  return shelves.reduce((sum, shelf) => sum + shelf.height, 0)
}

describe('the independent checker', () => {
  it('refuses a pinwheel, which no sequence of edge-to-edge cuts separates', () => {
    // Four 2 × 1 rectangles round a 1 × 1 centre in a 3 × 3 square: every line across meets one.
    const pinwheel = [{ x: 0, y: 0, w: 2, h: 1 }, { x: 2, y: 0, w: 1, h: 2 }, { x: 1, y: 2, w: 2, h: 1 }, { x: 0, y: 1, w: 1, h: 2 }, { x: 1, y: 1, w: 1, h: 1 }]
    expect(isGuillotine(pinwheel, { x: 0, y: 0, w: 3, h: 3 })).toBe(false)
    expect(isGuillotine(pinwheel.slice(0, 1).concat(pinwheel.slice(4)), { x: 0, y: 0, w: 3, h: 3 })).toBe(true)
  })
})

describe('layoutStrips', () => {
  it('cuts forty 3 × 4 in rectangles from 12 in of 40 in fabric', () => {
    const pieces = [{ for: 'A1', widthIn: 3, heightIn: 4, count: 40 }]
    const layout = layoutStrips(pieces, { widthOfFabricIn: 40 })
    // By hand: turned 4 in across, 40 / 4 = 10 pieces in each 3 in strip; 40 pieces / 10 = 4 strips;
    // 4 × 3 in = 12 in. The area bound is the same: 40 × 12 sq in / 40 in = 12 in, so nothing is shorter.
    expect(layout.lengthIn).toBe(12)
    expect(layout.strips.map((strip) => [strip.heightIn, strip.cuts.length])).toEqual([[3, 10], [3, 10], [3, 10], [3, 10]])
    expect(layout.lowerBoundIn).toBe(12)
    expect(layout.cuts.every((cut) => cut.turned && cut.widthIn === 4)).toBe(true)
    checkLayout(layout, pieces, 40)
  })

  it('lays pieces exactly the width of fabric across it, one strip each', () => {
    const pieces = [{ for: 'A1', widthIn: 40, heightIn: 2.5, count: 3 }, { for: 'A2', widthIn: 40, heightIn: 40, count: 1 }]
    const layout = layoutStrips(pieces, { widthOfFabricIn: 40 })
    // 3 × 2 1/2 in + 40 in = 47 1/2 in: no room beside any of them.
    expect(layout.lengthIn).toBe(47.5)
    expect(layout.problems).toEqual([])
    checkLayout(layout, pieces, 40)
  })

  it('reports a piece wider than the fabric whichever way it turns, and lays out the rest', () => {
    const pieces = [{ for: 'B1', widthIn: 41, heightIn: 42, count: 1 }, { for: 'A1', widthIn: 41, heightIn: 2, count: 2 }]
    const layout = layoutStrips(pieces, { widthOfFabricIn: 40 })
    expect(layout.problems).toHaveLength(1)
    expect(layout.problems[0]!.code).toBe('piece-too-wide')
    expect(layout.problems[0]!.for).toBe('B1')
    expect(layout.problems[0]!.message).toMatch(/wider than the usable width of 40 in/)
    // The 41 × 2 in pieces still fit turned: 2 in across, 41 in along, side by side.
    expect(layout.lengthIn).toBe(41)
    checkLayout(layout, pieces, 40)
  })

  it('batches pieces of one size in one strip, as a maker cuts them', () => {
    const pieces = [{ for: 'A1', widthIn: 2.5, heightIn: 2.5, count: 16 }, { for: 'A2', widthIn: 6, heightIn: 3.5, count: 6 }]
    const layout = layoutStrips(pieces, { widthOfFabricIn: 40 })
    // 6 × 6 in across one 3 1/2 in strip (36 in); 16 squares across one 2 1/2 in strip (40 in): 6 in.
    expect(layout.lengthIn).toBe(6)
    checkLayout(layout, pieces, 40)
  })

  it('turns the last pieces into one strip rather than leave one piece a strip of its own', () => {
    const pieces = [{ for: 'A3', widthIn: 5.5, heightIn: 3.125, count: 8 }]
    const layout = layoutStrips(pieces, { widthOfFabricIn: 40 })
    // Lying flat, 7 fit across (7 × 5.5 = 38.5 in) and the eighth needs a second 3 1/8 in strip: 6.25 in.
    // Turned, all 8 lie 3 1/8 in across (25 in) in one 5 1/2 in strip: 5.5 in.
    expect(firstFitDecreasingHeightInches(pieces, { widthOfFabricIn: 40 })).toBe(6.25)
    expect(layout.lengthIn).toBe(5.5)
    checkLayout(layout, pieces, 40)
  })

  it('cuts thousands of pieces of one size strip by strip (400 berries × 36 repeats)', () => {
    const layout = layoutStrips([{ for: 'berry', widthIn: 1.25, heightIn: 1.25, count: 14_400 }], { widthOfFabricIn: 40 })
    // 40 / 1.25 = 32 squares across each 1 1/4 in strip; 14,400 / 32 = 450 strips × 1.25 in = 562.5 in.
    expect(layout.lengthIn).toBe(562.5)
    expect(layout.cuts).toHaveLength(14_400)
  })

  it('passes the independent checker and never loses to first-fit decreasing height (random pieces)', () => {
    const eighths = (min: number, max: number) => fc.integer({ min: min * 8, max: max * 8 }).map((n) => n / 8)
    const piece = fc.record({ for: fc.constantFrom('A1', 'A2', 'B1', 'leaf', 'berry'), widthIn: eighths(0.5, 24), heightIn: eighths(0.5, 24), count: fc.integer({ min: 1, max: 8 }) })
    fc.assert(
      fc.property(fc.array(piece, { minLength: 1, maxLength: 10 }), fc.constantFrom(18, 21, 40, 42), (pieces, width) => {
        const layout = layoutStrips(pieces, { widthOfFabricIn: width })
        checkLayout(layout, pieces, width)
        expect(layout.lengthIn).toBeGreaterThanOrEqual(layout.lowerBoundIn - NOISE_INCHES)
        expect(layout.lengthIn).toBeLessThanOrEqual(firstFitDecreasingHeightLength(pieces.filter((p) => Math.min(p.widthIn, p.heightIn) <= width), width) + NOISE_INCHES)
      }),
      { numRuns: 150 },
    )
  })

  it('handles sides that are not multiples of 1/8 in, up to exactly the width', () => {
    const side = fc.double({ min: 0.3, max: 10, noNaN: true })
    fc.assert(
      fc.property(fc.array(fc.record({ for: fc.constant('leaf'), widthIn: side, heightIn: side, count: fc.integer({ min: 1, max: 6 }) }), { minLength: 1, maxLength: 6 }), (pieces) => {
        const width = 10
        const layout = layoutStrips(pieces, { widthOfFabricIn: width })
        checkLayout(layout, pieces, width)
      }),
      { numRuns: 100 },
    )
  })

  it('gives the same layout for the same pieces', () => {
    const pieces = [{ for: 'A1', widthIn: 3.25, heightIn: 2.5, count: 8 }, { for: 'A2', widthIn: 5.5, heightIn: 4.125, count: 8 }]
    expect(layoutStrips(pieces, { widthOfFabricIn: 40 })).toEqual(layoutStrips(pieces, { widthOfFabricIn: 40 }))
  })

  it('refuses a width that is not a positive length (a programmer error: inputs are checked first)', () => {
    expect(() => layoutStrips([], { widthOfFabricIn: -1 })).toThrow(RangeError)
    expect(layoutStrips([], { widthOfFabricIn: 40 }).lengthIn).toBe(0)
  })
})
