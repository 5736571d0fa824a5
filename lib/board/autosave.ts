/**
 * Saving the drafting board through the pattern API, framework-free so it can be tested with a
 * fake fetch, a fake storage and fake timers; React reads it through getState/subscribe.
 *
 * - A save goes out ~1 s after the last change, never mid-drag, one request at a time; changes
 *   made while a request is out are coalesced into the next one.
 * - Every save names the revision the board last saw. A 409 means the pattern was saved elsewhere
 *   meanwhile: saving stops (nothing is overwritten on either side) until the designer chooses
 *   `reloadTheirs()` or `keepMine()` — unless the design there is still the one this board last
 *   saved (the pattern was only renamed or changed state), when the save simply goes on top.
 * - Every change is also written to localStorage as a draft, cleared once the server has it, so a
 *   crash or a closed tab loses nothing; the next visit offers the draft back.
 */
import { designFileSchema, type DesignFile } from '@/lib/schemas/design'
import { clearLocalDraft, findRecoverableDraft, isSameDesign, writeLocalDraft, type DraftStorage, type LocalDraft } from './local-draft'

/** The part of the board store (lib/board/store.ts) the autosaver needs. */
export interface AutosaveStore {
  getState(): { readonly history: { readonly present: DesignFile; readonly mark: number | null } }
  subscribe(listener: () => void): () => void
  run(name: 'replaceDesign', args: { design: DesignFile }): void
}

/** Quiet time after the last change before it is saved. */
export const SAVE_DELAY_MS = 1_000

/** Waits before retrying a failed save: soon at first, then every 30 s while the network is out. */
export const RETRY_DELAYS_MS: readonly number[] = [2_000, 5_000, 15_000, 30_000]

export type SaveStatus = 'saved' | 'unsaved' | 'saving' | 'error' | 'conflict'

export interface AutosaveState {
  readonly status: SaveStatus
  /** The server revision the board's last saved design is; the next save starts from it. */
  readonly revision: number
  /** When the server last confirmed a save (ISO time), or null before the first one. */
  readonly lastSavedAt: string | null
  /** Why the last save or resolution failed, in plain words, or null. */
  readonly problem: string | null
  /** When the next automatic retry goes out (ms since 1970), or null if none is planned. */
  readonly retryAt: number | null
  /** In 'conflict': the revision now on the server, as the 409 named it. */
  readonly conflictRevision: number | null
  /** A reload or keep-mine is under way. */
  readonly resolving: boolean
  /** A draft left by an earlier visit that differs from the saved design, until restored or discarded. */
  readonly recoverableDraft: LocalDraft | null
}

export interface Autosaver {
  getState(): AutosaveState
  subscribe(listener: () => void): () => void
  /** Starts watching the store (and looks for a draft from an earlier visit); returns `stop`. */
  start(): () => void
  stop(): void
  /** Saves now instead of waiting for the quiet time (not mid-drag, not in a conflict). */
  saveNow(): Promise<void>
  /** Retries a failed save at once. */
  retryNow(): Promise<void>
  /** Conflict: show the version saved elsewhere; ours stays one undo step away. */
  reloadTheirs(): Promise<void>
  /** Conflict: save ours on top of the current revision; theirs stays in the revision history. */
  keepMine(): Promise<void>
  /** The page is going away: write the draft and send the last change with keepalive. */
  flushOnLeave(): void
  /** Puts the recoverable draft on the board as one undo step; it is then saved like any change. */
  restoreDraft(): void
  /** Forgets the recoverable draft. */
  discardDraft(): void
}

export interface AutosaverOptions {
  readonly patternId: string
  /** The revision of the design the store was created with. */
  readonly revision: number
  readonly store: AutosaveStore
  readonly fetch?: typeof fetch
  /** Where drafts are kept; null keeps none (server rendering, storage switched off). */
  readonly storage?: DraftStorage | null
  readonly debounceMs?: number
}

// ---------------------------------------------------------------------------------------------
// Talking to the pattern API

