/**
 * The sewing room's picture of the ring: the areas of one repeat, flipped into the screen's frame
 * (y down), with their fabric colours, and each repeat's place as an SVG matrix (a turn, or a
 * mirror image for the even repeats of an alternately mirrored ring); and what is laid over the
 * areas (leaves, stem rings, curls, berries, binding), each tied to the step after which it is in
 * the quilt. The page draws a done area in its colour and the rest in outline, with no geometry of
 * its own: the browser places the shared shapes by the matrices.
 *
 * The ring comes from lib/ring-drawing.ts, the same data the shop's cover draws.
 */
import { bindingPlan, mapSmoothCurve, repeatTransforms, type AffineTransform, type Point } from '@/geometry'
import type { BookletModel } from '@/lib/booklet/model'
import { circleData, CURL_STROKE, curveData, fabricFill, polygonData, ringDrawing } from '@/lib/ring-drawing'
import type { PictureOverlay, SewingPicture, SvgMatrix } from '@/lib/schemas/sewing-room'
import { leafSteps } from './joins'

/** Rounds to 1/`per` and never gives -0. */
const roundTo = (value: number, per: number): number => {
  const rounded = Math.round(value * per) / per
  return rounded === 0 ? 0 : rounded
}
/** Points to 1/1000 in: far below a pixel on any screen. */
const round = (value: number): number => roundTo(value, 1000)
/** The design's frame (y up) to the screen's (y down). */
const toScreen = (p: Point): [number, number] => [round(p[0]), round(-p[1])]

/**
 * A design-frame transform as it acts in the screen's frame, F·T·F with F the flip of y, written as
 * an SVG matrix; its turning part to a millionth (an error of under 1/10,000 in at the rim).
 *
 * @example screenMatrix({ xx: 1, xy: 0, yx: 0, yy: 1, tx: 0, ty: 0 }) // [1, 0, 0, 1, 0, 0]
 */
export function screenMatrix(transform: AffineTransform): SvgMatrix {
  const { xx, xy, yx, yy, tx, ty } = transform
  return [roundTo(xx, 1e6), roundTo(-yx, 1e6), roundTo(-xy, 1e6), roundTo(yy, 1e6), round(tx), round(-ty)]
}

/**
 * Double-fold binding shows about a sixth of its cut width on the front (2 1/4 in strips bind
 * about 3/8 in; recalled from memory, common practice). Only the picture uses this.
 */
const BINDING_SHOWN_PER_CUT_WIDTH = 1 / 6
/** Curls are drawn this thick, as a share of the outer radius (as the shop's cover draws them). */
const CURL_WIDTH_PER_RADIUS = 1 / 120

/**
 * The picture of a project's ring (see the file comment); a leaf that no step catches in any
 * repeat (the plan reports why) is left out.
 *
 * @example sewingPicture(model).repeats.length // the ring's repeats
 */
export function sewingPicture(model: BookletModel): SewingPicture {
  const { design, plan, colorway } = model
  const drawing = ringDrawing(design, plan, colorway)
  const transforms = repeatTransforms(design.ring)
  const inEvery = (stepId: string) => transforms.map(() => stepId)
  const overlays: PictureOverlay[] = []
  const caughtBy = transforms.map((_, index) => leafSteps(model, index + 1))
  for (const leaf of drawing.leaves) {
    const stepIds = caughtBy.map((steps) => steps.get(leaf.leafId) ?? null)
    if (stepIds.some((stepId) => stepId !== null)) overlays.push({ d: polygonData(leaf.outline.map(toScreen)), fill: leaf.fill, stroke: null, stepIds })
  }
  const r = design.ring.outerRadius
  drawing.stems.forEach((stem, index) => {
    overlays.push({ stepId: `finish:stem:${index + 1}`, d: circleData([0, 0], stem.radius), fill: null, stroke: stem.stroke, strokeWidthIn: round(stem.width) })
  })
  for (const curl of drawing.curls) {
    overlays.push({ d: curveData(mapSmoothCurve(curl, toScreen)), fill: null, stroke: CURL_STROKE, strokeWidthIn: round(r * CURL_WIDTH_PER_RADIUS), stepIds: inEvery('finish:curls') })
  }
  for (const berry of drawing.berries) overlays.push({ d: circleData(toScreen(berry.at), berry.radius), fill: berry.fill, stroke: null, stepIds: inEvery('finish:berries') })
  const binding = bindingPlan(design)
  const shown = binding.cutWidthIn * BINDING_SHOWN_PER_CUT_WIDTH
  for (const edge of binding.edges) {
    // The band lies inside the outer edge (outside the inner one): a stroke centred half its width in.
    const radius = edge.edge === 'outer' ? edge.radiusIn - shown / 2 : edge.radiusIn + shown / 2
    overlays.push({ stepId: 'finish:binding', d: circleData([0, 0], radius), fill: null, stroke: fabricFill(colorway, binding.fabric), strokeWidthIn: round(shown) })
  }
  return {
    viewBox: [round(-r), round(-r), round(2 * r), round(2 * r)],
    repeats: transforms.map((transform, index) => ({ repeat: index + 1, matrix: screenMatrix(transform) })),
    areas: drawing.areas.map(({ area, fill }) => ({ id: area.id, points: area.polygon.map(toScreen), fill })),
    overlays,
  }
}
