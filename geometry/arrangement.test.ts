import fc from 'fast-check'
import polygonClipping, { type MultiPolygon } from 'polygon-clipping'
import { describe, expect, it } from 'vitest'
import { buildArrangement } from './arrangement'
import { design, gridDesign, peelDesign, quarterWedge } from './fixtures/generators'
import { signedArea } from './polygon-measure'
import type { Polygon, Seam } from './types'

const ring = quarterWedge
const arc = (x: number): number => Math.sqrt(81 - x * x)

function multiPolygonArea(shape: MultiPolygon): number {
  return shape.reduce((sum, polygon) => sum + polygon.reduce((inner, ring, index) => inner + (index === 0 ? 1 : -1) * Math.abs(signedArea(ring.slice(0, -1) as Polygon)), 0), 0)
}

// polygon-clipping 0.15.7 can fail to close rings on edges that touch to within floating-point
// noise (its known robustness limit); rounding to a 1e-9 in grid gives it exact shared vertices.
const onGrid = (value: number): number => Math.round(value * 1e9) / 1e9
const asClip = (polygon: Polygon): [number, number][][] => [polygon.map((p) => [onGrid(p[0]), onGrid(p[1])] as [number, number])]

describe('buildArrangement', () => {
  it('splits a quarter wedge by one seam into two areas', () => {
    const arrangement = buildArrangement(ring, [{ id: 's1', from: [3, 0], to: [0, 3] }])
    expect(arrangement.areas).toHaveLength(2)
    expect(arrangement.problems).toEqual([])
    // the triangle cut off is 3 × 3 / 2 = 4.5 sq in (arithmetic)
    expect(arrangement.areas.map((area) => area.areaSqIn).sort((a, b) => a - b)[0]).toBeCloseTo(4.5, 9)
  })

  it('snaps a seam end that stops within 0.01 in of the outline onto it', () => {
    // geometry.md fixes the snap distance at 0.01 in; 0.008 and 0.009 in are inside it (arithmetic)
    const arrangement = buildArrangement(ring, [{ id: 's1', from: [3, 0.008], to: [0.009, 3] }])
    expect(arrangement.problems).toEqual([])
    expect(arrangement.areas).toHaveLength(2)
  })

  it('snaps a seam end that stops within 0.01 in of another seam onto it', () => {
    const arrangement = buildArrangement(ring, [
      { id: 's1', from: [0, 2], to: [arc(2), 2] },
      { id: 's2', from: [4, 2.007], to: [4, arc(4)] },
    ])
    expect(arrangement.problems).toEqual([])
    expect(arrangement.areas).toHaveLength(3)
  })

  it('reports a dangling end with its position instead of throwing', () => {
    const arrangement = buildArrangement(ring, [{ id: 's1', from: [3, 0], to: [3, 2] }])
    expect(arrangement.problems.map((p) => p.code)).toEqual(['dangling-seam-end'])
    expect(arrangement.problems[0]?.at).toEqual([3, 2])
    expect(arrangement.problems[0]?.message).toMatch(/s1.*without touching/)
  })

  it('reports a seam that leaves the outline', () => {
    const arrangement = buildArrangement(ring, [{ id: 's1', from: [3, 0], to: [3, 12] }])
    expect(arrangement.problems.map((p) => p.code)).toContain('seam-outside')
  })

  it('reports overlapping seams', () => {
    // s2 runs along s1 from x = 1 to x = 5 on y = 2 (arithmetic): two seams on one line
    const arrangement = buildArrangement(ring, [
      { id: 's1', from: [0, 2], to: [arc(2), 2] },
      { id: 's2', from: [1, 2], to: [5, 2] },
    ])
    expect(arrangement.problems.map((p) => p.code)).toContain('overlapping-seams')
  })

  it('warns about slivers under 0.1 sq in and corners under 10°', () => {
    // a triangle with legs 0.3 and 0.3 is 0.045 sq in (arithmetic)
    const sliver = buildArrangement(ring, [{ id: 's1', from: [0.3, 0], to: [0, 0.3] }])
    expect(sliver.problems.map((p) => p.code)).toContain('small-area')
    // a seam from (8, 0) to (0, 1) meets the x axis at atan(1/8) = 7.1° (arithmetic)
    const sharp = buildArrangement(ring, [{ id: 's1', from: [8, 0], to: [0, 1] }])
    const warning = sharp.problems.find((p) => p.code === 'sharp-angle')
    expect(warning?.at).toEqual([8, 0])
    expect(warning?.severity).toBe('warning')
  })

  it('does not call the 10° point of a 36-repeat wedge "under 10°"', () => {
    // 360° / 36 = 10° exactly (arithmetic); only rounding noise could make it 9.9999999°
    const arrangement = buildArrangement({ ...ring, repeats: 36 }, [])
    expect(arrangement.problems).toEqual([])
  })

  it('gives the same ids whatever order or direction the seams are listed in', () => {
    const { seams } = gridDesign(3, 4)
    const reversed: Seam[] = [...seams].reverse().map((s) => ({ id: s.id, from: s.to, to: s.from }))
    expect(buildArrangement(ring, reversed).areas.map((a) => a.id)).toEqual(buildArrangement(ring, seams).areas.map((a) => a.id))
  })

  it('always partitions the repeat (checked with polygon-clipping 0.15.7)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 2, max: 14 }), (seed, count) => {
        const { ring: peelRing, seams } = peelDesign(count, seed).design
        const arrangement = buildArrangement(peelRing, seams)
        // The full corner cycles (T-junctions included) so neighbours share exact vertices.
        const polygons = arrangement.areas.map((area) => area.vertices.map((id) => arrangement.vertices[id]!))
        const outline = asClip(arrangement.outline.polygon)
        const union = polygonClipping.union(asClip(polygons[0] as Polygon), ...polygons.slice(1).map(asClip))
        // union equals the outline: same area, and nothing of the outline left uncovered
        expect(Math.abs(multiPolygonArea(union) - signedArea(arrangement.outline.polygon))).toBeLessThan(1e-6)
        expect(multiPolygonArea(polygonClipping.difference(outline, ...polygons.map(asClip)))).toBeLessThan(1e-6)
        // the areas add up to the outline, so no two overlap anywhere (measure argument)...
        const total = polygons.reduce((sum, polygon) => sum + signedArea(polygon), 0)
        expect(Math.abs(total - signedArea(arrangement.outline.polygon))).toBeLessThan(1e-6)
        // ...and, checked directly, every pair meets at most along its boundary
        for (let i = 0; i < polygons.length; i += 1) {
          for (let j = i + 1; j < polygons.length; j += 1) {
            expect(multiPolygonArea(polygonClipping.intersection(asClip(polygons[i] as Polygon), asClip(polygons[j] as Polygon)))).toBeLessThan(1e-6)
          }
        }
      }),
      { numRuns: 40 },
    )
  })

  it('never throws on random seams, and reports what is wrong instead', () => {
    const point = fc.tuple(fc.double({ min: -2, max: 11, noNaN: true }), fc.double({ min: -2, max: 11, noNaN: true }))
    fc.assert(
      fc.property(fc.array(fc.tuple(point, point), { maxLength: 8 }), (pairs) => {
        const seams = pairs.map(([from, to], index) => ({ id: `s${index}`, from, to }))
        const arrangement = buildArrangement(design().ring, seams)
        expect(arrangement.areas.length).toBeGreaterThan(0)
      }),
      { numRuns: 200 },
    )
  })
})
