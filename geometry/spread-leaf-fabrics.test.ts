import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { alternation, spreadLeafFabrics } from './spread-leaf-fabrics'
import type { Leaf, Point, RepeatMode, Seam } from './types'

type Input = Parameters<typeof spreadLeafFabrics>[0]
type SpreadLeaf = Pick<Leaf, 'id' | 'seam' | 'at' | 'side' | 'layers'>

/** A radial seam at `degrees` from 1 in to 9 in; a leaf at fraction `at` of it sits at 1 + 8·at in. */
const ray = (id: string, degrees: number): Seam => {
  const r = (degrees * Math.PI) / 180
  return { id, from: [Math.cos(r), Math.sin(r)], to: [9 * Math.cos(r), 9 * Math.sin(r)] }
}
const leaf = (id: string, seam: string, layers: string[], at = 0.5): SpreadLeaf => ({ id, seam, at, side: 'left', layers })

/** One leaf per ray at 10°, 20°, 30° … in a repeat of `repeats`, listed back to front. */
function fan(count: number, layers: (index: number) => string[], repeatMode: RepeatMode = 'rotate'): Input {
  const seams = Array.from({ length: count }, (_, i) => ray(`s${i}`, 10 * (i + 1)))
  const leaves = seams.map((seam, i) => leaf(`l${i}`, seam.id, layers(i))).reverse()
  return { ring: { repeatMode }, seams, leaves }
}

const layersById = (input: Input) => spreadLeafFabrics(input).leaves.map((l) => l.layers.join('+'))

describe('spreadLeafFabrics: worked examples', () => {
  // Check values by hand from the rule "deal the fabrics in turn": standard graph theory (from
  // memory): a cycle of n leaves can alternate 2 fabrics only when n is even; 3 always suffice.
  it('alternates two fabrics over an even count per repeat, in ring order whatever the listing', () => {
    const input = fan(4, () => ['dark'])
    // Every leaf was dark; the fabrics in play are only dark, so nothing can be spread.
    expect(spreadLeafFabrics(input).notes.map((n) => n.code)).toEqual(['one-fabric'])
    const two = fan(4, (i) => [i === 0 ? 'light' : 'dark'])
    const spread = spreadLeafFabrics(two)
    // Counter-clockwise from 10°: l0 (light, first used) then l1, l2, l3; 4 = 2 + 2.
    expect(spread.leaves.map((l) => l.id)).toEqual(['l0', 'l1', 'l2', 'l3'])
    expect(spread.fabrics).toEqual(['light', 'dark'])
    expect(layersById(two)).toEqual(['light', 'dark', 'light', 'dark'])
    expect(spread.notes).toEqual([])
  })

  it('says so when an odd count per repeat cannot alternate two fabrics across the repeat edge, keeping counts even', () => {
    const spread = spreadLeafFabrics(fan(3, (i) => [i === 1 ? 'light' : 'dark']))
    // 3 leaves, 2 fabrics: 2 + 1, and the last dark meets the next repeat's first dark.
    expect(spread.leaves.map((l) => l.layers[0])).toEqual(['dark', 'light', 'dark'])
    expect(spread.notes.map((n) => n.code)).toEqual(['cannot-alternate'])
    expect(spread.notes[0]!.message).toContain('3 leaves in each repeat')
  })

  it('with three fabrics and 4 = 3 + 1 leaves, moves the second use of the first fabric away from the repeat edge', () => {
    // Dealt in turn: a b c a, and a meets the next repeat's a; a b a c keeps 2 + 1 + 1 and every
    // neighbour, the wrap included (c beside a), differs.
    expect(alternation(4, 3, true)).toEqual([0, 1, 0, 2])
    expect(alternation(7, 3, true)).toEqual([0, 1, 2, 0, 1, 0, 2])
    expect(alternation(4, 3, false)).toEqual([0, 1, 2, 0])
    const spread = spreadLeafFabrics(fan(4, (i) => [['a', 'b', 'c', 'c'][i]!]))
    expect(spread.leaves.map((l) => l.layers[0])).toEqual(['a', 'b', 'a', 'c'])
    expect(spread.notes).toEqual([])
  })

  it('in mirror mode treats the repeat as a path and says its end leaves meet their mirror images', () => {
    const spread = spreadLeafFabrics(fan(3, (i) => [i === 1 ? 'light' : 'dark'], 'mirror'))
    expect(spread.leaves.map((l) => l.layers[0])).toEqual(['dark', 'light', 'dark'])
    expect(spread.notes.map((n) => n.code)).toEqual(['mirror-edges'])
  })

  it('spreads each layer position of stacked leaves and keeps a leaf\'s layers different', () => {
    const spread = spreadLeafFabrics(fan(4, () => ['rust', 'gold', 'olive']))
    // Bottom layers rust gold olive rust would put rust beside rust across the edge (4 = 3 + 1):
    // rust gold rust olive; each layer above turns the fabrics by one, so each stack differs.
    expect(spread.leaves.map((l) => l.layers.join(' '))).toEqual(['rust gold olive', 'gold olive rust', 'rust gold olive', 'olive rust gold'])
    expect(spread.notes).toEqual([])
  })

  it('keeps stacks of different heights different where a trade allows, and notes a stack deeper than the fabrics', () => {
    // Bottoms dealt rust gold olive rust gold olive; the second layers of l0, l2, l4 (bottoms
    // rust, olive, gold) dealt gold olive rust would give l2 olive twice: l0 and l2 trade.
    const spread = spreadLeafFabrics(fan(6, (i) => (i % 2 === 0 ? ['rust', 'gold'] : ['olive'])))
    expect(spread.leaves.map((l) => l.layers.join(' '))).toEqual(['rust olive', 'gold', 'olive gold', 'rust', 'gold rust', 'olive'])
    expect(spread.notes).toEqual([])
    const deep = spreadLeafFabrics(fan(2, () => ['rust', 'gold', 'rust']))
    expect(deep.notes.map((n) => n.code)).toContain('stack-repeats')
  })

  it('leaves out leaves on a missing seam and has nothing to do without leaves', () => {
    const input = fan(2, (i) => [i === 0 ? 'a' : 'b'])
    const withStray: Input = { ...input, leaves: [...input.leaves, leaf('stray', 'gone', ['c'])] }
    expect(spreadLeafFabrics(withStray).leaves.map((l) => l.id)).toEqual(['l0', 'l1'])
    expect(spreadLeafFabrics({ ...input, leaves: [] }).notes.map((n) => n.code)).toEqual(['no-leaves'])
  })
})

