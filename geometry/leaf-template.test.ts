import fc from 'fast-check'
import polygonClipping from 'polygon-clipping'
import { areaPathsD, differenceD, FillRule, xorD, type PathD, type PathsD } from 'clipper2-ts'
import { describe, expect, it } from 'vitest'
import { isPointedLeaf, leafShapeProblem, leafTemplate, placeLeaf, tryPlaceLeaf } from './leaf-template'
import { defaultLayerOffset, leafLayers, tryPlaceLeafLayers } from './leaf-template'
import { polygonArea } from './offset'
import { arcSweep, endOf, startOf, type ArcPathSegment, type OutlinePath } from './trim-line'
import type { Leaf, Point, Polygon, Seam } from './types'

/** Values computed two ways agree to floating-point noise on lengths of a few inches. */
const NOISE = 1e-9
/** Chords sit within 0.005 in of their arcs (geometry.md), so chorded areas fall short by a little. */
const CHORD_AREA_SQ_IN = 0.01
/** polygon-clipping's rounding leaves slivers far below anything cut in fabric. */
const CONTAINMENT_SLACK_SQ_IN = 1e-9

const leaf = (overrides: Partial<Leaf> = {}): Leaf => ({
  id: 'l1', seam: 's1', at: 0.5, side: 'left', angle: 0, length: 1.5, width: 0.75, layers: ['dark', 'light'], ...overrides,
})
const seam = (overrides: Partial<Seam> = {}): Seam => ({ id: 's1', from: [0, 0], to: [4, 0], ...overrides })
const distance = (a: Point, b: Point): number => Math.hypot(a[0] - b[0], a[1] - b[1])

/** Exact area enclosed by a closed path (Green's theorem, arcs integrated exactly). */
function pathArea(path: OutlinePath): number {
  return path.reduce((sum, segment) => {
    if (segment.kind === 'line') return sum + (segment.from[0] * segment.to[1] - segment.to[0] * segment.from[1]) / 2
    const sweep = arcSweep(segment) * (segment.anticlockwise ? 1 : -1)
    const [a, b] = [segment.startAngle, segment.startAngle + sweep]
    const [cx, cy] = segment.center
    const r = segment.radius
    return sum + (r * r * sweep + r * (cx * (Math.sin(b) - Math.sin(a)) - cy * (Math.cos(b) - Math.cos(a)))) / 2
  }, 0)
}

function uncoveredArea(inner: Polygon, outer: Polygon): number {
  const geom = (polygon: Polygon): polygonClipping.Polygon => [polygon.map(([x, y]) => [x, y] as [number, number])]
  return polygonClipping.difference(geom(inner), geom(outer))
    .reduce((sum, polygon) => sum + polygon.reduce((inside, ring, i) =>
      inside + (i === 0 ? 1 : -1) * Math.abs(polygonArea(ring.slice(0, -1) as Point[])), 0), 0)
}

