/**
 * Undo history of immutable values. A drag marks a stopping point when it starts, updates the
 * present live, and on release squashes everything since the mark into one step — or bails back
 * to the mark on Escape.
 */
export interface History<T> {
  readonly past: readonly T[]
  readonly present: T
  readonly future: readonly T[]
  /** Length of `past` when the current drag started, or null outside a drag. */
  readonly mark: number | null
}

/** At least 100 undo steps are promised to designers; keep a little more. */
export const HISTORY_LIMIT = 200

export function createHistory<T>(present: T): History<T> {
  return { past: [], present, future: [], mark: null }
}

/**
 * Records a change. Pushing the value that is already present records nothing. During a drag
 * only the state before the drag is kept: later moves replace the present, so a long drag can
 * never push older undo steps (or its own starting point) out of the history.
 */
export function pushHistory<T>(history: History<T>, next: T, limit = HISTORY_LIMIT): History<T> {
  if (Object.is(next, history.present)) return history
  if (history.mark !== null && history.past.length > history.mark) return { ...history, present: next, future: [] }
  const past = [...history.past, history.present]
  const overflow = Math.max(0, past.length - limit)
  return {
    past: overflow > 0 ? past.slice(overflow) : past,
    present: next,
    future: [],
    mark: history.mark === null ? null : Math.max(0, history.mark - overflow),
  }
}

export function undoHistory<T>(history: History<T>): History<T> {
  const previous = history.past.at(-1)
  if (previous === undefined || history.mark !== null) return history
  return { past: history.past.slice(0, -1), present: previous, future: [history.present, ...history.future], mark: null }
}

export function redoHistory<T>(history: History<T>): History<T> {
  const [next, ...future] = history.future
  if (next === undefined || history.mark !== null) return history
  return { past: [...history.past, history.present], present: next, future, mark: null }
}

/** Starts a drag: later pushes are squashed or discarded together. */
export function markHistory<T>(history: History<T>): History<T> {
  return { ...history, mark: history.past.length }
}

/** Ends a drag, keeping its result as one undo step (none if nothing changed). */
export function squashToMark<T>(history: History<T>): History<T> {
  if (history.mark === null) return history
  const before = history.past[history.mark]
  if (before === undefined) return { ...history, mark: null }
  const past = history.past.slice(0, history.mark)
  // A drag that ended where it started leaves no step behind.
  if (Object.is(before, history.present)) return { past, present: history.present, future: history.future, mark: null }
  return { past: [...past, before], present: history.present, future: history.future, mark: null }
}

/** Cancels a drag: the present goes back to what it was at the mark. */
export function bailToMark<T>(history: History<T>): History<T> {
  if (history.mark === null) return history
  const before = history.past[history.mark]
  if (before === undefined) return { ...history, mark: null }
  return { past: history.past.slice(0, history.mark), present: before, future: history.future, mark: null }
}

export const canUndo = (history: History<unknown>) => history.past.length > 0 && history.mark === null
export const canRedo = (history: History<unknown>) => history.future.length > 0 && history.mark === null
