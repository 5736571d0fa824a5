'use client'

import { useState } from 'react'
import type { BoardRing } from '@/lib/board/commands'
import { design as designOf, type BoardStore } from '@/lib/board/store'
import { MAX_REPEATS, MIN_REPEATS } from '@/lib/limits'
import { designFileSchema } from '@/lib/schemas/design'
import { NumberField } from './number-field'
import { useBoard } from './use-board'

/** The ring's settings. A change is checked with the design file's own schema before it is made. */
export function RingPanel({ store }: { store: BoardStore }) {
  const design = useBoard(store, designOf)
  const [error, setError] = useState<{ field: string; message: string } | null>(null)
  const { ring, units } = design

  function change(field: keyof BoardRing, value: BoardRing[keyof BoardRing]) {
    const candidate = { ...design, ring: { ...ring, [field]: value } }
    const parsed = designFileSchema.safeParse(candidate)
    const issue = parsed.success ? undefined : parsed.error.issues.find((i) => i.path[0] === 'ring')
    if (issue) return setError({ field: String(issue.path[1] ?? field), message: issue.message })
    setError(null)
    store.run('setRing', { [field]: value })
  }
  const errorFor = (field: string) => (error?.field === field ? error.message : null)

  return (
    <section aria-labelledby="ring-heading" className="space-y-3">
      <h2 id="ring-heading" className="text-sm font-semibold uppercase tracking-wide text-stone-500">
        Ring
      </h2>
      <div className="grid grid-cols-2 gap-2">
        <NumberField id="ring-inner" label="Inner radius" value={ring.innerRadius} min={0} suffix={units} onCommit={(v) => change('innerRadius', v)} error={errorFor('innerRadius')} />
        <NumberField id="ring-outer" label="Outer radius" value={ring.outerRadius} min={0} suffix={units} onCommit={(v) => change('outerRadius', v)} error={errorFor('outerRadius')} />
        <NumberField id="ring-repeats" label="Repeats" value={ring.repeats} step={1} min={MIN_REPEATS} max={MAX_REPEATS} onCommit={(v) => change('repeats', v)} error={errorFor('repeats')} />
        <div className="flex flex-col gap-0.5">
          <label htmlFor="ring-mode" className="text-xs font-medium text-stone-600">
            Repeats are
          </label>
          <select
            id="ring-mode"
            value={ring.repeatMode}
            onChange={(event) => change('repeatMode', event.target.value as BoardRing['repeatMode'])}
            className="rounded border border-stone-300 bg-white px-2 py-1 text-sm"
          >
            <option value="rotate">rotated</option>
            <option value="mirror">alternately mirrored</option>
          </select>
          {errorFor('repeatMode') && <p role="alert" className="text-xs text-madder-700">{errorFor('repeatMode')}</p>}
        </div>
      </div>
      <div className="flex items-center justify-between text-sm">
        <span>
          Finished diameter: <strong data-testid="finished-diameter">{round(2 * ring.outerRadius)} {units}</strong>
        </span>
        <label className="flex items-center gap-1">
          <span className="text-xs text-stone-600">Units</span>
          <select
            value={units}
            aria-label="Units"
            onChange={(event) => {
              const next = event.target.value as 'in' | 'cm'
              store.run('setUnits', { units: next })
              // The grid follows the units: quarter inches, or half centimetres.
              store.setSnapping({ gridSize: next === 'cm' ? 0.5 : 0.25 })
            }}
            className="rounded border border-stone-300 bg-white px-1 py-0.5 text-sm"
          >
            <option value="in">inches</option>
            <option value="cm">centimetres</option>
          </select>
        </label>
      </div>
    </section>
  )
}

const round = (value: number) => Math.round(value * 1000) / 1000
