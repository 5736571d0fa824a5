import polygonClipping, { type Polygon as ClipPolygon } from 'polygon-clipping'
import { describe, expect, it } from 'vitest'
import { buildBooklet, writeBooklet } from './booklet'
import { applyTransform } from '@/geometry'
import { pageFrame } from './paper'
import { drawingWindow, onSheet } from './tiled-drawing'
import { layoutTiles, seamLengthInOverlaps } from './tiling'
import { allText, openPdf, pagePaths, pageRectangles, pageSizes, pageText } from './test-support/read-pdf'
import { asymmetricFile, designFrom, medallionFile, wreathFile } from './test-support/designs'
import type { DesignFile } from '@/lib/schemas/design'

const wreath = designFrom(wreathFile())

describe('booklet pages read back with pdfjs-dist', () => {
  it('carries every area label of the plan in its text', async () => {
    const written = writeBooklet(wreath, { paper: 'letter', finishedDiameterInches: 24 })
    const text = await allText(await openPdf(new Uint8Array(written.doc.output('arraybuffer'))))
    const labels = written.model.labelledAreas.map((area) => area.label!)
    expect(labels.length).toBeGreaterThan(3)
    for (const label of labels) expect(text).toMatch(new RegExp(`\\b${label}\\b`))
  })

  it.each([
    // ISO 216:2007: A4 = 210 × 297 mm, A3 = 297 × 420 mm; 1 in = 25.4 mm = 72 pt (ISO 32000-1:2008 §8.3.2.3)
    ['a4', 595.28, 841.89],
    ['a3', 841.89, 1190.55],
    // ANSI/ASME Y14.1 sheet sizes: Letter 8.5 × 11 in, Legal 8.5 × 14 in, Tabloid 11 × 17 in
    ['letter', 612, 792],
    ['legal', 612, 1008],
    ['tabloid', 792, 1224],
  ] as const)('makes every %s page %f × %f pt, portrait and landscape', async (paper, width, height) => {
    for (const orientation of ['portrait', 'landscape'] as const) {
      const pdf = await openPdf(buildBooklet(wreath, { paper, orientation }))
      const sizes = await pageSizes(pdf)
      expect(sizes.length).toBeGreaterThan(1)
      const [w, h] = orientation === 'portrait' ? [width, height] : [height, width]
      for (const [pageWidth, pageHeight] of sizes) {
        expect(Math.abs(pageWidth - w)).toBeLessThan(0.01)
        expect(Math.abs(pageHeight - h)).toBeLessThan(0.01)
      }
    }
  })

  it('draws a 72 pt and a 56.69 pt test square on every foundation page', async () => {
    const written = writeBooklet(wreath, { paper: 'a4', finishedDiameterInches: 24, parts: ['foundations'] })
    const pdf = await openPdf(new Uint8Array(written.doc.output('arraybuffer')))
    expect(pdf.numPages).toBeGreaterThan(2)
    for (let page = 1; page <= pdf.numPages; page += 1) {
      const squares = (await pageRectangles(pdf, page)).filter((r) => Math.abs(r.width - r.height) < 1e-3)
      // 1 in = 72 pt (ISO 32000-1:2008 §8.3.2.3); 2 cm = 20 / 25.4 × 72 = 56.6929 pt (1 in = 25.4 mm exactly)
      expect(squares.some((r) => Math.abs(r.width - 72) < 1e-3)).toBe(true)
      expect(squares.some((r) => Math.abs(r.width - 56.6929) < 1e-3)).toBe(true)
      const text = (await pageText(pdf, page)).map((item) => item.text).join(' ')
      expect(text).toContain('Print at 100 % (actual size)')
      expect(text).toContain('1 in')
      expect(text).toContain('2 cm')
    }
  })

  it('draws and writes nothing in the margin (clip in force counted)', async () => {
    const options = { paper: 'letter', finishedDiameterInches: 24, marginInches: 0.4 } as const
    const pdf = await openPdf(buildBooklet(wreath, options))
    const frame = pageFrame({ ...options, orientation: 'portrait' })
    // PDF space is y up; the printable rectangle is the same inset on all four sides.
    const inside = { minX: 28.8 - 0.01, minY: 28.8 - 0.01, maxX: frame.widthPt - 28.8 + 0.01, maxY: frame.heightPt - 28.8 + 0.01 }
    for (let page = 1; page <= pdf.numPages; page += 1) {
      for (const path of await pagePaths(pdf, page)) {
        if (!path.painted) continue
        const visible = path.clip
          ? { minX: Math.max(path.bounds.minX, path.clip.minX), minY: Math.max(path.bounds.minY, path.clip.minY), maxX: Math.min(path.bounds.maxX, path.clip.maxX), maxY: Math.min(path.bounds.maxY, path.clip.maxY) }
          : path.bounds
        if (visible.minX > visible.maxX || visible.minY > visible.maxY) continue
        // Half a line width of slack: a stroke on the printable edge is still inside it.
        expect(visible.minX, `page ${page}`).toBeGreaterThanOrEqual(inside.minX - 1)
        expect(visible.minY, `page ${page}`).toBeGreaterThanOrEqual(inside.minY - 1)
        expect(visible.maxX, `page ${page}`).toBeLessThanOrEqual(inside.maxX + 1)
        expect(visible.maxY, `page ${page}`).toBeLessThanOrEqual(inside.maxY + 1)
      }
      for (const item of await pageText(pdf, page)) {
        expect(item.x, `"${item.text}" on page ${page}`).toBeGreaterThanOrEqual(inside.minX)
        expect(item.x + item.width, `"${item.text}" on page ${page}`).toBeLessThanOrEqual(inside.maxX)
        expect(item.y - item.height * 0.25, `"${item.text}" on page ${page}`).toBeGreaterThanOrEqual(inside.minY)
        expect(item.y + item.height, `"${item.text}" on page ${page}`).toBeLessThanOrEqual(inside.maxY)
      }
    }
  })
})

