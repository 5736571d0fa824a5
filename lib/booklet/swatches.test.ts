/**
 * Swatch images in the booklet, read back from the PDF with pdfjs: a small square beside the
 * fabric's colour chip and name on the fabric page and the cutting diagrams; anything unreadable
 * leaves the colour chip alone and the booklet whole.
 */
import sharp from 'sharp'
import { describe, expect, it } from 'vitest'
import { writeBooklet } from './booklet'
import type { SwatchImages } from './swatches'
import { sniffSwatch, SWATCH_SIZE_PT } from './swatches'
import { designFrom, wreathFile } from './test-support/designs'
import { openPdf, pageImages, pageRectangles, pageText, type DrawnImage, type PdfDocument } from './test-support/read-pdf'

const wreath = designFrom(wreathFile())
/** 30 × 20 px, wider than tall: the square shows its middle. */
const image = (format: 'png' | 'jpeg' | 'webp', colour: string) =>
  sharp({ create: { width: 30, height: 20, channels: 3, background: colour } })[format]().toBuffer().then((buffer) => new Uint8Array(buffer))

async function booklet(swatches?: SwatchImages) {
  const written = writeBooklet(wreath, { paper: 'letter', colorway: 'Holly', parts: ['cover', 'cutting'] }, { swatches })
  const pdf = await openPdf(new Uint8Array(written.doc.output('arraybuffer')))
  const pages = (from: number, to: number) => Array.from({ length: to - from + 1 }, (_, index) => from + index)
  return { written, pdf, cover: pages(1, written.partPages.cutting! - 1), cutting: pages(written.partPages.cutting!, pdf.numPages) }
}

/** The images of some pages, each with the text that starts nearest to its right on its line. */
async function imagesWithNames(pdf: PdfDocument, pages: number[]): Promise<{ image: DrawnImage; name: string | undefined }[]> {
  const found: { image: DrawnImage; name: string | undefined }[] = []
  for (const page of pages) {
    const text = await pageText(pdf, page)
    for (const drawn of await pageImages(pdf, page)) {
      const clip = drawn.clip!
      const beside = text
        .filter((item) => item.x > clip.maxX && item.x - clip.maxX < 8 && item.y >= clip.minY && item.y <= clip.maxY)
        .sort((a, b) => a.x - b.x)[0]
      found.push({ image: drawn, name: beside?.text })
    }
  }
  return found
}

async function allRectangles(pdf: PdfDocument, pages: number[]) {
  return (await Promise.all(pages.map((page) => pageRectangles(pdf, page)))).flat()
}

describe('swatch images in the booklet', () => {
  it('draws each as a square beside its fabric’s name, on the fabric page and on the cutting diagrams', async () => {
    const swatches: SwatchImages = {
      background: { bytes: await image('png', '#e8dcc4'), type: 'image/png' },
      'leaf-dark': { bytes: await image('jpeg', '#2f5d50'), type: 'image/jpeg' },
      berry: { bytes: await image('webp', '#7b2d26'), type: 'image/webp' },
    }
    const { pdf, cover, cutting } = await booklet(swatches)
    const names = ['Parchment tone-on-tone', 'Holly green batik', 'Rosehip red tonal dot']
    const onCover = await imagesWithNames(pdf, cover)
    const onCutting = await imagesWithNames(pdf, cutting)
    // The fabric page names each fabric twice with its chip: under "What to buy" and in the cutting list.
    expect(onCover.map((found) => found.name).sort()).toEqual([...names, ...names].sort())
    // The cutting diagrams name each fabric once, above its strips.
    expect(onCutting.map((found) => found.name).sort()).toEqual([...names].sort())
    for (const { image: drawn } of [...onCover, ...onCutting]) {
      const clip = drawn.clip!
      // A square of SWATCH_SIZE_PT (10 pt) …
      expect(clip.maxX - clip.minX).toBeCloseTo(SWATCH_SIZE_PT, 3)
      expect(clip.maxY - clip.minY).toBeCloseTo(SWATCH_SIZE_PT, 3)
      // … covered by the 30 × 20 px image at 10 pt high, 15 pt wide, centred: its middle shows.
      expect([drawn.width, drawn.height]).toEqual([expect.closeTo(15, 3), expect.closeTo(10, 3)])
      expect(drawn.x + drawn.width / 2).toBeCloseTo((clip.minX + clip.maxX) / 2, 3)
      expect(drawn.y + drawn.height / 2).toBeCloseTo((clip.minY + clip.maxY) / 2, 3)
    }
  })

  it('takes a data: URL as well as bytes', async () => {
    const png = await image('png', '#d9a441')
    const dataUrl = `data:image/png;base64,${Buffer.from(png).toString('base64')}`
    const { pdf, cover, cutting } = await booklet({ sky: { dataUrl } })
    const found = await imagesWithNames(pdf, [...cover, ...cutting])
    expect(found.map((item) => item.name)).toEqual(['Morning mist solid', 'Morning mist solid', 'Morning mist solid'])
  })

  it('leaves the colour chip alone for a missing, mislabelled or unreadable image, and the booklet whole', async () => {
    const png = await image('png', '#3b4f7a')
    const plain = await booklet()
    const broken = await booklet({
      // Not an image at all, though labelled one.
      background: { bytes: new TextEncoder().encode('Cream tone-on-tone, 1/2 yd'), type: 'image/png' },
      // A PNG said to be a JPEG.
      band: { bytes: png, type: 'image/jpeg' },
      // A PNG cut short after its signature and a few bytes.
      sky: { bytes: png.slice(0, 24), type: 'image/png' },
      // Empty, and a data: URL that is not base64.
      'leaf-dark': { bytes: new Uint8Array(0), type: 'image/png' },
      'leaf-light': { dataUrl: 'data:image/png;base64,@@not base64@@' },
      // Not even the right shape (a caller's mistake).
      stem: { bytes: 'not bytes' } as unknown as SwatchImages[string],
    })
    expect(broken.pdf.numPages).toBe(plain.pdf.numPages)
    for (const page of [...broken.cover, ...broken.cutting]) expect(await pageImages(broken.pdf, page)).toEqual([])
    // The same chips and strips, drawn in the same places, as a booklet given no swatches.
    expect(await allRectangles(broken.pdf, [...broken.cover, ...broken.cutting])).toEqual(await allRectangles(plain.pdf, [...plain.cover, ...plain.cutting]))
  })

  it('knows an image by its first bytes, not its name', () => {
    expect(sniffSwatch(new Uint8Array([0xff, 0xd8, 0xff, 0xe0]))).toBe('JPEG')
    expect(sniffSwatch(new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))).toBe('PNG')
    // "RIFF", a length, "WEBP" (the RIFF container of WebP, RFC 9649).
    expect(sniffSwatch(new Uint8Array([0x52, 0x49, 0x46, 0x46, 1, 2, 3, 4, 0x57, 0x45, 0x42, 0x50]))).toBe('WEBP')
    expect(sniffSwatch(new Uint8Array([0x47, 0x49, 0x46, 0x38]))).toBeNull() // GIF8: not taken
  })
})
