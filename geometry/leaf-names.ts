/**
 * Plain names for leaf inserts, one rule for the board and the booklet: "leaf 2 of A3" is the
 * second leaf lying over area A3. A maker never sees a leaf's internal id.
 *
 * Leaves over one area are numbered in the order they are basted (the step of the area sewn over
 * them; leaves caught in a section join come last), then counter-clockwise around the ring's
 * centre, then outward. Every key is a function of the design's shape and its plan, so the names do
 * not change with the order the leaves are listed in, the design's units or its size.
 */
import type { PlanArea } from './plan'
import { isPointInPolygon } from './polygon-measure'
import { ANGLE_NOISE_RADIANS } from './tolerances'
import type { Leaf, Point, Seam } from './types'

/**
 * How far off the seam, inches, the point that finds the area a leaf lies over is taken: well
 * inside any area a leaf can lie over, and well beyond the snapping distance of seam ends.
 */
const OVER_PROBE_INCHES = 0.05

/** Where a leaf's open end sits on its seam, and the unit normal pointing to the side it lies over. */
export function leafBaseOnSeam(leaf: Pick<Leaf, 'at' | 'side'>, seam: Pick<Seam, 'from' | 'to'>): { base: Point; normal: Point } {
  const dx = seam.to[0] - seam.from[0]
  const dy = seam.to[1] - seam.from[1]
  const length = Math.hypot(dx, dy) || 1
  const left: Point = [-dy / length, dx / length]
  return {
    base: [seam.from[0] + leaf.at * dx, seam.from[1] + leaf.at * dy],
    normal: leaf.side === 'left' ? left : [-left[0], -left[1]],
  }
}

/**
 * The labelled area a leaf lies over (the area on its side of the seam at its open end), or null
 * when it lies over none (the plan has no labels, or the seam was dropped).
 *
 * @example areaUnderLeaf(leaf, seam, plan.areas)?.label // 'A2'
 */
export function areaUnderLeaf(leaf: Pick<Leaf, 'at' | 'side'>, seam: Pick<Seam, 'from' | 'to'>, areas: readonly PlanArea[]): PlanArea | null {
  const { base, normal } = leafBaseOnSeam(leaf, seam)
  const probe: Point = [base[0] + OVER_PROBE_INCHES * normal[0], base[1] + OVER_PROBE_INCHES * normal[1]]
  return areas.find((area) => area.label !== null && isPointInPolygon(probe, area.polygon)) ?? null
}

/** Sorting keys of one leaf; see the file comment. */
interface LeafKey {
  readonly id: string
  readonly over: string | null
  readonly basted: [section: string, step: number]
  /** The rank of the leaf's angle round the centre (angleRanks). */
  readonly angleRank: number
  readonly radius: number
}

/**
 * Each angle's rank among the distinct angles, angles within ANGLE_NOISE_RADIANS of their
 * neighbour counting as one (leaves on one ray are then ordered outward, not by rounding noise).
 * Ranks, unlike "equal when within the noise", order transitively, so a sort by them does not
 * depend on the order it is given its items in: three angles 0.6e-9 apart are one rank, not two
 * equal pairs and an unequal one.
 *
 * @example angleRanks([0.3, 0, 0.3 + 1e-12]) // [1, 0, 1]
 */
export function angleRanks(angles: readonly number[]): number[] {
  const order = angles.map((angle, index) => ({ angle, index })).sort((a, b) => a.angle - b.angle)
  const ranks = new Array<number>(angles.length)
  let rank = 0
  order.forEach(({ angle, index }, position) => {
    if (position > 0 && angle - order[position - 1]!.angle > ANGLE_NOISE_RADIANS) rank += 1
    ranks[index] = rank
  })
  return ranks
}

const compareKeys = (a: LeafKey, b: LeafKey): number =>
  a.basted[0].localeCompare(b.basted[0]) || a.basted[1] - b.basted[1] || a.angleRank - b.angleRank || a.radius - b.radius
  // Two leaves at one place: only then does the id decide, so the numbering stays total.
  || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0)

/**
 * The plain name of every leaf of the design, by leaf id: "leaf 1 of A2", or "leaf 1" for leaves
 * over no labelled area (numbered among themselves).
 *
 * @example leafNames(design, plan).get('l7') // 'leaf 2 of A3'
 */
export function leafNames(design: { readonly leaves: readonly Leaf[]; readonly seams: readonly Seam[] }, plan: { readonly areas: readonly PlanArea[] }): ReadonlyMap<string, string> {
  const keys: (Omit<LeafKey, 'angleRank'> & { angle: number })[] = []
  for (const leaf of design.leaves) {
    const seam = design.seams.find((s) => s.id === leaf.seam)
    const over = seam ? areaUnderLeaf(leaf, seam, plan.areas) : null
    const catcher = plan.areas.find((area) => area.leavesBefore.includes(leaf.id) && area.label !== null)
    const base = seam ? leafBaseOnSeam(leaf, seam).base : ([0, 0] as Point)
    let angle = Math.atan2(base[1], base[0])
    if (angle < 0) angle += 2 * Math.PI
    keys.push({
      id: leaf.id,
      over: over?.label ?? null,
      // A leaf caught in a section join is basted after every step of the sections.
      basted: catcher ? [catcher.section ?? '', catcher.step ?? 0] : ['\uffff', 0],
      angle,
      radius: Math.hypot(base[0], base[1]),
    })
  }
  const ranks = angleRanks(keys.map((key) => key.angle))
  const names = new Map<string, string>()
  const groups = new Map<string | null, LeafKey[]>()
  for (const key of keys.map((key, index): LeafKey => ({ ...key, angleRank: ranks[index]! }))) groups.set(key.over, [...(groups.get(key.over) ?? []), key])
  for (const [over, group] of groups) {
    group.sort(compareKeys).forEach((key, index) => names.set(key.id, over === null ? `leaf ${index + 1}` : `leaf ${index + 1} of ${over}`))
  }
  return names
}

/**
 * How the core mentions a leaf in a problem's message while it plans, before the leaf has a name:
 * `planDesign` replaces every mention by the leaf's plain name once the areas are labelled, so a
 * designer reads "leaf 2 of A3", never an id. Encoded so no id can end the mention early.
 *
 * @example leafMention('l1') // '{leaf:l1}'
 */
export const leafMention = (id: string): string => `{leaf:${encodeURIComponent(id)}}`

const MENTION = /\{leaf:([^}]*)\}/g

/**
 * A message with every leaf mention replaced by the leaf's plain name, its first letter capital.
 *
 * @example nameLeavesIn('{leaf:l1} sits on no seam.', new Map([['l1', 'leaf 1 of A2']])) // 'Leaf 1 of A2 sits on no seam.'
 */
export function nameLeavesIn(message: string, names: ReadonlyMap<string, string>): string {
  const named = message.replace(MENTION, (_, id: string) => {
    const leafId = decodeURIComponent(id)
    return names.get(leafId) ?? 'a leaf'
  })
  return named.charAt(0).toUpperCase() + named.slice(1)
}

/**
 * Leaves listed in words: "leaf 1 of A2", "leaf 1 of A2 and leaf 1 of B1", "…, … and …".
 *
 * @example listInWords(['a', 'b', 'c']) // 'a, b and c'
 */
export function listInWords(items: readonly string[]): string {
  return items.length <= 1 ? (items[0] ?? '') : `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`
}
