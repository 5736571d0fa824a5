import { formatSize } from '@/lib/units'
import type { ShownStep } from '@/lib/sewing-room-client/merge'

/**
 * The next step, large enough to read from the sewing table: its group, what to do, and the
 * rough-cut size of the piece it needs (inches in eighths, as a rotary ruler reads).
 */
export function NextStepCard({ step, groupLabel, onDone }: { step: ShownStep | null; groupLabel: string | null; onDone: () => void }) {
  if (!step) {
    return (
      <section aria-labelledby="next-step-heading" data-testid="next-step" className="rounded-2xl border-2 border-thread-700 bg-thread-800 p-5 text-white">
        <h2 id="next-step-heading" className="text-2xl font-semibold">
          Every step is done
        </h2>
        <p className="mt-2 text-lg text-linen-100">The ring is finished. Time to hang it, gift it, or start the next one.</p>
      </section>
    )
  }
  return (
    <section aria-labelledby="next-step-heading" data-testid="next-step" data-step-id={step.id} className="rounded-2xl border-2 border-thread-700 bg-white p-5 shadow-sm">
      <p className="text-sm font-semibold tracking-wide text-thread-700 uppercase">
        Next{groupLabel ? ` · ${groupLabel}` : ''}
      </p>
      <h2 id="next-step-heading" className="mt-1 text-2xl leading-tight font-semibold text-stone-900 sm:text-3xl">
        {step.label}
      </h2>
      {step.instruction && <p className="mt-3 text-lg leading-snug text-stone-800">{step.instruction}</p>}
      {step.roughCut && (
        <p className="mt-4 inline-flex items-baseline gap-2 rounded-lg bg-linen-100 px-3 py-2 text-stone-900" data-testid="next-step-rough-cut">
          <span className="text-sm text-stone-600">Rough cut</span>
          <span className="text-2xl font-semibold tabular-nums">{formatSize(step.roughCut.widthIn, step.roughCut.heightIn, 'in')}</span>
        </p>
      )}
      {step.note && <p className="mt-3 border-l-4 border-linen-200 pl-3 text-base text-stone-700 italic">{step.note}</p>}
      {/* On a wide screen the button sits in the card; on a phone the bar at the bottom carries it. */}
      <button
        type="button"
        onClick={onDone}
        className="mt-5 hidden min-h-12 w-full rounded-xl bg-thread-700 px-4 text-lg font-semibold text-white hover:bg-thread-800 md:block"
      >
        Done: {step.label}
      </button>
    </section>
  )
}
