/**
 * Sewing steps: the leaves to make first; for each section, each area in order with the leaves
 * to baste before it, its rough-cut piece and a small diagram of where the piece lies before the flip; then how the
 * sections and the repeats are joined, and the finishing order.
 */
import type { jsPDF } from 'jspdf'
import {
  applyToPolygon, applyTransform, berryCutDiameterInches, outlineFromPolygon, roughCutBeforeFlip, type JoinTree, type PlanArea, type Point, type Polygon, type Segment,
} from '@/geometry'
import { formatInches } from '@/lib/units'
import { font } from './chrome'
import type { BookletContext } from './context'
import { dashedPen, fitView, rgb, solidPen, toPage, tracePath, tracePolygon } from './draw'
import { startFlow, WRAP_SLACK_PT } from './flow'
import { bindingPlan, stemSewing, stemStrip } from './finishing'
import { layersInWords, leafBatches, leafName, leafPlace, PIECES_PER_FOLDED_LEAF } from './leaves'
import { fabricColour, fabricName, leavesInBooklet, sectionAreas, type BookletModel, type FoundationKind, type LeafInBooklet } from './model'

/** A corner of an area this close to a seam's line lies on it, inches. */
const SEAM_LINE_INCHES = 0.01

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

/**
 * True when an earlier area has an edge along the line an area is sewn on, overlapping that
 * segment for more than a point: the areas the fold-back line runs between, and no others.
 */
function sharesLine(earlier: PlanArea, sewnAlong: Segment): boolean {
  const [from, to] = sewnAlong
  const length = Math.hypot(to[0] - from[0], to[1] - from[1])
  if (!(length > 0)) return false
  const along: Point = [(to[0] - from[0]) / length, (to[1] - from[1]) / length]
  const offLine = (p: Point) => Math.abs((p[0] - from[0]) * along[1] - (p[1] - from[1]) * along[0])
  const position = (p: Point) => (p[0] - from[0]) * along[0] + (p[1] - from[1]) * along[1]
  const corners = earlier.polygon
  return corners.some((a, index) => {
    const b = corners[(index + 1) % corners.length]!
    if (offLine(a) >= SEAM_LINE_INCHES || offLine(b) >= SEAM_LINE_INCHES) return false
    const low = Math.max(0, Math.min(position(a), position(b)))
    const high = Math.min(length, Math.max(position(a), position(b)))
    return high - low > SEAM_LINE_INCHES
  })
}

/** What the maker does for one area, in words. */
function stepText(model: BookletModel, area: PlanArea, previous: PlanArea[]): string[] {
  const fabric = fabricName(model, model.fabricOf.get(area.id) ?? '')
  const cut = `${formatInches(area.roughCut.widthIn).replace(' in', '')} × ${formatInches(area.roughCut.heightIn).replace(' in', '')}`
  if (area.sewnAlong === null) {
    return [`${area.label}: ${fabric}. Cut ${cut} in. Lay it wrong side to the unprinted side of the paper, right side out, covering ${area.label} with at least 1/4 in to spare all round; pin or glue it in place.`]
  }
  // Held in a constant: the null check above does not reach into the callback.
  const sewnAlong = area.sewnAlong
  const neighbours = previous.filter((p) => p.label && sharesLine(p, sewnAlong)).map((p) => p.label).join(', ')
  const lines = [`${area.label}: ${fabric}. Cut ${cut} in (the first measure runs along the seam). Fold the paper back on the line between ${area.label} and ${neighbours || 'the sewn areas'} and trim the sewn fabric 1/4 in past the fold.`]
  const leaves = leavesInBooklet(model).filter((entry) => entry.catcher?.id === area.id)
  for (const entry of leaves) lines.push(`Then baste ${leafBastingWords(model, entry, area.sewnAlong)}`)
  lines.push(`Lay the ${area.label} piece right side down on the fabric side${leaves.length > 0 ? ' over the leaves' : ''}, edges matching the trimmed edge, as the dashed frame shows; sew on the line with a short stitch, flip it over ${area.label} and press.`)
  return lines
}

/**
 * How to baste one leaf on its line, after that seam's fold-back-and-trim: where it lies, its
 * layers, and the basting from the printed side that holds it and shows its place.
 */
function leafBastingWords(model: BookletModel, entry: LeafInBooklet, line: Segment): string {
  const place = leafPlace(model, entry.leaf, line, entry.over, entry.catcher)
  return `${place.name} (${layersInWords(model, entry.leaf)}): unfold the paper and lay the leaf on the fabric side ${place.words}, its raw edges on the trimmed edge (1/4 in past the line). From the printed side, baste on the line through it with long stitches, so it stays put and its place shows on the fabric side.`
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
  writeLeafPreparation(model, flow)
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
    flow.paragraph('Leaves caught in a section join: once the section is trimmed, before sewing that join, baste each on its marks, raw edges on the trimmed edge (1/4 in past the seam line):', { style: 'bold', size: 8.5 })
    for (const entry of inJoins) {
      const seam = model.design.seams.find((s) => s.id === entry.leaf.seam)
      const line = seam ? joinLine(entry, seam.from, seam.to) : null
      const place = line ? leafPlace(model, entry.leaf, line, entry.over, null) : null
      flow.paragraph(`- ${leafName(model, entry.leaf.id)} on section ${entry.section} (${layersInWords(model, entry.leaf)}): ${place ? `lay it on the fabric side ${place.words}; from the printed side, baste on the line through it.` : 'baste it on its marks.'}`, { indent: 10, size: 8.5 })
    }
  }
  flow.heading('Joining the repeats')
  flow.paragraph(model.plan.ringAssembly.message)
  if (model.design.ring.repeatMode === 'mirror') flow.paragraph('Alternate the repeats: each mirrored repeat sits between two plain ones.')
  writeFinishing(context, flow)
}

