/**
 * Spreading the leaf fabrics around the ring: the fabrics already on the leaves are dealt out so
 * that neighbouring leaves differ and every fabric is used as evenly as the count allows.
 *
 * The design stores repeat 0's leaves only; every other repeat is a copy (turned, or in mirror
 * mode every second one mirrored), so a leaf's fabrics repeat N times. Around the ring, repeat
 * 0's leaves follow one another counter-clockwise (by the polar angle of their open end, then
 * outward); the last one meets the first leaf of the next repeat, which in rotate mode is a copy
 * of repeat 0's first leaf, and in mirror mode the mirror image of repeat 0's last leaf. So in
 * rotate mode the leaves of one repeat form a cycle, and in mirror mode a path whose two end
 * leaves always meet their own mirror images. Even counts are per repeat: N repeats multiply
 * every count by N.
 *
 * Stacked layers are spread position by position (every bottom layer, then every second layer …),
 * each over the leaves that have that layer, and a leaf's layers are kept different from each
 * other where there are enough fabrics. A plan, not an effect: the caller applies it.
 */
import { angleRanks, leafBaseOnSeam } from './leaf-names'
import { ANGLE_NOISE_RADIANS } from './tolerances'
import type { Leaf, Ring, Seam } from './types'

/** Why a spread is less than perfect, in plain words for the designer. */
export interface LeafSpreadNote {
  readonly code: 'no-leaves' | 'one-fabric' | 'cannot-alternate' | 'mirror-edges' | 'stack-repeats'
  readonly message: string
}

export interface LeafSpread {
  /** Repeat 0's leaves in ring order, each with its new layers (bottom first). */
  readonly leaves: readonly { readonly id: string; readonly layers: readonly string[] }[]
  /** The fabrics dealt out: those on the leaves, in the order the ring first uses them. */
  readonly fabrics: readonly string[]
  readonly notes: readonly LeafSpreadNote[]
}

type SpreadInput = {
  readonly ring: Pick<Ring, 'repeatMode'>
  readonly leaves: readonly Pick<Leaf, 'id' | 'seam' | 'at' | 'side' | 'layers'>[]
  readonly seams: readonly Pick<Seam, 'id' | 'from' | 'to'>[]
}

interface Placed {
  readonly id: string
  readonly layers: readonly string[]
  readonly angle: number
  readonly radius: number
}

/**
 * Repeat 0's leaves counter-clockwise round the centre, then outward, then by id (two leaves at
 * one place). Leaves on a missing seam are left out: they are not on the ring.
 */
function ringOrder(input: SpreadInput): Placed[] {
  const placed: Placed[] = []
  for (const leaf of input.leaves) {
    const seam = input.seams.find((s) => s.id === leaf.seam)
    if (!seam) continue
    const { base } = leafBaseOnSeam(leaf, seam)
    let angle = Math.atan2(base[1], base[0])
    if (angle < 0) angle += 2 * Math.PI
    // A leaf on repeat 0's first radial edge may come out a hair under 360°.
    if (angle >= 2 * Math.PI - ANGLE_NOISE_RADIANS) angle = 0
    placed.push({ id: leaf.id, layers: leaf.layers, angle, radius: Math.hypot(base[0], base[1]) })
  }
  // Angles within the noise are one angle (angleRanks, as in leaf-names.ts): leaves on one ray go outward.
  const ranks = angleRanks(placed.map((leaf) => leaf.angle))
  const ranked = placed.map((leaf, index) => ({ leaf, rank: ranks[index]! }))
  ranked.sort((a, b) => a.rank - b.rank || a.leaf.radius - b.leaf.radius || (a.leaf.id < b.leaf.id ? -1 : a.leaf.id > b.leaf.id ? 1 : 0))
  return ranked.map(({ leaf }) => leaf)
}

/**
 * Fabric numbers 0 … k−1 dealt in turn to `count` leaves, so counts differ by at most one and
 * neighbours differ. On a cycle, when count ≡ 1 (mod k) the last leaf would get fabric 0 beside
 * the first: with k ≥ 3 the last two trade places (same counts, every neighbour differs).
 *
 * @example alternation(4, 3, true) // [0, 1, 0, 2]
 */
export function alternation(count: number, fabricCount: number, closed: boolean): number[] {
  const pattern = Array.from({ length: count }, (_, index) => index % fabricCount)
  if (closed && fabricCount >= 3 && count > fabricCount && count % fabricCount === 1) {
    pattern[count - 2] = 0
    pattern[count - 1] = fabricCount - 1
  }
  return pattern
}

/** Neighbouring pairs of one repeat that share a fabric (a cycle closes when it has 3 or more leaves). */
function matchingNeighbours(pattern: readonly number[], closed: boolean): number {
  let matches = 0
  for (let i = 0; i + 1 < pattern.length; i += 1) if (pattern[i] === pattern[i + 1]) matches += 1
  if (closed && pattern.length >= 3 && pattern[0] === pattern[pattern.length - 1]) matches += 1
  return matches
}

