import { describe, expect, it } from 'vitest'
import { fabricRequirements, planDesign } from '@/geometry'
import { parseDesign } from '@/lib/schemas/design'
import { DEMO_PATTERNS } from '@/scripts/demo-data'
import { leafPreparation } from './leaf-preparation'

function demoWreath() {
  const parsed = parseDesign(DEMO_PATTERNS.find((p) => p.design.name === 'Hollyberry Wreath')!.design)
  if (!parsed.ok) throw new Error('the demo wreath does not parse')
  return parsed.design
}

describe('leafPreparation', () => {
  it('lists each leaf fabric’s folded leaves by size, two pieces per folded leaf (common practice)', () => {
    const wreath = demoWreath()
    const requirements = fabricRequirements(wreath, planDesign(wreath), wreath.colorways[0]!)
    const batches = leafPreparation(requirements)
    expect(batches.map((batch) => batch.fabric)).toEqual(requirements.leaves.map((leaf) => leaf.fabric))
    expect(batches.length).toBeGreaterThan(0)
    for (const batch of batches) {
      const leaves = requirements.leaves.find((leaf) => leaf.fabric === batch.fabric)!
      expect([batch.leaves, batch.pieces]).toEqual([leaves.leaves, leaves.pieces])
      expect(batch.pieces).toBe(2 * batch.leaves)
      // The sizes account for every leaf of the fabric.
      expect(batch.sizes.reduce((sum, size) => sum + size.leaves, 0)).toBe(batch.leaves)
      for (const size of batch.sizes) expect(size.pieces).toBe(2 * size.leaves)
      expect(batch.name).toBe(requirements.fabrics.find((fabric) => fabric.fabric === batch.fabric)!.name)
    }
  })
})
