/**
 * How many areas a repeat's seams make, counted before the arrangement is built: the planner
 * refuses to plan a repeat of more than MAX_PLAN_AREAS areas (a search over tens of thousands of
 * areas would run for minutes), and building the arrangement of 400 crossing seams, about 40,000
 * areas, already takes seconds.
 */
import { orientation } from './orientation'
import type { Seam } from './types'

/** True when the two seams cross at one point inside both (touching ends and overlaps do not count). */
function crosses(a: Seam, b: Seam): boolean {
  const b1 = orientation(a.from, a.to, b.from)
  const b2 = orientation(a.from, a.to, b.to)
  if (b1 === 0 || b2 === 0 || b1 > 0 === b2 > 0) return false
  const a1 = orientation(b.from, b.to, a.from)
  const a2 = orientation(b.from, b.to, a.to)
  return a1 !== 0 && a2 !== 0 && a1 > 0 !== a2 > 0
}

/**
 * The areas a repeat would have if every seam ran from the outline to the outline: one, plus one
 * per seam, plus one per crossing (Euler's formula for lines cutting a disc; from memory,
 * derivable: a seam crossed k times is cut into k + 1 pieces, each splitting one area in two).
 * Seams that end on other seams or dangle make fewer; this is an upper bound up to snapping.
 * Quadratic in the seams: 80,000 pairs for 400 seams, about a millisecond. Stops counting past
 * `limit`.
 *
 * @example estimatedAreaCount([{ id: 'a', from: [0, 1], to: [2, 1] }, { id: 'b', from: [1, 0], to: [1, 2] }], 100) // 4
 */
export function estimatedAreaCount(seams: readonly Seam[], limit: number): number {
  let count = 1 + seams.length
  for (let i = 0; i < seams.length && count <= limit; i += 1) {
    for (let j = i + 1; j < seams.length; j += 1) if (crosses(seams[i]!, seams[j]!)) count += 1
  }
  return count
}
