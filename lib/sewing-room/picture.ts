/**
 * The sewing room's picture of the ring: every area of every repeat, already placed (rotated, or
 * mirrored for the odd repeats of an alternately mirrored ring) and flipped into the screen's
 * frame (y down), with its fabric colour; and what is laid over the areas (leaves, stem rings,
 * curls, berries, binding), each tied to the step after which it is in the quilt. The page draws
 * a done area in its colour and the rest in outline, with no geometry of its own.
 *
 * The ring comes from lib/ring-drawing.ts, the same data the shop's cover draws.
 */
import { applyToPolygon, bindingPlan, mapSmoothCurve, repeatTransforms, applyTransform, type AffineTransform, type Point, type Polygon } from '@/geometry'
import type { BookletModel } from '@/lib/booklet/model'
import { circleData, CURL_STROKE, curveData, fabricFill, polygonData, ringDrawing } from '@/lib/ring-drawing'
import type { SewingPicture } from '@/lib/schemas/sewing-room'
import { leafSteps } from './joins'

/** Points to 1/1000 in: far below a pixel on any screen. */
const round = (value: number): number => {
  const rounded = Math.round(value * 1000) / 1000
  return rounded === 0 ? 0 : rounded
}
/** The design's frame (y up) to the screen's (y down). */
const toScreen = (p: Point): [number, number] => [round(p[0]), round(-p[1])]

/**
 * Double-fold binding shows about a sixth of its cut width on the front (2 1/4 in strips bind
 * about 3/8 in; recalled from memory, common practice). Only the picture uses this.
 */
const BINDING_SHOWN_PER_CUT_WIDTH = 1 / 6
/** Curls are drawn this thick, as a share of the outer radius (as the shop's cover draws them). */
const CURL_WIDTH_PER_RADIUS = 1 / 120

/**
 * The picture of a project's ring (see the file comment); a leaf that no step catches (the plan
 * reports why) is left out.
 *
 * @example sewingPicture(model).areas.length // plan areas × repeats
 */
export function sewingPicture(model: BookletModel): SewingPicture {
  const { design, plan, colorway } = model
  const drawing = ringDrawing(design, plan, colorway)
  const transforms = repeatTransforms(design.ring)
  const place = (transform: AffineTransform, polygon: Polygon) => applyToPolygon(transform, polygon).map(toScreen)
  const areas: SewingPicture['areas'][number][] = []
  const finishing: SewingPicture['finishing'][number][] = []
  transforms.forEach((transform, index) => {
    const repeat = index + 1
    for (const { area, fill } of drawing.areas) areas.push({ repeat, id: area.id, points: place(transform, area.polygon), fill })
    const caughtBy = leafSteps(model, repeat)
    for (const leaf of drawing.leaves) {
      const stepId = caughtBy.get(leaf.leafId)
      if (stepId) finishing.push({ stepId, d: polygonData(place(transform, leaf.outline)), fill: leaf.fill, stroke: null })
    }
  })
  const r = design.ring.outerRadius
  drawing.stems.forEach((stem, index) => {
    finishing.push({ stepId: `finish:stem:${index + 1}`, d: circleData([0, 0], stem.radius), fill: null, stroke: stem.stroke, strokeWidthIn: round(stem.width) })
  })
  if (drawing.curls.length > 0) {
    for (const transform of transforms) {
      for (const curl of drawing.curls) {
        finishing.push({ stepId: 'finish:curls', d: curveData(mapSmoothCurve(curl, (p) => toScreen(applyTransform(transform, p)))), fill: null, stroke: CURL_STROKE, strokeWidthIn: round(r * CURL_WIDTH_PER_RADIUS) })
      }
    }
  }
  for (const transform of transforms) {
    for (const berry of drawing.berries) finishing.push({ stepId: 'finish:berries', d: circleData(toScreen(applyTransform(transform, berry.at)), berry.radius), fill: berry.fill, stroke: null })
  }
  const binding = bindingPlan(design)
  const shown = binding.cutWidthIn * BINDING_SHOWN_PER_CUT_WIDTH
  for (const edge of binding.edges) {
    // The band lies inside the outer edge (outside the inner one): a stroke centred half its width in.
    const radius = edge.edge === 'outer' ? edge.radiusIn - shown / 2 : edge.radiusIn + shown / 2
    finishing.push({ stepId: 'finish:binding', d: circleData([0, 0], radius), fill: null, stroke: fabricFill(colorway, binding.fabric), strokeWidthIn: round(shown) })
  }
  return { viewBox: [round(-r), round(-r), round(2 * r), round(2 * r)], areas, finishing }
}
