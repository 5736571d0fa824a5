/**
 * Sets of areas as bitsets: the searches memoise by set, and a bitset makes the key short and
 * the copies cheap. Sets are never mutated once handed out.
 */

export type AreaSet = Uint32Array

/**
 * The empty set for `count` areas.
 *
 * @example areaCount(emptyAreaSet(40)) // 0
 */
export function emptyAreaSet(count: number): AreaSet {
  return new Uint32Array(Math.max(1, Math.ceil(count / 32)))
}

/**
 * A set holding the given areas.
 *
 * @example hasArea(areaSetOf(40, [3, 35]), 35) // true
 */
export function areaSetOf(count: number, areas: Iterable<number>): AreaSet {
  const set = emptyAreaSet(count)
  for (const area of areas) set[area >>> 5] = (set[area >>> 5] as number) | (1 << (area & 31))
  return set
}

/**
 * Whether the set holds the area.
 *
 * @example hasArea(areaSetOf(8, [2]), 2) // true
 */
export function hasArea(set: AreaSet, area: number): boolean {
  return (((set[area >>> 5] ?? 0) >>> (area & 31)) & 1) === 1
}

/**
 * A copy of `set` without `area`.
 *
 * @example areaMembers(withoutArea(areaSetOf(8, [1, 2]), 1)) // [2]
 */
export function withoutArea(set: AreaSet, area: number): AreaSet {
  const copy = set.slice()
  copy[area >>> 5] = (copy[area >>> 5] as number) & ~(1 << (area & 31))
  return copy
}

/**
 * The members in increasing order.
 *
 * @example areaMembers(areaSetOf(40, [33, 1])) // [1, 33]
 */
export function areaMembers(set: AreaSet): number[] {
  const members: number[] = []
  for (let word = 0; word < set.length; word += 1) {
    let bits = set[word] as number
    while (bits !== 0) {
      const low = bits & -bits
      members.push(word * 32 + 31 - Math.clz32(low))
      bits ^= low
    }
  }
  return members
}

/**
 * How many areas the set holds.
 *
 * @example areaCount(areaSetOf(40, [0, 39])) // 2
 */
export function areaCount(set: AreaSet): number {
  let count = 0
  for (let word = 0; word < set.length; word += 1) {
    let bits = set[word] as number
    while (bits !== 0) {
      bits &= bits - 1
      count += 1
    }
  }
  return count
}

/**
 * A string key for memo tables.
 *
 * @example areaSetKey(areaSetOf(40, [0, 33])) // '1,2'
 */
export function areaSetKey(set: AreaSet): string {
  return set.join(',')
}
