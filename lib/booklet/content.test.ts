import { readFileSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { buildBooklet, writeBooklet } from './booklet'
import { fittingName } from './foundation-pages'
import { joinSentences } from './steps'
import { allText, openPdf } from './test-support/read-pdf'
import { designFrom, medallionFile, wreathFile } from './test-support/designs'
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
    expect(text).toMatch(/A2: Unassigned\. Cut 9 1\/4 × 5 3\/4 in/)
    expect(text).toMatch(/Finishing, in this order/)
    // The leaf by its plain name, over the one area it lies over, its layers bottom first.
    // Layers bottom first, each at its own size: the second is 0.9 of the first and turned 10° (the default fan):
    // 1.5 × 0.9 = 1.35 → 1 3/8 in, 0.75 × 0.9 = 0.675 → 5/8 in to the nearest 1/8.
    expect(text).toMatch(/baste leaf 1 of A1 \(layers bottom first: Leaf dark 1 1\/2 × 3\/4 in, Leaf light 1 3\/8 × 5\/8 in turned 10° counter-clockwise\)/)
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

  it('folds back on the line between an area and only the sewn areas along that line', async () => {
    const text = await textOf(buildBooklet(designFrom(medallionFile()), { paper: 'letter', parts: ['steps'] }))
    // The medallion's A3 is sewn along a line both A1 and A2 reach; A4 only along A3's edge.
    expect(text).toMatch(/Fold the paper back on the line between A3 and A1, A2 and trim/)
    expect(text).toMatch(/Fold the paper back on the line between A4 and A3 and trim/)
  })

  it('prepares the folded leaves before sewing and cuts pieces, two per leaf', async () => {
    const text = await textOf(buildBooklet(designFrom(wreathFile()), { paper: 'letter', parts: ['cover', 'steps', 'templates'] }))
    // The test wreath: 2 leaves per repeat, each of 2 layers (leaf-dark under leaf-light), 4 repeats:
    // 2 × 4 = 8 folded leaves of each fabric; 2 pieces per folded leaf gives 16 pieces each.
    expect(text).toMatch(/The ring needs 16 folded leaves: 4 per repeat × 4 repeats/)
    expect(text).toMatch(/- Holly green batik: 8 folded leaves 1 3\/4 × 7\/8 in, from 16 pieces\./)
    // The top layer is 0.9 of the leaf (the default fan): 1.75 × 0.9 = 1.575 → 1 5/8 in, 0.875 × 0.9 = 0.7875 → 3/4 in.
    expect(text).toMatch(/- Sage sprig print: 8 folded leaves 1 5\/8 × 3\/4 in, from 16 pieces\./)
    expect(text).toMatch(/sew on it, leaving the open end open; cut both on the dashed cut line; clip across the tip, turn right side out/)
    expect(text).toMatch(/Holly green batik 16 × leaf piece 1 3\/4 × 7\/8 in, cut with the leaf template of that size \(2 per folded leaf\)/)
    expect(text).toMatch(/Sage sprig print 16 × leaf piece 1 5\/8 × 3\/4 in, cut with the leaf template of that size \(2 per folded leaf\)/)
    expect(text).toMatch(/Leaf 1 3\/4 × 7\/8 in 8 folded leaves = 16 pieces: Holly green batik/)
    expect(text).toMatch(/Leaf 1 5\/8 × 3\/4 in 8 folded leaves = 16 pieces: Sage sprig print/)
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
    expect(text).toMatch(/leaf 1 of A2 on section A \(layers bottom first: Holly green batik 1 3\/4 × 7\/8 in, Sage sprig print 1 5\/8 × 3\/4 in turned 10° counter-clockwise\): lay it on the fabric side over A2/)
    // The band seam runs (7, 0) to (0, 7), 7√2 = 9.899 in, between A2's two corners on the foundation's
    // side edges; the leaf at 0.3 of it: 0.3 × 9.899 = 2.97 → 3 in from one end, 0.7 × 9.899 = 6.93 → 6 7/8 in
    // from the other. Section B's areas lie beyond the paper's edge, so they do not name the ends.
    expect(text).toMatch(/over A2, the middle of its open end 3 in from one end of the line and 6 7\/8 in from the other \(both ends at the edge of the foundation\), tip into A2, square to the line \(toward the centre\)/)
    expect(text).not.toMatch(/corner of B/)
    const order = ['Stem ring', 'Curling stems', 'quilt it', 'Berries', 'Bind the curved edge'].map((words) => text.indexOf(words))
    expect(order.every((at) => at >= 0)).toBe(true)
    expect([...order].sort((a, b) => a - b)).toEqual(order)
  })

  it("notes each area's fabric under its label on the foundations by the colourway's name, cut short to fit", async () => {
    const text = await textOf(buildBooklet(designFrom(wreathFile()), { paper: 'letter', finishedDiameterInches: 24, parts: ['foundations'], colorway: 'Holly' }))
    // A1 and B2 are background (Parchment tone-on-tone), A2 band, B1 sky: whole or shortened with "...".
    expect(text).toMatch(/Parchment( tone-on-tone|[^ ]*\.\.\.)/)
    expect(text).toMatch(/Pale fern (crossweave|[^ ]*\.\.\.)/)
    // The leaf notes name the layers' fabrics too.
    expect(text).toMatch(/baste Holly green batik, Sage sprig print \(bottom first\)/)
    for (const role of ['background', 'band', 'sky', 'leaf-dark', 'leaf-light']) expect(text).not.toMatch(new RegExp(`\\b${role}\\b`))
  })

  it('shortens a fabric name that does not fit under an area label, never below four letters', () => {
    expect(fittingName('Snowberry white tone-on-tone', (text) => text.length <= 12)).toBe('Snowberry...')
    expect(fittingName('Cream', () => true)).toBe('Cream')
    expect(fittingName('Snowberry white', (text) => text.length <= 6)).toBeNull()
  })

  it('lists every fabric of the colourway in the cutting list', async () => {
    const text = await textOf(buildBooklet(designFrom(wreathFile()), { paper: 'a4', parts: ['cover'], colorway: 'Frost' }))
    // By the names the chosen colourway gives them (lib/booklet/test-support/designs.ts, Frost), never by their roles.
    for (const name of ['Snowberry white tone-on-tone', 'Icicle blue crossweave', 'Frozen pond solid', 'Spruce shadow batik', 'Glacier print', 'Pewter shot cotton', 'Silver birch dot']) {
      expect(text).toContain(name)
    }
    for (const role of ['background', 'leaf-dark', 'leaf-light', 'sky']) expect(text).not.toMatch(new RegExp(`\\b${role}\\b`))
    expect(text).toContain('Colourway: Frost')
    expect(text).toMatch(/Finished diameter: 18 in/)
  })

  it('gives the binding its cut width, fabric and a strip for each curved edge', async () => {
    const wedge = await textOf(buildBooklet(designFrom(wreathFile()), { paper: 'letter', parts: ['cover', 'steps'] }))
    // Default 2 1/4 in (common practice for double-fold binding); the "binding" role of the colourway.
    expect(wedge).toMatch(/Double-fold bias binding, cut 2 1\/4 in wide from Binding: 67 in in all/)
    // 2π × 9 in = 56.5 in, + 10 in for joining (common practice) = 67 in, rounded up.
    expect(wedge).toMatch(/Outer edge: 2 × 3\.14 × 9 in = 56\.5 in, plus 10 in for joining the ends: 67 in\./)
    expect(wedge).toMatch(/1 × bias strip 2 1\/4 in wide, 67 in long in all \(binding, outer edge\)/)
    expect(wedge).not.toMatch(/Inner edge/)
    expect(wedge).toMatch(/Bind the curved edge with double-fold bias binding cut 2 1\/4 in wide from Binding \(67 in for the outer edge/)
    const ring = await textOf(buildBooklet(designFrom(medallionFile()), { paper: 'letter', parts: ['cover', 'steps'] }))
    // outer 2π × 10 in = 62.8 in + 10 in → 73 in; inner 2π × 3 in = 18.8 in + 10 in → 29 in; 102 in in all.
    expect(ring).toMatch(/Outer edge: 2 × 3\.14 × 10 in = 62\.8 in, plus 10 in for joining the ends: 73 in\./)
    expect(ring).toMatch(/Inner edge: 2 × 3\.14 × 3 in = 18\.8 in, plus 10 in for joining the ends: 29 in\./)
    expect(ring).toMatch(/102 in in all/)
    expect(ring).toMatch(/Bind the outer and inner curved edges .*\(73 in for the outer edge and 29 in for the inner edge/)
  })

  it("keeps the design's binding width and fabric at any printed size, and reads it from a centimetre file", async () => {
    const file = wreathFile({ binding: { cutWidth: 2.5, fabric: 'band' } })
    // Printed at 36 in (twice the size), the strips stay 2 1/2 in wide: binding is not part of the drawing.
    const text = await textOf(buildBooklet(designFrom(file), { paper: 'letter', parts: ['cover'], finishedDiameterInches: 36 }))
    expect(text).toMatch(/cut 2 1\/2 in wide from Pale fern crossweave/)
    // 6.35 cm = 2.5 in exactly (1 in = 2.54 cm, 1959 agreement).
    const centimetres = designFrom({ ...wreathFile(), units: 'cm', ring: { innerRadius: 0, outerRadius: 22.86, repeats: 4, repeatMode: 'rotate' }, seams: [], leaves: [], stems: [], berries: [], curls: [], fills: [], binding: { cutWidth: 6.35 } })
    expect(centimetres.binding?.cutWidth).toBeCloseTo(2.5, 12)
    expect(designFrom(wreathFile()).binding).toBeUndefined()
  })

  it('says on which side of the traced circle the stem strip lies, so it lands on the drawn stem', async () => {
    const text = await textOf(buildBooklet(designFrom(wreathFile()), { paper: 'letter', parts: ['steps'] }))
    // Stem of 3/8 in finished: cut 2 × 3/8 + 1/2 = 1 1/4 in (derivable), folded 5/8 in.
    expect(text).toMatch(/cut bias strips 1 1\/4 in wide/)
    expect(text).toMatch(/wrong sides together \(5\/8 in wide\)/)
    expect(text).toMatch(/Lay the strip on the centre side of the inner traced circle, its raw edges toward the outer edge and 1\/4 in beyond that circle, and sew 1\/4 in from the raw edges, so the stitching runs on the inner traced circle/)
    expect(text).toMatch(/Press the strip over the seam toward the outer edge: it covers the raw edges and its fold lies on the outer traced circle, 3\/8 in from the stitching/)
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
