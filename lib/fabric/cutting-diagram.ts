/**
 * A cutting diagram of one fabric, as data: the strips of the core's layout (fabricRequirements →
 * `strips`), each cut across the usable width of fabric, its sub-cuts labelled by what they are
 * for (an area label, "leaf", "berry", "stem", "binding"), and the same in words, one sentence per
 * strip. The fabric page draws it as SVG and the booklet with jsPDF, both from this, so the screen
 * and the paper cannot differ. Pure; no React, no drawing.
 */
import type { FabricRequirement, PlacedCut } from '@/geometry'
import { formatLength, formatSize, type LengthUnits } from '@/lib/units'

export interface DiagramCut {
  /** What the piece is for, as printed on it. */
  readonly label: string
  /** Across the width of fabric from one selvedge edge, inches. */
  readonly xIn: number
  /** Along the length from the cut end, inches. */
  readonly yIn: number
  readonly widthIn: number
  readonly heightIn: number
  /** Turned 90° from the size it was asked for. */
  readonly turned: boolean
}

export interface DiagramStrip {
  /** From 1, in cutting order. */
  readonly number: number
  readonly yIn: number
  readonly heightIn: number
  readonly cuts: readonly DiagramCut[]
  /** The strip in a maker's words: how deep to cut it, then its sub-cuts. */
  readonly words: string
}

export interface CuttingDiagram {
  readonly fabric: string
  readonly name: string
  readonly color: string | null
  readonly widthOfFabricIn: number
  /** The strips' total, inches (before any extra). */
  readonly lengthIn: number
  readonly strips: readonly DiagramStrip[]
  /** Every cut, strip by strip. */
  readonly cuts: readonly DiagramCut[]
  /** One line for the diagram's title: name, strips, length. */
  readonly title: string
}

/** The pieces cut as squares for continuous bias (geometry/cutting-pieces.ts adds them under these names). */
const BIAS_SQUARES: ReadonlySet<string> = new Set(['stem', 'binding'])

const plural = (count: number, word: string): string => `${count} ${word}${count === 1 ? '' : 's'}`

/**
 * The sub-cuts of a strip in words, like pieces grouped together: "9 × A3, 4 1/8 × 6 3/4 in (turned)".
 *
 * @example subCutsInWords([{ for: 'B1', xIn: 0, yIn: 0, widthIn: 3.5, heightIn: 3.25, turned: false }], 'in') // '1 × B1, 3 1/2 × 3 1/4 in'
 */
export function subCutsInWords(cuts: readonly PlacedCut[], units: LengthUnits): string {
  const groups = new Map<string, { cut: PlacedCut; count: number }>()
  for (const cut of cuts) {
    const key = `${cut.for}\u0000${cut.widthIn}\u0000${cut.heightIn}\u0000${cut.turned}`
    const group = groups.get(key) ?? { cut, count: 0 }
    group.count += 1
    groups.set(key, group)
  }
  return [...groups.values()]
    .map(({ cut, count }) => {
      const notes = [cut.turned ? 'turned' : '', BIAS_SQUARES.has(cut.for) ? 'a square for continuous bias' : ''].filter(Boolean)
      return `${count} × ${cut.for}, ${formatSize(cut.widthIn, cut.heightIn, units)}${notes.length ? ` (${notes.join(', ')})` : ''}`
    })
    .join('; ')
}

/**
 * The diagram of one fabric's layout.
 *
 * @example cuttingDiagram(requirements.fabrics[0]!, 40, 'in').strips[0]?.words // 'Strip 1: cut 6 3/4 in across the width of fabric, then 9 × A3, 4 1/8 × 6 3/4 in (turned)'
 */
export function cuttingDiagram(fabric: FabricRequirement, widthOfFabricIn: number, units: LengthUnits): CuttingDiagram {
  const strips = fabric.strips.map((strip, index): DiagramStrip => ({
    number: index + 1,
    yIn: strip.yIn,
    heightIn: strip.heightIn,
    cuts: strip.cuts.map((cut) => ({ label: cut.for, xIn: cut.xIn, yIn: cut.yIn, widthIn: cut.widthIn, heightIn: cut.heightIn, turned: cut.turned })),
    words: `Strip ${index + 1}: cut ${formatLength(strip.heightIn, units)} across the width of fabric, then ${subCutsInWords(strip.cuts, units)}`,
  }))
  return {
    fabric: fabric.fabric,
    name: fabric.name,
    color: fabric.color,
    widthOfFabricIn,
    lengthIn: fabric.lengthIn,
    strips,
    cuts: strips.flatMap((strip) => strip.cuts),
    title: `${fabric.name}: ${plural(strips.length, 'strip')}, ${formatLength(fabric.lengthIn, units)} of a ${formatLength(widthOfFabricIn, units)} usable width`,
  }
}
