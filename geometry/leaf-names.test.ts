import { describe, expect, it } from 'vitest'
import { design } from './fixtures/generators'
import { areaUnderLeaf, leafNames } from './leaf-names'
import { planDesign } from './plan'
import { scaleDesign } from './symmetry'
import type { Design, Leaf } from './types'

const arc = (y: number): number => Math.sqrt(81 - y * y)

const leaf = (id: string, seam: string, at: number, side: 'left' | 'right'): Leaf => ({ id, seam, at, side, angle: 0, length: 1, width: 0.5, layers: ['leaf'] })

/** Three strips of a quarter wedge; three leaves over the middle strip (so it is sewn first). */
function strips(leaves: readonly Leaf[]): Design {
  return design({
    seams: [
      { id: 'low', from: [0, 2], to: [arc(2), 2] },
      { id: 'high', from: [0, 4], to: [arc(4), 4] },
    ],
    leaves,
  })
}

const leaves = [
  leaf('leaf-east', 'high', 0.7, 'right'),
  leaf('leaf-west', 'high', 0.3, 'right'),
  leaf('under', 'low', 0.5, 'left'),
]

describe('leafNames', () => {
  it('numbers the leaves over each area: basting step first, then counter-clockwise round the centre', () => {
    const d = strips(leaves)
    const plan = planDesign(d)
    const middle = plan.areas.find((area) => area.polygon.some((p) => Math.abs(p[1] - 2) < 1e-9) && area.polygon.some((p) => Math.abs(p[1] - 4) < 1e-9))!
    const stepOf = (id: string) => plan.areas.find((area) => area.leavesBefore.includes(id))!.step!
    const names = leafNames(d, plan)
    // The two leaves on the high seam are caught by one step; of those, leaf-east lies at the
    // smaller polar angle (x = 0.7 × 8.06 in, y = 4 in), so it comes first counter-clockwise.
    const onHigh = stepOf('leaf-east')
    const expected = stepOf('under') < onHigh ? ['under', 'leaf-east', 'leaf-west'] : ['leaf-east', 'leaf-west', 'under']
    expected.forEach((id, index) => expect(names.get(id)).toBe(`leaf ${index + 1} of ${middle.label}`))
    expect(areaUnderLeaf(leaves[2]!, d.seams[0]!, plan.areas)?.label).toBe(middle.label)
    for (const [id, name] of names) {
      expect(name).not.toContain(id)
      expect(name).toMatch(/^leaf \d+ of [A-Z]+\d+$/)
    }
  })

  it('gives the same names whatever order the leaves are listed in and at any size', () => {
    const d = strips(leaves)
    const names = leafNames(d, planDesign(d))
    const reversed = strips([...leaves].reverse())
    expect(leafNames(reversed, planDesign(reversed))).toEqual(names)
    const scaled = scaleDesign(d, 31)
    expect(leafNames(scaled, planDesign(scaled))).toEqual(names)
  })

  it('numbers leaves on one ray from the centre outward, whatever the rounding of their angles', () => {
    // A radial seam at 30°: both leaves lie on one ray, so only their distance from the centre
    // orders them. atan2 of points computed along the seam differs in the last bits, which must
    // not decide. Checked at several sizes, where those bits differ again.
    const ray = (r: number): [number, number] => [r * Math.cos(Math.PI / 6), r * Math.sin(Math.PI / 6)]
    const radial = design({
      seams: [{ id: 'ray', from: [0, 0], to: ray(9) }],
      leaves: [leaf('far', 'ray', 0.77, 'left'), leaf('near', 'ray', 0.33, 'left')],
    })
    for (const factor of [1, 0.37, 2.9, 11.3]) {
      const scaled = scaleDesign(radial, factor)
      const names = leafNames(scaled, planDesign(scaled))
      expect(names.get('near')).toMatch(/^leaf 1 of /)
      expect(names.get('far')).toMatch(/^leaf 2 of /)
    }
  })

  it('numbers leaves over no labelled area among themselves', () => {
    // As for a design that cannot be planned: no area carries a label.
    const d = strips(leaves.slice(0, 2))
    const names = leafNames(d, { areas: [] })
    expect([...names.values()].sort()).toEqual(['leaf 1', 'leaf 2'])
  })
})
