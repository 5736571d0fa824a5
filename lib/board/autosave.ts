/**
 * Saving the drafting board: the save state machine. Framework-free so it can be tested with a
 * fake fetch, a fake storage and fake timers; React reads it through getState/subscribe. It talks
 * to the server through ./pattern-api.ts and keeps drafts by the rules of ./local-draft.ts.
 *
 * - A save goes out ~1 s after the last change, never mid-drag, one request at a time; changes
 *   made while a request is out are coalesced into the next one.
 * - Every save names the revision the board last saw. A 409 means the pattern was saved elsewhere
 *   meanwhile: saving stops (nothing is overwritten on either side) until the designer chooses
 *   `reloadTheirs()` or `keepMine()` — unless the design there is still the one this board last
 *   saved (the pattern was only renamed or changed state), when the save simply goes on top.
 * - Every change is also written to localStorage as a draft, cleared once the server has it, so a
 *   crash or a closed tab loses nothing; the next visit offers the draft back.
 *
 * Where the machine is, is one field, `phase`:
 *
 *   idle ──change──▶ waiting ──quiet time──▶ saving ──saved──▶ idle (or waiting: changes made meanwhile)
 *                                              ├──failed──▶ retrying ──retry time──▶ saving
 *                                              ├──refused──▶ refused ──change──▶ waiting
 *                                              └──409──▶ conflict ──reload / keep mine──▶ resolving ──▶ idle (or conflict)
 */
import type { DesignFile } from '@/lib/schemas/design'
import { createLocalDrafts, isSameDesign, type DraftStorage, type LocalDraft } from './local-draft'
import { createPatternApi, UNREACHABLE } from './pattern-api'

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

/**
 * Where the save machine is:
 * - `idle`: nothing to send (saved, or a drag not yet let go);
 * - `waiting`: a save goes out when the quiet time after the last change is over;
 * - `saving`: a request is out (changes made meanwhile wait for it);
 * - `retrying`: the last save failed (network, server, signed out) and is retried at `retryAt`;
 * - `refused`: the server refused the design; the next change is saved anew;
 * - `conflict`: saved elsewhere meanwhile; nothing is saved until the designer chooses;
 * - `resolving`: the designer's choice (reload theirs, keep mine) is under way.
 */
export type SavePhase = 'idle' | 'waiting' | 'saving' | 'retrying' | 'refused' | 'conflict' | 'resolving'

/** What the save indicator says, from the phase and whether the board differs from the server. */
export type SaveStatus = 'saved' | 'unsaved' | 'saving' | 'error' | 'conflict'

export interface AutosaveState {
  readonly phase: SavePhase
  readonly status: SaveStatus
  /** The server revision the board's last saved design is; the next save starts from it. */
  readonly revision: number
  /** When the server last confirmed a save (ISO time), or null before the first one. */
  readonly lastSavedAt: string | null
  /** Why the last save or resolution failed, in plain words, or null; kept until a save succeeds. */
  readonly problem: string | null
  /** When the next automatic retry goes out (ms since 1970), or null if none is planned. */
  readonly retryAt: number | null
  /** In a conflict: the revision now on the server, as the 409 named it. */
  readonly conflictRevision: number | null
  /** A reload or keep-mine is under way (phase `resolving`). */
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

/** Phases in which the machine sends nothing on its own: a request is out, or the designer must choose. */
const BUSY: ReadonlySet<SavePhase> = new Set(['saving', 'conflict', 'resolving'])

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
  const api = createPatternApi(patternId, options.fetch)
  const drafts = createLocalDrafts(options.storage ?? null, patternId)
  const debounceMs = options.debounceMs ?? SAVE_DELAY_MS

  let phase: SavePhase = 'idle'
  let revision = options.revision
  /** The design the server holds at `revision` (by reference: the store never mutates designs). */
  let savedDesign = store.getState().history.present
  let observed = savedDesign
  let observedDragging = store.getState().history.mark !== null
  let problem: string | null = null
  let conflictRevision: number | null = null
  let failures = 0
  let timer: ReturnType<typeof setTimeout> | null = null
  let retryAt: number | null = null
  let lastSavedAt: string | null = null
  let unsubscribe: (() => void) | null = null
  /** Set while the autosaver itself replaces the design with the server's, which is not a change. */
  let adopting = false

  const listeners = new Set<() => void>()
  let state = snapshot()

  function snapshot(): AutosaveState {
    const dirty = store.getState().history.present !== savedDesign
    const status: SaveStatus =
      phase === 'conflict' || phase === 'resolving' ? 'conflict' : problem !== null ? 'error' : phase === 'saving' ? 'saving' : dirty ? 'unsaved' : 'saved'
    return {
      phase, status, revision, lastSavedAt, problem, retryAt, conflictRevision, resolving: phase === 'resolving', recoverableDraft: drafts.recoverable,
    }
  }

  function publish() {
    const next = snapshot()
    const changed = (Object.keys(next) as (keyof AutosaveState)[]).some((key) => next[key] !== state[key])
    if (!changed) return
    state = next
    for (const listener of listeners) listener()
  }

