/**
 * Which fabric each area is cut from. A fill names its area by a point inside it; when several
 * fills fall in one area (a seam between them was deleted), the last one written wins, as on the
 * board where the latest fill is what the designer sees.
 */
import { isPointInPolygon } from './polygon-measure'
import type { Fill, Polygon } from './types'

/**
 * The fabric of every area that has one, by area id.
 *
 * @example fabricsOfAreas(design.fills, plan.areas).get(plan.areas[0].id) // 'background'
 */
export function fabricsOfAreas(fills: readonly Fill[], areas: readonly { readonly id: string; readonly polygon: Polygon }[]): Map<string, string> {
  const fabrics = new Map<string, string>()
  for (const fill of fills) {
    const area = areas.find((candidate) => isPointInPolygon(fill.at, candidate.polygon))
    if (area) fabrics.set(area.id, fill.fabric)
  }
  return fabrics
}
