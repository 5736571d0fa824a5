/**
 * The board's camera: from the ring's frame (inches, y up) to screen pixels (y down) and back.
 * On the printed side the ring is drawn mirrored across repeat 0's bisector, as the paper shows it;
 * labels are placed at the mirrored points but never drawn as mirrored text.
 */
import { applyTransform, printedSideTransform, type Point } from '@/geometry'
import type { View } from './store'

/** Fewest and most pixels per inch the board zooms to. */
export const MIN_ZOOM = 2
export const MAX_ZOOM = 2000

export function toScreen(point: Point, view: View, repeats: number): [number, number] {
  const p = view.side === 'printed' ? applyTransform(printedSideTransform({ repeats }), point) : point
  return [view.centre[0] + p[0] * view.zoom, view.centre[1] - p[1] * view.zoom]
}

export function toWorld(screen: Point, view: View, repeats: number): [number, number] {
  const p: Point = [(screen[0] - view.centre[0]) / view.zoom, -(screen[1] - view.centre[1]) / view.zoom]
  // The mirror is its own inverse.
  const world = view.side === 'printed' ? applyTransform(printedSideTransform({ repeats }), p) : p
  return [world[0], world[1]]
}

/** A view that shows the whole ring in a box of the given size, with a small border. */
export function fitView(outerRadiusInches: number, width: number, height: number, side: View['side']): View {
  const zoom = clampZoom((Math.min(width, height) * 0.92) / (2 * outerRadiusInches))
  return { zoom, centre: [width / 2, height / 2], side }
}

/** Zooms by `factor`, keeping the point under the cursor where it is. */
export function zoomAt(view: View, screen: Point, factor: number): View {
  const zoom = clampZoom(view.zoom * factor)
  const applied = zoom / view.zoom
  return {
    ...view,
    zoom,
    centre: [screen[0] - (screen[0] - view.centre[0]) * applied, screen[1] - (screen[1] - view.centre[1]) * applied],
  }
}

export const panBy = (view: View, dx: number, dy: number): View => ({ ...view, centre: [view.centre[0] + dx, view.centre[1] + dy] })

const clampZoom = (zoom: number) => Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, zoom))
