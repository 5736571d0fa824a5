/**
 * How the repeats of the ring are joined, along their radial edges.
 */
import type { Problem, Ring } from './types'

export interface RingAssembly {
  readonly kind: 'halves' | 'chain' | 'none'
  readonly message: string
}

/**
 * The ring assembly of geometry.md, and the warning an odd wedge ring carries at its centre.
 *
 * @example ringAssembly({ innerRadius: 0, outerRadius: 9, repeats: 8, repeatMode: 'rotate' }).assembly.kind // 'halves'
 */
export function ringAssembly(ring: Ring): { readonly assembly: RingAssembly; readonly problems: Problem[] } {
  const n = ring.repeats
  if (ring.innerRadius > 0) {
    return {
      assembly: {
        kind: 'chain',
        message: `Join the ${n} repeats one by one along their radial seams, then close the ring with the last radial seam; the ring has a hole, so no seam meets another at the centre.`,
      },
      problems: [],
    }
  }
  if (n % 2 === 0) {
    return {
      assembly: {
        kind: 'halves',
        message: `Join the repeats in two halves of ${n / 2}, one by one along their radial seams, then join the halves with one straight seam through the centre.`,
      },
      problems: [],
    }
  }
  const message = `${n} wedges meet at the centre: with an odd number, no sequence of straight seams joins them. Appliqué a circle over the centre or give the ring an inner radius.`
  return {
    assembly: { kind: 'none', message },
    problems: [{ code: 'odd-wedge-centre', severity: 'warning', message, at: [0, 0] }],
  }
}
