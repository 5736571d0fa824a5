import { describe, expect, it } from 'vitest'
import { smoothCurve, type Point } from '@/geometry'
import { buildBooklet } from './booklet'
import { openPdf, pagePaths, pageText, type DrawnPath, type PdfDocument } from './test-support/read-pdf'
import { designFrom, wreathFile } from './test-support/designs'

/** PDF coordinates are written with four decimals (context.ts): a size agrees to a thousandth of a point. */
const PDF_ROUNDING_PT = 1e-3
/** 1 in = 72 pt (ISO 32000-1 §8.3.2.3, default user space). */
const POINTS_PER_INCH = 72

/** "1 7/8" → 1.875, "5/8" → 0.625, "2" → 2. */
function inchesOf(words: string): number {
  return words.trim().split(/\s+/).reduce((sum, part) => {
    const [numerator, denominator] = part.split('/')
    return sum + (denominator ? Number(numerator) / Number(denominator) : Number(numerator))
  }, 0)
}

const widthOf = (path: DrawnPath): number => path.bounds.maxX - path.bounds.minX
const heightOf = (path: DrawnPath): number => path.bounds.maxY - path.bounds.minY

async function templatePages(doc: PdfDocument): Promise<number[]> {
  const pages: number[] = []
  for (let n = 1; n <= doc.numPages; n += 1) {
    if ((await pageText(doc, n)).some((item) => item.text.includes('Templates at actual size'))) pages.push(n)
  }
  return pages
}

describe('template sizes', () => {
  // The test wreath is 18 in across; 20 in and 27 in scale its 1 3/4 × 7/8 in leaves and its
  // 5/8 in berries to sizes off the 1/8 in steps (1.944 × 0.972 in, 0.694 in at 20 in).
  it.each([18, 20, 27])('draws every leaf and berry template at the size its label reads, at %s in across', async (diameter) => {
    const bytes = buildBooklet(designFrom(wreathFile()), { paper: 'letter', parts: ['templates'], finishedDiameterInches: diameter })
    const doc = await openPdf(bytes)
    const pages = await templatePages(doc)
    expect(pages.length).toBeGreaterThan(0)
    let leaves = 0
    let berries = 0
    for (const page of pages) {
      const text = (await pageText(doc, page)).map((item) => item.text).join(' ')
      const paths = await pagePaths(doc, page)
      const drawnAt = (width: number, height: number): boolean =>
        paths.some((path) => Math.abs(widthOf(path) - width) < PDF_ROUNDING_PT && Math.abs(heightOf(path) - height) < PDF_ROUNDING_PT)
      for (const match of text.matchAll(/Leaf ([\d /]+?) × ([\d /]+?) in/g)) {
        const [length, width] = [inchesOf(match[1]!), inchesOf(match[2]!)]
        // The sew line spans the finished width and runs from the raw edge, 1/4 in past the
        // seam line (common practice for inserts), to the tip: L + 1/4 in tall.
        expect(drawnAt(width * POINTS_PER_INCH, (length + 0.25) * POINTS_PER_INCH), `leaf ${match[0]} at ${diameter} in`).toBe(true)
        leaves += 1
      }
      for (const match of text.matchAll(/Berry ([\d /]+?) in finished/g)) {
        const finished = inchesOf(match[1]!)
        expect(drawnAt(finished * POINTS_PER_INCH, finished * POINTS_PER_INCH), `berry ${match[0]} at ${diameter} in`).toBe(true)
        berries += 1
      }
      for (const match of text.matchAll(/circles ([\d /]+?) in across/g)) {
        const cut = inchesOf(match[1]!)
        expect(drawnAt(cut * POINTS_PER_INCH, cut * POINTS_PER_INCH), `cut circle ${match[0]} at ${diameter} in`).toBe(true)
      }
    }
    expect(leaves).toBeGreaterThan(0)
    expect(berries).toBeGreaterThan(0)
  })
})

describe('the placement guide', () => {
  it('draws each curl as the smooth curve the board draws, at true scale', async () => {
    const design = designFrom(wreathFile())
    const curve = smoothCurve(design.curls[0]!.points)
    const expected = [curve.start, ...curve.pieces.flat()]
    const doc = await openPdf(buildBooklet(design, { paper: 'letter', parts: ['guide'] }))
    let found = 0
    for (let n = 1; n <= doc.numPages; n += 1) {
      for (const path of await pagePaths(doc, n)) {
        for (const subpath of path.subpaths) {
          if (subpath.length !== expected.length) continue
          // The page keeps y up (as read back), 72 pt per inch: each point sits 72 × its
          // offset from the curl's start (start, then control, control, end per piece).
          const [x0, y0] = subpath[0]!
          const matches = expected.every((p: Point, i) =>
            Math.abs(subpath[i]![0] - x0 - (p[0] - curve.start[0]) * POINTS_PER_INCH) < PDF_ROUNDING_PT &&
            Math.abs(subpath[i]![1] - y0 - (p[1] - curve.start[1]) * POINTS_PER_INCH) < PDF_ROUNDING_PT)
          if (matches) found += 1
        }
      }
    }
    expect(found).toBeGreaterThan(0)
  })
})

describe('templates of stacked leaves', () => {
  it('gives each layer size its own template: the leaf as drawn, and its 10 % smaller top layer', async () => {
    // 1 3/4 × 7/8 in leaves; the default top layer is × 0.9 = 1.575 × 0.7875 in, labelled
    // (and drawn) 1 5/8 × 3/4 in, to the nearest 1/8 in.
    const doc = await openPdf(buildBooklet(designFrom(wreathFile()), { paper: 'letter', parts: ['templates'] }))
    const text = (await Promise.all((await templatePages(doc)).map(async (page) => (await pageText(doc, page)).map((item) => item.text).join(' ')))).join(' ')
    expect(text).toMatch(/Leaf 1 3\/4 × 7\/8 in 8 [^:]*: Holly green batik\b/)
    expect(text).toMatch(/Leaf 1 5\/8 × 3\/4 in 8 [^:]*: Sage sprig print\b/)
  })
})
