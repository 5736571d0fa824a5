import { describe, expect, it } from 'vitest'
import { parseDesign } from '../lib/schemas/design'
import { DEMO_PATTERNS } from '../scripts/demo-data'
import { fabricDisplayName, fabricRequirements, fabricRoleInWords } from './fabric-requirements'
import { design } from './fixtures/generators'
import { planDesign } from './plan'
import { metresToBuy, yardsToBuy } from './yardage'

function demo(name: string) {
  const pattern = DEMO_PATTERNS.find((p) => p.design.name === name)!
  const parsed = parseDesign(pattern.design)
  if (!parsed.ok) throw new Error(`demo ${name} does not parse`)
  return parsed.design
}

describe('fabricRequirements', () => {
  it('gives every fabric of the demo wreath its pieces, a layout holding each of them, and what to buy', () => {
    const wreath = demo('Hollyberry Wreath')
    const colorway = wreath.colorways[0]!
    const result = fabricRequirements(wreath, planDesign(wreath), colorway)
    expect(result.colorway).toBe(colorway.name)
    expect([result.widthOfFabricIn, result.extraPercent]).toEqual([40, 10])
    expect(result.problems).toEqual([])
    for (const fabric of result.fabrics) {
      // The demo's colourway names every fabric it uses: the name, never the role, is what a maker reads.
      expect(fabric.name).toBe(colorway.fabrics[fabric.fabric]!.name)
      expect(fabric.name).not.toBe(fabric.fabric)
      expect(fabric.color).toBe(colorway.fabrics[fabric.fabric]!.color)
      // One cut per piece asked for.
      expect(fabric.cuts).toHaveLength(fabric.pieces.reduce((sum, piece) => sum + piece.count, 0))
      expect(fabric.lengthIn).toBeGreaterThanOrEqual(fabric.lowerBoundIn)
      expect(fabric.yards).toBe(yardsToBuy(fabric.lengthIn, 10))
      expect(fabric.metres).toBe(metresToBuy(fabric.lengthIn, 10))
      // Whatever fits a fat eighth fits a fat quarter (9 × 21 in lies inside 18 × 21 in).
      if (fabric.fatEighth) expect(fabric.fatQuarter).toBe(true)
    }
    expect(result.stems).toHaveLength(1)
    expect(result.leaves.every((leaf) => leaf.pieces === 2 * leaf.leaves)).toBe(true)
  })

  it('follows the settings: width of fabric and extra', () => {
    const wreath = demo('Hollyberry Wreath')
    const narrow = fabricRequirements(wreath, planDesign(wreath), null, { widthOfFabricIn: 20, extraPercent: 0 })
    expect(narrow.colorway).toBeNull()
    expect(narrow.fabrics.every((fabric) => fabric.color === null)).toBe(true)
    for (const fabric of narrow.fabrics) {
      expect(fabric.cuts.every((cut) => cut.xIn + cut.widthIn <= 20)).toBe(true)
      expect(fabric.yards).toBe(yardsToBuy(fabric.lengthIn, 0))
    }
  })

  it('reports a piece wider than the fabric as a problem in plain words, not a crash', () => {
    // A quarter wedge of radius 30 in with no seams is one area about 30 in square: wider than 20 in fabric either way.
    const big = design({ ring: { innerRadius: 0, outerRadius: 30, repeats: 4, repeatMode: 'rotate' }, fills: [{ at: [5, 5], fabric: 'background' }] })
    const result = fabricRequirements(big, planDesign(big), null, { widthOfFabricIn: 20 })
    expect(result.problems.map((problem) => problem.code)).toEqual(['piece-too-wide'])
    expect(result.problems[0]!.message).toMatch(/wider than the usable width of 20 in/)
    const background = result.fabrics.find((fabric) => fabric.fabric === 'background')!
    expect(background.cuts).toEqual([])
  })

  it("names a fabric by the colourway's display name, and a role no colourway names in words", () => {
    const autumn = { name: 'Autumn', fabrics: { background: { name: 'Cream tone-on-tone', color: '#f4ecd8' } } }
    expect(fabricDisplayName(autumn, 'background')).toBe('Cream tone-on-tone')
    expect(fabricDisplayName(autumn, 'leaf-dark')).toBe('Leaf dark')
    expect(fabricDisplayName(null, 'background-shade')).toBe('Background shade')
    // Only the colourway's own roles: a role spelled like an Object property is not Object's.
    expect(fabricDisplayName(autumn, 'constructor')).toBe('Constructor')
    expect(fabricRoleInWords('star_light  2')).toBe('Star light 2')
  })

  it('gives each fabric its name and colour from the colourway', () => {
    const named = design({ fills: [{ at: [5, 5], fabric: 'background' }] })
    const autumn = { name: 'Autumn', fabrics: { background: { name: 'Cream tone-on-tone', color: '#f4ecd8' } } }
    const background = fabricRequirements(named, planDesign(named), autumn).fabrics.find((fabric) => fabric.fabric === 'background')!
    expect(background).toMatchObject({ name: 'Cream tone-on-tone', color: '#f4ecd8' })
  })
})
