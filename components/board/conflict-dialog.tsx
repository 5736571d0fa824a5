'use client'

import { ModalDialog } from '@/components/ui/modal-dialog'
import type { UseAutosave } from './use-autosave'

/**
 * Asks the designer what to do when the pattern was saved elsewhere since this board loaded it.
 * Saving is stopped until they answer, so the dialog cannot be dismissed without a choice.
 *
 * @example <ConflictDialog autosave={autosave} />
 */
export function ConflictDialog({ autosave }: { autosave: UseAutosave }) {
  const { status, resolving, conflictRevision, problem } = autosave.state
  if (status !== 'conflict') return null
  const where = conflictRevision ? ` (it is now at revision ${conflictRevision})` : ''
  return (
    <ModalDialog titleId="conflict-title" describedById="conflict-explanation">
      <h2 id="conflict-title" className="text-lg font-semibold text-thread-800">
        This pattern was changed somewhere else
      </h2>
      <div id="conflict-explanation" className="space-y-2 text-sm text-stone-700">
        <p>
          Since this board opened the pattern, it was saved from another tab or by someone else{where}. Your
          latest changes here are not saved yet, and nothing has been overwritten on either side.
        </p>
        <p>Choose which version to carry on with:</p>
        <ul className="list-disc space-y-1 pl-5">
          <li>
            <strong>Load the saved version</strong> shows the other version on this board. Your changes are set
            aside: Undo brings them back.
          </li>
          <li>
            <strong>Keep my version</strong> saves what you see here as a new revision. The other version stays in
            the pattern’s saved revisions.
          </li>
        </ul>
      </div>
      {problem && (
        <p role="alert" className="text-sm text-madder-700">
          {problem} Try again.
        </p>
      )}
      <div className="flex flex-wrap justify-end gap-3">
        <button
          type="button"
          disabled={resolving}
          onClick={() => void autosave.reloadTheirs()}
          className="rounded border border-thread-700 px-4 py-2 text-thread-700 hover:bg-linen-100 disabled:opacity-60"
        >
          Load the saved version
        </button>
        <button
          type="button"
          disabled={resolving}
          onClick={() => void autosave.keepMine()}
          className="rounded bg-thread-700 px-4 py-2 text-white hover:bg-thread-800 disabled:opacity-60"
        >
          Keep my version as a new revision
        </button>
      </div>
    </ModalDialog>
  )
}