describe('tiling a foundation', () => {
  it.each([['wreath', wreathFile()], ['medallion', medallionFile()]])('covers the whole trim outline of the %s with tiles that overlap by the promised 0.5 in (polygon-clipping)', (_, file) => {
    const written = writeBooklet(designFrom(file), { paper: 'letter', finishedDiameterInches: 24, parts: ['foundations'], overlapInches: 0.5 })
    expect(written.foundations.length).toBeGreaterThan(0)
    let tiled = 0
    for (const { sheet, layout } of written.foundations) {
      // The trim line on the sheet: points, origin at the box's top left, y down.
      const trim: ClipPolygon = [sheet.trimPolygon.map((p) => [(p[0] - sheet.box[0]) * 72, (sheet.box[3] - p[1]) * 72] as [number, number])]
      const windows: ClipPolygon[] = layout.tiles.map(({ window: w }) => [[[w.x, w.y], [w.x + w.width, w.y], [w.x + w.width, w.y + w.height], [w.x, w.y + w.height]]])
      const uncovered = polygonClipping.difference([trim], ...windows.map((w) => [w]))
      expect(uncovered).toEqual([])
      if (layout.tiles.length > 1) tiled += 1
      for (const tile of layout.tiles) {
        const right = layout.tiles.find((t) => t.row === tile.row && t.column === tile.column + 1)
        const below = layout.tiles.find((t) => t.row === tile.row + 1 && t.column === tile.column)
        // 0.5 in × 72 pt/in = 36 pt of overlap (ISO 32000-1:2008 §8.3.2.3)
        if (right) expect(tile.window.x + tile.window.width - right.window.x).toBeCloseTo(36, 9)
        if (below) expect(tile.window.y + tile.window.height - below.window.y).toBeCloseTo(36, 9)
      }
    }
    // A 24 in ring's quarter does not fit one Letter page: the check above saw real tiles.
    expect(tiled).toBeGreaterThan(0)
  })
})

describe('tile origins', () => {
  it('keeps a seam out of the overlaps where centring would lay it along one (the test wreath at 18 in on Letter)', () => {
    const written = writeBooklet(wreath, { paper: 'letter', parts: ['foundations'] })
    const frame = pageFrame({ paper: 'letter', orientation: 'portrait', marginInches: 0.4 })
    const vein = wreath.seams.find((seam) => seam.id === 'vein')!
    let worstCentred = 0
    for (const { sheet, layout } of written.foundations) {
      const line = onSheet(sheet.box, [[applyTransform(sheet.placement, vein.from), applyTransform(sheet.placement, vein.to)]])
      const centred = layoutTiles((sheet.box[2] - sheet.box[0]) * 72, (sheet.box[3] - sheet.box[1]) * 72, drawingWindow(frame), 36)
      worstCentred = Math.max(worstCentred, seamLengthInOverlaps(centred, line))
      // The chosen origin keeps all of the vein clear, on the same number of pages.
      expect(seamLengthInOverlaps(layout, line)).toBe(0)
      expect(layout.tiles).toHaveLength(centred.tiles.length)
    }
    // Centred tiles lay the vein ((3.5, 3.5) to 9 in at 45°) along an overlap strip of one foundation, over 3 in (216 pt) of it.
    expect(worstCentred).toBeGreaterThan(3 * 72)
  })
})

describe('tile names', () => {
  it('reads back no tile name of the form of an area label: header, alignment marks and page map', async () => {
    const written = writeBooklet(wreath, { paper: 'letter', finishedDiameterInches: 24, parts: ['foundations'] })
    const pdf = await openPdf(new Uint8Array(written.doc.output('arraybuffer')))
    const areaLabels = new Set(written.model.labelledAreas.map((area) => area.label!))
    let page = written.partPages.foundations!
    let tiledPages = 0
    for (const { sheet, layout } of written.foundations) {
      for (const tile of layout.tiles) {
        const items = await pageText(pdf, page)
        const text = items.map((item) => item.text).join(' ')
        if (layout.tiles.length > 1) {
          tiledPages += 1
          expect(text).toContain(`sheet ${tile.sheet} of ${layout.tiles.length}`)
        }
        // Anything of the form of an area label is an area label of this foundation, written at
        // the labels' 10 pt: never an 18 pt page name, a 6 pt target name or a page-map cell.
        for (const item of items.filter((i) => /^[A-Z]+\d+$/.test(i.text.trim()))) {
          expect(areaLabels.has(item.text.trim()), `"${item.text}" on page ${page}`).toBe(true)
          expect(item.text.trim().startsWith(sheet.kind.section), `"${item.text}" on page ${page}`).toBe(true)
          expect(Math.abs(item.height - 10), `"${item.text}" on page ${page} at ${item.height} pt`).toBeLessThan(0.5)
        }
        page += 1
      }
    }
    expect(tiledPages).toBeGreaterThan(1)
  })
})

