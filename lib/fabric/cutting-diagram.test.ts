import { describe, expect, it } from 'vitest'
import { fabricRequirements, planDesign, type FabricRequirement } from '@/geometry'
import { parseDesign } from '@/lib/schemas/design'
import { DEMO_PATTERNS } from '@/scripts/demo-data'
import { cuttingDiagram, subCutsInWords } from './cutting-diagram'

function demoWreath() {
  const parsed = parseDesign(DEMO_PATTERNS.find((p) => p.design.name === 'Hollyberry Wreath')!.design)
  if (!parsed.ok) throw new Error('the demo wreath does not parse')
  return parsed.design
}

/** A layout written by hand: two 3 × 4 in pieces for A1 in a 4 in strip, then a 9 in bias square in a 9 in strip (13 in in all). */
const handMade: FabricRequirement = {
  fabric: 'background', name: 'Cream tone-on-tone', color: '#f6eddc',
  pieces: [{ for: 'A1', widthIn: 3, heightIn: 4, count: 2 }, { for: 'stem', widthIn: 9, heightIn: 9, count: 1 }],
  cuts: [],
  strips: [
    { yIn: 0, heightIn: 4, cuts: [{ for: 'A1', xIn: 0, yIn: 0, widthIn: 3, heightIn: 4, turned: false }, { for: 'A1', xIn: 3, yIn: 0, widthIn: 3, heightIn: 4, turned: false }] },
    { yIn: 4, heightIn: 9, cuts: [{ for: 'stem', xIn: 0, yIn: 4, widthIn: 9, heightIn: 9, turned: false }] },
  ],
  lengthIn: 13, lowerBoundIn: 3.2, yards: 0.5, metres: 0.4, fatQuarter: true, fatEighth: false,
}

describe('cuttingDiagram', () => {
  it('keeps every cut of the layout, inside the width of fabric and inside its strip', () => {
    const wreath = demoWreath()
    const requirements = fabricRequirements(wreath, planDesign(wreath), wreath.colorways[0]!, { widthOfFabricIn: 40 })
    for (const fabric of requirements.fabrics) {
      const diagram = cuttingDiagram(fabric, requirements.widthOfFabricIn, 'in')
      expect(diagram.cuts).toHaveLength(fabric.cuts.length)
      expect(diagram.name).toBe(fabric.name)
      for (const strip of diagram.strips) {
        for (const cut of strip.cuts) {
          expect(cut.xIn).toBeGreaterThanOrEqual(0)
          expect(cut.xIn + cut.widthIn).toBeLessThanOrEqual(40 + 1e-9)
          expect(cut.yIn).toBeGreaterThanOrEqual(strip.yIn - 1e-9)
          expect(cut.yIn + cut.heightIn).toBeLessThanOrEqual(strip.yIn + strip.heightIn + 1e-9)
          expect(cut.label).not.toBe('')
        }
      }
    }
  })

  it('says each strip in words: its depth across the width, then its sub-cuts grouped', () => {
    const diagram = cuttingDiagram(handMade, 40, 'in')
    expect(diagram.strips.map((strip) => strip.words)).toEqual([
      'Strip 1: cut 4 in across the width of fabric, then 2 × A1, 3 × 4 in',
      'Strip 2: cut 9 in across the width of fabric, then 1 × stem, 9 × 9 in (a square for continuous bias)',
    ])
    expect(diagram.title).toBe('Cream tone-on-tone: 2 strips, 13 in of a 40 in usable width')
    // 1 in = 2.54 cm exactly: 4 in = 10.2 cm to one decimal, 40 in = 101.6 cm.
    expect(cuttingDiagram(handMade, 40, 'cm').strips[0]!.words).toBe('Strip 1: cut 10.2 cm across the width of fabric, then 2 × A1, 7.6 × 10.2 cm')
  })

  it('marks turned pieces in words', () => {
    expect(subCutsInWords([{ for: 'leaf', xIn: 0, yIn: 0, widthIn: 2.125, heightIn: 1, turned: true }, { for: 'leaf', xIn: 2.125, yIn: 0, widthIn: 2.125, heightIn: 1, turned: true }], 'in'))
      .toBe('2 × leaf, 2 1/8 × 1 in (turned)')
  })
})
