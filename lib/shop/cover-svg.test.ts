// @vitest-environment jsdom
import { describe, expect, it } from 'vitest'
import { fabricsOfAreas, planDesign, type Design } from '@/geometry'
import { designFrom, wreathFile } from '@/lib/booklet/test-support/designs'
import { ringCoverSvg, UNCOLOURED_FILL } from './cover-svg'

/** The SVG read back as XML, so the test sees what a browser would, not our own strings. */
function parseSvg(svg: string): Document {
  // jsdom's DOMParser (this file's test environment), the XML parser a browser would use.
  const document = new DOMParser().parseFromString(svg, 'image/svg+xml')
  expect(document.querySelector('parsererror')).toBeNull()
  return document
}

const cover = (design: Design, colorway?: string) => parseSvg(ringCoverSvg(design, { colorway, idPrefix: 'c1', title: `${design.name} in ${colorway ?? 'its first colourway'}` }))

/** The areas of repeat 0, as placed once in <defs>. */
const areaPaths = (document: Document) => [...document.querySelectorAll('#c1-areas > path')]

describe('the shop cover of a ring', () => {
  const design = designFrom(wreathFile())
  const plan = planDesign(design)

  it('draws every area of the plan once in repeat 0 and places repeat 0 once per repeat', () => {
    const document = cover(design)
    expect(areaPaths(document)).toHaveLength(plan.areas.length)
    expect(plan.areas.length).toBeGreaterThan(0)
    // Areas and decorations, each placed at every one of the 4 repeats.
    expect(document.querySelectorAll('use[href="#c1-areas"]')).toHaveLength(design.ring.repeats)
    expect(document.querySelectorAll('use[href="#c1-decor"]')).toHaveLength(design.ring.repeats)
    // 18 in ring: the view is the outer circle's square, -9 to 9 in.
    expect(document.documentElement.getAttribute('viewBox')).toBe('-9 -9 18 18')
  })

  it('fills each area with its fabric’s colour in the chosen colourway', () => {
    const fabricOf = fabricsOfAreas(design.fills, plan.areas)
    for (const colorway of design.colorways) {
      const document = cover(design, colorway.name)
      expect(document.documentElement.getAttribute('data-colorway')).toBe(colorway.name)
      const fills = areaPaths(document).map((path) => path.getAttribute('fill'))
      const expected = plan.areas.map((area) => colorway.fabrics[fabricOf.get(area.id)!]?.color.toLowerCase())
      expect(fills).toEqual(expected)
      expect(fills).not.toContain(UNCOLOURED_FILL)
      // Leaves and berries too, in this colourway's colours.
      const colours = new Set(Object.values(colorway.fabrics).map((fabric) => fabric.color.toLowerCase()))
      const decorationFills = [...document.querySelectorAll('#c1-decor > [fill]')].map((shape) => shape.getAttribute('fill')).filter((fill) => fill !== 'none')
      expect(decorationFills.length).toBeGreaterThan(0)
      for (const fill of decorationFills) expect(colours).toContain(fill)
    }
  })

  it('draws two colourways of one design differently, and an unknown colourway as the first', () => {
    const two = designFrom(wreathFile({
      colorways: [
        { name: 'Holly', fabrics: { background: { name: 'Cream', color: '#f4ecd8' }, band: { name: 'Green', color: '#2f5540' }, sky: { name: 'Sky', color: '#8fb0c8' } } },
        { name: 'Ember', fabrics: { background: { name: 'Cinnamon', color: '#8a4b2f' }, band: { name: 'Gold', color: '#e9b44c' }, sky: { name: 'Ink', color: '#1d3557' } } },
      ],
    }))
    const holly = areaPaths(cover(two, 'Holly')).map((path) => path.getAttribute('fill'))
    const ember = areaPaths(cover(two, 'Ember')).map((path) => path.getAttribute('fill'))
    expect(new Set(holly)).toEqual(new Set(['#f4ecd8', '#2f5540', '#8fb0c8']))
    expect(new Set(ember)).toEqual(new Set(['#8a4b2f', '#e9b44c', '#1d3557']))
    expect(areaPaths(cover(two, 'No such colourway')).map((path) => path.getAttribute('fill'))).toEqual(holly)
  })

  it('draws a fabric the colourway does not colour in grey', () => {
    const partial = designFrom(wreathFile({ colorways: [{ name: 'Half', fabrics: { background: { name: 'Cream', color: '#f4ecd8' } } }] }))
    const fills = new Set(areaPaths(cover(partial)).map((path) => path.getAttribute('fill')))
    expect(fills).toEqual(new Set(['#f4ecd8', UNCOLOURED_FILL]))
  })

  it('draws arcs of the outer circle as SVG arcs of its radius', () => {
    const data = areaPaths(cover(design)).map((path) => path.getAttribute('d') ?? '')
    // The outer areas end on the 9 in circle: at least one arc of radius 9.
    expect(data.some((d) => /A9 9 0 0 1 /.test(d))).toBe(true)
  })

  it('escapes the title it is given', () => {
    const svg = ringCoverSvg(design, { idPrefix: 'c1', title: 'Rose & <Thorn> "ring"' })
    expect(parseSvg(svg).querySelector('title')?.textContent).toBe('Rose & <Thorn> "ring"')
    expect(svg).not.toContain('<Thorn>')
  })
})
