/**
 * The options of a pattern booklet, one zod schema shared by the print dialog and the command
 * line. Lengths are inches; the colourway is named, and the default is the design's first.
 */
import { z } from 'zod'
import { MAX_NAME_LENGTH } from '@/lib/limits'
import { cuttingSettingsSchema } from './cutting-settings'
import { text } from './text'

export const PAPER_NAMES = ['letter', 'legal', 'tabloid', 'a4', 'a3'] as const
export type PaperName = (typeof PAPER_NAMES)[number]

/** The parts a booklet can hold, in the order they are printed. */
export const BOOKLET_PARTS = ['cover', 'cutting', 'cautions', 'steps', 'foundations', 'templates', 'guide'] as const
export type BookletPart = (typeof BOOKLET_PARTS)[number]

/** Home printers leave about 0.25 in unprinted (common practice); 0.4 in leaves room to spare. */
export const DEFAULT_MARGIN_INCHES = 0.4
/** Tiles overlap by this much so they can be lined up and taped. */
export const DEFAULT_OVERLAP_INCHES = 0.5

/**
 * Booklet options. `finishedDiameterInches` absent keeps the design's own size; `colorway`
 * absent takes the design's first colourway. `widthOfFabricIn` and `extraPercent` are the fabric
 * page's and the command line's cutting settings (lib/schemas/cutting-settings.ts: 10–120 in,
 * 0–100 %; default 40 in and 10 %), used by the fabric requirements and the cutting diagrams.
 *
 * @example bookletOptionsSchema.parse({ paper: 'letter' }) // orientation portrait, every part
 */
export const bookletOptionsSchema = z.strictObject({
  paper: z.enum(PAPER_NAMES),
  orientation: z.enum(['portrait', 'landscape']).default('portrait'),
  colorway: text({ max: MAX_NAME_LENGTH }).optional(),
  finishedDiameterInches: z.number().positive().max(200).optional(),
  parts: z.array(z.enum(BOOKLET_PARTS)).min(1).default([...BOOKLET_PARTS]),
  marginInches: z.number().min(0.1).max(1.5).default(DEFAULT_MARGIN_INCHES),
  overlapInches: z.number().min(0.25).max(2).default(DEFAULT_OVERLAP_INCHES),
  ...cuttingSettingsSchema.shape,
})

/** What the dialog or the command line hands in (defaults may be left out). */
export type BookletOptionsInput = z.input<typeof bookletOptionsSchema>
/** Options with every default filled in. */
export type BookletOptions = z.output<typeof bookletOptionsSchema>
