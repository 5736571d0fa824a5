/**
 * `npm run bench`: how long a full sewing plan takes (areas, order, sections and allowances)
 * for generated designs of 10, 20, 40 and 80 areas, next to the time polygon-clipping alone
 * needs to split the same repeat by the same seams. Figures, not a test: the goals (a 40-area
 * repeat under 10 ms median on a 2-core machine, under 3× polygon-clipping's bare split) are
 * read from the output, never asserted.
 */
import polygonClipping, { type Polygon as ClipPolygon } from 'polygon-clipping'
import { gridDesign, peelDesign } from '../geometry/fixtures/generators'
import { cuttingShape } from '../geometry/offset'
import { planDesign } from '../geometry/plan'
import { repeatOutline } from '../geometry/ring'
import type { Design } from '../geometry/types'

const RUNS = 61
/**
 * Runs of each task before timing starts. The designs come smallest first, so with a handful of
 * warm-up runs the small ones were timed before the JIT had compiled the planner and read 3-5×
 * slower than they run on the board, where the same code plans every frame.
 */
const WARM_UP_RUNS = 200
/** Half-width of the sliver each seam cuts out for polygon-clipping, inches: far below any area. */
const SLIVER_HALF_WIDTH = 1e-4

/**
 * Medians of two tasks timed in alternation, so both see the same load: the development machine
 * is shared, and a ratio of two medians taken minutes apart would mostly measure the neighbours.
 */
function medians(first: () => unknown, second: () => unknown): [number, number] {
  for (let i = 0; i < WARM_UP_RUNS; i += 1) {
    first()
    second()
  }
  const a: number[] = []
  const b: number[] = []
  for (let i = 0; i < RUNS; i += 1) {
    let start = performance.now()
    first()
    a.push(performance.now() - start)
    start = performance.now()
    second()
    b.push(performance.now() - start)
  }
  a.sort((x, y) => x - y)
  b.sort((x, y) => x - y)
  return [a[RUNS >> 1] as number, b[RUNS >> 1] as number]
}

/** The plan itself, without the repair search (timed on its own by scripts/bench-repairs.ts). */
function fullPlan(design: Design): number {
  const plan = planDesign(design, { suggestions: false })
  for (const area of plan.areas) cuttingShape(area.polygon)
  return plan.sections.length
}

/** The bare split: the repeat minus a thin sliver along every seam leaves the areas as pieces. */
function bareSplit(design: Design): number {
  const outline: ClipPolygon = [repeatOutline(design.ring).polygon.map((p) => [p[0], p[1]] as [number, number])]
  const slivers: ClipPolygon[] = design.seams.map(({ from, to }) => {
    const length = Math.hypot(to[0] - from[0], to[1] - from[1])
    const nx = (-(to[1] - from[1]) / length) * SLIVER_HALF_WIDTH
    const ny = ((to[0] - from[0]) / length) * SLIVER_HALF_WIDTH
    return [[[from[0] + nx, from[1] + ny], [to[0] + nx, to[1] + ny], [to[0] - nx, to[1] - ny], [from[0] - nx, from[1] - ny]]]
  })
  return polygonClipping.difference(outline, ...slivers).length
}

const grids: Record<number, [number, number]> = { 10: [2, 5], 20: [4, 5], 40: [5, 8], 80: [8, 10] }
const designs = [10, 20, 40, 80].flatMap((size) => {
  const [m, n] = grids[size] as [number, number]
  return [
    ['one-section peel', peelDesign(size, 2024).design],
    [`${m} x ${n} grid`, gridDesign(m, n, 12)],
  ] as const
})
// Every design once through both tasks first, so no size is timed while the JIT still learns.
for (const [, design] of designs) medians(() => fullPlan(design), () => bareSplit(design))
const rows: string[] = []
rows.push('areas  design        sections  plan ms (median)  polygon-clipping split ms  ratio')
for (const [kind, design] of designs) {
  const sections = fullPlan(design)
  const [plan, split] = medians(() => fullPlan(design), () => bareSplit(design))
  rows.push(
    `${String(planDesign(design, { suggestions: false }).areas.length).padStart(5)}  ${kind.padEnd(16)}  ${String(sections).padStart(5)}  ${plan.toFixed(2).padStart(16)}  ${split.toFixed(2).padStart(25)}  ${(plan / split).toFixed(2).padStart(5)}×`,
  )
}
console.log(rows.join('\n'))
console.log(`\n${RUNS} runs each, plan and split alternating, after ${WARM_UP_RUNS} warm-up runs; goal: 40 areas under 10 ms median, ratio under 3×.`)

// Cutting layouts: length over the lower bound for the demo patterns and 160-area rings.
console.log('')
await import('./bench-cutting')
