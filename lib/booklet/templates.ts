/**
 * True-scale templates (leaves and berry circles) and the placement guide for the stem ring,
 * the curls and the berries. Templates are symmetric, so they read the same on either side.
 */
import type { jsPDF } from 'jspdf'
import { berryCutDiameterInches, leafLayers, leafShapeProblem, leafTemplate, outlineFromPolygon, pathToPolygon, repeatOutlinePath, smoothCurve, tryPlaceLeafLayers } from '@/geometry'
import { formatInches, POINTS_PER_INCH } from '@/lib/units'
import { drawHeader, drawTestSquares, font, HEADER_HEIGHT_PT, TEST_BAND_HEIGHT_PT } from './chrome'
import { startPage, type BookletContext } from './context'
import { dashedPen, solidPen, toPage, traceCurve, tracePath, tracePolygon, trueScaleView, type View } from './draw'
import { fabricName } from './model'
import { writeTiledDrawing } from './tiled-drawing'

interface Template {
  readonly widthIn: number
  readonly heightIn: number
  readonly caption: string[]
  /** Draws with the template's box top-left at the view's origin. */
  readonly draw: (doc: jsPDF, left: number, top: number) => void
}

/**
 * Templates are drawn at the size their label reads: the nearest 1/8 in, the step `formatInches`
 * writes (rotary rulers are marked in eighths, common practice). A design printed at another
 * finished diameter scales its leaves and berries to odd sizes (1 3/4 in × 20/18 = 1.944 in);
 * the label says "2 in" and the template is drawn at exactly 2 in, never at a size the
 * maker cannot read off it (1/16 in at most from the scaled design, within a maker's tolerance).
 */
const LABEL_STEP_INCHES = 1 / 8

/** A size as the label writes it, never below one step. @example labelledSize(1.944) // 2 */
const labelledSize = (inches: number): number => Math.max(LABEL_STEP_INCHES, Math.round(inches / LABEL_STEP_INCHES) * LABEL_STEP_INCHES)

function leafTemplates(context: BookletContext): Template[] {
  const { design } = context.model
  const sizes = new Map<string, { length: number; width: number; fabrics: Set<string>; count: number }>()
  // Each stacked layer is a folded leaf of its own size (its scale of the leaf's): one template per
  // size. An impossible leaf is an error of the plan and gets no template.
  for (const layer of design.leaves.flatMap((leaf) => (leafShapeProblem(leaf.length, leaf.width) ? [] : leafLayers(leaf)))) {
    let length = labelledSize(layer.length)
    let width = labelledSize(layer.width)
    // A leaf so near half a disc that rounding would blunt it keeps its exact size (and label).
    if (leafShapeProblem(length, width)) [length, width] = [layer.length, layer.width]
    const key = `${length}x${width}`
    const entry = sizes.get(key) ?? { length, width, fabrics: new Set<string>(), count: 0 }
    entry.fabrics.add(layer.fabric)
    entry.count += design.ring.repeats
    sizes.set(key, entry)
  }
  const sizeInWords = (inches: number): string =>
    inches === labelledSize(inches) ? formatInches(inches) : `${Number(inches.toFixed(3))} in`
  const templates: Template[] = []
  for (const { length, width, fabrics, count } of sizes.values()) {
    const template = leafTemplate(length, width)
    const xs = template.cutPolygon.map((p) => p[0])
    const ys = template.cutPolygon.map((p) => p[1])
    const box = [Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)] as const
    templates.push({
      widthIn: box[2] - box[0],
      heightIn: box[3] - box[1],
      caption: [`Leaf ${sizeInWords(length).replace(' in', '')} × ${sizeInWords(width)}`, `${count} folded leaves = ${2 * count} pieces: ${[...fabrics].map((fabric) => fabricName(context.model, fabric)).join(', ')}`],
      draw: (doc, left, top) => {
        const view = trueScaleView(box[0], box[3], left, top)
        dashedPen(doc, 0.6, [4, 2])
        tracePath(doc, view, template.cutLine)
        doc.stroke()
        solidPen(doc, 0.8)
        tracePath(doc, view, template.sewLine, false)
        doc.stroke()
        dashedPen(doc, 0.5, [1, 1.5], [60, 60, 60])
        doc.line(...toPage(view, template.seamLine[0]), ...toPage(view, template.seamLine[1]))
        doc.setLineDashPattern([], 0)
        // The open end is caught in the seam: say so where it lies.
        const [rawX, rawY] = toPage(view, [0, template.rawEdge[0][1]])
        font(doc, 5.5, 'italic', 60)
        doc.text('raw edge (open)', rawX, rawY - 2, { align: 'center' })
      },
    })
  }
  return templates
}

function berryTemplates(context: BookletContext): Template[] {
  const { design } = context.model
  const diameters = [...new Set(design.berries.map((berry) => labelledSize(berry.finishedDiameter)))]
  return diameters.map((diameter) => {
    const cut = berryCutDiameterInches(diameter)
    const count = design.berries.filter((b) => labelledSize(b.finishedDiameter) === diameter).length * design.ring.repeats
    return {
      widthIn: cut,
      heightIn: cut,
      caption: [`Berry ${formatInches(diameter)} finished`, `cut ${count} circles ${formatInches(cut)} across`],
      draw: (doc, left, top) => {
        const centre = [left + (cut / 2) * POINTS_PER_INCH, top + (cut / 2) * POINTS_PER_INCH] as const
        dashedPen(doc, 0.6, [4, 2])
        doc.circle(centre[0], centre[1], (cut / 2) * POINTS_PER_INCH, 'S')
        solidPen(doc, 0.8)
        doc.circle(centre[0], centre[1], (diameter / 2) * POINTS_PER_INCH, 'S')
      },
    }
  })
}

