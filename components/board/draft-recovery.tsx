'use client'

import type { UseAutosave } from './use-autosave'

/**
 * Offers back changes this browser kept but never saved (a crash, a closed tab, a lost
 * connection). The draft stays stored until the designer answers.
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
    <section
      aria-labelledby="draft-recovery-title"
      data-testid="draft-recovery"
      className="flex flex-wrap items-center gap-3 rounded-lg border border-linen-200 bg-linen-100 px-4 py-3 text-sm"
    >
      <div className="min-w-64 flex-1">
        <h2 id="draft-recovery-title" className="font-semibold text-thread-800">
          Unsaved changes found
        </h2>
        <p className="text-stone-700">
          This browser kept changes to “{draft.design.name}” from {when} that never reached the server (made from
          revision {draft.baseRevision}).{moved}
        </p>
      </div>
      <button
        type="button"
        onClick={autosave.restoreDraft}
        className="rounded bg-thread-700 px-3 py-1.5 text-white hover:bg-thread-800"
      >
        Restore those changes
      </button>
      <button
        type="button"
        onClick={autosave.discardDraft}
        className="rounded border border-stone-300 bg-white px-3 py-1.5 text-stone-700 hover:bg-linen-50"
      >
        Discard them
      </button>
    </section>
  )
}