describe('leaf templates', () => {
  it('draws a 1 1/2 × 3/4 in leaf with its sew line, cut line and open end', () => {
    const template = leafTemplate(1.5, 0.75)
    // 3/4 in finished + 2 × 1/8 in cut allowance = 1 in across the raw edge, 1/4 in past the seam.
    expect(template.rawEdge).toEqual([[-0.5, -0.25], [0.5, -0.25]])
    expect(template.seamLine).toEqual([[-0.5, 0], [0.5, 0]])
    const [, right, left] = template.sewLine as [unknown, ArcPathSegment, ArcPathSegment]
    expect(distance(endOf(right), [0, 1.5])).toBeLessThan(NOISE)
    expect(distance(startOf(left), [0, 1.5])).toBeLessThan(NOISE)
    // R = (W²/4 + L²)/W = (0.140625 + 2.25)/0.75 = 3.1875 in, centred on the seam line.
    expect(right.radius).toBeCloseTo(3.1875, 12)
    expect(right.center[1]).toBe(0)
    // Open at the raw edge: the sew line starts and ends there.
    expect(startOf(template.sewLine[0]!)).toEqual([0.375, -0.25])
    expect(endOf(template.sewLine[3]!)).toEqual([-0.375, -0.25])
  })

  it('grows the sides by exactly the cut allowance and closes the cut line across the raw edge', () => {
    fc.assert(fc.property(fc.double({ min: 0.3, max: 2, noNaN: true }), fc.double({ min: 0.6, max: 4, noNaN: true }),
      fc.constantFrom(1 / 16, 1 / 8, 1 / 4), (width, ratio, cut) => {
        const length = (width / 2) * (1 + ratio)
        const template = leafTemplate(length, width, { cutAllowanceInches: cut })
        const cutLine = template.cutLine
        cutLine.forEach((segment, i) => {
          expect(distance(endOf(segment), startOf(cutLine[(i + 1) % cutLine.length]!))).toBeLessThan(NOISE)
        })
        const sewArcs = template.sewLine.filter((s): s is ArcPathSegment => s.kind === 'arc')
        const cutArcs = cutLine.filter((s): s is ArcPathSegment => s.kind === 'arc')
        cutArcs.forEach((arc, i) => {
          expect(arc.center).toEqual(sewArcs[i]!.center)
          expect(arc.radius - sewArcs[i]!.radius).toBeCloseTo(cut, 12)
        })
        expect(pathArea(cutLine)).toBeGreaterThan(0)
        expect(uncoveredArea(template.finishedOutline, template.cutPolygon)).toBeLessThan(CONTAINMENT_SLACK_SQ_IN)
      }))
  })

  it('encloses the closed-form area of a pointed arch', () => {
    const [length, width] = [1.5, 0.75]
    // Twice ∫₀^{W/2} √(R² − (x + o)²) dx with o = R − W/2: F(u) = u/2·√(R² − u²) + R²/2·asin(u/R).
    const radius = (width * width / 4 + length * length) / width
    const offCentre = radius - width / 2
    const primitive = (u: number): number => (u / 2) * Math.sqrt(radius ** 2 - u ** 2) + (radius ** 2 / 2) * Math.asin(u / radius)
    const expected = 2 * (primitive(width / 2 + offCentre) - primitive(offCentre))
    const area = polygonArea(leafTemplate(length, width).finishedOutline)
    expect(area).toBeLessThanOrEqual(expected)
    expect(expected - area).toBeLessThan(CHORD_AREA_SQ_IN)
  })

  it('cuts the point of a slender leaf square, one cut allowance past the tip', () => {
    // L = 3, W = 0.5: R = 18.125, the tip is 2·atan(3/17.875) = 19°, its mitre 1/8 / sin 9.5° = 0.76 in.
    const template = leafTemplate(3, 0.5)
    const tip = template.cutLine.find((segment) => segment.kind === 'line' && segment.from[1] > 3)
    expect(tip).toBeDefined()
    expect(startOf(tip!)[1]).toBeCloseTo(3 + 1 / 8, 12)
  })

  it('refuses a leaf without a point', () => {
    expect(isPointedLeaf(0.3, 0.75)).toBe(false)
    expect(() => leafTemplate(0.3, 0.75)).toThrow(RangeError)
  })
})

describe('leaves that cannot be drawn', () => {
  it('says in plain words why a leaf is too wide for its length and what would fix it', () => {
    // A pointed leaf needs L > W/2 (the side arcs meet above the open end): 0.5 in < 3 in / 2.
    expect(leafShapeProblem(0.5, 3)).toBe(
      'it is 3 in wide but only 0.5 in long, and a pointed leaf must be longer than half its width. Make it longer than 1.5 in or narrower than 1 in.',
    )
    // Exactly half is a half disc, not a point.
    expect(leafShapeProblem(0.375, 0.75)).toContain('longer than 0.375 in')
    expect(leafShapeProblem(1.5, 0.75)).toBeNull()
    expect(leafShapeProblem(1, 0)).toContain('must both be positive')
  })

  it('places a drawable leaf exactly as placeLeaf does, and gives the reason instead of throwing otherwise', () => {
    const drawable = tryPlaceLeaf(leaf(), seam())
    expect(drawable).toEqual({ ok: true, placement: placeLeaf(leaf(), seam()) })
    const stubby = tryPlaceLeaf(leaf({ length: 0.5, width: 3 }), seam())
    expect(stubby.ok).toBe(false)
    if (!stubby.ok) expect(stubby.reason).toMatch(/^Leaf l1 cannot be drawn as a pointed leaf: it is 3 in wide but only 0.5 in long/)
    const pointSeam = tryPlaceLeaf(leaf(), seam({ to: [0, 0] }))
    expect(pointSeam).toEqual({ ok: false, reason: 'Leaf l1 cannot be placed: its seam s1 has no length.' })
  })

  it('agrees with isPointedLeaf on every size', () => {
    fc.assert(fc.property(fc.double({ min: 0.01, max: 10, noNaN: true }), fc.double({ min: 0.01, max: 10, noNaN: true }), (length, width) => {
      expect(leafShapeProblem(length, width) === null).toBe(isPointedLeaf(length, width))
    }))
  })
})

