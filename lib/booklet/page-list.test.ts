import { describe, expect, it } from 'vitest'
import { buildBookletFile, writeBooklet } from './booklet'
import { describePages } from './page-list'
import { openPdf, pageText } from './test-support/read-pdf'
import { designFrom, medallionFile, wreathFile } from './test-support/designs'

const wreath = designFrom(wreathFile())

describe('the page list returned beside the booklet', () => {
  it('describes every page of the PDF, in order, and each foundation page names the foundation its header prints', async () => {
    const written = writeBooklet(wreath, { paper: 'letter', finishedDiameterInches: 30 })
    const pdf = await openPdf(new Uint8Array(written.doc.output('arraybuffer')))
    expect(written.pages.map((page) => page.number)).toEqual(Array.from({ length: pdf.numPages }, (_, index) => index + 1))
    const foundationPages = written.pages.filter((page) => page.foundation)
    expect(foundationPages.length).toBeGreaterThan(written.tilings.length) // a 30 in ring tiles its foundations on Letter
    for (const page of foundationPages) {
      const header = (await pageText(pdf, page.number)).map((item) => item.text).join(' ')
      const { section, sheet, sheets, tile } = page.foundation!
      expect(header).toContain(`Foundation ${section} `)
      // The sheet and the tile's place are the ones the page header prints, read from the tiling.
      if (sheets > 1) expect(header).toContain(`sheet ${sheet} of ${sheets}`)
      if (sheets > 1) expect(header).toContain(tile)
      expect(page.description).toBe(`foundation ${section}, sheet ${sheet} of ${sheets}${sheets > 1 ? ` (${tile})` : ''}`)
    }
    // The tilings add up to the foundation pages, each foundation's pages being rows × columns.
    expect(written.tilings.reduce((sum, tiling) => sum + tiling.pages, 0)).toBe(foundationPages.length)
    for (const tiling of written.tilings) expect(tiling.pages).toBe(tiling.rows * tiling.columns)
  })

  it('names the mirrored foundations of an alternately mirrored ring apart', () => {
    const { pages, tilings } = buildBookletFile(designFrom(medallionFile()), { paper: 'a4', parts: ['foundations'] })
    expect(tilings.map((tiling) => tiling.mirroredRepeat)).toContain(true)
    expect(pages.some((page) => page.description.startsWith('foundation A (mirror image), sheet 1 of'))).toBe(true)
  })

  it('gives a part that wrote no page no page, and numbers the pages of a part that wrote several', () => {
    const pages = describePages({ partPages: { cover: 1, steps: 3, templates: 5, guide: 5 }, foundations: [], pageCount: 6 })
    expect(pages.map((page) => `${page.number} ${page.description}`)).toEqual([
      '1 cover, fabric and cutting list, page 1 of 2',
      '2 cover, fabric and cutting list, page 2 of 2',
      '3 sewing steps, page 1 of 2',
      '4 sewing steps, page 2 of 2',
      '5 placement guide, page 1 of 2',
      '6 placement guide, page 2 of 2',
    ])
  })

  it('tells each page as it is begun, in order, once', () => {
    const heard: number[] = []
    const { pages } = buildBookletFile(wreath, { paper: 'letter' }, { onPage: (page) => heard.push(page) })
    expect(heard).toEqual(pages.map((page) => page.number))
  })
})