type SaveOutcome =
  | { readonly kind: 'saved'; readonly revision: number }
  | { readonly kind: 'conflict'; readonly currentRevision: number | null }
  | { readonly kind: 'invalid'; readonly message: string }
  | { readonly kind: 'failed'; readonly message: string }

const UNREACHABLE = 'Could not reach Wreathwright.'

async function readJson(response: Response): Promise<Record<string, unknown>> {
  try {
    const body: unknown = await response.json()
    return body && typeof body === 'object' ? (body as Record<string, unknown>) : {}
  } catch {
    return {}
  }
}

function errorOf(body: Record<string, unknown>): { message?: unknown; currentRevision?: unknown; issues?: unknown } {
  return (body.error && typeof body.error === 'object' ? body.error : {}) as Record<string, unknown>
}

function failureMessage(status: number, body: Record<string, unknown>): string {
  if (status === 401) return 'You are signed out. Sign in again (in another tab) and saving carries on.'
  const message = errorOf(body).message
  return typeof message === 'string' ? message : `The server answered ${status}.`
}

// ---------------------------------------------------------------------------------------------
// The controller

/**
 * Creates the board's autosaver. It does nothing until `start()`.
 *
 * @example
 * const autosaver = createAutosaver({ patternId: pattern.id, revision: pattern.revision, store, storage: localStorage })
 * const stop = autosaver.start()
 * window.addEventListener('pagehide', () => autosaver.flushOnLeave())
 */
