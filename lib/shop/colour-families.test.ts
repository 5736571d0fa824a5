import { describe, expect, it } from 'vitest'
import { COLOUR_FAMILIES, colourFamiliesOf, colourFamily, type ColourFamily } from './colour-families'

/**
 * Named colours and their values from CSS Color Module Level 4, §6.1 "Named Colors"
 * (https://www.w3.org/TR/css-color-4/#named-colors). The family beside each is what the name
 * says in plain words; the table covers every family and the edges between them (crimson is still
 * red, pink is not; tan is brown, orange is not; teal counts as blue).
 */
const CSS_NAMED_COLOURS: readonly (readonly [name: string, hex: string, family: ColourFamily])[] = [
  ['red', '#ff0000', 'reds'],
  ['crimson', '#dc143c', 'reds'],
  ['darkred', '#8b0000', 'reds'],
  ['maroon', '#800000', 'reds'],
  ['tomato', '#ff6347', 'reds'],
  ['orange', '#ffa500', 'oranges'],
  ['darkorange', '#ff8c00', 'oranges'],
  ['coral', '#ff7f50', 'oranges'],
  ['peachpuff', '#ffdab9', 'oranges'],
  ['yellow', '#ffff00', 'yellows'],
  ['gold', '#ffd700', 'yellows'],
  ['goldenrod', '#daa520', 'yellows'],
  ['khaki', '#f0e68c', 'yellows'],
  ['green', '#008000', 'greens'],
  ['forestgreen', '#228b22', 'greens'],
  ['lime', '#00ff00', 'greens'],
  ['olivedrab', '#6b8e23', 'greens'],
  ['seagreen', '#2e8b57', 'greens'],
  ['blue', '#0000ff', 'blues'],
  ['navy', '#000080', 'blues'],
  ['steelblue', '#4682b4', 'blues'],
  ['skyblue', '#87ceeb', 'blues'],
  ['teal', '#008080', 'blues'],
  ['purple', '#800080', 'purples'],
  ['indigo', '#4b0082', 'purples'],
  ['rebeccapurple', '#663399', 'purples'],
  ['violet', '#ee82ee', 'purples'],
  ['pink', '#ffc0cb', 'pinks'],
  ['lightpink', '#ffb6c1', 'pinks'],
  ['hotpink', '#ff69b4', 'pinks'],
  ['deeppink', '#ff1493', 'pinks'],
  ['mediumvioletred', '#c71585', 'pinks'],
  ['saddlebrown', '#8b4513', 'browns'],
  ['sienna', '#a0522d', 'browns'],
  ['tan', '#d2b48c', 'browns'],
  ['white', '#ffffff', 'neutrals'],
  ['black', '#000000', 'neutrals'],
  ['gray', '#808080', 'neutrals'],
  ['silver', '#c0c0c0', 'neutrals'],
  ['beige', '#f5f5dc', 'neutrals'],
  ['ivory', '#fffff0', 'neutrals'],
  ['linen', '#faf0e6', 'neutrals'],
]

describe('colourFamily', () => {
  it.each(CSS_NAMED_COLOURS)('puts CSS %s (%s) among the %s', (_name, hex, family) => {
    expect(colourFamily(hex)).toBe(family)
  })

  it('covers every family with the named colours above', () => {
    expect(new Set(CSS_NAMED_COLOURS.map(([, , family]) => family))).toEqual(new Set(COLOUR_FAMILIES))
  })

  it('reads upper-case hex digits as lower-case ones', () => {
    expect(colourFamily('#DC143C')).toBe('reds')
  })

  it('gives no family to text that is not #rrggbb', () => {
    expect(colourFamily('red')).toBeNull()
    expect(colourFamily('#f00')).toBeNull()
    expect(colourFamily('#gg0000')).toBeNull()
  })

  it('sorts typical quilting fabrics where a quilter would look (our own demo colours)', () => {
    // A cream tone-on-tone background, a bark brown, a near-black ink, a holly green.
    expect(colourFamily('#f4ecd8')).toBe('neutrals')
    expect(colourFamily('#4a3a2a')).toBe('browns')
    expect(colourFamily('#1a1a1c')).toBe('neutrals')
    expect(colourFamily('#2f5540')).toBe('greens')
  })
})

describe('colourFamiliesOf', () => {
  it('lists each family once, in the filter’s order, skipping what is not a colour', () => {
    expect(colourFamiliesOf(['#f4ecd8', '#2f5540', '#9b2915', '#228b22', 'nonsense'])).toEqual(['reds', 'greens', 'neutrals'])
    expect(colourFamiliesOf([])).toEqual([])
  })
})
