/**
 * The sewing room (issue 15): a quilter's projects, each the whole job of one pattern as a
 * checklist, with progress kept on the server step by step. The request schemas are shared by the
 * pages and the routes; the answer types are what the routes return, for the pages to read.
 *
 *   GET    /api/sewing-room/projects              → { projects: ProjectSummary[] }
 *   POST   /api/sewing-room/projects              { licenceId | invitationId, colorway, diameterIn, paper, name? } → 201 { project: ProjectSummary }
 *   GET    /api/sewing-room/projects/:id          → PlanAnswer (read as a ProjectDetail)
 *   PATCH  /api/sewing-room/projects/:id/steps    { stepId, done?, note? } → { step: StepProgress }
 *   DELETE /api/sewing-room/projects/:id          → { deleted: true }
 */
import { z } from 'zod'
import { MAX_NAME_LENGTH, MAX_SEWING_NOTE_LENGTH, MAX_SEWING_STEP_ID_LENGTH } from '@/lib/limits'
import { bookletOptionsSchema } from './booklet'
import { text } from './text'

const bookletOptions = bookletOptionsSchema.shape

/**
 * A new project: the licence (or, for a tester, the invitation) it is made under — exactly one of
 * the two — the colourway by its index in the design, the finished diameter in inches and the
 * paper the foundations are printed on (the booklet's own paper and size schemas).
 *
 * @example newProjectSchema.parse({ licenceId: '6f1c2b3a-0000-4000-8000-000000000000', colorway: 0, diameterIn: 18, paper: 'letter' }).name // undefined
 */
export const newProjectSchema = z
  .strictObject({
    licenceId: z.uuid({ error: 'No such licence in your library.' }).optional(),
    invitationId: z.uuid({ error: 'No such invitation.' }).optional(),
    colorway: z.number({ error: 'Choose a colourway by its number.' }).int({ error: 'Choose a colourway by its number.' }).min(0, { error: 'Choose a colourway by its number.' }),
    diameterIn: bookletOptions.finishedDiameterInches.unwrap(),
    paper: bookletOptions.paper,
    name: text({ max: MAX_NAME_LENGTH }).optional(),
  })
  .superRefine((value, context) => {
    if ((value.licenceId === undefined) === (value.invitationId === undefined)) {
      context.addIssue({ code: 'custom', path: ['licenceId'], message: 'Name either the licence or the tester invitation the project is made under, not both.' })
    }
  })
export type NewProjectInput = z.output<typeof newProjectSchema>

/**
 * One step ticked or unticked, or its note written (null or an empty note clears it): one step per
 * call, so two devices ticking different steps never overwrite each other.
 *
 * @example stepUpdateSchema.parse({ stepId: 'r1:area:A2', done: true }) // { stepId: 'r1:area:A2', done: true }
 */
export const stepUpdateSchema = z
  .strictObject({
    stepId: text({ max: MAX_SEWING_STEP_ID_LENGTH }),
    done: z.boolean().optional(),
    note: text({ max: MAX_SEWING_NOTE_LENGTH, min: 0, multiline: true }).nullable().optional(),
  })
  .superRefine((value, context) => {
    if (value.done === undefined && value.note === undefined) {
      context.addIssue({ code: 'custom', path: ['done'], message: 'Say whether the step is done, or give its note.' })
    }
  })
export type StepUpdateInput = z.output<typeof stepUpdateSchema>

/** A rough-cut rectangle, inches (the first measure runs along the seam the piece is sewn on). */
export interface RoughCutSize {
  readonly widthIn: number
  readonly heightIn: number
}

/** A group of the checklist, in work order: `prepare-leaves`, `cut`, `repeat-1` … `repeat-N`, `join-sections`, `join-repeats`, `finishing`. */
export interface ChecklistGroup {
  readonly id: string
  readonly label: string
}

/** One step of the checklist, as lib/sewing-room/checklist.ts makes it (no progress). */
export interface ChecklistStep {
  /** Stable and meaningful: `leaves:leaf-dark`, `cut:background`, `r3:area:A4`, `r3:trim:B`, `join:r3:A+B`, `ring:join:1`, `finish:binding`. */
  readonly id: string
  readonly group: string
  readonly label: string
  readonly instruction?: string
  readonly roughCut?: RoughCutSize | null
  /** The repeat (from 1) the step belongs to, or null for a step of the whole ring. */
  readonly repeat: number | null
  /** Plan area ids that are sewn once this step is done (for the picture; with `repeat`). */
  readonly areas: readonly string[]
  /** The leaves to baste before this area is sewn, by their names ("leaf 1 of A2"); absent when none. */
  readonly leaves?: readonly string[]
}