describe('leaves placed on a seam', () => {
  it('stands a leaf on the middle of a seam, its raw edge 1/4 in past the seam line', () => {
    const placed = placeLeaf(leaf(), seam())
    expect(placed.base).toEqual([2, 0])
    expect(distance(placed.tip, [2, 1.5])).toBeLessThan(NOISE)
    expect(distance(placed.rawEdge[0], [1.625, -0.25])).toBeLessThan(NOISE)
    expect(distance(placed.rawEdge[1], [2.375, -0.25])).toBeLessThan(NOISE)
    expect(polygonArea(placed.finishedOutline)).toBeCloseTo(polygonArea(leafTemplate(1.5, 0.75).finishedOutline), 9)
  })

  it('lays a right-side leaf over the other side of the seam', () => {
    const placed = placeLeaf(leaf({ side: 'right' }), seam())
    expect(distance(placed.tip, [2, -1.5])).toBeLessThan(NOISE)
    expect(placed.rawEdge.every(([, y]) => Math.abs(y - 0.25) < NOISE)).toBe(true)
  })

  it('keeps a tilted leaf on its side of the seam, raw edge along the seam, at any seam direction', () => {
    fc.assert(fc.property(
      fc.double({ min: -75, max: 75, noNaN: true }), fc.constantFrom<Leaf['side']>('left', 'right'),
      fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), fc.double({ min: 0.1, max: 0.9, noNaN: true }),
      (angle, side, direction, at) => {
        const to: Point = [1 + 5 * Math.cos(direction), 2 + 5 * Math.sin(direction)]
        const s = seam({ from: [1, 2], to })
        const placed = placeLeaf(leaf({ angle, side, at }), s)
        const along: Point = [Math.cos(direction), Math.sin(direction)]
        const sideSign = side === 'left' ? 1 : -1
        const fromSeam = (p: Point): number => sideSign * (along[0] * (p[1] - 2) - along[1] * (p[0] - 1))
        expect(polygonArea(placed.finishedOutline)).toBeGreaterThan(0)
        for (const corner of placed.finishedOutline) expect(fromSeam(corner)).toBeGreaterThan(-NOISE)
        for (const end of placed.rawEdge) expect(fromSeam(end)).toBeCloseTo(-0.25, 9)
        expect(distance(placed.tip, placed.base)).toBeCloseTo(1.5, 9)
        // The axis leans `angle` degrees anticlockwise from the normal on the leaf's side.
        const axis: Point = [(placed.tip[0] - placed.base[0]) / 1.5, (placed.tip[1] - placed.base[1]) / 1.5]
        const normal: Point = [-along[1] * sideSign, along[0] * sideSign]
        const lean = Math.atan2(normal[0] * axis[1] - normal[1] * axis[0], normal[0] * axis[0] + normal[1] * axis[1])
        expect((lean * 180) / Math.PI).toBeCloseTo(angle, 9)
      }))
  })
})