describe('leaf notes on the foundations', () => {
  it('never overprint an area label (text positions read back)', async () => {
    // Three strips of a quarter; a leaf on the upper seam whose tip reaches the middle strip's label point.
    const strips = (leaves: DesignFile['leaves']) => designFrom(wreathFile({
      seams: [{ id: 'low', from: [0, 2], to: [Math.sqrt(77), 2] }, { id: 'high', from: [0, 4], to: [Math.sqrt(65), 4] }],
      fills: [{ at: [1, 1], fabric: 'background' }, { at: [1, 3], fabric: 'band' }, { at: [1, 5], fabric: 'sky' }],
      leaves, stems: [], berries: [], curls: [],
    }))
    const bare = writeBooklet(strips([]), { paper: 'tabloid', parts: ['foundations'] })
    const middle = bare.model.labelledAreas.find((area) => area.point[1] > 2 && area.point[1] < 4)!
    const leaf = { id: 'l1', seam: 'high', at: middle.point[0] / Math.sqrt(65), side: 'right' as const, angle: 0, length: 4 - middle.point[1], width: 0.75, layers: ['leaf-dark', 'leaf-light'] }
    const written = writeBooklet(strips([leaf]), { paper: 'tabloid', parts: ['foundations'] })
    const pdf = await openPdf(new Uint8Array(written.doc.output('arraybuffer')))
    const box = (item: { x: number; y: number; width: number; height: number }) => ({ minX: item.x, maxX: item.x + item.width, minY: item.y - 0.25 * item.height, maxY: item.y + 0.8 * item.height })
    const meet = (a: ReturnType<typeof box>, b: ReturnType<typeof box>) => a.minX < b.maxX && b.minX < a.maxX && a.minY < b.maxY && b.minY < a.maxY
    let notes = 0
    for (let page = 1; page <= pdf.numPages; page += 1) {
      const items = await pageText(pdf, page)
      const labels = items.filter((item) => /^[A-Z]+\d+$/.test(item.text.trim()))
      // Each label's fabric line is written 8 pt under it.
      const fabrics = items.filter((item) => labels.some((label) => Math.abs(label.y - 8 - item.y) < 0.5 && Math.abs(label.x + label.width / 2 - item.x - item.width / 2) < 0.5))
      const leafNotes = items.filter((item) => /^leaf \d+ of [A-Z]+\d+: baste$/.test(item.text.trim()) || item.text.trim() === 'leaf-dark, leaf-light (bottom first)')
      notes += leafNotes.length
      for (const note of leafNotes) {
        for (const label of [...labels, ...fabrics]) expect(meet(box(note), box(label)), `"${note.text}" over "${label.text}" on page ${page}`).toBe(false)
      }
    }
    expect(notes).toBeGreaterThan(0)
  })
})

describe('mirroring', () => {
  /** Twice the signed area of the triangle of three label positions: its sign is the handedness. */
  const handedness = (points: { x: number; y: number }[]): number => {
    const [a, b, c] = points as [{ x: number; y: number }, { x: number; y: number }, { x: number; y: number }]
    return (b.x - a.x) * (c.y - a.y) - (b.y - a.y) * (c.x - a.x)
  }

  it('reads mirrored on the foundation page and unmirrored on the cover (common practice: fabric on the unprinted side)', async () => {
    const design = designFrom(asymmetricFile())
    const written = writeBooklet(design, { paper: 'tabloid', parts: ['cover', 'foundations'] })
    const pdf = await openPdf(new Uint8Array(written.doc.output('arraybuffer')))
    const labels = written.model.labelledAreas.map((area) => area.label!)
    expect(labels).toHaveLength(3)
    const positions = async (page: number) => {
      const items = await pageText(pdf, page)
      return labels.map((label) => {
        const item = items.find((i) => i.text === label)
        if (!item) throw new Error(`${label} not on page ${page}`)
        return { x: item.x + item.width / 2, y: item.y }
      })
    }
    const cover = handedness(await positions(written.partPages.cover!))
    const foundation = handedness(await positions(written.partPages.foundations!))
    // The design's own handedness, from the plan's label points in repeat 0's frame (y up, like PDF space).
    const design0 = handedness(written.model.labelledAreas.map((area) => ({ x: area.point[0], y: area.point[1] })))
    expect(Math.sign(cover)).toBe(Math.sign(design0))
    expect(Math.sign(foundation)).toBe(-Math.sign(design0))
  })
})
