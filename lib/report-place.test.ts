import { describe, expect, it } from 'vitest'
import type { Ring } from '@/geometry'
import { areaLabelAt, changedAtPin, pinOf, stepLabels } from './report-place'

/** Two triangles in the first quarter of a ring of four: A1 by the x axis, A2 by the y axis. */
const RING: Ring = { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }
const PLAN = {
  areas: [
    { id: 'a', label: 'A1', point: [3, 1] as const, polygon: [[0, 0], [8, 0], [5, 5]] as const },
    { id: 'b', label: 'A2', point: [1, 3] as const, polygon: [[0, 0], [5, 5], [0, 8]] as const },
  ],
  sections: [{ label: 'A', order: ['b', 'a'] }],
}
// The types of the core's plan, with only what these functions read.
const plan = PLAN as unknown as Parameters<typeof stepLabels>[0]

describe('report places', () => {
  it('numbers steps in sewing order', () => {
    expect(stepLabels(plan)).toEqual(['A2', 'A1'])
  })

  it('finds the area under a point in any repeat', () => {
    expect(areaLabelAt(plan, RING, [3, 1])).toBe('A1')
    // [3, 1] turned by 90° (repeat 1): [-1, 3].
    expect(areaLabelAt(plan, RING, [-1, 3])).toBe('A1')
    expect(areaLabelAt(plan, RING, [20, 20])).toBeNull()
  })

  it('pins a point where it is, an area or a step at the label point, a page nowhere', () => {
    expect(pinOf({ point: [-1, 3] }, plan, RING)).toEqual({ point: [-1, 3], area: 'A1' })
    expect(pinOf({ area: 'A2' }, plan, RING)).toEqual({ point: [1, 3], area: 'A2' })
    expect(pinOf({ step: 2 }, plan, RING)).toEqual({ point: [3, 1], area: 'A1' })
    expect(pinOf({ page: 4 }, plan, RING)).toBeNull()
  })

  it('calls a pin changed when its area is gone or another area lies under it now', () => {
    const pin = { point: [3, 1] as const, area: 'A1' }
    expect(changedAtPin(pin, plan, RING)).toBe(false)
    const relabelled = { ...plan, areas: plan.areas.map((area) => ({ ...area, label: area.label === 'A1' ? 'A2' : 'A1' })) }
    expect(changedAtPin(pin, relabelled, RING)).toBe(true)
    expect(changedAtPin(pin, { areas: [], sections: [] }, RING)).toBe(true)
    expect(changedAtPin({ point: [20, 20], area: null }, { areas: [], sections: [] }, RING)).toBe(false)
  })
})