const LAYER_WORDS = ['Bottom layers', 'Second layers', 'Third layers', 'Fourth layers', 'Fifth layers']
const layerWords = (position: number) => LAYER_WORDS[position] ?? `Layers ${position + 1}`

/**
 * The leaves' fabrics spread around the ring (see the file comment), with notes where a perfect
 * spread is impossible. Deterministic, and the same whatever order the leaves are listed in.
 *
 * @example spreadLeafFabrics(design).leaves // [{ id: 'l1', layers: ['leaf-dark'] }, { id: 'l2', layers: ['leaf-light'] }, …]
 */
export function spreadLeafFabrics(input: SpreadInput): LeafSpread {
  const ordered = ringOrder(input)
  const fabrics = [...new Set(ordered.flatMap((leaf) => leaf.layers))]
  const unchanged = ordered.map((leaf) => ({ id: leaf.id, layers: [...leaf.layers] }))
  if (ordered.length === 0) return { leaves: [], fabrics, notes: [{ code: 'no-leaves', message: 'There are no leaves to spread.' }] }
  if (fabrics.length < 2) {
    return {
      leaves: unchanged,
      fabrics,
      notes: [{ code: 'one-fabric', message: 'Every leaf is one fabric: give one leaf another fabric in the inspector, then spread.' }],
    }
  }

  const k = fabrics.length
  const closed = input.ring.repeatMode === 'rotate'
  const stacked = ordered.some((leaf) => leaf.layers.length > 1)
  const deepest = Math.max(...ordered.map((leaf) => leaf.layers.length))
  // Fabric numbers per leaf, filled one layer position at a time.
  const numbers: number[][] = ordered.map(() => [])
  const notes: LeafSpreadNote[] = []

  for (let position = 0; position < deepest; position += 1) {
    const members = ordered.flatMap((leaf, index) => (leaf.layers.length > position ? [index] : []))
    const base = alternation(members.length, k, closed)
    const clashes = (pattern: readonly number[], j: number) => numbers[members[j]!]!.includes(pattern[j]!)
    const clashCount = (pattern: readonly number[]) => pattern.filter((_, j) => clashes(pattern, j)).length
    // Turning the fabric numbers keeps the counts and the neighbours; the turn by `position`
    // gives a leaf whose layers all sit on equal stacks a different fabric per layer.
    let pattern = base
    for (let turn = 0; turn < k; turn += 1) {
      const candidate = base.map((n) => (n + position + turn) % k)
      if (turn === 0 || clashCount(candidate) < clashCount(pattern)) pattern = candidate
    }
    // Leaves whose stacks differ in height may still clash: trade with another leaf of this
    // position (counts stay) when that leaves no more matching neighbours than before.
    for (let j = 0; j < members.length; j += 1) {
      if (!clashes(pattern, j)) continue
      const before = matchingNeighbours(pattern, closed)
      for (let other = 0; other < members.length; other += 1) {
        if (pattern[other] === pattern[j]) continue
        const traded = [...pattern]
        traded[j] = pattern[other]!
        traded[other] = pattern[j]!
        if (clashes(traded, j) || clashes(traded, other) || matchingNeighbours(traded, closed) > before) continue
        pattern = traded
        break
      }
    }
    members.forEach((index, j) => numbers[index]!.push(pattern[j]!))

    const prefix = stacked ? `${layerWords(position)}: ` : ''
    if (closed && members.length === 1) {
      notes.push({ code: 'cannot-alternate', message: `${prefix}with one leaf in each repeat, every leaf sits beside a copy of itself, so neighbours match.` })
    } else if (closed && k === 2 && members.length % 2 === 1) {
      notes.push({
        code: 'cannot-alternate',
        message: `${prefix}${members.length} leaves in each repeat cannot alternate two fabrics all round the ring, so one pair of neighbours in each repeat matches. A third fabric, or one leaf more or fewer, would alternate.`,
      })
    }
  }

  if (!closed) {
    notes.push({ code: 'mirror-edges', message: 'In mirror mode the leaf nearest each edge of a repeat meets its own mirror image, so those neighbours always match.' })
  }
  const repeating = numbers.filter((stack) => new Set(stack).size < stack.length).length
  if (repeating > 0) {
    notes.push({
      code: 'stack-repeats',
      message: deepest > k
        ? `Some leaves have more layers than there are leaf fabrics (${k}), so a fabric comes twice in their stack.`
        : `${repeating === 1 ? 'One leaf has' : `${repeating} leaves have`} a fabric twice in the stack; change a layer in the inspector.`,
    })
  }
  return { leaves: ordered.map((leaf, index) => ({ id: leaf.id, layers: numbers[index]!.map((n) => fabrics[n]!) })), fabrics, notes }
}
