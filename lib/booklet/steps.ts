/**
 * Sewing steps: for each section, each area in order with the leaves to baste first, its
 * rough-cut piece and a small diagram of where the piece lies before the flip; then how the
 * sections and the repeats are joined, and the finishing order.
 */
import type { jsPDF } from 'jspdf'
import {
  applyToPolygon, applyTransform, outlineFromPolygon, roughCutBeforeFlip, type JoinTree, type PlanArea, type Polygon,
} from '@/geometry'
import { formatInches } from '@/lib/units'
import { font } from './chrome'
import type { BookletContext } from './context'
import { dashedPen, fitView, rgb, solidPen, toPage, tracePath, tracePolygon } from './draw'
import { BERRY_EXTRA_INCHES, STEM_OVERLAP_INCHES } from './fabric-list'
import { startFlow, WRAP_SLACK_PT } from './flow'
import { fabricColour, leavesInBooklet, sectionAreas, type BookletModel, type FoundationKind } from './model'

/** Side of a step's diagram, points. */
const DIAGRAM_PT = 92

/**
 * The join order of a tree, one sentence per seam, pairs first: [['A','B'],'C'] gives
 * "Join A and B.", "Join AB and C.".
 *
 * @example joinSentences([['A', 'B'], 'C']) // ['Join A and B along their shared seam (now AB).', 'Join AB and C along their shared seam (now ABC).']
 */
export function joinSentences(tree: JoinTree | readonly []): string[] {
  const sentences: string[] = []
  const visit = (node: JoinTree): string => {
    if (typeof node === 'string') return node
    const first = visit(node[0])
    const second = visit(node[1])
    sentences.push(`Join ${first} and ${second} along their shared seam (now ${first}${second}).`)
    return `${first}${second}`
  }
  if (typeof tree === 'string' || tree.length === 2) visit(tree as JoinTree)
  return sentences
}

/** What the maker does for one area, in words. */
function stepText(model: BookletModel, area: PlanArea, previous: PlanArea[]): string[] {
  const fabric = model.fabricOf.get(area.id) ?? ''
  const cut = `${formatInches(area.roughCut.widthIn).replace(' in', '')} × ${formatInches(area.roughCut.heightIn).replace(' in', '')}`
  const lines: string[] = []
  for (const leafId of area.leavesBefore) {
    const leaf = model.design.leaves.find((l) => l.id === leafId)
    const layers = leaf ? leaf.layers.join(', then ') : ''
    lines.push(`First baste leaf ${leafId} (${layers} on top) on its marks, raw edges 1/4 in past the seam line, over ${previous.map((p) => p.label).join(', ') || 'the sewn areas'}.`)
  }
  if (area.sewnAlong === null) {
    lines.push(`${area.label}: ${fabric}. Cut ${cut} in. Lay it wrong side to the unprinted side of the paper, right side out, covering ${area.label} with at least 1/4 in to spare all round; pin or glue it in place.`)
  } else {
    const neighbours = previous.filter((p) => p.label).map((p) => p.label).join(', ')
    lines.push(`${area.label}: ${fabric}. Cut ${cut} in (the first measure runs along the seam). Fold the paper back on the line between ${area.label} and ${neighbours || 'the sewn areas'} and trim the sewn fabric 1/4 in past the fold. Lay the piece right side down on it, edges matching, as the dashed frame shows; sew on the line with a short stitch, flip it over ${area.label} and press.`)
  }
  return lines
}

/** The section seen from the printed side: sewn areas grey, this one in its colour, the piece before the flip dashed. */
function drawStepDiagram(doc: jsPDF, model: BookletModel, kind: FoundationKind, areas: PlanArea[], index: number, left: number, top: number): void {
  const area = areas[index]!
  const printed = (polygon: Polygon): Polygon => applyToPolygon(kind.printedSide, polygon)
  const before = area.sewnAlong ? roughCutBeforeFlip(area.roughCut, area.sewnAlong) : area.roughCut.corners
  const points = [...areas.flatMap((a) => printed(a.polygon)), ...printed(before)]
  const xs = points.map((p) => p[0])
  const ys = points.map((p) => p[1])
  const view = fitView([Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)], { x: left + 3, y: top + 3, width: DIAGRAM_PT - 6, height: DIAGRAM_PT - 6 })
  areas.forEach((other, k) => {
    const path = outlineFromPolygon(printed(other.polygon), model.design.ring)
    if (k < index) doc.setFillColor(225, 225, 225)
    else if (k === index) doc.setFillColor(...rgb(fabricColour(model, model.fabricOf.get(other.id) ?? '')))
    else doc.setFillColor(255, 255, 255)
    solidPen(doc, 0.4, [100, 100, 100])
    tracePath(doc, view, path)
    doc.fillStroke()
  })
  if (area.sewnAlong) {
    solidPen(doc, 1.4)
    doc.line(...toPage(view, applyTransform(kind.printedSide, area.sewnAlong[0])), ...toPage(view, applyTransform(kind.printedSide, area.sewnAlong[1])))
  }
  dashedPen(doc, 0.8, [3, 2], [180, 30, 30])
  tracePolygon(doc, view, printed(before))
  doc.stroke()
  doc.setLineDashPattern([], 0)
  font(doc, 6, 'bold', 20)
  const at = toPage(view, applyTransform(kind.printedSide, area.point))
  doc.text(area.label ?? '', at[0], at[1] + 2, { align: 'center' })
}

