'use client'

import { ModalDialog } from '@/components/ui/modal-dialog'
import type { UseAutosave } from './use-autosave'

/**
 * Offers back changes this browser kept but never saved (a crash, a closed tab, a lost
 * connection). The draft stays stored until the designer answers, and the board waits for the
 * answer: work done meanwhile could not be kept as a draft without writing over that one.
 *
 * @example <DraftRecovery autosave={autosave} />
 */
export function DraftRecovery({ autosave }: { autosave: UseAutosave }) {
  const draft = autosave.state.recoverableDraft
  if (!draft) return null
  const when = new Date(draft.savedAt).toLocaleString()
  const current = autosave.state.revision
  const moved = draft.baseRevision < current ? ` The pattern has been saved since (now revision ${current}); restoring puts these changes on top.` : ''
  return (
    <ModalDialog titleId="draft-recovery-title" describedById="draft-recovery-explanation">
      <div data-testid="draft-recovery" className="space-y-4 text-sm">
        <h2 id="draft-recovery-title" className="text-lg font-semibold text-thread-800">
          Unsaved changes found
        </h2>
        <p id="draft-recovery-explanation" className="text-stone-700">
          This browser kept changes to “{draft.design.name}” from {when} that never reached the server (made from
          revision {draft.baseRevision}).{moved}
        </p>
        <div className="flex flex-wrap justify-end gap-3">
          <button type="button" onClick={autosave.discardDraft} className="rounded border border-stone-300 bg-white px-3 py-1.5 text-stone-700 hover:bg-linen-50">
            Discard them
          </button>
          <button type="button" onClick={autosave.restoreDraft} className="rounded bg-thread-700 px-3 py-1.5 text-white hover:bg-thread-800">
            Restore those changes
          </button>
        </div>
      </div>
    </ModalDialog>
  )
}
