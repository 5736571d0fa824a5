'use client'

import Link from 'next/link'
import { useMemo, useState } from 'react'
import { areasCount, areasOfStep, groupsWithProgress, nextStepOf, overlaysShown, progressOf, sewnAreas } from '@/lib/sewing-room-client/merge'
import { formatInches } from '@/lib/units'
import { ChecklistGroup } from './checklist-group'
import { NextStepCard } from './next-step-card'
import { PAPER_LABELS } from './paper-labels'
import { ProgressBar } from './progress-bar'
import { RingPicture } from './ring-picture'
import { SaveStatus } from './save-status'
import { useProjectRoom } from './use-project-room'

/**
 * A project in the sewing room: the next step on top, the ring as it stands, the checklist grouped
 * as the work happens, and on a phone a bar at the bottom with "done" and "undo" under the thumb.
 */
export function ProjectRoom({ projectId }: { projectId: string }) {
  const room = useProjectRoom(projectId)
  const { detail, steps } = room
  // Groups the quilter opened or closed; the rest follow the next step (its group is open).
  const [toggled, setToggled] = useState<Record<string, boolean>>({})

  const view = useMemo(() => {
    if (!detail) return null
    const next = nextStepOf(steps)
    const sewn = sewnAreas(steps, detail.picture)
    return {
      next,
      progress: progressOf(steps),
      groups: groupsWithProgress(detail.groups, steps),
      sewn,
      areas: areasCount(detail.picture, sewn),
      nextAreas: areasOfStep(next, detail.picture),
      overlays: overlaysShown(detail.picture, steps),
      waiting: steps.filter((step) => step.saveState === 'waiting').length,
      refused: steps.filter((step) => step.saveState === 'refused').length,
    }
  }, [detail, steps])

  if (!detail || !view) {
    if (room.loadProblem) {
      return (
        <div className="mx-auto max-w-xl space-y-3 rounded-xl border border-madder-600/40 bg-white p-5" role="alert">
          <p className="font-semibold text-madder-700">{room.loadProblem.status === 404 ? 'No such project in your sewing room.' : room.loadProblem.message}</p>
          <Link href="/sewing-room" className="text-thread-700 underline">
            Back to the sewing room
          </Link>
        </div>
      )
    }
    return <p className="mx-auto max-w-xl text-stone-600" aria-live="polite">Opening the project…</p>
  }

  const { project } = detail
  const nextGroup = view.next ? detail.groups.find((group) => group.id === view.next!.group) : null
  const isOpen = (groupId: string) => toggled[groupId] ?? groupId === nextGroup?.id
  const { done: areasSewn, total: areasTotal } = view.areas
  const title = project.name ?? project.patternName

  return (
    <article className="mx-auto max-w-6xl pb-28 md:pb-6" data-testid="project-room" data-project-id={project.id}>
      <Link href="/sewing-room" className="inline-block py-2 text-sm text-thread-700 hover:underline">
        ← Sewing room
      </Link>
      <header className="space-y-2">
        <h1 className="text-2xl leading-tight font-semibold text-thread-800">{title}</h1>
        <p className="text-sm text-stone-600">
          {project.name ? `${project.patternName} · ` : ''}
          {project.colorway.name ?? `Colourway ${project.colorway.index + 1}`} · {formatInches(project.diameterIn)} across · {PAPER_LABELS[project.paper] ?? project.paper}
          {project.designerName ? ` · by ${project.designerName}` : ''}
        </p>
        <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
          <div className="min-w-48 flex-1">
            <ProgressBar progress={view.progress} label="Overall progress" size="large" />
          </div>
          <p className="text-sm text-stone-700 tabular-nums" data-testid="overall-progress">
            {view.progress.done} of {view.progress.total} steps
          </p>
        </div>
        <SaveStatus sync={room.sync} waiting={view.waiting} refused={view.refused} onRetry={room.retryNow} signInPath={`/sewing-room/${project.id}`} />
      </header>

      <div className="mt-5 grid gap-6 md:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
        <div className="space-y-5 md:sticky md:top-4 md:self-start">
          <NextStepCard step={view.next} groupLabel={nextGroup?.label ?? null} onDone={() => view.next && room.setDone(view.next, true)} />
          <figure className="rounded-2xl border border-linen-200 bg-white p-3">
            <RingPicture
              picture={detail.picture}
              sewn={view.sewn}
              next={view.nextAreas}
              overlays={view.overlays}
              caption={`The ring so far: ${areasSewn} of ${areasTotal} areas sewn${view.next ? `; the next step is outlined` : ''}.`}
            />
            <figcaption className="mt-2 text-center text-sm text-stone-600">
              {areasSewn} of {areasTotal} areas sewn · fabric shows what is done, outline what is to come
            </figcaption>
          </figure>
          {room.lastTick && (
            <p className="hidden md:block">
              <button type="button" onClick={room.undo} className="min-h-11 rounded-lg border border-stone-300 bg-white px-4 text-stone-800 hover:bg-linen-100">
                Undo: {room.lastTick.done ? 'tick' : 'untick'} of “{room.lastTick.label}”
              </button>
            </p>
          )}
        </div>

        <section aria-labelledby="checklist-heading" className="space-y-3">
          <h2 id="checklist-heading" className="text-lg font-semibold text-stone-900">
            The whole job, step by step
          </h2>
          {view.groups.map((group) => (
            <ChecklistGroup
              key={group.id}
              group={group}
              steps={steps.filter((step) => step.group === group.id)}
              open={isOpen(group.id)}
              onToggle={() => setToggled((state) => ({ ...state, [group.id]: !isOpen(group.id) }))}
              nextStepId={view.next?.id ?? null}
              savedHere={room.savedHere}
              onDone={room.setDone}
              onNote={room.setNote}
            />
          ))}
        </section>
      </div>

      {/* Under the thumb on a phone: the next step's "done" and the undo of the last tick. */}
      <div className="fixed inset-x-0 bottom-0 z-10 border-t border-linen-200 bg-white/95 px-3 pt-3 pb-[max(0.75rem,env(safe-area-inset-bottom))] shadow-[0_-4px_12px_rgba(0,0,0,0.06)] md:hidden">
        <div className="mx-auto flex max-w-xl gap-2">
          <button
            type="button"
            onClick={room.undo}
            disabled={!room.lastTick}
            aria-label={room.lastTick ? `Undo ${room.lastTick.done ? 'tick' : 'untick'} of ${room.lastTick.label}` : 'Undo (nothing to undo)'}
            className="min-h-14 rounded-xl border border-stone-300 px-4 text-base font-medium text-stone-800 disabled:opacity-40"
          >
            Undo
          </button>
          <button
            type="button"
            onClick={() => view.next && room.setDone(view.next, true)}
            disabled={!view.next}
            className="min-h-14 min-w-0 flex-1 truncate rounded-xl bg-thread-700 px-4 text-lg font-semibold text-white active:bg-thread-800 disabled:opacity-40"
          >
            {view.next ? `Done: ${view.next.label}` : 'All done'}
          </button>
        </div>
      </div>
    </article>
  )
}
