/**
 * Sends a project's step changes to the server and keeps them until it has them: optimistic on the
 * page, one PATCH per step, retried with back-off on a flaky connection, and kept in localStorage
 * so a reload or a closed tab loses nothing. No React here: the page subscribes to it (as
 * `useSyncExternalStore` expects) and the tests drive it with a fake `send` and fake timers.
 */
import { ApiError } from '@/lib/api-client'
import type { StepProgress, StepUpdateInput } from '@/lib/schemas/sewing-room'
import { retryDelayMs } from './backoff'
import {
  afterFailed,
  afterSaved,
  dueChanges,
  nextDueAt,
  queueChange,
  readQueue,
  requestBodyOf,
  serializeQueue,
  storageKeyOf,
  withoutStep,
  type PendingQueue,
  type StepChange,
} from './pending-queue'

/** The part of localStorage used here (a test passes a Map-backed one). */
export interface KeyValueStorage {
  getItem(key: string): string | null
  setItem(key: string, value: string): void
  removeItem(key: string): void
}

export interface StepSyncOptions {
  readonly projectId: string
  /** Sends one step's change and resolves with what the server saved (rejects as `apiFetch` does). */
  readonly send: (body: StepUpdateInput) => Promise<StepProgress>
  /** Where waiting changes are kept across reloads; null keeps them in memory only. */
  readonly storage?: KeyValueStorage | null
  /** Told of each step the server saved, with its answer. */
  readonly onSaved?: (step: StepProgress) => void
  readonly now?: () => number
  readonly random?: () => number
}

export interface StepSyncState {
  readonly queue: PendingQueue
  /** Steps whose change is on its way now. */
  readonly sending: ReadonlySet<string>
  /** Steps whose last change the server refused for good, with its reason. */
  readonly refused: Readonly<Record<string, string>>
  /** The server answered 401: the quilter must sign in again before anything more is saved. */
  readonly signedOut: boolean
  /** When the next retry is due (ms since the epoch), or null when nothing waits for one. */
  readonly nextRetryAt: number | null
  /** When the server last confirmed a change (ms since the epoch). */
  readonly lastSavedAt: number | null
}

export interface StepSync {
  getState(): StepSyncState
  subscribe(listener: () => void): () => void
  /** A tick, untick or note: shown at once, sent as soon as it can be. */
  change(change: StepChange): void
  /** Sends every waiting change now (the connection came back, or the quilter asked). */
  retryNow(): void
  /** Stops the timers; waiting changes stay in storage for the next visit. */
  dispose(): void
}

/** Changes sent at the same time at most: different steps, so their order does not matter. */
const MOST_IN_FLIGHT = 4
/** After a 401, wait this long before trying again (the quilter may sign in in another tab). */
const SIGNED_OUT_RETRY_MS = 15_000

export type FailureKind = 'retry' | 'refused' | 'signed-out'

/**
 * What a failed send means: worth retrying (no connection, a timeout, a busy or broken server, a
 * rate limit), refused for good (the step or project is not there, the change is not allowed), or
 * signed out.
 *
 * @example classifyFailure(new TypeError('Failed to fetch')).kind // 'retry'
 */
export function classifyFailure(error: unknown): { kind: FailureKind; message: string; retryAfterSeconds?: number } {
  if (error instanceof ApiError) {
    const retryAfter = typeof error.body.retryAfterSeconds === 'number' ? error.body.retryAfterSeconds : undefined
    if (error.status === 401) return { kind: 'signed-out', message: 'Signed out: sign in again to save.' }
    if (error.status === 408 || error.status === 425 || error.status === 429 || error.status >= 500 || error.status === 0) {
      return { kind: 'retry', message: error.status === 429 ? 'The server asked us to wait.' : 'The server did not save it.', retryAfterSeconds: retryAfter }
    }
    return { kind: 'refused', message: error.message }
  }
  return { kind: 'retry', message: 'No connection.' }
}

/**
 * A step sync for one project, starting from what storage kept of an earlier visit.
 *
 * @example const sync = createStepSync({ projectId, send: (body) => patchStep(projectId, body), storage: localStorage })
 */