/** The part of a seam line that bounds the area a join-caught leaf lies over: the area's edge along the seam. */
function joinLine(entry: LeafInBooklet, from: Point, to: Point): Segment {
  const over = entry.over
  if (!over) return [from, to]
  const direction: Point = [to[0] - from[0], to[1] - from[1]]
  const length = Math.hypot(direction[0], direction[1]) || 1
  // The area's corners on the seam line (within a hair of it), as the stretch of line it owns.
  const onLine = over.polygon.filter((p) => Math.abs((p[0] - from[0]) * direction[1] - (p[1] - from[1]) * direction[0]) / length < SEAM_LINE_INCHES)
  if (onLine.length < 2) return [from, to]
  const t = (p: Point): number => ((p[0] - from[0]) * direction[0] + (p[1] - from[1]) * direction[1]) / length
  const sorted = [...onLine].sort((a, b) => t(a) - t(b))
  return [sorted[0]!, sorted[sorted.length - 1]!]
}

/**
 * "Prepare the leaves": how many folded leaves of each fabric the whole ring needs, how each is
 * made from two pieces cut with its template, and that they are all made before sewing starts.
 */
function writeLeafPreparation(model: BookletModel, flow: ReturnType<typeof startFlow>): void {
  const batches = leafBatches(model)
  if (batches.length === 0) return
  const { design } = model
  const perRepeat = design.leaves.reduce((sum, leaf) => sum + leaf.layers.length, 0)
  flow.heading('Prepare the leaves')
  flow.paragraph(`Make every folded leaf before you sew the foundations, one fabric at a time (batch them: cut all, sew all, turn and press all). The ring needs ${perRepeat * design.ring.repeats} folded leaves: ${perRepeat} per repeat × ${design.ring.repeats} repeats (each layer of a stacked leaf is a folded leaf of its own).`)
  for (const batch of batches) {
    flow.paragraph(`- ${fabricName(model, batch.fabric)}: ${batch.folded} folded leaves ${formatInches(batch.lengthIn).replace(' in', '')} × ${formatInches(batch.widthIn)}, from ${batch.pieces} pieces.`, { indent: 10 })
  }
  flow.paragraph(`Each folded leaf is made of ${PIECES_PER_FOLDED_LEAF} pieces cut from its leaf template (see the templates): lay two pieces of its fabric, a little larger than the template, right sides together; trace the template's solid sew line on the top one and sew on it, leaving the open end open; cut both on the dashed cut line; clip across the tip, turn right side out through the open end, push out the point and press flat.`)
}

function writeFinishing(context: BookletContext, flow: ReturnType<typeof startFlow>): void {
  const { design } = context.model
  flow.heading('Finishing, in this order')
  const steps: string[] = ['Press the joined ring and tear away the foundation papers, starting from the outside seams.']
  for (const stem of design.stems) {
    const sewing = stemSewing(stem)
    const trim = sewing.trimAllowance ? ` Trim the seam allowance to less than ${formatInches(stem.finishedWidth)} first, so the strip hides it.` : ''
    steps.push(`Stem ring (once the repeats are joined): cut bias strips ${formatInches(sewing.cutWidthIn)} wide, about ${formatInches(stemStrip(stem).lengthIn)} long in all, join them into one and fold it in half lengthwise, wrong sides together (${formatInches(sewing.foldedWidthIn)} wide). Trace the stem's two solid circles from the placement guide. Lay the strip on the centre side of the inner traced circle, its raw edges toward the outer edge and 1/4 in beyond that circle, and sew 1/4 in from the raw edges, so the stitching runs on the inner traced circle. Press the strip over the seam toward the outer edge: it covers the raw edges and its fold lies on the outer traced circle, ${formatInches(stem.finishedWidth)} from the stitching.${trim} Stitch the fold down by hand.`)
  }
  if (design.curls.length > 0) steps.push('Curling stems: trace them from the placement guide, then embroider them in outline stitch with 2 or 3 strands of floss.')
  steps.push('Layer the top with batting and backing and quilt it.')
  for (const berry of design.berries.slice(0, 1)) {
    steps.push(`Berries: cut circles ${formatInches(berryCutDiameterInches(berry.finishedDiameter))} across (see the templates), run a gathering stitch near the edge, stuff lightly, draw up and stitch each at its mark on the placement guide.`)
  }
  const binding = bindingPlan(design)
  const edges = binding.edges.map((edge) => `${edge.stripLengthIn} in for the ${edge.edge} edge`).join(' and ')
  steps.push(`Bind the ${binding.edges.length > 1 ? 'outer and inner curved edges' : 'curved edge'} with double-fold bias binding cut ${formatInches(binding.cutWidthIn)} wide from ${fabricName(context.model, binding.fabric)} (${edges}, see the cutting list); join each strip's ends on its own edge.`)
  steps.forEach((step, index) => flow.paragraph(`${index + 1}. ${step}`))
}
