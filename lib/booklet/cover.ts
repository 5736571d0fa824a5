/**
 * The cover: the finished ring in the chosen colourway (fabric side, as the quilt will look),
 * its size, and the fabric and cutting list that follows it.
 */
import type { jsPDF } from 'jspdf'
import { applyToPolygon, applyTransform, colorwayFabric, mapSmoothCurve, outlineFromPolygon, repeatTransforms, smoothCurve, tryPlaceLeafLayers, type AffineTransform, type Point } from '@/geometry'
import { formatMetres, formatYards } from '@/lib/fabric/fabric-table'
import { formatInches, formatLength, inchesToCentimetres } from '@/lib/units'
import { font } from './chrome'
import { startPage, type BookletContext } from './context'
import { fitView, rgb, solidPen, toPage, traceCurve, tracePath, tracePolygon, type View } from './draw'
import { bindingLengthInches, cuttingList } from './fabric-list'
import { BINDING_JOIN_INCHES, bindingPlan } from './finishing'
import { bookletRequirements, fabricColour, fabricName, UNASSIGNED_FABRIC, type BookletModel } from './model'
import { PAPERS } from './paper'
import { startFlow, type Flow } from './flow'
import { drawFabricMark } from './swatches'

/**
 * Draws the whole ring, fabric side, into a page box; labels the first repeat's areas.
 *
 * @example drawRingPreview(doc, model, { x: 36, y: 100, width: 400, height: 400 }, true)
 */
export function drawRingPreview(doc: jsPDF, model: BookletModel, into: { x: number; y: number; width: number; height: number }, labels: boolean): View {
  const { design } = model
  const r = design.ring.outerRadius
  const view = fitView([-r, -r, r, r], into)
  const transforms = repeatTransforms(design.ring)
  for (const transform of transforms) {
    for (const area of model.plan.areas) {
      doc.setFillColor(...rgb(fabricColour(model, model.fabricOf.get(area.id) ?? '')))
      solidPen(doc, 0.4, [90, 90, 90])
      tracePath(doc, view, outlineFromPolygon(applyToPolygon(transform, area.polygon), design.ring))
      doc.fillStroke()
    }
  }
  for (const stem of design.stems) {
    // The folded stem as a band of its finished width along its circle.
    doc.setLineDashPattern([], 0)
    doc.setDrawColor(...rgb(fabricColour(model, stem.fabric)))
    doc.setLineWidth(stem.finishedWidth * view.scale)
    const [cx, cy] = toPage(view, [0, 0])
    doc.circle(cx, cy, stem.radius * view.scale, 'S')
  }
  for (const transform of transforms) drawDecorations(doc, model, view, transform)
  if (labels) {
    for (const area of model.labelledAreas) {
      const at = toPage(view, area.point)
      font(doc, 6.5, 'bold', 20)
      doc.text(area.label ?? '', at[0], at[1] + 2, { align: 'center' })
    }
  }
  return view
}

/** Leaves, berries and embroidered curls of one repeat. */
function drawDecorations(doc: jsPDF, model: BookletModel, view: View, transform: AffineTransform): void {
  const { design } = model
  for (const leaf of design.leaves) {
    const seam = design.seams.find((s) => s.id === leaf.seam)
    if (!seam) continue
    // An impossible leaf is reported by the plan; the preview leaves it out.
    const placed = tryPlaceLeafLayers(leaf, seam)
    if (!placed.ok) continue
    // Bottom first, each layer turned and sized by its offset, so the ones beneath show.
    for (const layer of placed.layers) {
      doc.setFillColor(...rgb(fabricColour(model, layer.fabric)))
      solidPen(doc, 0.3, [40, 40, 40])
      tracePolygon(doc, view, applyToPolygon(transform, layer.placement.finishedOutline))
      doc.fillStroke()
    }
  }
  for (const berry of design.berries) {
    const [x, y] = toPage(view, applyTransform(transform, berry.at))
    doc.setFillColor(...rgb(fabricColour(model, berry.fabric)))
    solidPen(doc, 0.3, [40, 40, 40])
    doc.circle(x, y, (berry.finishedDiameter / 2) * view.scale, 'FD')
  }
  for (const curl of design.curls) {
    solidPen(doc, 0.8, [50, 40, 30])
    // The board's curve, moved to this repeat (a Bézier moves with its control points).
    traceCurve(doc, view, mapSmoothCurve(smoothCurve(curl.points), (p: Point) => applyTransform(transform, p)))
    doc.stroke()
  }
}