/** A project in the list (and `POST`'s answer). */
export interface ProjectSummary {
  readonly id: string
  readonly name: string | null
  readonly patternId: string
  readonly patternName: string
  readonly designerName: string
  readonly colorway: { readonly index: number; readonly name: string | null }
  readonly diameterIn: number
  readonly paper: string
  /** What the project is made under: a licence (bought) or a tester invitation. */
  readonly licenceId: string | null
  readonly invitationId: string | null
  readonly done: number
  readonly total: number
  /** The first step not done yet, in work order, or null when every step is done. */
  readonly nextStepLabel: string | null
  readonly createdAt: string
  readonly updatedAt: string
}

/** A step's stored progress. */
export interface StepProgress {
  readonly id: string
  readonly done: boolean
  readonly note: string | null
  readonly updatedAt: string | null
}

export interface ProjectStep extends ChecklistStep {
  readonly done: boolean
  readonly note: string | null
  readonly updatedAt: string | null
}

/** An SVG transform matrix [a, b, c, d, e, f]: (x, y) goes to (a x + c y + e, b x + d y + f). */
export type SvgMatrix = readonly [number, number, number, number, number, number]

/** How a drawing over the areas looks: an SVG path; `fill` and `stroke` are colours or null (none). */
export interface PictureMark {
  readonly d: string
  readonly fill: string | null
  readonly stroke: string | null
  /** The line's width in inches; without it, a line is drawn a fixed width on screen. */
  readonly strokeWidthIn?: number
}

/**
 * What is drawn over the areas, in drawing order: either once where it is, after the step `stepId`
 * (a stem ring, the binding), or in every repeat's place (a leaf, a curl, a berry), given once in
 * the frame of the repeat's shapes, after the step that `stepIds[k − 1]` names for repeat k (null:
 * never drawn there).
 */
export type PictureOverlay = PictureMark & ({ readonly stepId: string } | { readonly stepIds: readonly (string | null)[] })

/**
 * The ring to draw, in inches, in the screen's frame: the ring's centre at (0, 0), x to the right
 * and y DOWN (the design's y-up frame already flipped). The shapes every repeat shares are given
 * once, with each repeat's place as an SVG matrix (a turn about the centre, or a mirror image):
 * a ring with more repeats adds a matrix and a step id per shape for each, not the shapes again.
 */
export interface SewingPicture {
  /** [minX, minY, width, height], inches. */
  readonly viewBox: readonly [number, number, number, number]
  /** Every repeat (from 1) with the matrix that places the shared shapes as that repeat. */
  readonly repeats: readonly { readonly repeat: number; readonly matrix: SvgMatrix }[]
  /** The areas, as one repeat before placing; a step's `repeat` and `areas` name the ones it sews. */
  readonly areas: readonly { readonly id: string; readonly points: readonly (readonly [number, number])[]; readonly fill: string }[]
  readonly overlays: readonly PictureOverlay[]
}

/** A project's sewing plan as the page uses it (`GET /api/sewing-room/projects/:id` sends it as a PlanAnswer). */
export interface ProjectDetail {
  readonly project: ProjectSummary
  readonly groups: readonly (ChecklistGroup & { readonly done: number; readonly total: number })[]
  readonly steps: readonly ProjectStep[]
  readonly nextStepId: string | null
  readonly picture: SewingPicture
}

/**
 * `GET /api/sewing-room/projects/:id` as sent (lib/sewing-room/plan-answer.ts writes and reads it):
 * a ProjectDetail with each distinct instruction written once, in `words` (a ring's repeats say the
 * same things), and a step's progress only when it differs from not done, no note.
 */
export interface PlanAnswer extends Omit<ProjectDetail, 'steps'> {
  readonly words: readonly string[]
  readonly steps: readonly PlanAnswerStep[]
}

export interface PlanAnswerStep extends Omit<ChecklistStep, 'instruction'> {
  /** Where its instruction is in `words`; absent when the step has none. */
  readonly instruction?: number
  readonly done?: boolean
  readonly note?: string | null
  readonly updatedAt?: string | null
}
