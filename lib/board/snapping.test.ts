import { describe, expect, it } from 'vitest'
import { emptyDesign } from '@/lib/new-design'
import { normalizeDesign } from './commands'
import { snapSeamEnd, type SnapContext } from './snapping'

const design = normalizeDesign({
  ...emptyDesign('Snap test'),
  seams: [{ id: 's1', from: [4, 0], to: [0, 4] }],
})

const context = (overrides: Partial<SnapContext> = {}): SnapContext => ({
  design,
  snapping: { enabled: true, grid: true, gridSize: 0.25, angles: true },
  tolerance: 0.2,
  ...overrides,
})

describe('snapSeamEnd', () => {
  it('prefers an existing seam end to the outline it lies on', () => {
    expect(snapSeamEnd([4.1, 0.05], context())).toEqual({ point: [4, 0], kind: 'point' })
  })

  it('lands on the radial edge of the repeat', () => {
    const result = snapSeamEnd([6.03, 0.12], context())
    expect(result.kind).toBe('outline')
    expect(result.point[1]).toBe(0)
    expect(result.point[0]).toBeCloseTo(6.03, 10)
  })

  it('lands exactly on the outer arc', () => {
    const result = snapSeamEnd([6.3, 6.3], context())
    expect(result.kind).toBe('outline')
    expect(Math.hypot(...result.point)).toBeCloseTo(9, 12)
  })

  it('lands on another seam', () => {
    const result = snapSeamEnd([2.1, 2.05], context())
    expect(result.kind).toBe('seam')
    expect(result.point[0] + result.point[1]).toBeCloseTo(4, 12)
  })

  it('follows a 15° direction from the other end up to the outline', () => {
    // From (2, 2) at 45°, the ray meets the arc of radius 9 at 9 · (cos 45°, sin 45°).
    const result = snapSeamEnd([6.3, 6.45], context({ anchor: [2, 2], tolerance: 0.3 }))
    expect(result.kind).toBe('angle')
    expect(result.point[0]).toBeCloseTo(9 * Math.SQRT1_2, 9)
    expect(result.point[1]).toBeCloseTo(9 * Math.SQRT1_2, 9)
  })

  it('falls back to the grid in open space', () => {
    expect(snapSeamEnd([5.13, 1.61], context())).toEqual({ point: [5.25, 1.5], kind: 'grid' })
  })

  it('snaps nothing when snapping is off', () => {
    const off = context({ snapping: { enabled: false, grid: true, gridSize: 0.25, angles: true } })
    expect(snapSeamEnd([4.1, 0.05], off)).toEqual({ point: [4.1, 0.05], kind: 'none' })
  })

  it('does not snap a seam onto itself', () => {
    expect(snapSeamEnd([4.05, 0.05], context({ ignoreSeam: 's1' })).kind).toBe('outline')
  })
})