/**
 * Writes the cover page and the fabric and cutting pages after it.
 *
 * @example writeCover(context)
 */
export function writeCover(context: BookletContext): void {
  const { doc, frame, model } = context
  const { design } = model
  const { x, y, width, height } = frame.printable
  startPage(context)
  font(doc, 22, 'bold')
  doc.text(design.name, x, y + 24)
  font(doc, 10, 'normal', 60)
  doc.text('A foundation-pieced ring: pattern booklet', x, y + 40)
  const size = Math.min(width, height * 0.55)
  drawRingPreview(doc, model, { x: x + (width - size) / 2, y: y + 52, width: size, height: size }, true)
  let line = y + 52 + size + 20
  const facts = [
    `Finished diameter: ${formatInches(model.finishedDiameterInches)} (${inchesToCentimetres(model.finishedDiameterInches).toFixed(1)} cm)`,
    `${design.ring.repeats} repeats, ${design.ring.repeatMode === 'mirror' ? 'alternately mirrored' : 'all alike'}; ${model.plan.sections.length} foundation section${model.plan.sections.length === 1 ? '' : 's'} per repeat`,
    `Colourway: ${model.colorway?.name ?? 'none (fabrics shown grey)'}`,
    `Paper: ${PAPERS[model.options.paper].title}, ${model.options.orientation}. Print at 100 % (actual size).`,
    'The picture shows the finished quilt (fabric side); the first repeat carries its area labels.',
  ]
  for (const fact of facts) {
    font(doc, 10, fact.startsWith('The picture') ? 'italic' : 'normal', fact.startsWith('The picture') ? 80 : 0)
    doc.text(fact, x, line)
    line += 14
  }
  const missing = missingFabrics(model)
  if (missing.length > 0) {
    font(doc, 10, 'bold', 0)
    const warning: string[] = doc.splitTextToSize(`Fabrics not chosen yet: ${missing.join(' ')} These parts are printed grey (the cutting list counts areas without a fabric under "${fabricName(model, UNASSIGNED_FABRIC)}"). Choose their fabrics on the drafting board before cutting.`, width)
    doc.text(warning, x, line + 4)
    line += warning.length * 12 + 6
  }
  if (!model.plan.sewable) {
    font(doc, 10, 'bold', 0)
    const problems: string[] = doc.splitTextToSize(`This design cannot be sewn as it stands: ${model.plan.problems.filter((p) => p.severity === 'error').map((p) => p.message).join(' ')}`, width)
    doc.text(problems, x, line + 4)
  }
  writeFabricPages(context)
}

/** "A1, A2 and B1". */
const listInWords = (items: readonly string[]): string =>
  items.length <= 1 ? items.join('') : `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`

/**
 * Which parts of the design have no fabric, in plain words, one sentence each: areas no fill
 * names, and fabric roles (of areas, leaves, the stem ring, berries) without a colour in the
 * colourway, or every role when the design has no colourway. Empty when every part has one.
 *
 * @example missingFabrics(model) // ['No area has a fabric: A1, A2 and B1 have none.']
 */
export function missingFabrics(model: BookletModel): string[] {
  const { design, plan, colorway } = model
  const sentences: string[] = []
  const unfilled = plan.areas.filter((area) => model.fabricOf.get(area.id) === UNASSIGNED_FABRIC)
  if (unfilled.length > 0) {
    const named = unfilled.map((area) => area.label).filter((label): label is string => label !== null).sort()
    const which = named.length === unfilled.length ? listInWords(named) : `${unfilled.length} area${unfilled.length === 1 ? '' : 's'}`
    sentences.push(unfilled.length === plan.areas.length
      ? `No area has a fabric: ${which} ${unfilled.length === 1 ? 'has' : 'have'} none.`
      : `Area${unfilled.length === 1 ? '' : 's'} ${which} ${unfilled.length === 1 ? 'has' : 'have'} no fabric.`)
  }
  const uses = new Map<string, Set<string>>()
  const use = (fabric: string, part: string): void => {
    if (fabric === UNASSIGNED_FABRIC) return
    uses.set(fabric, (uses.get(fabric) ?? new Set<string>()).add(part))
  }
  for (const fabric of model.fabricOf.values()) use(fabric, 'areas')
  for (const leaf of design.leaves) leaf.layers.forEach((fabric) => use(fabric, 'leaves'))
  for (const stem of design.stems) use(stem.fabric, 'the stem ring')
  for (const berry of design.berries) use(berry.fabric, 'berries')
  const uncoloured = [...uses.entries()].filter(([fabric]) => !colorwayFabric(colorway, fabric)).sort(([a], [b]) => a.localeCompare(b))
  if (uncoloured.length > 0) {
    const list = listInWords(uncoloured.map(([fabric, parts]) => `${fabricName(model, fabric)} (${[...parts].join(', ')})`))
    sentences.push(colorway
      ? `The colourway ${colorway.name} gives no colour to ${list}.`
      : `The design has no colourway, so no fabric has a colour: ${list}.`)
  }
  return sentences
}

