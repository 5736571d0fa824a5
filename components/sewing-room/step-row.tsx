'use client'

import { useId, useState, type FormEvent } from 'react'
import { MAX_SEWING_NOTE_LENGTH } from '@/lib/limits'
import type { ShownStep } from '@/lib/sewing-room-client/merge'
import { formatSize } from '@/lib/units'

/**
 * One step of the checklist: a large tick box with the step's words, its rough cut, its save state
 * ("not saved yet", "saved", or why the server refused), and its note.
 */
export function StepRow({
  step,
  isNext,
  savedHere,
  onDone,
  onNote,
}: {
  step: ShownStep
  isNext: boolean
  savedHere: boolean
  onDone: (done: boolean) => void
  onNote: (note: string | null) => void
}) {
  const id = useId()
  const [editing, setEditing] = useState(false)
  const saveNote = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault()
    const note = String(new FormData(event.currentTarget).get('note') ?? '').trim()
    onNote(note === '' ? null : note)
    setEditing(false)
  }
  return (
    <li
      data-testid="step"
      data-step-id={step.id}
      data-done={step.done ? 'true' : 'false'}
      data-save-state={step.saveState}
      className={`rounded-xl border bg-white ${isNext ? 'border-thread-700 ring-2 ring-thread-700/20' : 'border-linen-200'}`}
    >
      <div className="flex items-start gap-1">
        <label htmlFor={`${id}-done`} className="flex min-h-14 flex-1 cursor-pointer items-start gap-3 p-3">
          <input
            id={`${id}-done`}
            type="checkbox"
            checked={step.done}
            onChange={(event) => onDone(event.currentTarget.checked)}
            className="mt-0.5 size-7 shrink-0 cursor-pointer accent-thread-700"
          />
          <span className="min-w-0 flex-1">
            <span className={`block text-base leading-snug ${step.done ? 'text-stone-500 line-through decoration-stone-400' : 'font-medium text-stone-900'}`}>{step.label}</span>
            {step.instruction && !step.done && <span className="mt-0.5 block text-sm text-stone-600">{step.instruction}</span>}
            {step.roughCut && <span className="mt-0.5 block text-sm text-stone-600 tabular-nums">Rough cut {formatSize(step.roughCut.widthIn, step.roughCut.heightIn, 'in')}</span>}
          </span>
        </label>
        <button
          type="button"
          onClick={() => setEditing((open) => !open)}
          aria-expanded={editing}
          aria-controls={`${id}-note`}
          className="m-1.5 min-h-11 min-w-11 shrink-0 rounded-lg px-2 text-sm text-thread-700 hover:bg-linen-100"
        >
          {step.note ? 'Edit note' : 'Note'}
          <span className="sr-only"> for {step.label}</span>
        </button>
      </div>
      <StepSaveState step={step} savedHere={savedHere} />
      {step.note && !editing && <p className="mx-3 mb-3 border-l-4 border-linen-200 pl-3 text-sm whitespace-pre-line text-stone-700 italic">{step.note}</p>}
      {editing && (
        <form id={`${id}-note`} onSubmit={saveNote} className="space-y-2 border-t border-linen-200 p-3">
          <label htmlFor={`${id}-note-text`} className="block text-sm font-medium text-stone-700">
            Note for {step.label}
          </label>
          <textarea
            id={`${id}-note-text`}
            name="note"
            defaultValue={step.note ?? ''}
            maxLength={MAX_SEWING_NOTE_LENGTH}
            rows={3}
            className="w-full rounded-lg border border-stone-300 px-3 py-2 text-base"
          />
          <div className="flex gap-2">
            <button type="submit" className="min-h-11 rounded-lg bg-thread-700 px-4 font-semibold text-white hover:bg-thread-800">
              Save note
            </button>
            <button type="button" onClick={() => setEditing(false)} className="min-h-11 rounded-lg px-4 text-stone-700 hover:bg-linen-100">
              Cancel
            </button>
          </div>
        </form>
      )}
    </li>
  )
}

function StepSaveState({ step, savedHere }: { step: ShownStep; savedHere: boolean }) {
  if (step.saveState === 'waiting') {
    return (
      <p data-testid="step-save-state" className="mx-3 mb-2 -mt-1 text-sm font-medium text-amber-800">
        Not saved yet{step.problem ? ` (${step.problem.replace(/\.$/, '').toLowerCase()})` : ''}
      </p>
    )
  }
  if (step.saveState === 'refused') {
    return (
      <p data-testid="step-save-state" className="mx-3 mb-2 -mt-1 text-sm font-medium text-madder-700">
        Not saved: {step.problem}
      </p>
    )
  }
  if (savedHere) {
    return (
      <p data-testid="step-save-state" className="mx-3 mb-2 -mt-1 text-sm text-thread-700">
        <span aria-hidden="true">✓ </span>Saved
      </p>
    )
  }
  return null
}
