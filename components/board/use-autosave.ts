'use client'

/**
 * Wires the autosaver (lib/board/autosave.ts) to the board page.
 *
 * Mounting, in the board component that owns the store:
 *
 *   const autosave = useAutosave({ patternId, revision, store })
 *   <SaveStatus autosave={autosave} />
 *   <ConflictDialog autosave={autosave} />
 *   <DraftRecovery autosave={autosave} />       // no store prop: restoring goes through the autosaver
 *   <DesignFileButtons store={store} />
 *
 * `revision` is the revision the store's design was loaded at; later revisions are tracked by the
 * autosaver itself (read `autosave.state.revision`). A new autosaver is made only when the
 * pattern or the store changes.
 */
import { useEffect, useMemo, useSyncExternalStore } from 'react'
import { createAutosaver, type AutosaveState, type AutosaveStore } from '@/lib/board/autosave'
import type { DraftStorage } from '@/lib/board/local-draft'

export interface UseAutosave {
  readonly state: AutosaveState
  readonly saveNow: () => Promise<void>
  readonly retryNow: () => Promise<void>
  readonly reloadTheirs: () => Promise<void>
  readonly keepMine: () => Promise<void>
  readonly restoreDraft: () => void
  readonly discardDraft: () => void
}

export interface UseAutosaveOptions {
  readonly patternId: string
  readonly revision: number
  readonly store: AutosaveStore
  readonly debounceMs?: number
}

/** localStorage, or null where the browser refuses it (some private modes throw on access). */
function browserStorage(): DraftStorage | null {
  try {
    return typeof window === 'undefined' ? null : window.localStorage
  } catch {
    return null
  }
}

/**
 * Saves the board as the designer works and tells the page how saving goes.
 *
 * @example
 * const autosave = useAutosave({ patternId: pattern.id, revision: pattern.revision, store })
 * if (autosave.state.status === 'conflict') … // <ConflictDialog autosave={autosave} /> shows itself
 */
export function useAutosave({ patternId, revision, store, debounceMs }: UseAutosaveOptions): UseAutosave {
  // The revision (and the quiet time) are read once: after that the autosaver knows better than
  // the page's props, and a new autosaver for a new revision would meet its own saves as conflicts.
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const autosaver = useMemo(() => createAutosaver({ patternId, revision, store, storage: browserStorage(), debounceMs }), [patternId, store])

  useEffect(() => {
    const stop = autosaver.start()
    return () => {
      // Leaving the board by a link inside the app fires no pagehide: send what is not saved yet.
      autosaver.flushOnLeave()
      stop()
    }
  }, [autosaver])

  useEffect(() => {
    // pagehide is the last event a closing or navigating page reliably gets; a hidden tab may
    // never come back (mobile browsers discard them), so it is treated as leaving too.
    const onPageHide = () => autosaver.flushOnLeave()
    const onVisibilityChange = () => {
      if (document.visibilityState === 'hidden') autosaver.flushOnLeave()
    }
    const onBeforeUnload = (event: BeforeUnloadEvent) => {
      if (autosaver.getState().status === 'saved') return
      autosaver.flushOnLeave()
      // Asks the browser to confirm leaving; the draft keeps the work even if the designer goes.
      event.preventDefault()
      event.returnValue = ''
    }
    const onOnline = () => void autosaver.retryNow()
    window.addEventListener('pagehide', onPageHide)
    document.addEventListener('visibilitychange', onVisibilityChange)
    window.addEventListener('beforeunload', onBeforeUnload)
    window.addEventListener('online', onOnline)
    return () => {
      window.removeEventListener('pagehide', onPageHide)
      document.removeEventListener('visibilitychange', onVisibilityChange)
      window.removeEventListener('beforeunload', onBeforeUnload)
      window.removeEventListener('online', onOnline)
    }
  }, [autosaver])

  const state = useSyncExternalStore(autosaver.subscribe, autosaver.getState, autosaver.getState)

  return useMemo(
    () => ({
      state,
      saveNow: autosaver.saveNow,
      retryNow: autosaver.retryNow,
      reloadTheirs: autosaver.reloadTheirs,
      keepMine: autosaver.keepMine,
      restoreDraft: autosaver.restoreDraft,
      discardDraft: autosaver.discardDraft,
    }),
    [state, autosaver],
  )
}