// ---------------------------------------------------------------------------------------------
// Properties over random repeats. The checker below expands the whole ring itself (N copies of
// repeat 0, every second one reversed in mirror mode) and counts neighbours there.

const FABRIC_POOL = ['a', 'b', 'c', 'd', 'e', 'f']

const arbitraryInput = fc
  .record({
    repeats: fc.integer({ min: 2, max: 36 }),
    mirror: fc.boolean(),
    fabricCount: fc.integer({ min: 1, max: 6 }),
    leaves: fc.array(
      fc.record({
        from: fc.tuple(fc.double({ min: 0.5, max: 9, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })),
        to: fc.tuple(fc.double({ min: 0.5, max: 9, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })),
        // A few fixed fractions so that leaves share a place or a ray now and then.
        at: fc.oneof(fc.constantFrom(0, 0.5, 1), fc.double({ min: 0, max: 1, noNaN: true })),
        side: fc.constantFrom('left' as const, 'right' as const),
        layers: fc.array(fc.nat(5), { minLength: 1, maxLength: 3 }),
        sameSeamAsPrevious: fc.boolean(),
      }),
      { minLength: 1, maxLength: 12 },
    ),
    uniformDepth: fc.integer({ min: 0, max: 3 }),
  })
  .map(({ repeats, mirror, fabricCount, leaves, uniformDepth }) => {
    // 2–36 repeats; mirror mode only with an even count (the design format's rule).
    const n = mirror ? repeats + (repeats % 2) : repeats
    const span = (2 * Math.PI) / n
    // Points in polar form inside repeat 0's sector (convex for N ≥ 2).
    const polar = ([radius, fraction]: readonly [number, number]): Point => [radius * Math.cos(fraction * span), radius * Math.sin(fraction * span)]
    const seams: Seam[] = []
    const list: SpreadLeaf[] = leaves.map((l, i) => {
      if (!(l.sameSeamAsPrevious && seams.length > 0)) seams.push({ id: `s${i}`, from: polar(l.from), to: polar(l.to) })
      const depth = uniformDepth > 0 ? uniformDepth : l.layers.length
      const layers = Array.from({ length: depth }, (_, k) => FABRIC_POOL[(l.layers[k] ?? l.layers[0]!) % fabricCount]!)
      return { id: `l${i}`, seam: seams[seams.length - 1]!.id, at: l.at, side: l.side, layers }
    })
    return { repeats: n, uniformDepth, input: { ring: { repeatMode: mirror ? ('mirror' as const) : ('rotate' as const) }, seams, leaves: list } satisfies Input }
  })

