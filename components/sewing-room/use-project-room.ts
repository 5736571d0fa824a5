'use client'

import { useCallback, useEffect, useMemo, useRef, useState, useSyncExternalStore } from 'react'
import { ApiError, type Tagged } from '@/lib/api-client'
import type { ProjectDetail, ProjectStep } from '@/lib/schemas/sewing-room'
import { fetchProject, patchStep } from '@/lib/sewing-room-client/api'
import { applySaved, mergeServerSteps, overlayPending, type ShownStep } from '@/lib/sewing-room-client/merge'
import type { StepChange } from '@/lib/sewing-room-client/pending-queue'
import { createStepSync, type StepSync, type StepSyncState } from '@/lib/sewing-room-client/step-sync'
import { recordTick, undoLastTick, type Tick } from '@/lib/sewing-room-client/tick-history'

/** While the page is in view, it asks for the other devices' ticks this often. */
const REFRESH_MS = 30_000

const EMPTY_STATE: StepSyncState = { queue: [], sending: new Set(), refused: {}, signedOut: false, nextRetryAt: null, lastSavedAt: null }

/** localStorage when the browser lets the page have it (private modes may not). */
function browserStorage(): Storage | null {
  try {
    return window.localStorage
  } catch {
    return null
  }
}

export interface ProjectRoom {
  readonly detail: ProjectDetail | null
  readonly steps: ShownStep[]
  readonly sync: StepSyncState
  readonly loadProblem: { message: string; status: number } | null
  /** Steps saved on the server during this visit (for their "saved" mark). */
  readonly savedHere: ReadonlySet<string>
  readonly lastTick: Tick | null
  setDone(step: ProjectStep, done: boolean): void
  setNote(stepId: string, note: string | null): void
  undo(): void
  retryNow(): void
}

/**
 * A project's page state: the server's copy of the steps (fetched, refreshed when the page comes
 * back into view and every half minute), the quilter's unsaved changes laid over it by the step
 * sync, and the ticks "undo" can take back.
 */
export function useProjectRoom(projectId: string): ProjectRoom {
  const [detail, setDetail] = useState<ProjectDetail | null>(null)
  const [serverSteps, setServerSteps] = useState<ProjectStep[]>([])
  const [loadProblem, setLoadProblem] = useState<{ message: string; status: number } | null>(null)
  const [savedHere, setSavedHere] = useState<ReadonlySet<string>>(new Set())
  const [history, setHistory] = useState<Tick[]>([])
  const [sync, setSync] = useState<StepSync | null>(null)
  const loading = useRef(false)
  /** The last answer with its tag: a refresh is answered 304, without the body, while it holds. */
  const lastAnswer = useRef<Tagged<ProjectDetail> | null>(null)

  useEffect(() => {
    const created = createStepSync({
      projectId,
      send: (body) => patchStep(projectId, body),
      storage: browserStorage(),
      onSaved: (saved) => {
        setServerSteps((steps) => applySaved(steps, saved))
        setSavedHere((ids) => new Set([...ids, saved.id]))
      },
    })
    // eslint-disable-next-line react-hooks/set-state-in-effect -- the sync reads localStorage, which only the browser has, so it is made after hydration
    setSync(created)
    return () => created.dispose()
  }, [projectId])

  const syncState = useSyncExternalStore(
    useCallback((listener) => sync?.subscribe(listener) ?? (() => {}), [sync]),
    () => sync?.getState() ?? EMPTY_STATE,
    () => EMPTY_STATE,
  )

  const load = useCallback(async () => {
    if (loading.current) return
    loading.current = true
    try {
      const previous = lastAnswer.current
      const tagged = await fetchProject(projectId, previous)
      lastAnswer.current = tagged
      setLoadProblem(null)
      // Unchanged since the last answer (304): nothing to merge.
      if (tagged === previous) return
      const answer = tagged.value
      setDetail(answer)
      setServerSteps((known) => mergeServerSteps(known, answer.steps))
    } catch (error) {
      setLoadProblem(error instanceof ApiError ? { message: error.message, status: error.status } : { message: 'The server could not be reached.', status: 0 })
    } finally {
      loading.current = false
    }
  }, [projectId])

  useEffect(() => {
    // eslint-disable-next-line react-hooks/set-state-in-effect -- the fetch sets state once it answers
    void load()
    const whenVisible = () => {
      if (document.visibilityState === 'visible') void load()
    }
    const online = () => {
      sync?.retryNow()
      void load()
    }
    document.addEventListener('visibilitychange', whenVisible)
    window.addEventListener('focus', whenVisible)
    window.addEventListener('online', online)
    const timer = setInterval(whenVisible, REFRESH_MS)
    return () => {
      document.removeEventListener('visibilitychange', whenVisible)
      window.removeEventListener('focus', whenVisible)
      window.removeEventListener('online', online)
      clearInterval(timer)
    }
  }, [load, sync])

  const steps = useMemo(() => overlayPending(serverSteps, syncState.queue, syncState.refused), [serverSteps, syncState.queue, syncState.refused])

  const change = useCallback(
    (next: StepChange) => {
      setSavedHere((ids) => {
        if (!ids.has(next.stepId)) return ids
        const without = new Set(ids)
        without.delete(next.stepId)
        return without
      })
      sync?.change(next)
    },
    [sync],
  )

  return {
    detail,
    steps,
    sync: syncState,
    loadProblem,
    savedHere,
    lastTick: history.at(-1) ?? null,
    setDone(step, done) {
      setHistory((ticks) => recordTick(ticks, { stepId: step.id, done, label: step.label }))
      change({ stepId: step.id, done })
    },
    setNote(stepId, note) {
      change({ stepId, note })
    },
    undo() {
      const undone = undoLastTick(history)
      if (!undone) return
      setHistory(undone.history)
      change(undone.change)
    },
    retryNow() {
      sync?.retryNow()
    },
  }
}