/**
 * Writes the sewing steps, the join order and the finishing order.
 *
 * @example writeSteps(context)
 */
export function writeSteps(context: BookletContext): void {
  const { doc, model } = context
  const flow = startFlow(context, 'Sewing steps', 'Diagrams show the printed side; the red dashed frame is where the rough-cut piece lies before it is flipped.')
  flow.heading('Before you start')
  if (model.design.ring.repeatMode === 'mirror') {
    flow.paragraph('The mirrored repeats have their own foundations, printed the other way round; sew them in the same order, area by area. The diagrams show the plain repeats.', { style: 'italic' })
  }
  flow.paragraph('Set a short stitch (about 1.5 mm, 16 to 18 stitches per inch) so the paper tears away cleanly. Sew on the printed lines with the fabric on the unprinted side; fabric pieces are right side down until they are flipped. Press after each seam.')
  const kind = model.foundations[0]
  for (const section of model.plan.sections) {
    if (!kind) break
    const areas = sectionAreas(model, section.label)
    const kindsOfSection = model.foundations.filter((k) => k.section === section.label)
    flow.heading(`Section ${section.label}`)
    flow.paragraph(`Make ${kindsOfSection.map((k) => `${k.count} for ${k.repeatName}`).join(' and ')}. Areas in order: ${areas.map((a) => a.label).join(', ')}.`, { size: 8.5, grey: 40 })
    const sectionKind = kindsOfSection[0] ?? kind
    areas.forEach((area, index) => {
      const lines = stepText(model, area, areas.slice(0, index))
      font(doc, 8.5)
      const wrapped = lines.flatMap((line) => doc.splitTextToSize(line, flow.width - DIAGRAM_PT - 12 - WRAP_SLACK_PT) as string[])
      const height = Math.max(DIAGRAM_PT, wrapped.length * 11) + 6
      flow.ensure(height)
      drawStepDiagram(doc, model, sectionKind, areas, index, flow.left, flow.y)
      font(doc, 8.5)
      doc.text(wrapped, flow.left + DIAGRAM_PT + 12, flow.y + 10)
      flow.y += height
    })
    flow.paragraph(`When ${section.label} is sewn, press it and trim along the dashed trim line, through paper and fabric.`, { style: 'italic' })
  }
  flow.heading('Joining the sections')
  const joins = joinSentences(model.plan.assembly)
  if (joins.length === 0) flow.paragraph('Each repeat is one section: nothing to join.')
  joins.forEach((sentence, index) => flow.paragraph(`${index + 1}. ${sentence} Pin at the seam ends, sew on the line, press the seam open.`))
  const inJoins = leavesInBooklet(model).filter((entry) => entry.basteBefore === null && entry.section !== null)
  if (inJoins.length > 0) {
    flow.paragraph('Leaves caught in a section join: before sewing that join, baste each on its marks at the edge of its section, raw edges 1/4 in past the seam line:', { style: 'bold', size: 8.5 })
    for (const { leaf, section } of inJoins) flow.paragraph(`- leaf ${leaf.id} on section ${section}: ${leaf.layers.join(', then ')}${leaf.layers.length > 1 ? ' on top' : ''}.`, { indent: 10, size: 8.5 })
  }
  flow.heading('Joining the repeats')
  flow.paragraph(model.plan.ringAssembly.message)
  if (model.design.ring.repeatMode === 'mirror') flow.paragraph('Alternate the repeats: each mirrored repeat sits between two plain ones.')
  writeFinishing(context, flow)
}

function writeFinishing(context: BookletContext, flow: ReturnType<typeof startFlow>): void {
  const { design } = context.model
  flow.heading('Finishing, in this order')
  const steps: string[] = ['Press the joined ring and tear away the foundation papers, starting from the outside seams.']
  for (const stem of design.stems) {
    steps.push(`Stem ring (once the repeats are joined): cut bias strips ${formatInches(2 * stem.finishedWidth + 0.5)} wide, about ${formatInches(Math.ceil(2 * Math.PI * stem.radius + STEM_OVERLAP_INCHES))} long in all; fold in half wrong sides together, lay the raw edges on the marked circle of radius ${formatInches(stem.radius)} (see the placement guide), sew 1/4 in from them, fold the strip over the seam and stitch its folded edge down by hand.`)
  }
  if (design.curls.length > 0) steps.push('Curling stems: trace them from the placement guide, then embroider them in outline stitch with 2 or 3 strands of floss.')
  steps.push('Layer the top with batting and backing and quilt it.')
  for (const berry of design.berries.slice(0, 1)) {
    steps.push(`Berries: cut circles ${formatInches(2 * berry.finishedDiameter + BERRY_EXTRA_INCHES)} across (see the templates), run a gathering stitch near the edge, stuff lightly, draw up and stitch each at its mark on the placement guide.`)
  }
  steps.push('Bind the curved edge with bias binding.')
  steps.forEach((step, index) => flow.paragraph(`${index + 1}. ${step}`))
}
