import { describe, expect, it } from 'vitest'
import { fabricRequirements } from '@/geometry'
import { writeBooklet } from './booklet'
import { formatMetres, formatYards } from '@/lib/fabric/fabric-table'
import { allText, openPdf, pageRectangles } from './test-support/read-pdf'
import { designFrom, wreathFile } from './test-support/designs'

const wreath = designFrom(wreathFile())

async function cuttingPart(paper: 'letter' | 'a4', orientation: 'portrait' | 'landscape' = 'portrait', settings: { widthOfFabricIn?: number; extraPercent?: number } = {}) {
  const written = writeBooklet(wreath, { paper, orientation, parts: ['cover', 'cutting', 'steps'], ...settings })
  const pdf = await openPdf(new Uint8Array(written.doc.output('arraybuffer')))
  const first = written.partPages.cutting!
  const last = written.partPages.steps! - 1
  const pages = Array.from({ length: last - first + 1 }, (_, index) => first + index)
  const rectangles = (await Promise.all(pages.map((page) => pageRectangles(pdf, page)))).flat()
  return { written, pdf, pages, rectangles }
}

describe('the booklet’s cutting diagrams', () => {
  it('is a part of its own after the cutting list, described page by page', async () => {
    const { written, pages } = await cuttingPart('letter')
    expect(written.partPages.cutting).toBeGreaterThan(written.partPages.cover!)
    expect(pages.length).toBeGreaterThan(0)
    expect(written.pages.filter((page) => page.part === 'cutting').map((page) => page.number)).toEqual(pages)
    expect(written.pages.find((page) => page.part === 'cutting')!.description).toMatch(/^cutting diagrams/)
  })

  it.each([['letter', 'portrait'], ['a4', 'landscape']] as const)('draws every cut of every strip to one scale inside the usable width (%s, %s)', async (paper, orientation) => {
    const { written, rectangles } = await cuttingPart(paper, orientation)
    const requirements = fabricRequirements(written.model.design, written.model.plan, written.model.colorway)
    // The strips run across the whole usable width, so the widest rectangles are the strips: 40 in at the drawing's scale.
    const stripWidth = Math.max(...rectangles.map((rect) => rect.width))
    const scale = stripWidth / requirements.widthOfFabricIn
    const left = Math.min(...rectangles.map((rect) => rect.x))
    const strips = requirements.fabrics.reduce((sum, fabric) => sum + fabric.strips.length, 0)
    expect(rectangles.filter((rect) => Math.abs(rect.width - stripWidth) < 0.01)).toHaveLength(strips)
    for (const rect of rectangles) {
      expect(rect.x).toBeGreaterThanOrEqual(left - 0.01)
      expect(rect.x + rect.width).toBeLessThanOrEqual(left + stripWidth + 0.01)
    }
    // Every cut of the layout is a rectangle of its size at that scale (1 in = 72 pt at true scale; here scaled down alike).
    const unmatched = [...rectangles]
    for (const fabric of requirements.fabrics) {
      for (const cut of fabric.cuts) {
        const index = unmatched.findIndex((rect) => Math.abs(rect.width - cut.widthIn * scale) < 0.01 && Math.abs(rect.height - cut.heightIn * scale) < 0.01)
        expect(index, `${fabric.fabric} ${cut.for} ${cut.widthIn} × ${cut.heightIn} in`).toBeGreaterThanOrEqual(0)
        unmatched.splice(index, 1)
      }
    }
    // What is left: the strips and a swatch per fabric.
    expect(unmatched).toHaveLength(strips + requirements.fabrics.filter((fabric) => fabric.strips.length > 0).length)
  })

  it('labels the pieces by what they are for and names each fabric and strip', async () => {
    const { written, pdf } = await cuttingPart('letter')
    const requirements = fabricRequirements(written.model.design, written.model.plan, written.model.colorway)
    const text = await allText(pdf)
    expect(text).toContain('Cutting diagrams')
    for (const fabric of requirements.fabrics) {
      expect(text).toContain(fabric.name)
      for (const cut of fabric.cuts) expect(text).toMatch(new RegExp(`\\b${cut.for}\\b`))
      fabric.strips.forEach((_, index) => expect(text).toContain(`Strip ${index + 1}: cut`))
    }
    // Leaves are cut in pairs for folding (two pieces per folded leaf, common practice): the labels carry "leaf".
    expect(requirements.fabrics.some((fabric) => fabric.cuts.some((cut) => cut.for === 'leaf'))).toBe(true)
  })

  it('works the amounts and the strips out for the usable width of fabric and the extra chosen, and says so on the fabric page', async () => {
    const standard = await cuttingPart('letter')
    const coverText = async (part: Awaited<ReturnType<typeof cuttingPart>>) => {
      const pages = Array.from({ length: part.written.partPages.cutting! - 1 }, (_, index) => index + 1)
      return (await Promise.all(pages.map(async (page) => (await part.pdf.getPage(page)).getTextContent()))).flatMap((content) => content.items.map((item) => ('str' in item ? item.str : ''))).join(' ')
    }
    // The defaults: 40 in (40 × 2.54 = 101.6 cm) and 10 % (common practice; geometry/yardage.ts).
    expect(await coverText(standard)).toContain('Yardage for 40 in (101.6 cm) usable width of fabric, 10 % extra')

    const narrow = await cuttingPart('letter', 'portrait', { widthOfFabricIn: 20, extraPercent: 0 })
    const { model } = narrow.written
    const expected = fabricRequirements(model.design, model.plan, model.colorway, { widthOfFabricIn: 20, extraPercent: 0 })
    const text = await coverText(narrow)
    // 20 in = 50.8 cm.
    expect(text).toContain('Yardage for 20 in (50.8 cm) usable width of fabric, 0 % extra')
    for (const fabric of expected.fabrics) expect(text).toContain(`${formatYards(fabric.yards)} (${formatMetres(fabric.metres)})`)
    // The strips drawn are the 20 in layout's, all as wide as each other and every cut inside them.
    const strips = expected.fabrics.reduce((sum, fabric) => sum + fabric.strips.length, 0)
    const standardStrips = fabricRequirements(model.design, model.plan, model.colorway).fabrics.reduce((sum, fabric) => sum + fabric.strips.length, 0)
    expect(strips).toBeGreaterThan(standardStrips)
    const stripWidth = Math.max(...narrow.rectangles.map((rect) => rect.width))
    expect(narrow.rectangles.filter((rect) => Math.abs(rect.width - stripWidth) < 0.01)).toHaveLength(strips)
    const scale = stripWidth / 20
    for (const fabric of expected.fabrics) {
      for (const cut of fabric.cuts) {
        expect(narrow.rectangles.some((rect) => Math.abs(rect.width - cut.widthIn * scale) < 0.01 && Math.abs(rect.height - cut.heightIn * scale) < 0.01)).toBe(true)
      }
    }
    const diagramsText = await allText(narrow.pdf)
    expect(diagramsText).toContain('Strips cut across a 20 in usable width of fabric')
    expect(diagramsText).toContain('The amounts add 0 %')
  })
})
