import type { DesignFile } from '@/lib/schemas/design'

/** A new pattern's ring unless another is asked for: quarters meeting at the centre, 18 in across. */
export const NEW_RING: DesignFile['ring'] = { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }

/**
 * An empty ring ready to draw on, in inches, with one colourway holding a background fabric.
 *
 * @example emptyDesign('Winter Star', { ...NEW_RING, repeats: 6 }).seams // []
 */
export function emptyDesign(name: string, ring: DesignFile['ring'] = NEW_RING): DesignFile {
  return {
    format: 'wreathwright-design',
    version: 2,
    name,
    units: 'in',
    ring,
    seams: [],
    fills: [],
    leaves: [],
    stems: [],
    berries: [],
    curls: [],
    colorways: [{ name: 'Main', fabrics: { background: { name: 'Background', color: '#f4ecd8' } } }],
    order: null,
  }
}
