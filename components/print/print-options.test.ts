import { describe, expect, it } from 'vitest'
import { buildBookletFile } from '@/lib/booklet/booklet'
import type { BookletPage, FoundationTiling } from '@/lib/booklet/page-list'
import { designFrom, wreathFile } from '@/lib/booklet/test-support/designs'
import { openPdf } from '@/lib/booklet/test-support/read-pdf'
import { bookletFileName, bookletSummary, printOptionsFrom, thumbnailAlt, type PrintFormState } from './print-options'

const form = (overrides: Partial<PrintFormState> = {}): PrintFormState => ({
  paper: 'letter', orientation: 'portrait', colorway: 'Holly', diameter: '24', units: 'in',
  parts: ['cover', 'foundations'], margin: '0.4', overlap: '0.5', widthOfFabric: '40', extraPercent: '10', ...overrides,
})

describe('print dialog options', () => {
  it('turns the form into the shared booklet options', () => {
    const result = printOptionsFrom(form())
    expect(result).toEqual({ ok: true, options: expect.objectContaining({ paper: 'letter', finishedDiameterInches: 24, parts: ['cover', 'foundations'], marginInches: 0.4, overlapInches: 0.5 }) })
  })

  it('reads a centimetre diameter as inches (1 in = 2.54 cm exactly)', () => {
    const result = printOptionsFrom(form({ diameter: '60.96', units: 'cm' }))
    expect(result.ok && result.options.finishedDiameterInches).toBeCloseTo(24, 9)
  })

  it('names the problem in words', () => {
    expect(printOptionsFrom(form({ diameter: 'abc' }))).toEqual({ ok: false, message: 'The finished diameter must be a positive number.' })
    expect(printOptionsFrom(form({ parts: [] }))).toEqual({ ok: false, message: 'Choose at least one part of the booklet.' })
    expect(printOptionsFrom(form({ overlap: '0.1' }))).toEqual({ ok: false, message: 'The overlap must be between 0.25 and 2 in.' })
  })

  it('carries the usable width of fabric (in the design’s units) and the extra into the options', () => {
    const inches = printOptionsFrom(form({ widthOfFabric: '42', extraPercent: '0' }))
    expect(inches.ok && [inches.options.widthOfFabricIn, inches.options.extraPercent]).toEqual([42, 0])
    // 101.6 cm = 40 in (1 in = 2.54 cm exactly).
    const metric = printOptionsFrom(form({ units: 'cm', diameter: '60.96', widthOfFabric: '101.6', extraPercent: '15' }))
    expect(metric.ok && metric.options.widthOfFabricIn).toBeCloseTo(40, 9)
    expect(metric.ok && metric.options.extraPercent).toBe(15)
    // The ends of the shared range (lib/schemas/cutting-settings.ts) are accepted: 10 in, and 304.8 cm = 120 in.
    expect(printOptionsFrom(form({ widthOfFabric: '10', extraPercent: '100' })).ok).toBe(true)
    expect(printOptionsFrom(form({ units: 'cm', diameter: '60.96', widthOfFabric: '304.8' })).ok).toBe(true)
  })

  it('refuses a width or extra outside the shared range, in the units typed', () => {
    expect(printOptionsFrom(form({ widthOfFabric: '9.9' }))).toEqual({ ok: false, message: 'The usable width of fabric must be between 10 and 120 in.' })
    expect(printOptionsFrom(form({ units: 'cm', diameter: '60.96', widthOfFabric: '305' }))).toEqual({ ok: false, message: 'The usable width of fabric must be between 25.4 and 304.8 cm.' })
    expect(printOptionsFrom(form({ widthOfFabric: 'wide' }))).toEqual({ ok: false, message: 'The usable width of fabric must be between 10 and 120 in.' })
    expect(printOptionsFrom(form({ extraPercent: '' }))).toEqual({ ok: false, message: 'The extra must be between 0 and 100 %.' })
    expect(printOptionsFrom(form({ extraPercent: '-5' }))).toEqual({ ok: false, message: 'The extra must be between 0 and 100 %.' })
  })

  it('names the file after pattern, colourway, size and paper', () => {
    expect(bookletFileName('Hollyberry Wreath', { paper: 'a4', colorway: 'Frost', finishedDiameterInches: 24 })).toBe('hollyberry-wreath-frost-24in-a4.pdf')
  })
})

