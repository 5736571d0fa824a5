'use client'

import type { ShownStep } from '@/lib/sewing-room-client/merge'
import { cautionsFor, CAUTIONS_NOTE } from '@/lib/sewing-room-client/cautions'
import { ProgressBar } from './progress-bar'
import { StepRow } from './step-row'

/** One group of the checklist (cutting, a repeat, the finishing…), collapsible, with its progress and its cautions. */
export function ChecklistGroup({
  group,
  steps,
  open,
  onToggle,
  nextStepId,
  savedHere,
  onDone,
  onNote,
}: {
  group: { id: string; label: string; done: number; total: number }
  steps: ShownStep[]
  open: boolean
  onToggle: () => void
  nextStepId: string | null
  savedHere: ReadonlySet<string>
  onDone: (step: ShownStep, done: boolean) => void
  onNote: (stepId: string, note: string | null) => void
}) {
  const complete = group.total > 0 && group.done === group.total
  const waiting = steps.some((step) => step.saveState === 'waiting')
  const panelId = `group-${group.id}`
  const cautions = cautionsFor(group.id)
  return (
    <section data-testid="checklist-group" data-group={group.id} className="rounded-2xl border border-linen-200 bg-linen-50">
      <h3>
        <button
          type="button"
          onClick={onToggle}
          aria-expanded={open}
          aria-controls={panelId}
          className="flex min-h-14 w-full items-center gap-3 rounded-2xl px-4 py-3 text-left hover:bg-linen-100"
        >
          <span aria-hidden="true" className={`inline-block w-4 text-stone-500 transition-transform ${open ? 'rotate-90' : ''}`}>
            ▶
          </span>
          <span className="min-w-0 flex-1">
            <span className="flex items-baseline justify-between gap-2">
              <span className={`text-base font-semibold ${complete ? 'text-thread-700' : 'text-stone-900'}`}>
                {complete && <span aria-hidden="true">✓ </span>}
                {group.label}
              </span>
              <span className="shrink-0 text-sm text-stone-600 tabular-nums">
                {waiting && <span className="mr-2 text-amber-800">not saved yet</span>}
                {group.done}/{group.total}
              </span>
            </span>
            <span className="mt-1.5 block">
              <ProgressBar progress={group} label={`${group.label}: progress`} />
            </span>
          </span>
        </button>
      </h3>
      {/* A closed group keeps its steps in the page, hidden, so finding a step never depends on which group is open. */}
      <div id={panelId} hidden={!open} className="space-y-2 px-3 pb-3">
        {cautions.length > 0 && (
          <aside aria-label="Cautions" className="rounded-xl border border-amber-300 bg-amber-50 px-3 py-2 text-sm text-amber-950" data-testid="caution">
            {cautions.map((caution) => (
              <p key={caution.id}>
                <span className="font-semibold">{caution.title}.</span> {caution.text}
              </p>
            ))}
            <p className="mt-1 text-xs text-amber-900">{CAUTIONS_NOTE}</p>
          </aside>
        )}
        <ol className="space-y-2">
          {steps.map((step) => (
            <StepRow
              key={step.id}
              step={step}
              isNext={step.id === nextStepId}
              savedHere={savedHere.has(step.id)}
              onDone={(done) => onDone(step, done)}
              onNote={(note) => onNote(step.id, note)}
            />
          ))}
        </ol>
      </div>
    </section>
  )
}
