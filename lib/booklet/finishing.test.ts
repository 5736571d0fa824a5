import { describe, expect, it } from 'vitest'
import { bindingPlan, stemSewing } from './finishing'

const ring = (innerRadius: number, outerRadius: number) => ({ innerRadius, outerRadius, repeats: 4, repeatMode: 'rotate' as const })

describe('bindingPlan', () => {
  it('binds a wedge ring with one strip: 2πr + 10 in for joining, cut 2 1/4 in wide by default (common practice)', () => {
    const plan = bindingPlan({ ring: ring(0, 9) })
    // Double-fold binding strips are cut 2 1/4–2 1/2 in wide (common practice): default 2 1/4 in.
    expect(plan.cutWidthIn).toBe(2.25)
    expect(plan.fabric).toBe('binding')
    expect(plan.edges).toHaveLength(1)
    // 2π × 9 in = 56.55 in, + 10 in joining allowance (common practice) = 66.55 in, rounded up: 67 in
    expect(plan.edges[0]!.circumferenceIn).toBeCloseTo(56.549, 3)
    expect(plan.edges[0]!.stripLengthIn).toBe(67)
  })

  it('binds both edges of a ring with a hole, each with its own joining allowance', () => {
    const plan = bindingPlan({ ring: ring(3, 10) })
    expect(plan.edges.map((edge) => edge.edge)).toEqual(['outer', 'inner'])
    // outer: 2π × 10 = 62.83 in + 10 in = 72.83 in → 73 in; inner: 2π × 3 = 18.85 in + 10 in = 28.85 in → 29 in
    expect(plan.edges.map((edge) => edge.stripLengthIn)).toEqual([73, 29])
  })

  it("takes the design's own cut width and fabric role", () => {
    const plan = bindingPlan({ ring: ring(0, 9), binding: { cutWidth: 2.5, fabric: 'rust' } })
    expect([plan.cutWidthIn, plan.fabric]).toEqual([2.5, 'rust'])
    expect(bindingPlan({ ring: ring(0, 9), binding: { fabric: 'rust' } }).cutWidthIn).toBe(2.25)
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
