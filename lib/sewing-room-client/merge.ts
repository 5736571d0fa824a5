/**
 * What the page shows: the server's steps with the quilter's unsaved changes laid over them, step
 * by step, and the progress, next step and picture that follow from that. Pure functions.
 */
import type { PictureMark, ProjectStep, SewingPicture, StepProgress, SvgMatrix } from '@/lib/schemas/sewing-room'
import type { PendingQueue } from './pending-queue'

/** Where a step's latest change stands: on the server, waiting (or on its way), or refused by it. */
export type SaveState = 'saved' | 'waiting' | 'refused'

export interface ShownStep extends ProjectStep {
  readonly saveState: SaveState
  /** Why the last send failed or was refused, in words. */
  readonly problem?: string
}

/**
 * Steps as the server last told them, refreshed by `incoming` (a new GET) step by step: for each
 * step the later of the two by `updatedAt` wins, so an answer to a GET that set off before a PATCH
 * landed cannot put back what the PATCH changed. A step that only one of them knows is kept as the
 * incoming list has it (the incoming order is the work order).
 *
 * @example mergeServerSteps([], []) // []
 */
export function mergeServerSteps(known: readonly ProjectStep[], incoming: readonly ProjectStep[]): ProjectStep[] {
  const byId = new Map(known.map((step) => [step.id, step]))
  return incoming.map((step) => {
    const mine = byId.get(step.id)
    if (!mine) return step
    return timeOf(mine.updatedAt) > timeOf(step.updatedAt) ? { ...step, done: mine.done, note: mine.note, updatedAt: mine.updatedAt } : step
  })
}

/** The steps with one step's saved progress (a PATCH's answer) written in. */
export function applySaved(steps: readonly ProjectStep[], saved: StepProgress): ProjectStep[] {
  return steps.map((step) =>
    step.id === saved.id && timeOf(saved.updatedAt) >= timeOf(step.updatedAt) ? { ...step, done: saved.done, note: saved.note, updatedAt: saved.updatedAt } : step,
  )
}

/**
 * The steps as the quilter sees them: each waiting change laid over its own step, with its save
 * state; a refusal is shown until the step is changed again.
 */
export function overlayPending(steps: readonly ProjectStep[], queue: PendingQueue, refused: Readonly<Record<string, string>> = {}): ShownStep[] {
  const pending = new Map(queue.map((entry) => [entry.stepId, entry]))
  return steps.map((step): ShownStep => {
    const entry = pending.get(step.id)
    if (entry) {
      return {
        ...step,
        ...(entry.done !== undefined && { done: entry.done }),
        ...(entry.note !== undefined && { note: entry.note }),
        saveState: 'waiting',
        ...(entry.lastError && { problem: entry.lastError }),
      }
    }
    const refusal = refused[step.id]
    return refusal ? { ...step, saveState: 'refused', problem: refusal } : { ...step, saveState: 'saved' }
  })
}

export interface Progress {
  readonly done: number
  readonly total: number
}

/** Steps done of all steps. */
export function progressOf(steps: readonly { readonly done: boolean }[]): Progress {
  return { done: steps.filter((step) => step.done).length, total: steps.length }
}

/** A whole percentage for a progress bar (0 for an empty list). */
export function percentOf(progress: Progress): number {
  return progress.total === 0 ? 0 : Math.round((100 * progress.done) / progress.total)
}

/** The groups in work order, each with its progress counted from the steps shown. */
export function groupsWithProgress<G extends { readonly id: string }>(groups: readonly G[], steps: readonly ProjectStep[]): (G & Progress & { readonly steps: ProjectStep[] })[] {
  return groups.map((group) => {
    const own = steps.filter((step) => step.group === group.id)
    return { ...group, ...progressOf(own), steps: own }
  })
}

/** The first step not done, in work order (the steps' order), or null when all are done. */
export function nextStepOf<S extends ProjectStep>(steps: readonly S[]): S | null {
  return steps.find((step) => !step.done) ?? null
}

/** The key of one area of one repeat in the picture. */
export const areaKey = (repeat: number, areaId: string) => `${repeat}:${areaId}`

/**
 * The areas sewn so far: those of every done step, each in its own repeat. A step of the whole
 * ring (repeat null) that names areas sews them in every repeat.
 */
export function sewnAreas(steps: readonly ProjectStep[], picture: SewingPicture): Set<string> {
  const repeats = picture.repeats.map((place) => place.repeat)
  const sewn = new Set<string>()
  for (const step of steps) {
    if (!step.done) continue
    for (const id of step.areas) {
      for (const repeat of step.repeat === null ? repeats : [step.repeat]) sewn.add(areaKey(repeat, id))
    }
  }
  return sewn
}

/** The areas the given step sews (for marking the next step on the picture). */
export function areasOfStep(step: ProjectStep | null, picture: SewingPicture): Set<string> {
  if (!step) return new Set()
  return sewnAreas([{ ...step, done: true }], picture)
}

/** Every area of every repeat in the picture, and how many of them are sewn. */
export function areasCount(picture: SewingPicture, sewn: ReadonlySet<string>): Progress {
  const keys = picture.repeats.flatMap(({ repeat }) => picture.areas.map((area) => areaKey(repeat, area.id)))
  return { done: keys.filter((key) => sewn.has(key)).length, total: keys.length }
}

/** One drawing over the areas, where it is drawn: `matrix` places a repeat's shape (null: as it is). */
export interface ShownOverlay extends PictureMark {
  readonly key: string
  readonly stepId: string
  readonly matrix: SvgMatrix | null
}

/** The drawings over the areas whose step is done, each in every repeat whose step is, in the picture's order. */
export function overlaysShown(picture: SewingPicture, steps: readonly ProjectStep[]): ShownOverlay[] {
  const done = new Set(steps.filter((step) => step.done).map((step) => step.id))
  const shown: ShownOverlay[] = []
  picture.overlays.forEach((overlay, index) => {
    const { d, fill, stroke, strokeWidthIn } = overlay
    const mark = { d, fill, stroke, ...(strokeWidthIn !== undefined && { strokeWidthIn }) }
    if ('stepId' in overlay) {
      if (done.has(overlay.stepId)) shown.push({ ...mark, key: `${index}`, stepId: overlay.stepId, matrix: null })
      return
    }
    for (const { repeat, matrix } of picture.repeats) {
      const stepId = overlay.stepIds[repeat - 1]
      if (stepId && done.has(stepId)) shown.push({ ...mark, key: `${index}:${repeat}`, stepId, matrix })
    }
  })
  return shown
}

function timeOf(iso: string | null | undefined): number {
  if (!iso) return Number.NEGATIVE_INFINITY
  const time = Date.parse(iso)
  return Number.isNaN(time) ? Number.NEGATIVE_INFINITY : time
}
