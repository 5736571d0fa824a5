/**
 * The one place that knows which fields of a design are lengths. Reading a centimetre file
 * (lib/schemas/design.ts), switching the board between inches and centimetres
 * (lib/board/commands.ts `setUnits`) and resizing a design (`scaleDesign`) all scale through
 * `scaleDesignLengths`, so a new length field is added here once and every one of them follows.
 * lib/schemas/design-units.test.ts fails when the design schema gains a number this file does not
 * scale and that is not listed there as unitless.
 */

import type { Point } from './types'

/**
 * The fields of a design that hold lengths, as both the design file and the core's `Design`
 * carry them. Everything else (ids, fabrics, colours, a leaf's `at` fraction and its angle, the
 * number of repeats, a hand-set order's labels) is unitless and passes through untouched.
 */
export interface DesignLengths {
  readonly ring: { readonly innerRadius: number; readonly outerRadius: number }
  readonly seams: readonly { readonly from: Point; readonly to: Point }[]
  readonly fills?: readonly { readonly at: Point }[]
  readonly leaves?: readonly { readonly length: number; readonly width: number }[]
  readonly stems?: readonly { readonly radius: number; readonly finishedWidth: number }[]
  readonly berries?: readonly { readonly at: Point; readonly finishedDiameter: number }[]
  readonly curls?: readonly { readonly points: readonly Point[] }[]
  readonly order?: { readonly sections: readonly { readonly areas: readonly Point[] }[] } | null
  /** The binding strip's cut width (issue 9, item 8), when the design has one. */
  readonly binding?: { readonly cutWidth?: number } | null
}

/**
 * The design with every length multiplied by `factor` (and then passed through `round`, if
 * given); unitless fields are kept, lists left out stay left out. A new design; the input is
 * never changed.
 *
 * @example scaleDesignLengths(design, 2.54).ring.outerRadius // 22.86 for a 9 in radius
 */
export function scaleDesignLengths<T extends DesignLengths>(design: T, factor: number, round: (value: number) => number = (value) => value): T {
  const length = (value: number) => round(value * factor)
  const point = (p: Point): [number, number] => [length(p[0]), length(p[1])]
  const scaled: DesignLengths = {
    ...design,
    ring: { ...design.ring, innerRadius: length(design.ring.innerRadius), outerRadius: length(design.ring.outerRadius) },
    seams: design.seams.map((seam) => ({ ...seam, from: point(seam.from), to: point(seam.to) })),
    ...(design.fills && { fills: design.fills.map((fill) => ({ ...fill, at: point(fill.at) })) }),
    ...(design.leaves && { leaves: design.leaves.map((leaf) => ({ ...leaf, length: length(leaf.length), width: length(leaf.width) })) }),
    ...(design.stems && {
      stems: design.stems.map((stem) => ({ ...stem, radius: length(stem.radius), finishedWidth: length(stem.finishedWidth) })),
    }),
    ...(design.berries && {
      berries: design.berries.map((berry) => ({ ...berry, at: point(berry.at), finishedDiameter: length(berry.finishedDiameter) })),
    }),
    ...(design.curls && { curls: design.curls.map((curl) => ({ ...curl, points: curl.points.map(point) })) }),
    ...(design.order && {
      order: { ...design.order, sections: design.order.sections.map((section) => ({ ...section, areas: section.areas.map(point) })) },
    }),
    ...(design.binding && {
      binding: { ...design.binding, ...(design.binding.cutWidth !== undefined && { cutWidth: length(design.binding.cutWidth) }) },
    }),
  }
  return scaled as T
}