/** Ring order computed here from the seams, independently of the module. */
function expectedOrder(input: Input): string[] {
  const keyed = input.leaves.map((l) => {
    const seam = input.seams.find((s) => s.id === l.seam)!
    const x = seam.from[0] + l.at * (seam.to[0] - seam.from[0])
    const y = seam.from[1] + l.at * (seam.to[1] - seam.from[1])
    let angle = Math.atan2(y, x)
    if (angle < 0) angle += 2 * Math.PI
    if (angle > 2 * Math.PI - 1e-9) angle = 0
    return { id: l.id, angle, radius: Math.hypot(x, y) }
  })
  // Angles within 1e-9 rad of their neighbour, in a chain, are one angle: "within the noise of each
  // other" pair by pair is no order (0, 0.5e-9 and 1.0000000000000002e-9 would sort differently by
  // the order they came in; a case fast-check found).
  const byAngle = [...keyed].sort((a, b) => a.angle - b.angle)
  const rank = new Map<string, number>()
  byAngle.forEach((k, i) => rank.set(k.id, i > 0 && k.angle - byAngle[i - 1]!.angle <= 1e-9 ? rank.get(byAngle[i - 1]!.id)! : i))
  keyed.sort((a, b) => rank.get(a.id)! - rank.get(b.id)! || a.radius - b.radius || (a.id < b.id ? -1 : 1))
  return keyed.map((k) => k.id)
}

/** Around the whole ring, the neighbouring pairs of layer `position` that share a fabric. */
function matchesAroundRing(order: readonly (readonly string[])[], position: number, repeats: number, mirror: boolean): number {
  const repeat0 = order.filter((layers) => layers.length > position).map((layers) => layers[position]!)
  const ring = Array.from({ length: repeats }, (_, r) => (mirror && r % 2 === 1 ? [...repeat0].reverse() : repeat0)).flat()
  return ring.filter((fabric, i) => fabric === ring[(i + 1) % ring.length]).length
}

