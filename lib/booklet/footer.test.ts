import { describe, expect, it } from 'vitest'
import { writeBooklet } from './booklet'
import { footerLine } from './chrome'
import { pageFrame } from './paper'
import { openPdf, pageText } from './test-support/read-pdf'
import { designFrom, wreathFile } from './test-support/designs'

const wreath = designFrom(wreathFile())
const tester = { person: 'Sam Reed', notice: 'test copy – not for sale' }

async function readBack(footer?: typeof tester) {
  const written = writeBooklet(wreath, { paper: 'letter', finishedDiameterInches: 24 }, footer ? { footer } : {})
  return { written, pdf: await openPdf(new Uint8Array(written.doc.output('arraybuffer'))) }
}

describe('the footer notice', () => {
  it("prints the notice and the person's name at the foot of every page, inside the printable area", async () => {
    const { written, pdf } = await readBack(tester)
    expect(pdf.numPages).toBeGreaterThan(3)
    const frame = pageFrame(written.model.options)
    const pageHeight = frame.heightPt
    for (let page = 1; page <= pdf.numPages; page += 1) {
      const items = (await pageText(pdf, page)).filter((item) => item.text.includes('test copy – not for sale · Sam Reed'))
      expect(items, `page ${page}`).toHaveLength(1)
      const item = items[0]!
      // pdfjs reads y up from the page's foot; the printable area's foot is its top + height, y down.
      const printableFoot = pageHeight - (frame.printable.y + frame.printable.height)
      expect(item.y).toBeGreaterThanOrEqual(printableFoot - 0.01)
      expect(item.y).toBeLessThan(printableFoot + 4)
      // Centred on the page (within a point): clear of the test squares on the left.
      expect(Math.abs(item.x + item.width / 2 - (frame.printable.x + frame.printable.width / 2))).toBeLessThan(1)
    }
  })

  it('is left out when no footer is asked for', async () => {
    const { pdf } = await readBack()
    for (let page = 1; page <= pdf.numPages; page += 1) {
      expect((await pageText(pdf, page)).some((item) => item.text.includes('not for sale'))).toBe(false)
    }
  })

  it('reads as one line and shortens a very long one', () => {
    expect(footerLine({ person: '  Sam\n Reed ', notice: 'licensed to Sam Reed for personal use' })).toBe('licensed to Sam Reed for personal use · Sam Reed')
    expect(footerLine({ person: 'x'.repeat(300), notice: 'test copy' })).toHaveLength(160)
  })
})
