/**
 * "Undo" for ticks: the last few ticks and unticks made on this page, newest last. Undoing one
 * queues the opposite change for that step only, like any other tick.
 */

export interface Tick {
  readonly stepId: string
  /** What the tick set the step to. */
  readonly done: boolean
  /** The step's label, for the undo button ("Undo: A3 sewn"). */
  readonly label: string
}

/** How many ticks "undo" can walk back: an evening's last few, our choice. */
export const UNDO_DEPTH = 20

/**
 * The history with one more tick.
 *
 * @example recordTick([], { stepId: 'a', done: true, label: 'A1' }).length // 1
 */
export function recordTick(history: readonly Tick[], tick: Tick): Tick[] {
  return [...history, tick].slice(-UNDO_DEPTH)
}

/**
 * The last tick taken back: the change that reverses it and the history without it, or null when
 * there is nothing to undo.
 *
 * @example undoLastTick([{ stepId: 'a', done: true, label: 'A1' }])?.change // { stepId: 'a', done: false }
 */
export function undoLastTick(history: readonly Tick[]): { change: { stepId: string; done: boolean }; history: Tick[] } | null {
  const last = history.at(-1)
  if (!last) return null
  return { change: { stepId: last.stepId, done: !last.done }, history: history.slice(0, -1) }
}