  function cancelTimer() {
    if (timer !== null) clearTimeout(timer)
    timer = null
    retryAt = null
  }
  /** Sends a save after `delayMs`; while a request is out, the phase stays `saving` until it answers. */
  function saveAfter(delayMs: number, next: 'waiting' | 'retrying' = 'waiting') {
    cancelTimer()
    if (phase !== 'saving') phase = next
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
      if (phase !== 'saving') {
        drafts.drop()
        problem = null
        cancelTimer()
        if (!BUSY.has(phase)) phase = 'idle'
      }
      return publish()
    }
    drafts.keep(present, revision)
    // In a conflict nothing is saved until the designer chooses; while retrying, the retry goes
    // first; while saving, the next save waits its quiet time and the answer.
    if (phase !== 'conflict' && phase !== 'resolving' && phase !== 'retrying') saveAfter(debounceMs)
    publish()
  }

  /**
   * After a 409: whether the newer revision on the server has the very design this board last
   * saved (only the pattern's name or state changed). If so its revision is adopted.
   */
  async function isOnlyDetailsChangedElsewhere(): Promise<boolean> {
    try {
      const saved = await api.load()
      if (!isSameDesign(saved.design, savedDesign)) return false
      revision = saved.revision
      return true
    } catch {
      return false
    }
  }

  async function save({ force = false, keepalive = false } = {}): Promise<void> {
    if (BUSY.has(phase)) return
    const { present, mark } = store.getState().history
    if (mark !== null) return // the drag's end schedules the save
    if (!force && (present === savedDesign || isSameDesign(present, savedDesign))) {
      // Nothing to send; a command that changed nothing (the same value typed again) makes no empty revision.
      if (present !== savedDesign) drafts.drop()
      savedDesign = present
      problem = null
      phase = timer !== null ? phase : 'idle'
      return publish()
    }
    phase = 'saving'
    publish()
    const outcome = await api.save(revision, present, { keepalive })
    phase = 'idle'
    if (outcome.kind === 'saved') {
      revision = outcome.revision
      savedDesign = present
      lastSavedAt = new Date().toISOString()
      problem = null
      failures = 0
      const now = store.getState().history.present
      if (now === savedDesign) drafts.drop()
      else drafts.keep(now, revision)
      // Changes made while this request was out: their quiet time may be over already.
      if (timer !== null) phase = 'waiting'
      else if (now !== savedDesign && store.getState().history.mark === null) saveAfter(0)
    } else if (outcome.kind === 'conflict' && !force && !keepalive && (await isOnlyDetailsChangedElsewhere())) {
      // Renamed or moved to another state elsewhere, the design untouched: nothing to choose
      // between, so the change goes out again on top of the newer revision.
      problem = null
      saveAfter(0)
    } else if (outcome.kind === 'conflict') {
      cancelTimer()
      phase = 'conflict'
      conflictRevision = outcome.currentRevision
      problem = null
    } else if (outcome.kind === 'invalid') {
      // Sending the same design again would be refused again; the next change tries anew.
      cancelTimer()
      phase = 'refused'
      problem = outcome.message
    } else {
      problem = outcome.message
      failures += 1
      const delay = RETRY_DELAYS_MS[Math.min(failures, RETRY_DELAYS_MS.length) - 1] ?? SAVE_DELAY_MS
      saveAfter(delay, 'retrying')
      retryAt = Date.now() + delay
    }
    publish()
  }

  /** Runs the designer's answer to a conflict; if it fails, the conflict stays, with the reason. */
  async function resolve(work: () => Promise<void>) {
    if (phase !== 'conflict') return
    phase = 'resolving'
    problem = null
    publish()
    try {
      await work()
    } catch (error) {
      phase = 'conflict'
      problem = error instanceof Error ? error.message : UNREACHABLE
    }
    publish()
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
      drafts.lookForRecoverable(savedDesign)
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
      if (problem === null) return Promise.resolve()
      cancelTimer()
      return save()
    },
    reloadTheirs: () =>
      resolve(async () => {
        const saved = await api.load()
        adopting = true
        try {
          store.run('replaceDesign', { design: saved.design })
        } finally {
          adopting = false
        }
        savedDesign = store.getState().history.present
        observed = savedDesign
        revision = saved.revision
        phase = 'idle'
        conflictRevision = null
        lastSavedAt = new Date().toISOString()
        drafts.drop()
      }),
    keepMine: () =>
      resolve(async () => {
        const saved = await api.load()
        revision = saved.revision
        phase = 'idle'
        conflictRevision = null
        // Forced: even if the board was undone back to the old design, the designer chose it.
        await save({ force: true })
      }),
    flushOnLeave() {
      const { present, mark } = store.getState().history
      if (present !== savedDesign) drafts.keep(present, revision)
      // Mid-drag or mid-request the draft carries the change to the next visit instead; a second
      // request from the same revision would only meet the first one as a conflict.
      if (mark !== null || BUSY.has(phase) || present === savedDesign) return
      cancelTimer()
      // keepalive lets the request outlive the page (its body must stay under 64 KiB).
      void save({ keepalive: true })
    },
    restoreDraft() {
      const draft = drafts.takeRecoverable()
      if (!draft) return
      store.run('replaceDesign', { design: draft.design })
      publish()
    },
    discardDraft() {
      if (!drafts.recoverable) return
      const present = store.getState().history.present
      drafts.discardRecoverable(present === savedDesign ? null : { design: present, baseRevision: revision })
      publish()
    },
  }
}