/**
 * Writes the template pages (leaves, berries), each with test squares; nothing when the design
 * has neither.
 *
 * @example writeTemplates(context)
 */
export function writeTemplates(context: BookletContext): void {
  const templates = [...leafTemplates(context), ...berryTemplates(context)]
  if (templates.length === 0) return
  const { doc, frame } = context
  const { x, y, width, height } = frame.printable
  const bottom = y + height - TEST_BAND_HEIGHT_PT - 8
  let cursorX = x
  let cursorY = 0
  let rowHeight = 0
  const newPage = (): void => {
    const page = startPage(context)
    drawHeader(doc, frame, `${context.model.design.name} - Templates at actual size`, `Solid: sew line or finished size; dashed: cut line; dotted: where the piecing seam crosses the leaf. Booklet page ${page}.`)
    drawTestSquares(doc, x, y + height - TEST_BAND_HEIGHT_PT, width - 160)
    cursorX = x
    cursorY = y + HEADER_HEIGHT_PT + 8
    rowHeight = 0
  }
  newPage()
  for (const template of templates) {
    const w = Math.max(template.widthIn * POINTS_PER_INCH, 110)
    const h = template.heightIn * POINTS_PER_INCH + 26
    if (cursorX + w > x + width) {
      cursorX = x
      cursorY += rowHeight + 12
      rowHeight = 0
    }
    if (cursorY + h > bottom) newPage()
    template.draw(doc, cursorX + (w - template.widthIn * POINTS_PER_INCH) / 2, cursorY)
    font(doc, 7.5, 'bold')
    doc.text(template.caption[0] ?? '', cursorX, cursorY + template.heightIn * POINTS_PER_INCH + 11)
    font(doc, 7, 'normal', 50)
    doc.text(template.caption[1] ?? '', cursorX, cursorY + template.heightIn * POINTS_PER_INCH + 20)
    cursorX += w + 14
    rowHeight = Math.max(rowHeight, h)
  }
}

/**
 * The placement guide: one repeat, fabric side, at true scale and tiled, with the stem ring's
 * edges, the curls to embroider, the berries' places and the leaves, to trace onto the top.
 *
 * @example writePlacementGuide(context) // nothing for a design with no stem, curl or berry
 */
export function writePlacementGuide(context: BookletContext): void {
  const { model } = context
  const { design } = model
  if (design.stems.length === 0 && design.curls.length === 0 && design.berries.length === 0) return
  const outlinePath = repeatOutlinePath(design.ring)
  const outline = pathToPolygon(outlinePath)
  const xs = [...outline.map((p) => p[0]), 0, design.ring.outerRadius]
  const ys = [...outline.map((p) => p[1]), 0]
  const pad = 0.3
  const box = [Math.min(...xs) - pad, Math.min(...ys) - pad, Math.max(...xs) + pad, Math.max(...ys) + pad] as const
  const span = (2 * Math.PI) / design.ring.repeats
  const draw = (doc: jsPDF, view: View): void => {
    solidPen(doc, 0.5, [150, 150, 150])
    tracePath(doc, view, outlinePath)
    doc.stroke()
    for (const area of model.plan.areas) {
      tracePath(doc, view, outlineFromPolygon(area.polygon, design.ring))
      doc.stroke()
    }
    for (const stem of design.stems) {
      for (const radius of [stem.radius - stem.finishedWidth / 2, stem.radius + stem.finishedWidth / 2]) {
        solidPen(doc, 0.9)
        tracePath(doc, view, [{ kind: 'arc', center: [0, 0], radius, startAngle: 0, endAngle: span, anticlockwise: true }], false)
        doc.stroke()
      }
      dashedPen(doc, 0.5, [4, 3])
      tracePath(doc, view, [{ kind: 'arc', center: [0, 0], radius: stem.radius, startAngle: 0, endAngle: span, anticlockwise: true }], false)
      doc.stroke()
    }
    for (const curl of design.curls) {
      solidPen(doc, 1.2)
      traceCurve(doc, view, smoothCurve(curl.points))
      doc.stroke()
    }
    for (const berry of design.berries) {
      const [bx, by] = toPage(view, berry.at)
      solidPen(doc, 0.7)
      doc.circle(bx, by, (berry.finishedDiameter / 2) * view.scale, 'S')
      doc.line(bx - 3, by, bx + 3, by)
      doc.line(bx, by - 3, bx, by + 3)
    }
    for (const leaf of design.leaves) {
      const seam = design.seams.find((s) => s.id === leaf.seam)
      if (!seam) continue
      const placed = tryPlaceLeafLayers(leaf, seam)
      if (!placed.ok) continue // reported by the plan
      // Every stacked layer where it lies, each turned and sized by its offset.
      dashedPen(doc, 0.4, [2, 2], [120, 120, 120])
      for (const layer of placed.layers) tracePolygon(doc, view, layer.placement.finishedOutline)
      doc.stroke()
    }
    doc.setLineDashPattern([], 0)
  }
  writeTiledDrawing(context, {
    title: `${design.name} - Placement guide: stem ring, curls and berries`,
    note: 'Fabric side (as the quilt is seen). Trace onto each joined repeat: solid stem edges, dashed stem centre, curls and berry marks.',
    box,
    outline,
    draw,
  })
}