const tiling = (overrides: Partial<FoundationTiling> = {}): FoundationTiling => ({
  section: 'A', mirroredRepeat: false, repeatName: 'every repeat (all 4)', count: 4, pages: 1, rows: 1, columns: 1, firstPage: 1, ...overrides,
})
const page = (number: number, part: BookletPage['part'], description = part): BookletPage => ({ number, part, description })

describe('the print preview summary', () => {
  it('counts the pages, the pages of each part and the tiles of each foundation', () => {
    const pages = [
      page(1, 'cover'), page(2, 'cover'), page(3, 'steps'),
      page(4, 'foundations'), page(5, 'foundations'), page(6, 'foundations'), page(7, 'foundations'), page(8, 'foundations'),
    ]
    const tilings = [
      tiling({ pages: 4, rows: 2, columns: 2, firstPage: 4 }),
      tiling({ section: 'B', repeatName: 'repeats 2, 4 (mirror image)', mirroredRepeat: true, count: 2, firstPage: 8 }),
    ]
    expect(bookletSummary({ pages, tilings })).toEqual({
      pageCount: 8,
      headline: '8 pages',
      parts: [
        { part: 'cover', title: 'Cover, fabric and cutting list', pages: 2 },
        { part: 'steps', title: 'Sewing steps, joins and finishing', pages: 1 },
        { part: 'foundations', title: 'Foundations (true scale, tiled)', pages: 5 },
      ],
      foundations: [
        // 2 rows × 2 columns = 4 pages
        'Foundation A for every repeat (all 4), make 4: 4 pages (2 rows × 2 columns)',
        'Foundation B for repeats 2, 4 (mirror image), make 2: 1 page',
      ],
    })
    expect(bookletSummary({ pages: [page(1, 'cover')], tilings: [] }).headline).toBe('1 page')
  })

  it('labels a thumbnail with its page number and what it shows', () => {
    expect(thumbnailAlt({ number: 3, description: 'foundation A, sheet 2 of 4 (row 1, column 2)' })).toBe('page 3: foundation A, sheet 2 of 4 (row 1, column 2)')
  })

  it('follows the form: the summary counts the pages of the PDF built from it, and larger paper needs fewer foundation pages', async () => {
    const wreath = designFrom(wreathFile())
    const summaryOn = async (paper: PrintFormState['paper']) => {
      const options = printOptionsFrom(form({ paper, parts: ['cover', 'foundations'] }))
      if (!options.ok) throw new Error(options.message)
      const file = buildBookletFile(wreath, options.options)
      return { summary: bookletSummary(file), pdfPages: (await openPdf(file.bytes.slice())).numPages, tilings: file.tilings }
    }
    const letter = await summaryOn('letter')
    const tabloid = await summaryOn('tabloid')
    expect(letter.summary.pageCount).toBe(letter.pdfPages)
    expect(tabloid.summary.pageCount).toBe(tabloid.pdfPages)
    expect(letter.summary.foundations).toHaveLength(letter.tilings.length)
    // ANSI/ASME Y14.1: Tabloid (11 × 17 in) holds a Letter page (8.5 × 11 in) either way up, so no
    // foundation takes more Tabloid pages than Letter pages, and the 24 in ring takes fewer in all.
    const foundationPages = (tilings: readonly FoundationTiling[]) => tilings.reduce((sum, t) => sum + t.pages, 0)
    letter.tilings.forEach((t, index) => expect(tabloid.tilings[index]!.pages).toBeLessThanOrEqual(t.pages))
    expect(foundationPages(tabloid.tilings)).toBeLessThan(foundationPages(letter.tilings))
    expect(tabloid.summary.headline).not.toBe(letter.summary.headline)
  })
})