export function createAutosaver(options: AutosaverOptions): Autosaver {
  const { patternId, store } = options
  const request = options.fetch ?? ((input: RequestInfo | URL, init?: RequestInit) => globalThis.fetch(input, init))
  const storage = options.storage ?? null
  const debounceMs = options.debounceMs ?? SAVE_DELAY_MS
  const url = `/api/patterns/${encodeURIComponent(patternId)}`
  // Not crypto.randomUUID: that exists only on secure origins, and a board may be opened over plain http on a LAN.
  const writer = Math.random().toString(36).slice(2, 12)

  let revision = options.revision
  /** The design the server holds at `revision` (by reference: the store never mutates designs). */
  let savedDesign = store.getState().history.present
  let observed = savedDesign
  let observedDragging = store.getState().history.mark !== null
  let inFlight = false
  let resolving = false
  let conflictRevision: number | null = null
  let inConflict = false
  let failure: { message: string; retry: boolean } | null = null
  let failures = 0
  let timer: ReturnType<typeof setTimeout> | null = null
  let retryAt: number | null = null
  let lastSavedAt: string | null = null
  let recoverableDraft: LocalDraft | null = null
  let lookedForDraft = false
  let unsubscribe: (() => void) | null = null
  /** Set while the autosaver itself replaces the design with the server's, which is not a change. */
  let adopting = false

  const listeners = new Set<() => void>()
  let state = snapshot()

  function snapshot(): AutosaveState {
    const dirty = store.getState().history.present !== savedDesign
    const status: SaveStatus = inConflict ? 'conflict' : failure ? 'error' : inFlight ? 'saving' : dirty ? 'unsaved' : 'saved'
    return { status, revision, lastSavedAt, problem: failure?.message ?? null, retryAt, conflictRevision, resolving, recoverableDraft }
  }

  function publish() {
    const next = snapshot()
    const changed = (Object.keys(next) as (keyof AutosaveState)[]).some((key) => next[key] !== state[key])
    if (!changed) return
    state = next
    for (const listener of listeners) listener()
  }

  // While an old draft waits for the designer's answer it stays in storage untouched: the current
  // work is on its way to the server anyway, and the old one must survive another crash.
  function keepDraft(design: DesignFile) {
    if (recoverableDraft) return
    writeLocalDraft(storage, { patternId, baseRevision: revision, savedAt: new Date().toISOString(), design, writer })
  }
  function dropDraft() {
    if (!recoverableDraft) clearLocalDraft(storage, patternId, writer)
  }

  function cancelTimer() {
    if (timer !== null) clearTimeout(timer)
    timer = null
    retryAt = null
  }
  function schedule(delayMs: number) {
    cancelTimer()
    timer = setTimeout(() => {
      timer = null
      retryAt = null
      void save()
    }, delayMs)
  }

  function onStoreChange() {
    const { present, mark } = store.getState().history
    const dragging = mark !== null
    if (present === observed && dragging === observedDragging) return // the view, tool or selection changed
    observed = present
    observedDragging = dragging
    if (adopting) {
      savedDesign = present
      return
    }
    // Mid-drag the design changes on every pointer move; the drag's end is the change to save.
    if (dragging) return publish()
    if (present === savedDesign) {
      // Undone back to what the server has: nothing is left to save or to retry.
      if (!inFlight) {
        dropDraft()
        failure = null
        cancelTimer()
      }
      return publish()
    }
    keepDraft(present)
    // In a conflict nothing is saved until the designer chooses; while retrying, the retry goes first.
    if (!inConflict && !(failure?.retry && timer !== null)) schedule(debounceMs)
    publish()
  }

  async function patch(design: DesignFile, keepalive: boolean): Promise<SaveOutcome> {
    let response: Response
    try {
      response = await request(url, {
        method: 'PATCH',
        headers: { 'content-type': 'application/json', accept: 'application/json' },
        body: JSON.stringify({ revision, design }),
        credentials: 'same-origin',
        keepalive,
      })
    } catch {
      return { kind: 'failed', message: UNREACHABLE }
    }
    const body = await readJson(response)
    if (response.ok) {
      const saved = (body.pattern as { revision?: unknown } | undefined)?.revision
      return typeof saved === 'number' ? { kind: 'saved', revision: saved } : { kind: 'failed', message: 'The server’s answer made no sense.' }
    }
    if (response.status === 409) {
      const current = errorOf(body).currentRevision
      return { kind: 'conflict', currentRevision: typeof current === 'number' ? current : null }
    }
    if (response.status === 422) {
      const issues = errorOf(body).issues
      const first = Array.isArray(issues) ? (issues[0] as { path?: string; message?: string } | undefined) : undefined
      const detail = first ? `${first.path ?? ''}: ${first.message ?? ''}` : failureMessage(422, body)
      return { kind: 'invalid', message: `The server refused this design (${detail}).` }
    }
    return { kind: 'failed', message: failureMessage(response.status, body) }
  }

  async function fetchSaved(): Promise<{ revision: number; design: DesignFile }> {
    let response: Response
    try {
      response = await request(url, { headers: { accept: 'application/json' }, credentials: 'same-origin' })
    } catch {
      throw new Error(UNREACHABLE)
    }
    const body = await readJson(response)
    if (!response.ok) throw new Error(failureMessage(response.status, body))
    const pattern = body.pattern as { revision?: unknown; design?: unknown } | undefined
    const design = designFileSchema.safeParse(pattern?.design)
    if (typeof pattern?.revision !== 'number' || !design.success) throw new Error('The saved pattern could not be read.')
    return { revision: pattern.revision, design: design.data }
  }

  /**
   * After a 409: whether the newer revision on the server has the very design this board last
   * saved (only the pattern's name or state changed). If so its revision is adopted.
   */
  async function isOnlyDetailsChangedElsewhere(): Promise<boolean> {
    try {
      const saved = await fetchSaved()
      if (!isSameDesign(saved.design, savedDesign)) return false
      revision = saved.revision
      return true
    } catch {
      return false
    }
  }

  async function save({ force = false, keepalive = false } = {}): Promise<void> {
    if (inFlight || inConflict || resolving) return
    const { present, mark } = store.getState().history
    if (mark !== null) return // the drag's end schedules the save
    if (!force && present === savedDesign) {
      failure = null
      return publish()
    }
    if (!force && isSameDesign(present, savedDesign)) {
      // A command that changed nothing (the same value typed again) makes no empty revision.
      savedDesign = present
      failure = null
      dropDraft()
      return publish()
    }
    inFlight = true
    publish()
    const outcome = await patch(present, keepalive)
    inFlight = false
    if (outcome.kind === 'saved') {
      revision = outcome.revision
      savedDesign = present
      lastSavedAt = new Date().toISOString()
      failure = null
      failures = 0
      if (timer !== null && retryAt !== null) cancelTimer()
      const now = store.getState().history.present
      if (now === savedDesign) dropDraft()
      else {
        keepDraft(now)
        // Changes made while this request was out: their quiet time may be over already.
        if (timer === null) schedule(0)
      }
    } else if (outcome.kind === 'conflict' && !force && !keepalive && (await isOnlyDetailsChangedElsewhere())) {
      // Renamed or moved to another state elsewhere, the design untouched: nothing to choose
      // between, so the change goes out again on top of the newer revision.
      failure = null
      schedule(0)
    } else if (outcome.kind === 'conflict') {
      inConflict = true
      conflictRevision = outcome.currentRevision
      failure = null
      cancelTimer()
    } else if (outcome.kind === 'invalid') {
      // Sending the same design again would be refused again; the next change tries anew.
      failure = { message: outcome.message, retry: false }
      cancelTimer()
    } else {
      failure = { message: outcome.message, retry: true }
      failures += 1
      const delay = RETRY_DELAYS_MS[Math.min(failures, RETRY_DELAYS_MS.length) - 1] ?? SAVE_DELAY_MS
      schedule(delay)
      retryAt = Date.now() + delay
    }
    publish()
  }

  async function resolve(work: () => Promise<void>) {
    if (!inConflict || resolving || inFlight) return
    resolving = true
    failure = null
    publish()
    try {
      await work()
    } catch (error) {
      failure = { message: error instanceof Error ? error.message : UNREACHABLE, retry: false }
    } finally {
      resolving = false
      publish()
    }
  }

  function stop() {
    unsubscribe?.()
    unsubscribe = null
    cancelTimer()
  }

  return {
    getState: () => state,
    subscribe(listener) {
      listeners.add(listener)
      return () => listeners.delete(listener)
    },
    start() {
      if (unsubscribe) return stop
      if (!lookedForDraft) {
        // Read before this visit writes a draft of its own over it.
        lookedForDraft = true
        recoverableDraft = findRecoverableDraft(storage, patternId, savedDesign)
        if (!recoverableDraft) clearLocalDraft(storage, patternId)
      }
      unsubscribe = store.subscribe(onStoreChange)
      onStoreChange()
      publish()
      return stop
    },
    stop,
    saveNow() {
      cancelTimer()
      return save()
    },
    retryNow() {
      if (!failure) return Promise.resolve()
      cancelTimer()
      return save()
    },
    reloadTheirs: () =>
      resolve(async () => {
        const saved = await fetchSaved()
        adopting = true
        try {
          store.run('replaceDesign', { design: saved.design })
        } finally {
          adopting = false
        }
        savedDesign = store.getState().history.present
        observed = savedDesign
        revision = saved.revision
        inConflict = false
        conflictRevision = null
        lastSavedAt = new Date().toISOString()
        dropDraft()
      }),
    keepMine: () =>
      resolve(async () => {
        const saved = await fetchSaved()
        revision = saved.revision
        inConflict = false
        conflictRevision = null
        resolving = false
        // Forced: even if the board was undone back to the old design, the designer chose it.
        await save({ force: true })
      }),
    flushOnLeave() {
      const { present, mark } = store.getState().history
      if (present !== savedDesign) keepDraft(present)
      // Mid-drag or mid-request the draft carries the change to the next visit instead; a second
      // request from the same revision would only meet the first one as a conflict.
      if (mark !== null || inFlight || inConflict || resolving || present === savedDesign) return
      cancelTimer()
      // keepalive lets the request outlive the page (its body must stay under 64 KiB).
      void save({ keepalive: true })
    },
    restoreDraft() {
      const draft = recoverableDraft
      if (!draft) return
      recoverableDraft = null
      store.run('replaceDesign', { design: draft.design })
      publish()
    },
    discardDraft() {
      if (!recoverableDraft) return
      recoverableDraft = null
      const present = store.getState().history.present
      // The stored draft is still the one offered (nothing was written over it meanwhile), so it
      // goes whoever wrote it.
      if (present === savedDesign) clearLocalDraft(storage, patternId)
      else keepDraft(present)
      publish()
    },
  }
}
