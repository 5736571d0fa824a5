'use client'

import type { SaveStatus as SaveStatusName } from '@/lib/board/autosave'
import type { UseAutosave } from './use-autosave'

const LABELS: Record<SaveStatusName, string> = {
  saved: 'All changes saved',
  unsaved: 'Not saved yet',
  saving: 'Saving…',
  error: 'Could not save — retrying',
  conflict: 'Changed elsewhere',
}

const DOTS: Record<SaveStatusName, string> = {
  saved: 'bg-thread-600',
  unsaved: 'bg-amber-500',
  saving: 'bg-amber-500 animate-pulse',
  error: 'bg-madder-600',
  conflict: 'bg-madder-600',
}

/**
 * How saving goes, always visible on the board; screen readers hear each change.
 *
 * @example <SaveStatus autosave={useAutosave({ patternId, revision, store })} />
 */
export function SaveStatus({ autosave }: { autosave: UseAutosave }) {
  const { status, problem, retryAt, lastSavedAt, revision } = autosave.state
  // A refused design is not retried by itself, so it must not promise a retry.
  const label = status === 'error' && retryAt === null ? 'Could not save' : LABELS[status]
  const savedAt = lastSavedAt ? `, last saved at ${new Date(lastSavedAt).toLocaleTimeString()}` : ''
  return (
    <div
      data-testid="save-status"
      data-state={status}
      title={`Revision ${revision}${savedAt}`}
      className="flex items-center gap-2 text-sm text-stone-700"
    >
      <span aria-hidden="true" className={`inline-block h-2 w-2 rounded-full ${DOTS[status]}`} />
      <span role="status" aria-live="polite">
        {label}
        {status === 'error' && problem ? <span className="text-madder-700">: {problem}</span> : null}
      </span>
      {status === 'error' && (
        <button
          type="button"
          onClick={() => void autosave.retryNow()}
          className="rounded px-2 py-0.5 text-thread-700 underline hover:text-thread-800"
        >
          Try now
        </button>
      )}
    </div>
  )
}