describe('stacked leaf layers', () => {

  it('fans the layers by default: the bottom as drawn, each one above smaller and turned to alternate sides', () => {
    expect(defaultLayerOffset(0)).toEqual({ turn: 0, scale: 1 })
    expect(defaultLayerOffset(1)).toEqual({ turn: 10, scale: 0.9 })
    expect(defaultLayerOffset(2)).toEqual({ turn: -10, scale: 0.8 })
    expect(defaultLayerOffset(3)).toEqual({ turn: 20, scale: 0.7 })
    expect(defaultLayerOffset(9).scale).toBe(0.5)
    // 1 1/2 in × 3/4 in leaf, top layer × 0.9 = 1.35 × 0.675 in, turned 10° from the leaf's 20°.
    const [bottom, top] = leafLayers(leaf({ angle: 20 }))
    expect(bottom).toEqual({ fabric: 'dark', turn: 0, scale: 1, length: 1.5, width: 0.75, angle: 20 })
    expect(top!.fabric).toBe('light')
    expect(top!.length).toBeCloseTo(1.35, 12)
    expect(top!.width).toBeCloseTo(0.675, 12)
    expect(top!.angle).toBe(30)
  })

  it('takes the design\'s own offsets, member by member, and keeps the angle within ±75°', () => {
    const layers = leafLayers(leaf({ angle: 70, layers: ['a', 'b', 'c'], layerOffsets: [{ scale: 1.2 }, { turn: 15 }, {}] }))
    expect(layers.map((layer) => [layer.turn, layer.scale, layer.angle])).toEqual([[0, 1.2, 70], [15, 0.9, 75], [-10, 0.8, 60]])
  })

  it('shows every layer of a default stack: none covered by the layers above it, no two alike (clipper2-ts 2.0.1)', () => {
    // clipper2-ts rather than polygon-clipping 0.15: every layer's open end lies on the seam
    // line, and polygon-clipping's sweep overflowed its stack on such shared collinear edges
    // (about once in a few hundred runs).
    const path = (polygon: Polygon): PathD => polygon.map(([x, y]) => ({ x, y }))
    const areaOf = (paths: PathsD): number => Math.abs(areaPathsD(paths))
    const digits = 8 // 1e-8 in grid, far finer than the 2 % checked
    fc.assert(fc.property(
      fc.double({ min: 0.3, max: 3, noNaN: true }), fc.double({ min: 0.55, max: 4, noNaN: true }),
      fc.double({ min: -75, max: 75, noNaN: true }), fc.constantFrom<'left' | 'right'>('left', 'right'),
      fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), fc.integer({ min: 2, max: 5 }),
      (width, ratio, angle, side, direction, count) => {
        const s = seam({ from: [1, 2], to: [1 + 6 * Math.cos(direction), 2 + 6 * Math.sin(direction)] })
        const stack = leaf({ width, length: width * ratio, angle, side, layers: Array.from({ length: count }, (_, k) => `fabric-${k}`) })
        const placed = tryPlaceLeafLayers(stack, s)
        if (!placed.ok) throw new Error(placed.reason)
        const outlines = placed.layers.map((layer) => path(layer.placement.finishedOutline))
        outlines.forEach((outline, k) => {
          const own = areaOf([outline])
          // Visible: more than 2 % of the layer is outside the union of every layer above it.
          const above = outlines.slice(k + 1)
          const visible = above.length === 0 ? own : areaOf(differenceD([outline], above, FillRule.NonZero, digits))
          expect(visible / own, `layer ${k} of ${count}`).toBeGreaterThan(0.02)
          outlines.forEach((other, j) => {
            if (j !== k) expect(areaOf(xorD([outline], [other], FillRule.NonZero, digits))).toBeGreaterThan(0.02 * own)
          })
        })
      }))
  })

  it('places each layer as a leaf of its own size caught at the same point of the same seam', () => {
    const placed = tryPlaceLeafLayers(leaf(), seam())
    if (!placed.ok) throw new Error(placed.reason)
    const [bottom, top] = placed.layers
    expect(bottom!.placement).toEqual(placeLeaf(leaf(), seam()))
    expect(top!.placement.base).toEqual(bottom!.placement.base)
    // Top layer 1.5 × 0.9 = 1.35 in from the seam to its tip.
    expect(distance(top!.placement.tip, top!.placement.base)).toBeCloseTo(1.35, 9)
  })

  it('refuses a leaf that cannot be pointed as a whole, without throwing', () => {
    expect(tryPlaceLeafLayers(leaf({ length: 0.5, width: 3 }), seam()).ok).toBe(false)
  })
})
