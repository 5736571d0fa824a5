/**
 * The booklet through an independent renderer: Debian's pdftoppm (poppler) renders every page
 * without complaint, and a rendered foundation page's 1 in test square measures one inch of
 * pixels at the resolution asked for.
 */
import { execFileSync, spawnSync } from 'node:child_process'
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { writeBooklet } from '@/lib/booklet/booklet'
import { TEST_BAND_HEIGHT_PT } from '@/lib/booklet/chrome'
import { designFrom } from '@/lib/booklet/test-support/designs'
import { parseDesign } from '@/lib/schemas/design'
import { DEMO_PATTERNS } from '@/scripts/demo-data'

const demoWreath = (() => {
  const file = DEMO_PATTERNS.find((pattern) => pattern.design.name === 'Hollyberry Wreath')!.design
  const parsed = parseDesign(file)
  return parsed.ok ? parsed.design : designFrom(file)
})()

/** Reads a binary PGM (P5) as written by pdftoppm -gray. */
function readPgm(path: string): { width: number; height: number; pixel: (x: number, y: number) => number } {
  const data = readFileSync(path)
  const header = data.subarray(0, 64).toString('latin1').split(/\s+/)
  const [magic, width, height, max] = [header[0], Number(header[1]), Number(header[2]), header[3]]
  expect(magic).toBe('P5')
  const offset = data.indexOf(`${max}\n`, 0, 'latin1') + `${max}\n`.length
  return { width, height, pixel: (x, y) => data[offset + y * width + x]! }
}

/** Centres of the dark runs (value < 128) along a line of pixels. */
function darkRunCentres(values: number[]): number[] {
  const centres: number[] = []
  let start = -1
  values.forEach((value, index) => {
    if (value < 128 && start < 0) start = index
    if ((value >= 128 || index === values.length - 1) && start >= 0) {
      centres.push((start + (value >= 128 ? index - 1 : index)) / 2)
      start = -1
    }
  })
  return centres
}

describe('the demo wreath at 24 in on Letter, rendered with pdftoppm', () => {
  const folder = mkdtempSync(join(tmpdir(), 'booklet-render-'))
  const written = writeBooklet(demoWreath, { paper: 'letter', finishedDiameterInches: 24 })
  const pdfPath = join(folder, 'wreath.pdf')
  writeFileSync(pdfPath, new Uint8Array(written.doc.output('arraybuffer')))
  const pages = written.doc.getNumberOfPages()

  it('renders every page without errors', () => {
    const result = spawnSync('pdftoppm', ['-r', '24', '-png', pdfPath, join(folder, 'page')], { encoding: 'utf8' })
    expect(result.status).toBe(0)
    expect(result.stderr).toBe('')
    expect(readdirSync(folder).filter((name) => name.startsWith('page') && name.endsWith('.png'))).toHaveLength(pages)
  })

  it('prints the 1 in test square 1 in wide and high: 150 px at 150 dpi (1 in = 72 pt, ISO 32000-1:2008 §8.3.2.3)', () => {
    const page = written.partPages.foundations!
    const dpi = 150
    execFileSync('pdftoppm', ['-r', String(dpi), '-gray', '-f', String(page), '-l', String(page), '-singlefile', pdfPath, join(folder, 'square')])
    const image = readPgm(join(folder, 'square.pgm'))
    // US Letter at 150 dpi: 8.5 × 11 in = 1275 × 1650 px (ANSI/ASME Y14.1)
    expect([image.width, image.height]).toEqual([1275, 1650])
    const px = (points: number): number => (points / 72) * dpi
    const margin = 0.4 * 72
    // The square's top left, where chrome.ts draws it: the test band's top + 10 pt.
    const left = px(margin)
    const top = px(792 - margin - TEST_BAND_HEIGHT_PT + 10)
    // Scan through the square a quarter of the way in, clear of its "1 in" label.
    const row = Math.round(top + px(18))
    const across = Array.from({ length: Math.round(px(90)) }, (_, i) => image.pixel(Math.round(left - px(9)) + i, row))
    const column = Math.round(left + px(18))
    const down = Array.from({ length: Math.round(px(90)) }, (_, i) => image.pixel(column, Math.round(top - px(9)) + i))
    // The edges are the dark runs nearest where they should be (the scans also cross label text).
    const nearest = (runs: number[], expected: number): number => runs.reduce((best, run) => (Math.abs(run - expected) < Math.abs(best - expected) ? run : best))
    const [l, r] = [nearest(darkRunCentres(across), px(9)), nearest(darkRunCentres(across), px(9) + dpi)]
    const [t, b] = [nearest(darkRunCentres(down), px(9)), nearest(darkRunCentres(down), px(9) + dpi)]
    // One pixel of slack for the rasteriser's rounding of a 0.5 pt line.
    expect(Math.abs(r - l - dpi)).toBeLessThanOrEqual(1)
    expect(Math.abs(b - t - dpi)).toBeLessThanOrEqual(1)
  })
})
