import * as pdfjs from 'pdfjs-dist/legacy/build/pdf.mjs'
import { describe, expect, it } from 'vitest'
import { smoothCurve, type Point } from '@/geometry'
import { bookletOptionsSchema } from '@/lib/schemas/booklet'
import { buildBooklet } from './booklet'
import { missingFabrics } from './cover'
import { bookletModel } from './model'
import { allText, openPdf, pagePaths, type PdfDocument } from './test-support/read-pdf'
import { designFrom, wreathFile } from './test-support/designs'

/** PDF coordinates are written with four decimals (context.ts); the fitted scale adds a little. */
const PDF_ROUNDING_PT = 2e-3

const coverText = async (bytes: Uint8Array) => (await allText(await openPdf(bytes))).replace(/\s+/g, ' ')
const model = (overrides: Parameters<typeof wreathFile>[0] = {}, colorway?: string) =>
  bookletModel(designFrom(wreathFile(overrides)), bookletOptionsSchema.parse({ paper: 'letter', colorway }))

describe('the cover warns of parts with no fabric', () => {
  it('says nothing when every part has a fabric with a colour', async () => {
    expect(missingFabrics(model())).toEqual([])
    expect(await coverText(buildBooklet(designFrom(wreathFile()), { paper: 'letter', parts: ['cover'] }))).not.toMatch(/not chosen/)
  })

  it('names every area when no area is filled and the design has no colourway', async () => {
    const design = designFrom(wreathFile({ fills: [], colorways: [] }))
    const text = await coverText(buildBooklet(design, { paper: 'letter', parts: ['cover'] }))
    expect(text).toMatch(/Fabrics not chosen yet: No area has a fabric: A1, .* have none\./)
    expect(text).toMatch(/The design has no colourway, so no fabric has a colour: Berry \(berries\), Leaf dark \(leaves\), Leaf light \(leaves\) and Stem \(the stem ring\)\./)
    // The cutting list heads the areas with no fabric as the warning says.
    expect(text).toMatch(/under "Unassigned"/)
    expect(text).toMatch(/printed grey/)
  })

  it('names the areas left unfilled and the roles the colourway does not colour', () => {
    const sentences = missingFabrics(model({
      fills: [{ at: [1, 1], fabric: 'background' }],
      colorways: [{ name: 'Bare', fabrics: { background: { name: 'Cream tone-on-tone', color: '#f4ecd8' }, berry: { name: 'Cranberry dot', color: '#a3392b' } } }],
    }))
    expect(sentences[0]).toMatch(/^Areas (\w\d, )+\w\d and \w\d have no fabric\.$/)
    expect(sentences[1]).toBe('The colourway Bare gives no colour to Leaf dark (leaves), Leaf light (leaves) and Stem (the stem ring).')
  })
})

describe('the cover picture', () => {
  it('draws each curl as the smooth curve the board draws', async () => {
    const design = designFrom(wreathFile())
    const curve = smoothCurve(design.curls[0]!.points)
    const expected: Point[] = [curve.start, ...curve.pieces.flat()]
    const doc = await openPdf(buildBooklet(design, { paper: 'letter', parts: ['cover'] }))
    let found = 0
    for (const path of await pagePaths(doc, 1)) {
      for (const subpath of path.subpaths) {
        if (subpath.length !== expected.length) continue
        // Repeat 0 is drawn unturned at the preview's scale, y up as read back: fit the scale on
        // the first control point, then every point must sit at that scale from the start.
        const [x0, y0] = subpath[0]!
        const scale = (subpath[1]![0] - x0) / (expected[1]![0] - curve.start[0])
        if (!(scale > 0)) continue
        const matches = expected.every((p, i) =>
          Math.abs(subpath[i]![0] - x0 - (p[0] - curve.start[0]) * scale) < PDF_ROUNDING_PT &&
          Math.abs(subpath[i]![1] - y0 - (p[1] - curve.start[1]) * scale) < PDF_ROUNDING_PT)
        if (matches) found += 1
      }
    }
    expect(found).toBe(1)
  })
})

/** How many shapes of each fill colour a page paints (pdfjs gives colours as #rrggbb). */
async function filledColours(doc: PdfDocument, pageNumber: number): Promise<Map<string, number>> {
  const list = await (await doc.getPage(pageNumber)).getOperatorList()
  const counts = new Map<string, number>()
  let fill = ''
  list.fnArray.forEach((fn, index) => {
    const args = list.argsArray[index] as unknown[]
    if (fn === pdfjs.OPS.setFillRGBColor) {
      fill = typeof args[0] === 'string' ? args[0] : `#${(args as number[]).slice(0, 3).map((v) => Math.round(v).toString(16).padStart(2, '0')).join('')}`
    } else if (fn === pdfjs.OPS.constructPath && [pdfjs.OPS.fill, pdfjs.OPS.eoFill, pdfjs.OPS.fillStroke, pdfjs.OPS.eoFillStroke].includes(args[0] as number)) {
      counts.set(fill, (counts.get(fill) ?? 0) + 1)
    }
  })
  return counts
}

/** jsPDF writes colours as fractions of 1 with a few decimals: a channel may read back one step off. */
const COLOUR_STEP = 2
const channels = (hex: string): number[] => [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16))
const paintedIn = (counts: Map<string, number>, colour: string): number =>
  [...counts].filter(([painted]) => channels(painted).every((value, i) => Math.abs(value - channels(colour)[i]!) <= COLOUR_STEP)).reduce((sum, [, n]) => sum + n, 0)

describe('the cover picture of stacked leaves', () => {
  it('paints every layer of every leaf in its own fabric, not only the top one', async () => {
    // Test wreath: 2 leaves of 2 layers (leaf-dark under leaf-light) in each of 4 repeats.
    const doc = await openPdf(buildBooklet(designFrom(wreathFile()), { paper: 'letter', parts: ['cover'] }))
    const counts = await filledColours(doc, 1)
    expect(paintedIn(counts, '#2f5540')).toBe(8) // leaf-dark, Holly
    expect(paintedIn(counts, '#6f9a6a')).toBe(8) // leaf-light, Holly
  })
})