describe('spreadLeafFabrics: properties', () => {
  it('counts per layer position differ by at most one, and neighbours differ whenever a proper colouring exists', () => {
    fc.assert(
      fc.property(arbitraryInput, ({ repeats, input, uniformDepth }) => {
        const fabrics = [...new Set(input.leaves.flatMap((l) => l.layers))]
        const k = fabrics.length
        const spread = spreadLeafFabrics(input)
        expect(spread.leaves.map((l) => l.id)).toEqual(expectedOrder(input))
        if (k < 2) {
          expect(spread.notes.map((n) => n.code)).toEqual(['one-fabric'])
          return
        }
        const byId = new Map(input.leaves.map((l) => [l.id, l]))
        const mirror = input.ring.repeatMode === 'mirror'
        for (const l of spread.leaves) {
          // Same stack height, and only fabrics already on the leaves.
          expect(l.layers).toHaveLength(byId.get(l.id)!.layers.length)
          for (const fabric of l.layers) expect(fabrics).toContain(fabric)
        }
        const deepest = Math.max(...input.leaves.map((l) => l.layers.length))
        const stacks = spread.leaves.map((l) => l.layers)
        for (let position = 0; position < deepest; position += 1) {
          const used = stacks.filter((s) => s.length > position).map((s) => s[position]!)
          const counts = fabrics.map((fabric) => used.filter((f) => f === fabric).length)
          expect(Math.max(...counts) - Math.min(...counts)).toBeLessThanOrEqual(1)
          // m leaves per repeat at this position. Rotate mode: the ring repeats a cycle of m, which
          // k fabrics colour properly iff m ≥ 2 and (k ≥ 3 or m even) (χ(C_m) is 2 for even m, 3
          // for odd m: standard graph theory, from memory); otherwise one match per repeat is the
          // fewest a repeating colouring allows. Mirror mode: the leaf at each repeat edge meets
          // its own mirror image (N matches), and nothing else may match.
          const m = used.length
          const properExists = !mirror && m >= 2 && (k >= 3 || m % 2 === 0)
          expect(matchesAroundRing(stacks, position, repeats, mirror)).toBe(properExists ? 0 : repeats)
        }
        // Leaves of one stack height with no more layers than fabrics: every stack differs within.
        if (uniformDepth > 0 && uniformDepth <= k) for (const s of stacks) expect(new Set(s).size).toBe(s.length)
      }),
      { numRuns: 400 },
    )
  })

  it('orders leaves whose angles lie within the noise of each other alike in any listing (a case fast-check found)', () => {
    // Three leaves about 0.5e-9 rad apart: l0 and l1 within the noise, l1 and l2 within it, l0 and
    // l2 just beyond it. "Equal within the noise" is then no order; ranks of the angles are.
    const input: Parameters<typeof spreadLeafFabrics>[0] = {
      ring: { repeatMode: 'rotate' },
      seams: [{ id: 's0', from: [0.5, 5.000000000000001e-10], to: [0.5, 0] }, { id: 's2', from: [0.5, 0], to: [0.5, 0] }],
      leaves: [
        { id: 'l0', seam: 's0', at: 0, side: 'left', layers: ['a'] },
        { id: 'l1', seam: 's0', at: 0.5, side: 'left', layers: ['a'] },
        { id: 'l2', seam: 's2', at: 0, side: 'left', layers: ['a'] },
      ],
    }
    const orders = [[0, 1, 2], [0, 2, 1], [1, 0, 2], [1, 2, 0], [2, 0, 1], [2, 1, 0]].map((permutation) =>
      spreadLeafFabrics({ ...input, leaves: permutation.map((index) => input.leaves[index]!) }).leaves.map((leaf) => leaf.id))
    for (const order of orders) expect(order).toEqual(orders[0])
  })

  it('is held to a reference that ranks a chain of angles within the noise as one angle (a case fast-check found)', () => {
    // 0, 0.5e-9 and 1.0000000000000002e-9 rad: the first and last are just beyond the noise of
    // each other, each within it of the middle one. One angle, so the leaves go outward, then by id.
    const input: Input = {
      ring: { repeatMode: 'rotate' },
      seams: [
        { id: 's0', from: [0.5000000000000001, 0], to: [0.5, 0] },
        { id: 's1', from: [0.5, 5.000000000000001e-10], to: [0.5, 0] },
        { id: 's3', from: [0.5, 0], to: [0.5, 0] },
      ],
      leaves: [
        { id: 'l0', seam: 's0', at: 0, side: 'left', layers: ['a'] },
        { id: 'l1', seam: 's1', at: 0, side: 'left', layers: ['a'] },
        { id: 'l2', seam: 's1', at: 0.5, side: 'left', layers: ['a'] },
        { id: 'l3', seam: 's3', at: 0, side: 'left', layers: ['a'] },
      ],
    }
    expect(expectedOrder(input)).toEqual(['l1', 'l2', 'l3', 'l0'])
    expect(spreadLeafFabrics(input).leaves.map((leaf) => leaf.id)).toEqual(expectedOrder(input))
  })

  it('is deterministic, does not change its input, and does not depend on the order leaves are listed in', () => {
    fc.assert(
      fc.property(arbitraryInput, fc.integer({ min: 0, max: 11 }), ({ input }, shift) => {
        const before = structuredClone(input)
        const spread = spreadLeafFabrics(input)
        expect(input).toEqual(before)
        expect(spreadLeafFabrics(input)).toEqual(spread)
        const s = shift % input.leaves.length
        const relisted = { ...input, leaves: [...input.leaves.slice(s), ...input.leaves.slice(0, s)].reverse() }
        expect(spreadLeafFabrics(relisted).leaves).toEqual(spread.leaves)
      }),
      { numRuns: 200 },
    )
  })
})
