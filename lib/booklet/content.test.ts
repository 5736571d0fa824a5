import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { buildBooklet, writeBooklet } from './booklet'
import { joinSentences } from './steps'
import { allText, openPdf } from './test-support/read-pdf'
import { designFrom, wreathFile } from './test-support/designs'
import type { DesignFile } from '@/lib/schemas/design'

const fixture = (name: string) => designFrom(JSON.parse(readFileSync(`geometry/fixtures/${name}/design.json`, 'utf8')) as DesignFile)
const textOf = async (bytes: Uint8Array) => (await allText(await openPdf(bytes))).replace(/\s+/g, ' ')

describe('booklet text', () => {
  it('carries the cautions of the trade (common practice)', async () => {
    const text = await textOf(buildBooklet(designFrom(wreathFile()), { paper: 'letter', parts: ['cautions'] }))
    expect(text).toMatch(/Rotary cutters are very sharp/)
    expect(text).toMatch(/never leave a hot iron unattended/)
    expect(text).toMatch(/not suitable for infants/)
    expect(text).toMatch(/Use your own judgement/)
  })

  it('gives each step its rough-cut size and the leaves to baste first', async () => {
    // Plan fixture: A2 is sewn after leaf l1 is basted; A2's rough cut is 9 1/4 × 5 3/4 in.
    const design = fixture('leaf-basted-before-its-seam')
    const text = await textOf(buildBooklet(design, { paper: 'letter', parts: ['steps'] }))
    expect(text).toMatch(/A2: unassigned\. Cut 9 1\/4 × 5 3\/4 in/)
    expect(text).toMatch(/Finishing, in this order/)
    // The leaf by its plain name, over the one area it lies over, its layers bottom first.
    expect(text).toMatch(/baste leaf 1 of A1 \(layers bottom first: leaf-dark, leaf-light\)/)
    expect(text).not.toMatch(/leaf l1/)
    // Seam "high" runs from (0, 4) to the outer arc at (√(81 − 16), 4) = (8.062, 4); the leaf sits at
    // 0.4 of it, x = 3.225, so 8.062 − 3.225 = 4.837 in from the outer end: 4 7/8 in to the nearest 1/8.
    // The other end lies on a straight side edge, less clear to find, so the outer end is named.
    expect(text).toMatch(/over A1, the middle of its open end 4 7\/8 in along the line from its end at the outer edge/)
    // Its 15° tilt turns the tip from straight down (−y, the right of the seam) toward +x: the outer end.
    expect(text).toMatch(/tip into A1, leaning 15° from square toward the end at the outer edge/)
    // In order: the earlier seam folded back and trimmed, the leaf basted from the printed side, then A2 sewn.
    const order = ['Fold the paper back on the line between A2 and A1', 'baste leaf 1 of A1', 'From the printed side, baste on the line through it', 'Lay the A2 piece right side down'].map((words) => text.indexOf(words))
    expect(order.every((at) => at >= 0)).toBe(true)
    expect([...order].sort((a, b) => a - b)).toEqual(order)
  })

  it('prepares the folded leaves before sewing and cuts pieces, two per leaf', async () => {
    const text = await textOf(buildBooklet(designFrom(wreathFile()), { paper: 'letter', parts: ['cover', 'steps', 'templates'] }))
    // The test wreath: 2 leaves per repeat, each of 2 layers (leaf-dark under leaf-light), 4 repeats:
    // 2 × 4 = 8 folded leaves of each fabric; 2 pieces per folded leaf gives 16 pieces each.
    expect(text).toMatch(/The ring needs 16 folded leaves: 4 per repeat × 4 repeats/)
    expect(text).toMatch(/- leaf-dark: 8 folded leaves 1 3\/4 × 7\/8 in, from 16 pieces\./)
    expect(text).toMatch(/- leaf-light: 8 folded leaves 1 3\/4 × 7\/8 in, from 16 pieces\./)
    expect(text).toMatch(/sew on it, leaving the open end open; cut both on the dashed cut line; clip across the tip, turn right side out/)
    expect(text).toMatch(/16 × leaf piece 1 3\/4 × 7\/8 in, cut with the leaf template \(2 per folded leaf\)/)
    // The leaf template's caption counts both fabrics of its size: 8 + 8 = 16 folded leaves, 32 pieces.
    expect(text).toMatch(/16 folded leaves = 32 pieces: leaf-dark, leaf-light/)
    expect(text.indexOf('Prepare the leaves')).toBeGreaterThan(0)
    expect(text.indexOf('Prepare the leaves')).toBeLessThan(text.indexOf('Section A'))
  })

  it('never shows a leaf id, anywhere in the booklet', async () => {
    const file = wreathFile()
    const design = designFrom({ ...file, leaves: file.leaves!.map((leaf, index) => ({ ...leaf, id: `leaf-${['east', 'west'][index]}` })) })
    const text = await textOf(buildBooklet(design, { paper: 'letter' }))
    expect(text).toMatch(/leaf 1 of A2/)
    expect(text).not.toMatch(/leaf-east|leaf-west/)
  })

  it('names leaves caught in a section join and the finishing order', async () => {
    const text = await textOf(buildBooklet(designFrom(wreathFile()), { paper: 'letter', parts: ['steps'] }))
    expect(text).toMatch(/Join A and B along their shared seam/)
    expect(text).toMatch(/leaf 1 of A2 on section A \(layers bottom first: leaf-dark, leaf-light\): lay it on the fabric side over A2/)
    const order = ['Stem ring', 'Curling stems', 'quilt it', 'Berries', 'Bind the curved edge'].map((words) => text.indexOf(words))
    expect(order.every((at) => at >= 0)).toBe(true)
    expect([...order].sort((a, b) => a - b)).toEqual(order)
  })

  it('lists every fabric of the colourway in the cutting list', async () => {
    const text = await textOf(buildBooklet(designFrom(wreathFile()), { paper: 'a4', parts: ['cover'], colorway: 'Frost' }))
    for (const fabric of ['background', 'band', 'sky', 'leaf-dark', 'leaf-light', 'stem', 'berry']) expect(text).toContain(fabric)
    expect(text).toContain('Colourway: Frost')
    expect(text).toMatch(/Finished diameter: 18 in/)
  })

  it('prints the mirrored repeats of an alternately mirrored ring as their own foundations', () => {
    const design = designFrom(wreathFile({ ring: { innerRadius: 2, outerRadius: 9, repeats: 6, repeatMode: 'mirror' }, seams: [{ id: 'a', from: [5, 0], to: [2.5, 4.33] }], fills: [], leaves: [], berries: [], curls: [], stems: [] }))
    const written = writeBooklet(design, { paper: 'letter', parts: ['foundations'] })
    const titles = written.foundations.map((f) => f.sheet.title)
    expect(titles.some((title) => /repeats 1, 3, 5: make 3/.test(title))).toBe(true)
    expect(titles.some((title) => /repeats 2, 4, 6 \(mirror image\): make 3/.test(title))).toBe(true)
  })

  it('still writes a booklet for a design that cannot be sewn, and says why on the cover', async () => {
    const text = await textOf(buildBooklet(fixture('y-junction-set-in'), { paper: 'letter' }))
    expect(text).toMatch(/cannot be sewn as it stands/)
  })

  it('describes the join tree pairs first', () => {
    expect(joinSentences([['A', 'B'], ['C', 'D']])).toEqual([
      'Join A and B along their shared seam (now AB).',
      'Join C and D along their shared seam (now CD).',
      'Join AB and CD along their shared seam (now ABCD).',
    ])
    expect(joinSentences('A')).toEqual([])
    expect(joinSentences([])).toEqual([])
  })
})

describe('every geometry fixture', () => {
  const names = ['centimetre-annulus-one-section', 'dangling-seam-end', 'ends-near-outline-snapped', 'grid-3x4-three-sections', 'hand-set-order-two-lines', 'leaf-basted-before-its-seam', 'odd-wedge-ring-warns-at-centre', 'pinwheel-no-plan', 'straight-seam-two-rays-one-section', 'x-crossing-two-sections', 'y-junction-set-in']
  it.each(names)('gets a booklet on every paper: %s', (name) => {
    const design = fixture(name)
    for (const paper of ['letter', 'a3'] as const) {
      const bytes = buildBooklet(design, { paper, orientation: paper === 'a3' ? 'landscape' : 'portrait' })
      expect(new TextDecoder().decode(bytes.subarray(0, 5))).toBe('%PDF-')
    }
  })
})
