/**
 * `npm run bench` (repairs): time to suggestions for unsewable designs of about 10, 20 and 40
 * areas: peel designs (one section by construction) whose last region gets a Y junction, so no
 * number of sections sews them (geometry/fixtures/generators.ts, `yJunctionDesign`). Each size
 * runs eight seeds; the figures are the median and 95th percentile over every timed run of
 * every seed, next to one plan of the same design without the search. Figures, not a test: the
 * goal (under 100 ms median at 40 areas on the 2-core development machine) is read, never
 * asserted.
 */
import { yJunctionDesign } from '../geometry/fixtures/generators'
import { planDesign } from '../geometry/plan'
import { suggestRepairs } from '../geometry/repairs'
import type { Design } from '../geometry/types'

const SEEDS = [1, 2, 3, 4, 5, 6, 7, 8]
/** Untimed runs of each design first, so the JIT has compiled the planner (the board is warm too). */
const WARM_UP_RUNS = 10
const RUNS = 21

function percentile(sorted: readonly number[], fraction: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor(fraction * sorted.length))] as number
}

function timed(task: () => unknown): number {
  const start = performance.now()
  task()
  return performance.now() - start
}

console.log('Repairs: time to suggestions for unsewable designs (a Y in a peel design), 8 seeds each')
console.log('areas  median ms  p95 ms  plan ms  suggestions (first: sections)  stopped')
for (const size of [10, 20, 40]) {
  const designs: Design[] = SEEDS.map((seed) => yJunctionDesign(size - 2, seed)).filter((design) => !planDesign(design, { suggestions: false }).sewable)
  const search: number[] = []
  const plain: number[] = []
  let stopped = 0
  const firstSections: number[] = []
  let count = 0
  for (const design of designs) {
    for (let i = 0; i < WARM_UP_RUNS; i += 1) suggestRepairs(design)
    for (let i = 0; i < RUNS; i += 1) {
      search.push(timed(() => suggestRepairs(design)))
      plain.push(timed(() => planDesign(design, { suggestions: false })))
    }
    const result = suggestRepairs(design)
    if (result.stopped) stopped += 1
    count += result.suggestions.length
    firstSections.push(result.suggestions[0]?.sections ?? 0)
  }
  search.sort((a, b) => a - b)
  plain.sort((a, b) => a - b)
  const areas = Math.round(designs.reduce((sum, design) => sum + planDesign(design, { suggestions: false }).areas.length, 0) / designs.length)
  console.log(
    `${String(areas).padStart(5)}  ${percentile(search, 0.5).toFixed(1).padStart(9)}  ${percentile(search, 0.95).toFixed(1).padStart(6)}  ${percentile(plain, 0.5).toFixed(2).padStart(7)}  ${`${count} (${firstSections.join(' ')})`.padEnd(29)}  ${stopped}/${designs.length}`,
  )
}
