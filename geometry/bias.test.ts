import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  BIAS_TUBE_SEAM_INCHES, bindingPlan, continuousBiasSquareInches, stemCutWidthInches, stemSewing, stemStrip,
} from './bias'

const ring = (innerRadius: number, outerRadius: number) => ({ innerRadius, outerRadius, repeats: 4, repeatMode: 'rotate' as const })

describe('bindingPlan', () => {
  it('binds a wedge ring with one strip: 2πr + 10 in for joining, cut 2 1/4 in wide by default (common practice)', () => {
    const plan = bindingPlan({ ring: ring(0, 9) })
    // Double-fold binding strips are cut 2 1/4–2 1/2 in wide (common practice): default 2 1/4 in.
    expect(plan.cutWidthIn).toBe(2.25)
    expect(plan.fabric).toBe('binding')
    expect(plan.edges).toHaveLength(1)
    // Circumference 2πr (derivable): 2π × 9 in = 56.55 in, + 10 in joining allowance (common practice) = 66.55 in → 67 in
    expect(plan.edges[0]!.circumferenceIn).toBeCloseTo(56.549, 3)
    expect(plan.edges[0]!.stripLengthIn).toBe(67)
    expect(plan.lengthIn).toBe(67)
  })

  it('binds both edges of a ring with a hole, each with its own joining allowance', () => {
    const plan = bindingPlan({ ring: ring(3, 10) })
    expect(plan.edges.map((edge) => edge.edge)).toEqual(['outer', 'inner'])
    // outer: 2π × 10 = 62.83 in + 10 in = 72.83 in → 73 in; inner: 2π × 3 = 18.85 in + 10 in = 28.85 in → 29 in
    expect(plan.edges.map((edge) => edge.stripLengthIn)).toEqual([73, 29])
    expect(plan.lengthIn).toBe(102)
  })

  it("takes the design's own cut width and fabric role, and a joining allowance as a setting", () => {
    const plan = bindingPlan({ ring: ring(0, 9), binding: { cutWidth: 2.5, fabric: 'rust' } })
    expect([plan.cutWidthIn, plan.fabric]).toEqual([2.5, 'rust'])
    expect(bindingPlan({ ring: ring(0, 9), binding: { fabric: 'rust' } }).cutWidthIn).toBe(2.25)
    // 56.55 in + 6 in = 62.55 in → 63 in
    expect(bindingPlan({ ring: ring(0, 9) }, { joinInches: 6 }).edges[0]!.stripLengthIn).toBe(63)
  })
})

describe('stem strips', () => {
  it('cuts a folded stem 2 × finished width + 1/2 in wide (derived here: fold, sew 1/4 in, press over)', () => {
    // Folded in half the strip is half its cut width; sewn 1/4 in from the raw edges and pressed over
    // the stitching, what lies between the stitching and the fold shows: cut / 2 − 1/4 = finished,
    // so cut = 2 × (finished + 1/4) = 2 × finished + 1/2.
    for (const finished of [0.25, 0.375, 0.5, 1]) {
      const cut = stemCutWidthInches(finished)
      expect(cut / 2 - 0.25).toBe(finished)
    }
    expect(stemCutWidthInches(0.375)).toBe(1.25)
  })

  it('is the circumference 2πr plus the joining overlap, rounded up to a whole inch', () => {
    const strip = stemStrip({ radius: 7.75, finishedWidth: 0.375, fabric: 'stem' })
    // 2π × 7.75 = 48.69 in (circumference, derivable) + 4 in overlap (common practice: a few inches) = 52.69 → 53 in
    expect(strip.circumferenceIn).toBeCloseTo(2 * Math.PI * 7.75, 12)
    expect(strip.lengthIn).toBe(53)
    expect(strip.cutWidthIn).toBe(1.25)
    // The overlap is a setting: 48.69 + 2 = 50.69 → 51 in.
    expect(stemStrip({ radius: 7.75, finishedWidth: 0.375, fabric: 'stem' }, { joinOverlapInches: 2 }).lengthIn).toBe(51)
  })
})

describe('continuousBiasSquareInches', () => {
  it('gives a square whose area is the strip area plus the two seams and the spiral ends (derivable)', () => {
    // Strip 53 × 1 1/4 in: area 66.25 sq in, so a square of at least √66.25 = 8.14 in.
    const side = continuousBiasSquareInches(53, 1.25)
    expect(side).toBeGreaterThanOrEqual(Math.sqrt(53 * 1.25))
    // The two 1/4 in seams take 1/2 in off each side of what is cut into strips: the rest, t², must
    // hold the strip plus about one strip length t√2 lost at the spiral's two ends.
    const usable = side - 2 * BIAS_TUBE_SEAM_INCHES
    expect(usable * usable).toBeGreaterThanOrEqual(53 * 1.25 + usable * Math.SQRT2 * 1.25)
    // Rounded up to the ruler's 1/8 in, and no more: 1/8 in less would not hold it.
    expect((side * 8) % 1).toBe(0)
    const smaller = side - 0.125 - 2 * BIAS_TUBE_SEAM_INCHES
    expect(smaller * smaller).toBeLessThan(53 * 1.25 + smaller * Math.SQRT2 * 1.25)
    expect(side).toBe(9.625)
  })

  it('holds any strip, and stays within an inch and a half plus a strip width of √(length × width)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 600, noNaN: true }), fc.double({ min: 0.5, max: 3, noNaN: true }), (length, width) => {
        const side = continuousBiasSquareInches(length, width)
        const usable = side - 2 * BIAS_TUBE_SEAM_INCHES
        expect(usable * usable / width - usable * Math.SQRT2).toBeGreaterThanOrEqual(length - 1e-9)
        expect(side).toBeLessThanOrEqual(Math.sqrt(length * width) + 1.5 + width)
      }),
    )
  })

  it('needs nothing for no strip', () => {
    expect(continuousBiasSquareInches(0, 1.25)).toBe(0)
  })
})

describe('stemSewing', () => {
  it('sews the folded strip on the inner traced circle so it presses over onto the outer one', () => {
    const stem = { radius: 7.75, finishedWidth: 0.375, fabric: 'stem' }
    const sewing = stemSewing(stem)
    // Folded bias stem (derivable): cut width = 2 × 3/8 in + 1/2 in = 1 1/4 in; folded in half, 5/8 in.
    expect(sewing.cutWidthIn).toBe(1.25)
    expect(sewing.foldedWidthIn).toBe(0.625)
    // The placement guide draws the stem's edges at radius ± half its width: 7.5625 and 7.9375 in.
    // Stitching 1/4 in from the raw edges lies on the inner one, so the raw edges sit 1/4 in beyond it.
    expect(sewing.stitchRadiusIn).toBe(stem.radius - stem.finishedWidth / 2)
    expect(sewing.rawEdgeRadiusIn).toBe(7.8125)
    // Pressed outward over the stitching: 5/8 − 1/4 = 3/8 in from the stitching, the outer edge.
    expect(sewing.foldRadiusIn).toBe(stem.radius + stem.finishedWidth / 2)
    // The raw edges (7.8125 in) lie under the pressed stem (7.5625 to 7.9375 in).
    expect(sewing.rawEdgeRadiusIn).toBeLessThan(sewing.foldRadiusIn)
    expect(sewing.trimAllowance).toBe(false)
  })

  it('asks for the allowance to be trimmed when the stem is narrower than the 1/4 in seam', () => {
    expect(stemSewing({ radius: 5, finishedWidth: 0.125, fabric: 'stem' }).trimAllowance).toBe(true)
  })
})
