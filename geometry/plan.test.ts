import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { design, gridDesign, peelDesign, quarterWedge, xInLastRegionDesign } from './fixtures/generators'
import { independentJoinProblem, independentOrderProblem } from './fixtures/independent-checker'
import { parseDesign } from '../lib/schemas/design'
import { planDesign, sectionLetter, type Plan } from './plan'
import type { Design, HandSetOrder, JoinTree, Polygon, Seam } from './types'

const arc = (x: number): number => Math.sqrt(81 - x * x)

/** The plan's own order, written back as an order set by hand. */
function asHandSetOrder(plan: Plan): HandSetOrder {
  const byId = new Map(plan.areas.map((area) => [area.id, area.point]))
  return {
    sections: plan.sections.map((section) => ({ label: section.label, areas: section.order.map((id) => byId.get(id)!) })),
    assembly: plan.assembly as JoinTree,
  }
}

const labels = (plan: Plan): Record<string, string | null> => Object.fromEntries(plan.areas.map((area) => [area.id, area.label]))

const anyDesign = fc.oneof(
  fc.record({ seed: fc.integer({ min: 1, max: 1_000_000 }), count: fc.integer({ min: 2, max: 16 }) }).map(({ seed, count }) => peelDesign(count, seed).design),
  fc.record({ m: fc.integer({ min: 1, max: 5 }), n: fc.integer({ min: 1, max: 5 }) }).map(({ m, n }) => gridDesign(m, n)),
  fc.record({ seed: fc.integer({ min: 1, max: 1_000_000 }), count: fc.integer({ min: 2, max: 12 }) }).map(({ seed, count }) => xInLastRegionDesign(count, seed)),
)

function strips(leaves: Design['leaves'] = []): Design {
  return design({
    seams: [
      { id: 'low', from: [0, 2], to: [arc(2), 2] },
      { id: 'high', from: [0, 4], to: [arc(4), 4] },
    ],
    leaves,
  })
}

const leaf = (id: string, seam: string, side: 'left' | 'right') => ({ id, seam, at: 0.3, side, angle: 0, length: 1, width: 0.5, layers: ['leaf'] })