export function createStepSync(options: StepSyncOptions): StepSync {
  const now = options.now ?? (() => Date.now())
  const key = storageKeyOf(options.projectId)
  const storage = options.storage ?? null
  const listeners = new Set<() => void>()
  let timer: ReturnType<typeof setTimeout> | undefined
  let disposed = false
  let state: StepSyncState = {
    queue: readStored(),
    sending: new Set(),
    refused: {},
    signedOut: false,
    nextRetryAt: null,
    lastSavedAt: null,
  }

  function readStored(): PendingQueue {
    try {
      return readQueue(storage?.getItem(key) ?? null)
    } catch {
      return []
    }
  }

  function persist(queue: PendingQueue): void {
    try {
      if (queue.length === 0) storage?.removeItem(key)
      else storage?.setItem(key, serializeQueue(queue))
    } catch {
      // A full or forbidden storage (private browsing) only loses the copy for a reload.
    }
  }

  function update(next: Partial<StepSyncState>): void {
    if (next.queue && next.queue !== state.queue) persist(next.queue)
    state = { ...state, ...next }
    for (const listener of listeners) listener()
  }

  function schedule(): void {
    clearTimeout(timer)
    timer = undefined
    if (disposed) return
    const due = nextDueAt(state.queue, state.sending)
    if (due !== state.nextRetryAt) update({ nextRetryAt: due !== null && due > now() ? due : null })
    if (due === null) return
    timer = setTimeout(pump, Math.max(0, due - now()))
  }

  function pump(): void {
    if (disposed) return
    const room = MOST_IN_FLIGHT - state.sending.size
    const due = dueChanges(state.queue, now(), state.sending).slice(0, Math.max(0, room))
    for (const entry of due) void sendOne(entry.stepId, entry.version)
    schedule()
  }

  async function sendOne(stepId: string, version: number): Promise<void> {
    const entry = state.queue.find((candidate) => candidate.stepId === stepId)
    if (!entry) return
    let body: StepUpdateInput
    try {
      body = requestBodyOf(entry)
    } catch {
      update({ queue: withoutStep(state.queue, stepId), refused: { ...state.refused, [stepId]: 'This change cannot be saved.' } })
      return
    }
    update({ sending: new Set([...state.sending, stepId]) })
    try {
      const saved = await options.send(body)
      if (disposed) return
      options.onSaved?.(saved)
      const { [stepId]: _cleared, ...refused } = state.refused
      update({ queue: afterSaved(state.queue, stepId, version), sending: without(state.sending, stepId), refused, signedOut: false, lastSavedAt: now() })
    } catch (error) {
      if (disposed) return
      const failure = classifyFailure(error)
      const sending = without(state.sending, stepId)
      if (failure.kind === 'refused') {
        update({ queue: withoutStep(state.queue, stepId), sending, refused: { ...state.refused, [stepId]: failure.message } })
      } else {
        const failures = (state.queue.find((candidate) => candidate.stepId === stepId)?.failures ?? 0) + 1
        const delay = failure.kind === 'signed-out' ? SIGNED_OUT_RETRY_MS : retryDelayMs(failures, options.random, failure.retryAfterSeconds)
        update({ queue: afterFailed(state.queue, stepId, now(), delay, failure.message), sending, signedOut: failure.kind === 'signed-out' })
      }
    }
    pump()
  }

  if (state.queue.length > 0) queueMicrotask(pump)

  return {
    getState: () => state,
    subscribe(listener) {
      listeners.add(listener)
      return () => listeners.delete(listener)
    },
    change(change) {
      const { [change.stepId]: _cleared, ...refused } = state.refused
      update({ queue: queueChange(state.queue, change), refused })
      pump()
    },
    retryNow() {
      update({ queue: state.queue.map((entry) => ({ ...entry, notBefore: 0 })) })
      pump()
    },
    dispose() {
      disposed = true
      clearTimeout(timer)
      listeners.clear()
    },
  }
}

function without(set: ReadonlySet<string>, item: string): Set<string> {
  const next = new Set(set)
  next.delete(item)
  return next
}
