import { describe, expect, it } from 'vitest'
import { fabricRequirements } from '@/geometry'
import { writeBooklet } from './booklet'
import { allText, openPdf, pageRectangles } from './test-support/read-pdf'
import { designFrom, wreathFile } from './test-support/designs'

const wreath = designFrom(wreathFile())

async function cuttingPart(paper: 'letter' | 'a4', orientation: 'portrait' | 'landscape' = 'portrait') {
  const written = writeBooklet(wreath, { paper, orientation, parts: ['cover', 'cutting', 'steps'] })
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
})