describe('planDesign', () => {
  it('labels sections A, B, … Z, AA', () => {
    // spreadsheet-style letters after Z (from memory: common in pattern publishing for many sections)
    expect([0, 1, 25, 26, 27].map(sectionLetter)).toEqual(['A', 'B', 'Z', 'AA', 'AB'])
  })

  it('accepts any plan it proposes when the plan is fed back as a hand-set order', () => {
    fc.assert(
      fc.property(anyDesign, (d) => {
        const proposed = planDesign(d)
        const checked = planDesign({ ...d, order: asHandSetOrder(proposed) })
        expect(checked.problems.filter((p) => p.severity === 'error')).toEqual([])
        expect(checked.sewable).toBe(true)
        expect(labels(checked)).toEqual(labels(proposed))
      }),
      { numRuns: 40 },
    )
  })

  it('changes no label when the seams are listed in another order or direction', () => {
    fc.assert(
      fc.property(anyDesign, fc.integer({ min: 0, max: 1_000 }), (d, shuffleSeed) => {
        let state = shuffleSeed + 1
        const next = (): number => (state = (state * 16807) % 2147483647) / 2147483647
        const seams: Seam[] = d.seams.map((s) => (next() < 0.5 ? { id: s.id, from: s.to, to: s.from } : s))
        for (let i = seams.length - 1; i > 0; i -= 1) {
          const j = Math.floor(next() * (i + 1))
          ;[seams[i], seams[j]] = [seams[j] as Seam, seams[i] as Seam]
        }
        expect(labels(planDesign({ ...d, seams }))).toEqual(labels(planDesign(d)))
      }),
      { numRuns: 40 },
    )
  })

  it('snaps hand-drawn ends the same way whatever order the seams are listed in', () => {
    // ends moved up to 0.004 in off the lines they belong on: inside the 0.01 in snap (geometry.md)
    fc.assert(
      fc.property(anyDesign, fc.integer({ min: 1, max: 1_000_000 }), (d, jitterSeed) => {
        let state = jitterSeed
        const next = (): number => (state = (state * 48271) % 2147483647) / 2147483647
        const jitter = (p: readonly [number, number]): [number, number] => [p[0] + (next() - 0.5) * 0.008, p[1] + (next() - 0.5) * 0.008]
        const drawn = { ...d, seams: d.seams.map((s) => ({ ...s, from: jitter(s.from), to: jitter(s.to) })) }
        const plan = planDesign(drawn)
        expect(plan.sewable).toBe(true)
        const reversed = planDesign({ ...drawn, seams: [...drawn.seams].reverse().map((s) => ({ id: s.id, from: s.to, to: s.from })) })
        expect(labels(reversed)).toEqual(labels(plan))
      }),
      { numRuns: 30 },
    )
  })

  it('plans a centimetre design exactly as its inch twin', () => {
    // 1 in = 2.54 cm exactly (standard: international yard and pound agreement, 1959)
    const inches = gridDesign(2, 3)
    const file = (units: 'in' | 'cm', scale: number) => ({
      format: 'wreathwright-design',
      version: 1,
      name: 'twin',
      units,
      ring: { ...inches.ring, outerRadius: inches.ring.outerRadius * scale },
      seams: inches.seams.map((s) => ({ id: s.id, from: [s.from[0] * scale, s.from[1] * scale], to: [s.to[0] * scale, s.to[1] * scale] })),
    })
    const plans = [file('in', 1), file('cm', 2.54)].map((json) => {
      const parsed = parseDesign(json)
      if (!parsed.ok) throw new Error(parsed.issues[0]?.message)
      return planDesign(parsed.design)
    })
    expect(labels(plans[1]!)).toEqual(labels(plans[0]!))
    expect(plans[1]!.areas.map((a) => a.areaSqIn)).toEqual(plans[0]!.areas.map((a) => a.areaSqIn))
  })

  it('proposes sections and joins that an independent checker accepts', () => {
    // published criterion (Leake et al., ACM TOG 40(4) 2021) applied to sections and to joins
    const designs = fc.oneof(
      fc.record({ m: fc.integer({ min: 1, max: 5 }), n: fc.integer({ min: 1, max: 5 }) }).map(({ m, n }) => gridDesign(m, n)),
      fc.record({ seed: fc.integer({ min: 1, max: 1_000_000 }), count: fc.integer({ min: 2, max: 14 }) }).map(({ seed, count }) => xInLastRegionDesign(count, seed)),
    )
    fc.assert(
      fc.property(designs, (d) => {
        const plan = planDesign(d)
        expect(plan.sewable).toBe(true)
        const polygon = new Map(plan.areas.map((area) => [area.id, area.polygon]))
        const sectionPolygons = new Map(plan.sections.map((s) => [s.label, s.order.map((id) => polygon.get(id)!)]))
        for (const areas of sectionPolygons.values()) expect(independentOrderProblem(areas)).toBeNull()
        const visit = (tree: JoinTree): Polygon[] => {
          if (typeof tree === 'string') return sectionPolygons.get(tree) ?? []
          const first = visit(tree[0])
          const second = visit(tree[1])
          expect(independentJoinProblem(first, second)).toBeNull()
          return [...first, ...second]
        }
        expect(visit(plan.assembly as JoinTree)).toHaveLength(plan.areas.length)
      }),
      { numRuns: 40 },
    )
  })

  it('gives every step its sewing line, and the first of a section none', () => {
    const plan = planDesign(strips())
    expect(plan.areas.map((a) => a.label)).toEqual(['A1', 'A2', 'A3'])
    expect(plan.areas[0]?.sewnAlong).toBeNull()
    for (const area of plan.areas.slice(1)) expect(area.sewnAlong).not.toBeNull()
    // 1/8 in steps (common practice: rotary rulers); the rough cut covers at least the area
    for (const area of plan.areas) expect((area.roughCut.widthIn * 8) % 1).toBeCloseTo(0, 9)
  })

  it('bastes a leaf on the area it lies over before the next one is sewn', () => {
    // common practice (references.md): an insert's raw edge is caught in the seam sewn over it, so
    // it is basted to the area it lies over first
    // seam "low" runs from the y axis to the arc (left to right), so its left side is above it
    const plan = planDesign(strips([leaf('l1', 'low', 'left')]))
    const middle = plan.areas.find((a) => a.point[1] > 2 && a.point[1] < 4)!
    const bottom = plan.areas.find((a) => a.point[1] < 2)!
    expect(plan.sections).toHaveLength(1)
    expect((middle.step ?? 0) < (bottom.step ?? 0)).toBe(true)
    expect(bottom.leavesBefore).toEqual(['l1'])
  })

  it('turns a seam into a section join when leaves on both sides need opposite orders, and says so', () => {
    const plan = planDesign(strips([leaf('l1', 'low', 'left'), leaf('l2', 'low', 'right')]))
    expect(plan.sewable).toBe(true)
    expect(plan.sections).toHaveLength(2)
    const conflict = plan.problems.find((p) => p.code === 'insert-conflict')
    // Leaves are named by where they lie (geometry/leaf-names.ts), never by id.
    expect(conflict?.message).toMatch(/^Leaf 1 of A2 and leaf 1 of B1 need /)
    expect(conflict?.message).not.toMatch(/l1|l2/)
    expect(conflict?.at[1]).toBeCloseTo(2, 9)
  })

  it('makes a leaf too wide for its length an error at the leaf, naming it and the fix', () => {
    // derivable (leaf-template.ts): a pointed leaf needs length > width / 2; 0.5 in < 3 in / 2
    const stubby = { ...leaf('stubby', 'low', 'left'), at: 0.5, length: 0.5, width: 3 }
    const plan = planDesign(strips([stubby]))
    expect(plan.sewable).toBe(false)
    const problem = plan.problems.find((p) => p.code === 'impossible-leaf')
    expect(problem?.severity).toBe('error')
    expect(problem?.message).toBe(
      // The plan is not sewable, so no area is labelled: the leaf is numbered around the ring.
      'Leaf 1 cannot be made as a pointed leaf: it is 3 in wide but only 0.5 in long, and a pointed leaf must be longer than half its width. Make it longer than 1.5 in or narrower than 1 in.',
    )
    // placed at the leaf's open end: halfway along seam "low"
    const low = strips().seams.find((s) => s.id === 'low')!
    expect(problem?.at[0]).toBeCloseTo((low.from[0] + low.to[0]) / 2, 2)
    expect(problem?.at[1]).toBeCloseTo(2, 6)
  })

  it('checks a hand-set order instead of proposing one, naming the failing step', () => {
    const d = strips()
    const plan = planDesign({ ...d, order: { sections: [{ label: 'A', areas: [[1, 1], [1, 5], [1, 3]] }] } })
    expect(plan.sewable).toBe(false)
    expect(plan.problems.map((p) => p.message)).toEqual(['A2 does not meet the sewn areas along a seam.', 'A3 meets the sewn areas along two lines.'])
    // the problem is placed on the failing step's area (the top strip, y > 4)
    expect(plan.problems[0]?.at[1]).toBeGreaterThan(4)
  })

  it('names a leaf basted too late in a hand-set order', () => {
    const d = strips([leaf('l2', 'low', 'left')])
    const plan = planDesign({ ...d, order: { sections: [{ label: 'A', areas: [[1, 1], [1, 3], [1, 5]] }] } })
    expect(plan.problems.map((p) => p.message)).toEqual(['Leaf 1 of A2 must be basted on A2 before A1 is sewn, but A2 comes later.'])
  })

  it('rejects a hand-set join tree that joins along two lines', () => {
    const grid = gridDesign(2, 2)
    const proposed = planDesign(grid)
    const order = asHandSetOrder(proposed)
    // split the 2 × 2 grid into its four cells and join them round the crossing: A+D touch at a point only
    const cells = proposed.areas.map((a) => a.point)
    const plan = planDesign({ ...grid, order: { sections: cells.map((point, index) => ({ label: `S${index}`, areas: [point] })), assembly: [['S0', 'S3'], ['S1', 'S2']] } })
    expect(order.sections).toHaveLength(2)
    expect(plan.sewable).toBe(false)
    expect(plan.problems.some((p) => p.code === 'join-not-straight')).toBe(true)
  })

  it('warns at the centre of an odd wedge ring and joins even wedges in halves', () => {
    // derivable: a straight seam through the centre continues a radial edge only if the opposite
    // direction is also a radial edge, i.e. 180° is a multiple of 360°/N, which needs N even
    const odd = planDesign(design({ ring: { ...quarterWedge, repeats: 5 }, seams: [{ id: 's1', from: [3, 0], to: [2 * Math.cos((2 * Math.PI) / 5), 2 * Math.sin((2 * Math.PI) / 5)] }] }))
    expect(odd.ringAssembly.kind).toBe('none')
    expect(odd.sewable).toBe(true)
    const warning = odd.problems.find((p) => p.code === 'odd-wedge-centre')
    expect(warning?.at).toEqual([0, 0])
    expect(warning?.severity).toBe('warning')
    expect(planDesign(design()).ringAssembly.kind).toBe('halves')
    expect(planDesign(design({ ring: { ...quarterWedge, innerRadius: 2, repeats: 5 } })).ringAssembly.kind).toBe('chain')
  })

  it('never throws on random seams drawn between the outline and other seams', () => {
    // geometry.md: an unsewable design is a result, never an exception
    const design01 = fc.record({
      repeats: fc.integer({ min: 2, max: 36 }),
      outer: fc.constantFrom(0.5, 3, 9, 20),
      hole: fc.constantFrom(0, 0, 0.3),
      picks: fc.array(fc.record({ side: fc.integer({ min: 0, max: 3 }), t: fc.double({ min: 0, max: 1, noNaN: true }), u: fc.double({ min: 0, max: 1, noNaN: true }), onSeam: fc.boolean() }), { maxLength: 8 }),
    })
    fc.assert(
      fc.property(design01, ({ repeats, outer, hole, picks }) => {
        const inner = outer * hole
        const span = (2 * Math.PI) / repeats
        const onOutline = (side: number, t: number): [number, number] => {
          const radius = inner + t * (outer - inner)
          if (side === 0) return [radius, 0]
          if (side === 1) return [radius * Math.cos(span), radius * Math.sin(span)]
          const r = side === 2 ? outer : inner
          return [r * Math.cos(t * span), r * Math.sin(t * span)]
        }
        const seams: Seam[] = []
        picks.forEach(({ side, t, u, onSeam }, index) => {
          const host = seams[index - 1]
          const from: [number, number] = onSeam && host ? [host.from[0] + u * (host.to[0] - host.from[0]), host.from[1] + u * (host.to[1] - host.from[1])] : onOutline((side + 1) % 4, u)
          seams.push({ id: `s${index}`, from, to: onOutline(side, t) })
        })
        const plan = planDesign(design({ ring: { innerRadius: inner, outerRadius: outer, repeats, repeatMode: 'rotate' }, seams }))
        expect(plan.areas.length).toBeGreaterThan(0)
      }),
      { numRuns: 300 },
    )
  })

  it('does not throw when several seams run nearly straight through one point (found by fuzzing)', () => {
    // seven seams in a 0.5 in wedge, some within the 0.001 in straightness tolerance of each
    // other at shared points: seam lines must still be simple chains (geometry.md: never a crash)
    const seams: Seam[] = [
      { id: 's0', from: [0.49798929845700973, 0.04479574335018092], to: [0.2537418674910441, 0] },
      { id: 's1', from: [0.4999807183789352, 0.004391041936016934], to: [2.932720439557672e-18, 0.04789495945442468] },
      { id: 's2', from: [0.1964382991220145, 0.4597956009337736], to: [1.8761913511146972e-17, 0.3064053002744913] },
      { id: 's3', from: [0.11059208765215628, 0.03827221025120135], to: [0.45509455911815166, 0] },
      { id: 's4', from: [0.11322077532803215, 0.038043485007148464], to: [2.7063711958177786e-17, 0.44198395777493715] },
      { id: 's5', from: [0.06515124634269306, 0.35727913348063867], to: [0, 0] },
      { id: 's6', from: [0.4301428882599195, 0.2549060526535501], to: [1.2207701812659071e-17, 0.19936690025497228] },
    ]
    const plan = planDesign(design({ ring: { innerRadius: 0, outerRadius: 0.5, repeats: 4, repeatMode: 'mirror' }, seams }))
    expect(plan.areas.length).toBeGreaterThan(1)
  })

  it('places a set-in seam at its point', () => {
    const plan = planDesign(
      design({
        seams: [
          { id: 'a', from: [4, 4], to: [4, 0] },
          { id: 'b', from: [4, 4], to: [0, 6] },
          { id: 'c', from: [4, 4], to: [9 * Math.SQRT1_2, 9 * Math.SQRT1_2] },
        ],
      }),
    )
    expect(plan.sewable).toBe(false)
    expect(plan.problems.map((p) => [p.code, p.at])).toEqual([['set-in-seam', [4, 4]]])
  })
})
