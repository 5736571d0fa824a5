import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  applyToPath, applyToPolygon, applyTransform, compose, IDENTITY, isReflection, printedSide, printedSideTransform,
  reflectionAcrossRadius, repeatTransforms, scaleDesign, type AffineTransform,
} from './symmetry'
import { arcSweep, endOf, repeatOutline, startOf, trimLine, type OutlinePath } from './trim-line'
import type { Design, Point, Ring } from './types'

/** Transforms built from sines and cosines agree to floating-point noise on a few inches. */
const NOISE = 1e-9

const ring = (overrides: Partial<Ring> = {}): Ring =>
  ({ innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate', ...overrides })

const design = (overrides: Partial<Design> = {}): Design => ({
  name: 'Test ring',
  ring: ring(),
  seams: [{ id: 's1', from: [1, 0], to: [0, 6] }, { id: 's2', from: [3, 0], to: [0.5, 3] }],
  fills: [{ at: [0.5, 0.5], fabric: 'background' }],
  leaves: [{ id: 'l1', seam: 's1', at: 0.5, side: 'left', angle: 20, length: 1.5, width: 0.75, layers: ['dark', 'light'] }],
  stems: [{ radius: 6.5, finishedWidth: 0.375, fabric: 'stem' }],
  berries: [{ at: [3.2, 5.1], finishedDiameter: 0.5, fabric: 'berry' }],
  curls: [{ points: [[3, 5], [3.4, 5.6], [3.1, 6]] }],
  colorways: [{ name: 'Autumn', fabrics: { background: { name: 'Cream tone-on-tone', color: '#f4ecd8' } } }],
  order: { sections: [{ label: 'A', areas: [[0.2, 0.2], [2, 2]] }] },
  ...overrides,
})

function deepFreeze<T>(value: T): T {
  if (value !== null && typeof value === 'object') {
    for (const child of Object.values(value)) deepFreeze(child)
    Object.freeze(value)
  }
  return value
}

const expectSameTransform = (a: AffineTransform, b: AffineTransform): void => {
  for (const key of ['xx', 'xy', 'yx', 'yy', 'tx', 'ty'] as const) expect(Math.abs(a[key] - b[key])).toBeLessThan(NOISE)
}
const expectSamePoint = (a: Point, b: Point): void => {
  expect(Math.hypot(a[0] - b[0], a[1] - b[1])).toBeLessThan(NOISE)
}
const polar = (radius: number, angle: number): Point => [radius * Math.cos(angle), radius * Math.sin(angle)]
const angleOf = (point: Point): number => {
  const angle = Math.atan2(point[1], point[0])
  return angle < 0 ? angle + 2 * Math.PI : angle
}

const repeatCount = fc.integer({ min: 2, max: 36 })
const evenRepeatCount = fc.integer({ min: 1, max: 18 }).map((half) => 2 * half)
const pointInRepeat0 = (repeats: number) =>
  fc.tuple(fc.double({ min: 0.1, max: 10, noNaN: true }), fc.double({ min: 0.01, max: 0.99, noNaN: true }))
    .map(([radius, fraction]) => polar(radius, (fraction * 2 * Math.PI) / repeats))

describe('the printed side', () => {
  it('is undone by printing it again (mirror twice = identity)', () => {
    fc.assert(fc.property(repeatCount.chain((n) => fc.tuple(fc.constant(n), fc.array(pointInRepeat0(n), { minLength: 1 }))),
      ([repeats, points]) => {
        printedSide(printedSide(points, { repeats }), { repeats }).forEach((point, i) => expectSamePoint(point, points[i]!))
      }))
  })

  it('keeps repeat 0 in its own sector, its radial edges trading places', () => {
    fc.assert(fc.property(repeatCount.chain((n) => fc.tuple(fc.constant(n), pointInRepeat0(n))), ([repeats, point]) => {
      const [printed] = printedSide([point], { repeats }) as [Point]
      // A point at polar angle φ prints at 360°/N − φ, at the same distance from the centre.
      expect(angleOf(printed)).toBeCloseTo((2 * Math.PI) / repeats - angleOf(point), 9)
      expect(Math.hypot(...printed)).toBeCloseTo(Math.hypot(...point), 9)
    }))
    expectSamePoint(printedSide([[2, 0]], { repeats: 4 })[0]!, [0, 2])
  })

  it('returns polygons counter-clockwise', () => {
    const printed = applyToPolygon(printedSideTransform({ repeats: 6 }), [[0, 0], [2, 0], [1, 1]])
    const [a, b, c] = printed as [Point, Point, Point]
    expect((b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0])).toBeGreaterThan(0)
  })
})

describe('paths of lines and arcs under the same transforms', () => {
  /** Exact area of a closed path (Green's theorem, arcs integrated exactly). */
  const pathArea = (path: OutlinePath): number => path.reduce((sum, segment) => {
    if (segment.kind === 'line') return sum + (segment.from[0] * segment.to[1] - segment.to[0] * segment.from[1]) / 2
    const sweep = arcSweep(segment) * (segment.anticlockwise ? 1 : -1)
    const [a, b] = [segment.startAngle, segment.startAngle + sweep]
    const [cx, cy] = segment.center
    const r = segment.radius
    return sum + (r * r * sweep + r * (cx * (Math.sin(b) - Math.sin(a)) - cy * (Math.cos(b) - Math.cos(a)))) / 2
  }, 0)

  it('prints a trim line mirrored, still counter-clockwise, closed and of the same area', () => {
    fc.assert(fc.property(repeatCount, fc.constantFrom(0, 2), (repeats, innerRadius) => {
      const trim = trimLine(repeatOutline(ring({ repeats, innerRadius }))).path
      const printed = applyToPath(printedSideTransform({ repeats }), trim)
      expect(pathArea(printed)).toBeCloseTo(pathArea(trim), 9)
      printed.forEach((segment, i) => expectSamePoint(endOf(segment), startOf(printed[(i + 1) % printed.length]!)))
      const back = applyToPath(printedSideTransform({ repeats }), printed)
      expect(pathArea(back)).toBeCloseTo(pathArea(trim), 9)
      expect(back.map((segment) => segment.kind)).toEqual(trim.map((segment) => segment.kind))
    }))
  })

  it("places a repeat's trim line in every repeat of a mirrored ring", () => {
    const trim = trimLine(repeatOutline(ring({ repeats: 6, repeatMode: 'mirror', innerRadius: 2 }))).path
    for (const transform of repeatTransforms(ring({ repeats: 6, repeatMode: 'mirror' }))) {
      expect(pathArea(applyToPath(transform, trim))).toBeCloseTo(pathArea(trim), 9)
    }
  })

  it('refuses a shear, which would not keep arcs as arcs', () => {
    expect(() => applyToPath({ ...IDENTITY, xy: 0.5 }, repeatOutline(ring()))).toThrow(RangeError)
  })
})

describe('repeat transforms', () => {
  it('rotate mode: repeat k is repeat 1 applied k times, and N steps make the full turn', () => {
    fc.assert(fc.property(repeatCount, (repeats) => {
      const transforms = repeatTransforms(ring({ repeats }))
      expect(transforms).toHaveLength(repeats)
      let walked = IDENTITY
      for (let k = 0; k < repeats; k += 1) {
        expectSameTransform(transforms[k]!, walked)
        walked = compose(transforms[1]!, walked)
      }
      expectSameTransform(walked, IDENTITY)
    }))
  })

  it('mirror mode: each repeat is the last one mirrored across their shared edge, all the way round', () => {
    fc.assert(fc.property(evenRepeatCount, (repeats) => {
      const step = (2 * Math.PI) / repeats
      const transforms = repeatTransforms(ring({ repeats, repeatMode: 'mirror' }))
      let walked = IDENTITY
      for (let k = 0; k < repeats; k += 1) {
        expectSameTransform(transforms[k]!, walked)
        expect(isReflection(transforms[k]!)).toBe(k % 2 === 1)
        walked = compose(reflectionAcrossRadius((k + 1) * step), walked)
      }
      expectSameTransform(walked, IDENTITY)
    }))
  })

  it('mirror mode: repeats k and k+1 agree along their shared radial edge', () => {
    fc.assert(fc.property(evenRepeatCount, fc.double({ min: 0, max: 10, noNaN: true }), (repeats, radius) => {
      const step = (2 * Math.PI) / repeats
      const transforms = repeatTransforms(ring({ repeats, repeatMode: 'mirror' }))
      for (let k = 0; k < repeats; k += 1) {
        const next = transforms[(k + 1) % repeats]!
        // Even repeats meet the next one with repeat 0's edge at 360°/N, odd ones with its edge at 0°.
        const onEdge = polar(radius, k % 2 === 0 ? step : 0)
        const here = applyTransform(transforms[k]!, onEdge)
        expectSamePoint(here, applyTransform(next, onEdge))
        expectSamePoint(here, polar(radius, (k + 1) * step))
      }
    }))
  })

  it('carries repeat 0 onto sector k in both modes', () => {
    fc.assert(fc.property(evenRepeatCount, fc.constantFrom<Ring['repeatMode']>('rotate', 'mirror'),
      fc.double({ min: 0.01, max: 0.99, noNaN: true }), (repeats, repeatMode, fraction) => {
        const step = (2 * Math.PI) / repeats
        repeatTransforms(ring({ repeats, repeatMode })).forEach((transform, k) => {
          const angle = angleOf(applyTransform(transform, polar(5, fraction * step)))
          expect(angle).toBeGreaterThan(k * step)
          expect(angle).toBeLessThan((k + 1) * step)
        })
      }))
  })
})

describe('scaling a design to a finished diameter', () => {
  it('scales every length and leaves the input alone', () => {
    const original = deepFreeze(design())
    const scaled = scaleDesign(original, 27)
    // 27 in finished diameter / (2 × 9 in outer radius) = 1.5
    expect(scaled.ring.outerRadius).toBe(13.5)
    expect(scaled.seams[0]).toEqual({ id: 's1', from: [1.5, 0], to: [0, 9] })
    expect(scaled.fills[0]!.at).toEqual([0.75, 0.75])
    expect(scaled.leaves[0]).toMatchObject({ at: 0.5, angle: 20, length: 2.25, width: 1.125 })
    expect(scaled.stems[0]).toMatchObject({ radius: 9.75, finishedWidth: 0.5625 })
    expect(scaled.berries[0]!.finishedDiameter).toBe(0.75)
    expect(scaled.curls[0]!.points[2]).toEqual([4.65, 9])
    expect(scaled.order!.sections[0]!.areas[1]).toEqual([3, 3])
    expect(scaled.colorways).toEqual(original.colorways)
    expect(original.ring.outerRadius).toBe(9)
  })

  it('preserves angles and ratios', () => {
    fc.assert(fc.property(fc.double({ min: 1, max: 80, noNaN: true }), (diameter) => {
      const original = design()
      const scaled = scaleDesign(original, diameter)
      const factor = diameter / 18
      const seamVector = (d: Design, i: number): Point => {
        const seam = d.seams[i]!
        return [seam.to[0] - seam.from[0], seam.to[1] - seam.from[1]]
      }
      const angleBetween = (a: Point, b: Point): number => Math.atan2(a[0] * b[1] - a[1] * b[0], a[0] * b[0] + a[1] * b[1])
      expect(angleBetween(seamVector(scaled, 0), seamVector(scaled, 1)))
        .toBeCloseTo(angleBetween(seamVector(original, 0), seamVector(original, 1)), 9)
      expect(Math.hypot(...seamVector(scaled, 0)) / Math.hypot(...seamVector(scaled, 1)))
        .toBeCloseTo(Math.hypot(...seamVector(original, 0)) / Math.hypot(...seamVector(original, 1)), 9)
      expect(scaled.leaves[0]!.length / scaled.ring.outerRadius).toBeCloseTo(1.5 / 9, 12)
      expect(scaled.ring.outerRadius * 2).toBeCloseTo(diameter, 12)
      expect(scaled.stems[0]!.radius).toBeCloseTo(6.5 * factor, 12)
    }))
  })

  it('rejects a diameter that is not a positive length', () => {
    expect(() => scaleDesign(design(), 0)).toThrow(RangeError)
    expect(() => scaleDesign(design(), Number.NaN)).toThrow(RangeError)
  })
})
