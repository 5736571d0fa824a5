/**
 * The steps a quilter changed that the server has not confirmed yet: at most one entry per step,
 * in the order they were first changed. Pure functions over a plain array, so the page, the
 * localStorage copy (which survives a reload or a dropped connection) and the tests all share them.
 *
 * Why one entry per step: the server takes one step per PATCH and keeps each step on its own row,
 * so a tick sent from here can never overwrite another step; ticking and unticking the same step
 * while it waits only changes what that one entry will send. Every change bumps the entry's
 * `version`; a send answers for the version it carried, so a change made while a request was on
 * its way is sent again afterwards rather than lost.
 */
import { stepUpdateSchema, type StepUpdateInput } from '@/lib/schemas/sewing-room'

export interface PendingChange {
  readonly stepId: string
  /** Ticked (true) or unticked (false); absent when only the note changed. */
  readonly done?: boolean
  /** The step's note; null clears it; absent when only the tick changed. */
  readonly note?: string | null
  /** Grows with each change to this step while it waits. */
  readonly version: number
  /** Failed sends so far (for the back-off). */
  readonly failures: number
  /** Not sent again before this time (ms since the epoch); 0 sends at once. */
  readonly notBefore: number
  /** Why the last send failed, in words, for the step's status. */
  readonly lastError?: string
}

export type PendingQueue = readonly PendingChange[]

/** One change as the quilter makes it (the PATCH body's shape). */
export type StepChange = Pick<StepUpdateInput, 'stepId' | 'done' | 'note'>

/**
 * The queue with `change` added: merged into the step's waiting entry when there is one (the later
 * tick and the later note win), which is then due at once with its back-off count kept.
 *
 * @example queueChange([], { stepId: 'cut:background', done: true })[0].version // 1
 */
export function queueChange(queue: PendingQueue, change: StepChange): PendingQueue {
  const existing = queue.find((entry) => entry.stepId === change.stepId)
  if (!existing) return [...queue, { ...fieldsOf(change), stepId: change.stepId, version: 1, failures: 0, notBefore: 0 }]
  return queue.map((entry) =>
    entry === existing ? { ...entry, ...fieldsOf(change), version: entry.version + 1, notBefore: 0, lastError: undefined } : entry,
  )
}

/** The entries to send now: due, and not already on their way. */
export function dueChanges(queue: PendingQueue, now: number, inFlight: ReadonlySet<string>): PendingQueue {
  return queue.filter((entry) => entry.notBefore <= now && !inFlight.has(entry.stepId))
}

/** When the next waiting entry falls due (ms since the epoch), or null when nothing waits. */
export function nextDueAt(queue: PendingQueue, inFlight: ReadonlySet<string>): number | null {
  const times = queue.filter((entry) => !inFlight.has(entry.stepId)).map((entry) => entry.notBefore)
  return times.length === 0 ? null : Math.min(...times)
}

/**
 * The server saved `version` of the step's change: the entry goes, unless the quilter changed the
 * step again meanwhile, in which case the newer change stays, due at once.
 *
 * @example afterSaved([{ stepId: 'a', done: true, version: 2, failures: 0, notBefore: 0 }], 'a', 1).length // 1
 */
export function afterSaved(queue: PendingQueue, stepId: string, version: number): PendingQueue {
  return queue.flatMap((entry) => {
    if (entry.stepId !== stepId) return [entry]
    if (entry.version === version) return []
    return [{ ...entry, failures: 0, notBefore: 0, lastError: undefined }]
  })
}

/** A send failed and may be tried again after `delayMs`. */
export function afterFailed(queue: PendingQueue, stepId: string, now: number, delayMs: number, error: string): PendingQueue {
  return queue.map((entry) => (entry.stepId === stepId ? { ...entry, failures: entry.failures + 1, notBefore: now + delayMs, lastError: error } : entry))
}

/** The server refused the change for good (the step is not in the plan, the project is gone): it leaves the queue. */
export function withoutStep(queue: PendingQueue, stepId: string): PendingQueue {
  return queue.filter((entry) => entry.stepId !== stepId)
}

/** The PATCH body of an entry, through the server's own schema. */
export function requestBodyOf(entry: PendingChange): StepUpdateInput {
  return stepUpdateSchema.parse({ stepId: entry.stepId, ...fieldsOf(entry) })
}

/** Where a project's queue is kept in localStorage. */
export function storageKeyOf(projectId: string): string {
  return `wreathwright.sewing-room.pending.${projectId}`
}

/** The queue as stored. */
export function serializeQueue(queue: PendingQueue): string {
  return JSON.stringify({ version: 1, queue })
}

/**
 * A stored queue read back. Whatever does not read as a change (an older format, a hand-edited
 * value, a step id the schema refuses) is dropped rather than trusted; a change that waited is
 * due at once after a reload.
 *
 * @example readQueue('{"version":1,"queue":[{"stepId":"cut:background","done":true,"version":3,"failures":2,"notBefore":9}]}')[0].notBefore // 0
 */
export function readQueue(stored: string | null): PendingQueue {
  if (!stored) return []
  let parsed: unknown
  try {
    parsed = JSON.parse(stored)
  } catch {
    return []
  }
  const list = isRecord(parsed) && Array.isArray(parsed.queue) ? parsed.queue : []
  const seen = new Set<string>()
  return list.flatMap((item: unknown): PendingChange[] => {
    if (!isRecord(item)) return []
    const body = stepUpdateSchema.safeParse({
      stepId: item.stepId,
      ...(typeof item.done === 'boolean' && { done: item.done }),
      ...((typeof item.note === 'string' || item.note === null) && { note: item.note }),
    })
    if (!body.success || seen.has(body.data.stepId)) return []
    seen.add(body.data.stepId)
    const count = (value: unknown) => (typeof value === 'number' && Number.isInteger(value) && value >= 0 ? value : 0)
    return [{ ...fieldsOf(body.data), stepId: body.data.stepId, version: Math.max(1, count(item.version)), failures: count(item.failures), notBefore: 0 }]
  })
}

function fieldsOf(change: { readonly done?: boolean; readonly note?: string | null }): { done?: boolean; note?: string | null } {
  return { ...(change.done !== undefined && { done: change.done }), ...(change.note !== undefined && { note: change.note }) }
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value)
}