/**
 * The settings the amounts were worked out for, as the fabric page says them.
 *
 * @example yardageBasis(40, 10) // 'Yardage for 40 in (101.6 cm) usable width of fabric, 10 % extra'
 */
export function yardageBasis(widthOfFabricIn: number, extraPercent: number): string {
  return `Yardage for ${formatInches(widthOfFabricIn)} (${formatLength(widthOfFabricIn, 'cm')}) usable width of fabric, ${extraPercent} % extra`
}

/** A fabric's line: colour chip, swatch image if any, and its name in bold; the flow moves past it. */
function fabricLine(context: BookletContext, flow: Flow, fabric: string, after = ''): void {
  const { doc, model } = context
  flow.ensure(30)
  flow.y += 6
  const nameAt = drawFabricMark(doc, fabricColour(model, fabric), context.swatches.get(fabric), flow.left, flow.y)
  font(doc, 10, 'bold')
  const name = fabricName(model, fabric)
  doc.text(name, nameAt, flow.y + 8)
  const afterAt = nameAt + doc.getTextWidth(name) + 6
  flow.y += 10
  if (!after) return
  font(doc, 9, 'normal', 40)
  // Beside the name when it fits on the line, else on a line of its own under it.
  if (afterAt + doc.getTextWidth(after) <= flow.left + flow.width) doc.text(after, afterAt, flow.y - 2)
  else flow.paragraph(after, { indent: nameAt - flow.left, size: 9, grey: 40 })
}

function writeFabricPages(context: BookletContext): void {
  const { model } = context
  const flow = startFlow(context, 'Fabric and cutting', 'Rough-cut pieces are rectangles: cut them on the straight grain, one per area and foundation.')
  const requirements = bookletRequirements(model)
  flow.heading('What to buy')
  flow.paragraph(`${yardageBasis(requirements.widthOfFabricIn, requirements.extraPercent)}, rounded up to 1/8 yd (4 1/2 in) or 10 cm as shops cut. A fat quarter is 18 × 21 in, a fat eighth 9 × 21 in.`, { size: 8.5, grey: 50 })
  for (const fabric of requirements.fabrics) {
    const precut = fabric.fatEighth ? ', or a fat eighth' : fabric.fatQuarter ? ', or a fat quarter' : ''
    fabricLine(context, flow, fabric.fabric, `${formatYards(fabric.yards)} (${formatMetres(fabric.metres)})${precut}`)
  }
  for (const problem of requirements.problems) flow.paragraph(problem.message, { size: 9, style: 'bold' })
  flow.gap(8)
  flow.heading('Cutting list by fabric')
  flow.paragraph('Each rectangle covers its area and a 1/4 in seam allowance with a little to spare once it is sewn and flipped. Counts are for the whole ring.', { size: 8.5, grey: 50 })
  for (const [fabric, pieces] of cuttingList(model)) {
    fabricLine(context, flow, fabric)
    for (const piece of pieces) flow.paragraph(piece, { indent: 20, size: 8.5 })
  }
  flow.gap(8)
  flow.heading('Binding')
  const binding = bindingPlan(model.design)
  flow.paragraph(`Double-fold bias binding, cut ${formatInches(binding.cutWidthIn)} wide from ${fabricName(model, binding.fabric)}: ${bindingLengthInches(model)} in in all, a strip for each curved edge (a curved edge must be bound with strips cut on the bias). Fold each strip in half lengthwise, wrong sides together, and press.`)
  for (const edge of binding.edges) {
    flow.paragraph(`- ${edge.edge === 'outer' ? 'Outer' : 'Inner'} edge: 2 × 3.14 × ${formatInches(edge.radiusIn)} = ${edge.circumferenceIn.toFixed(1)} in, plus ${BINDING_JOIN_INCHES} in for joining the ends: ${edge.stripLengthIn} in.`, { indent: 10 })
  }
}
