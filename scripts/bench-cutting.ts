/**
 * `npm run bench`, cutting layouts: for each fabric of the demo patterns (every colourway gives the
 * same pieces, so once per pattern) and for 160-area rings from the generators, the layout's
 * length over its lower bound (the pieces' area over the usable width, or the tallest piece),
 * beside first-fit decreasing height's length (the floor) and the time a whole
 * `fabricRequirements` takes. Figures, not a test: the ratio is read from the output, never asserted.
 */
import { fabricRequirements } from '../geometry/fabric-requirements'
import { gridDesign, peelDesign } from '../geometry/fixtures/generators'
import { planDesign } from '../geometry/plan'
import { firstFitDecreasingHeightInches } from '../geometry/strip-layout'
import type { Design, Fill } from '../geometry/types'
import { parseDesign } from '../lib/schemas/design'
import { DEMO_PATTERNS } from './demo-data'

const RUNS = 11
const WIDTH_OF_FABRIC_INCHES = 40

/** The same design with its areas filled from `roles` in turn (plan order), so pieces spread over several fabrics. */
function filledInTurn(design: Design, roles: readonly string[]): Design {
  const fills: Fill[] = planDesign(design, { suggestions: false }).areas.map((area, index) => ({ at: area.point, fabric: roles[index % roles.length]! }))
  return { ...design, fills }
}

const designs: [string, Design][] = []
for (const pattern of DEMO_PATTERNS) {
  const parsed = parseDesign(pattern.design)
  if (parsed.ok && !designs.some(([name]) => name === parsed.design.name)) designs.push([parsed.design.name, parsed.design])
}
// 40 areas a repeat × 4 repeats = 160 areas in the ring.
const peel = peelDesign(40, 2024).design
const grid = gridDesign(5, 8, 12)
designs.push(['160-area peel ring, one fabric', peel])
designs.push(['160-area peel ring, three fabrics', filledInTurn(peel, ['light', 'medium', 'dark'])])
designs.push(['160-area 5 × 8 grid ring, one fabric', grid])

const rows = ['design                                   fabric              pieces  length in  bound in  ratio  FFDH in']
const ratios: number[] = []
for (const [name, design] of designs) {
  const plan = planDesign(design, { suggestions: false })
  const times: number[] = []
  let result = fabricRequirements(design, plan, design.colorways[0] ?? null, { widthOfFabricIn: WIDTH_OF_FABRIC_INCHES })
  for (let i = 0; i < RUNS; i += 1) {
    const start = performance.now()
    result = fabricRequirements(design, plan, design.colorways[0] ?? null, { widthOfFabricIn: WIDTH_OF_FABRIC_INCHES })
    times.push(performance.now() - start)
  }
  times.sort((a, b) => a - b)
  for (const fabric of result.fabrics) {
    const count = fabric.pieces.reduce((sum, piece) => sum + piece.count, 0)
    const ratio = fabric.lengthIn / fabric.lowerBoundIn
    ratios.push(ratio)
    const floor = firstFitDecreasingHeightInches(fabric.pieces, { widthOfFabricIn: WIDTH_OF_FABRIC_INCHES })
    rows.push(`${name.slice(0, 40).padEnd(40)} ${fabric.fabric.slice(0, 18).padEnd(18)} ${String(count).padStart(7)} ${fabric.lengthIn.toFixed(3).padStart(10)} ${fabric.lowerBoundIn.toFixed(3).padStart(9)} ${ratio.toFixed(3).padStart(6)} ${floor.toFixed(3).padStart(8)}`)
  }
  rows.push(`${''.padEnd(40)} (fabricRequirements median ${times[RUNS >> 1]!.toFixed(1)} ms over ${RUNS} runs, plan excluded)`)
}
console.log(rows.join('\n'))
const mean = ratios.reduce((sum, ratio) => sum + ratio, 0) / ratios.length
console.log(`\nlayout length / lower bound over ${ratios.length} fabrics: mean ${mean.toFixed(3)}, worst ${Math.max(...ratios).toFixed(3)} (${WIDTH_OF_FABRIC_INCHES} in usable width).`)
