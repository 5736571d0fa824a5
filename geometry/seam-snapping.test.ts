import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { buildArrangement } from './arrangement'
import { snapOutline, snapSeamEnds } from './seam-snapping'
import { ARC_CHORD_TOLERANCE_INCHES, SNAP_DISTANCE_INCHES } from './tolerances'
import type { Point, Ring } from './types'

/** An annular quarter: inner arc r = 3 in, outer arc r = 9 in. */
const annulus: Ring = { innerRadius: 3, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }
const polar = (radius: number, degrees: number): Point => [radius * Math.cos((degrees * Math.PI) / 180), radius * Math.sin((degrees * Math.PI) / 180)]
/** Floating-point noise on lengths of a few inches. */
const NOISE = 1e-9

/** A radial seam across the annulus at `degrees`, its ends `inner` and `outer` inches off the true arcs (positive: outward). */
const radialSeam = (degrees: number, inner: number, outer: number) => ({ id: 's1', from: polar(3 + inner, degrees), to: polar(9 + outer, degrees) })

describe('seam ends near the arcs snap onto the true arcs', () => {
  // geometry.md: ends closer than 0.01 in to the outline are snapped onto it; the arcs are the
  // true circles, the chords (up to 0.005 in inside an outer arc, outside an inner arc) only
  // draw them. Angles: on a chord joint (0°, 3.75°), mid-chord, and arbitrary.
  const angles = [1.875, 3.75, 17.2, 45, 61.3, 88.125]

  for (const degrees of angles) {
    for (const [inner, outer] of [[0.009, 0.009], [-0.009, -0.009], [0.009, -0.009], [-0.009, 0.009]] as const) {
      it(`snaps ends ${inner} in off the inner arc and ${outer} in off the outer arc at ${degrees}°`, () => {
        const arrangement = buildArrangement(annulus, [radialSeam(degrees, inner, outer)])
        expect(arrangement.problems).toEqual([])
        expect(arrangement.areas).toHaveLength(2)
        const [seam] = arrangement.seams
        // on the circles themselves, not on a chord
        expect(Math.abs(Math.hypot(...seam!.from) - 3)).toBeLessThan(NOISE)
        expect(Math.abs(Math.hypot(...seam!.to) - 9)).toBeLessThan(NOISE)
        // a radial seam keeps its direction: its ends move along it
        expect(Math.atan2(seam!.to[1], seam!.to[0]) * 180 / Math.PI).toBeCloseTo(degrees, 9)
      })
    }
  }

  it('leaves an end 0.011 in beyond the outer arc outside, and one 0.011 in short of either arc dangling, at every angle', () => {
    for (const degrees of angles) {
      expect(buildArrangement(annulus, [radialSeam(degrees, 0, 0.011)]).problems.map((p) => p.code)).toContain('seam-outside')
      expect(buildArrangement(annulus, [radialSeam(degrees, 0, -0.011)]).problems.map((p) => p.code)).toContain('dangling-seam-end')
      expect(buildArrangement(annulus, [radialSeam(degrees, 0.011, 0)]).problems.map((p) => p.code)).toContain('dangling-seam-end')
      expect(buildArrangement(annulus, [radialSeam(degrees, -0.011, 0)]).problems.map((p) => p.code)).toContain('seam-outside')
    }
  })

  it('treats every angle alike: within 0.01 in of a true arc snaps, farther does not (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 89, noNaN: true }),
        fc.double({ min: -0.0099, max: 0.0099, noNaN: true }),
        fc.double({ min: -0.0099, max: 0.0099, noNaN: true }),
        (degrees, inner, outer) => {
          const arrangement = buildArrangement(annulus, [radialSeam(degrees, inner, outer)])
          expect(arrangement.problems).toEqual([])
          expect(Math.abs(Math.hypot(...arrangement.seams[0]!.to) - 9)).toBeLessThan(NOISE)
          expect(Math.abs(Math.hypot(...arrangement.seams[0]!.from) - 3)).toBeLessThan(NOISE)
        },
      ),
      { numRuns: 200 },
    )
  }, 30_000)

  it('makes an end snapped onto an arc a corner of the outline, so areas meet it exactly', () => {
    const arrangement = buildArrangement(annulus, [radialSeam(17.2, 0.009, 0.009)])
    const { from, to } = arrangement.seams[0]!
    for (const end of [from, to]) expect(arrangement.outline.polygon.some((p) => p[0] === end[0] && p[1] === end[1])).toBe(true)
    // the chords stay within the tolerance of the arc around the inserted corner
    const polygon = arrangement.outline.polygon
    polygon.forEach((a, i) => {
      if (arrangement.outline.parts[i] !== 'outer-arc') return
      const b = polygon[(i + 1) % polygon.length]!
      expect(9 - Math.hypot((a[0] + b[0]) / 2, (a[1] + b[1]) / 2)).toBeLessThanOrEqual(ARC_CHORD_TOLERANCE_INCHES + NOISE)
    })
  })

  it('keeps a slanted seam in line when it snaps onto an arc', () => {
    // the seam's line from (5, 1) towards (8.9, 4) meets the circle r = 9 just past its end
    const from: Point = [5, 1]
    const direction: Point = [3.9, 3]
    const length = Math.hypot(...direction)
    // walk along the line to the circle, then stop 0.008 in short of it
    const b = from[0] * direction[0] + from[1] * direction[1]
    const t = (-b + Math.sqrt(b * b - length * length * (Math.hypot(...from) ** 2 - 81))) / (length * length)
    const onCircle: Point = [from[0] + t * direction[0], from[1] + t * direction[1]]
    const short: Point = [onCircle[0] - (0.008 * direction[0]) / length, onCircle[1] - (0.008 * direction[1]) / length]
    const [snapped] = snapSeamEnds(snapOutline(annulus), [{ id: 's1', from, to: short }])
    expect(snapped!.onArc).toEqual([false, true])
    expect(snapped!.seam.to[0]).toBeCloseTo(onCircle[0], 12)
    expect(snapped!.seam.to[1]).toBeCloseTo(onCircle[1], 12)
    expect(SNAP_DISTANCE_INCHES).toBe(0.01)
  })
})
