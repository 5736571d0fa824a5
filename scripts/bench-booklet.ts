/**
 * `npx tsx scripts/bench-booklet.ts`: time and peak memory to build the booklet of a 24 in,
 * 4-repeat ring of 40 areas per repeat with leaves, on Letter, in Node. Figures, not a test: the
 * goal (under 2 s and under 300 MB) is read from the output, never asserted.
 */
import { peelDesign } from '../geometry/fixtures/generators'
import type { Design, Leaf } from '../geometry/types'
import { buildBooklet, writeBooklet } from '../lib/booklet/booklet'

const RUNS = 5

function benchDesign(): Design {
  // peelDesign's default ring is a 4-repeat wedge of radius 12 in: a 24 in ring.
  const { design } = peelDesign(40, 7)
  const leaves: Leaf[] = design.seams
    .filter((_, index) => index % 6 === 2)
    .map((seam, index) => ({
      id: `leaf-${index + 1}`, seam: seam.id, at: 0.5, side: index % 2 === 0 ? 'left' : 'right', angle: 0,
      length: 1.25, width: 0.625, layers: ['leaf-dark', 'leaf-light'],
    }))
  return {
    ...design,
    name: 'Bench ring (40 areas per repeat)',
    leaves,
    stems: [{ radius: 10, finishedWidth: 0.375, fabric: 'stem' }],
    berries: [{ at: [7, 7], finishedDiameter: 0.5, fabric: 'berry' }],
    curls: [{ points: [[8, 4], [8.5, 4.6], [8.2, 5.2]] }],
    colorways: [{
      name: 'Bench',
      fabrics: {
        background: { name: 'Background', color: '#f4ecd8' }, 'leaf-dark': { name: 'Leaf dark', color: '#2f5540' },
        'leaf-light': { name: 'Leaf light', color: '#6f9a6a' }, stem: { name: 'Stem', color: '#4a3a2a' }, berry: { name: 'Berry', color: '#a3392b' },
      },
    }],
  }
}

const design = benchDesign()
const options = { paper: 'letter', finishedDiameterInches: 24 } as const
const written = writeBooklet(design, options)
const areas = written.model.labelledAreas.length
const times: number[] = []
let bytes = 0
for (let run = 0; run < RUNS; run += 1) {
  const start = performance.now()
  bytes = buildBooklet(design, options).length
  times.push(performance.now() - start)
}
times.sort((a, b) => a - b)
const peakMegabytes = process.resourceUsage().maxRSS / 1024
process.stdout.write(
  [
    `booklet: ${design.name}, 24 in ring, ${design.ring.repeats} repeats, ${areas} areas per repeat in ${written.model.plan.sections.length} sections, ${design.leaves.length} leaves per repeat, Letter`,
    `pages: ${written.doc.getNumberOfPages()}, PDF size: ${(bytes / 1024).toFixed(0)} KiB`,
    `time: median ${times[RUNS >> 1]!.toFixed(0)} ms, first ${times[0]!.toFixed(0)} ms .. slowest ${times[RUNS - 1]!.toFixed(0)} ms over ${RUNS} runs (goal: under 2000 ms)`,
    `peak memory (process max RSS): ${peakMegabytes.toFixed(0)} MB (goal: under 300 MB)`,
    '',
  ].join('\n'),
)
