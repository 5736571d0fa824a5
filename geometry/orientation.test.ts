import { orient2d } from 'robust-predicates'
import { describe, expect, it } from 'vitest'
import { orientation, signedDistanceToLine } from './orientation'

describe('orientation', () => {
  it('is positive for a counter-clockwise turn in our y-up frame', () => {
    // (0,0) → (1,0) → (0,1) turns left when y points up: counter-clockwise (from memory:
    // the standard determinant (bx−ax)(cy−ay) − (by−ay)(cx−ax) = 1).
    expect(orientation([0, 0], [1, 0], [0, 1])).toBeGreaterThan(0)
    expect(orientation([0, 0], [0, 1], [1, 0])).toBeLessThan(0)
  })

  it('flips robust-predicates once, because its README counts counter-clockwise with y down', () => {
    // published: robust-predicates 3.0.3 README, orient2d "positive if a, b, c occur in
    // counterclockwise order" on a y-down screen; the same triple is clockwise in y-up.
    expect(orient2d(0, 0, 1, 0, 0, 1)).toBeLessThan(0)
    expect(orientation([0, 0], [1, 0], [0, 1])).toBe(-orient2d(0, 0, 1, 0, 0, 1))
  })

  it('is exactly zero for collinear points, even nearly degenerate ones', () => {
    // 0.1 + 0.2 is not 0.3 in binary, but the three points below are exactly collinear multiples.
    expect(orientation([0, 0], [0.5, 0.5], [1e-30, 1e-30])).toBe(0)
    expect(orientation([1, 1], [2, 2], [3, 3])).toBe(0)
  })

  it('measures the signed distance from a line', () => {
    // the point (1, 0.5) stands 0.5 in above the x axis (arithmetic)
    expect(signedDistanceToLine([0, 0], [2, 0], [1, 0.5])).toBeCloseTo(0.5, 15)
    expect(signedDistanceToLine([0, 0], [2, 0], [1, -0.5])).toBeCloseTo(-0.5, 15)
  })
})
