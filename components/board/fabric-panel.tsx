'use client'

import { useState, type FormEvent } from 'react'
import type { ActionContext } from '@/lib/board/actions'
import { design as designOf, type BoardStore } from '@/lib/board/store'
import { LeafSpreadButton } from './leaf-spread-button'
import { useBoard } from './use-board'

const FABRIC_NAME = /^[a-z0-9][a-z0-9 -]{0,39}$/i

/**
 * The colourways and their fabrics. Fabric roles (background, leaf-dark …) are shared by every
 * colourway; each colourway gives them its own colours. Choosing a swatch picks it and the Fill tool.
 */
export function FabricPanel({ store, context }: { store: BoardStore; context: ActionContext }) {
  const design = useBoard(store, designOf)
  const activeColorway = useBoard(store, (state) => state.activeColorway)
  const activeFabric = useBoard(store, (state) => state.activeFabric)
  const [error, setError] = useState<string | null>(null)
  const colorway = design.colorways.find((c) => c.name === activeColorway) ?? design.colorways[0]
  const fabrics = Object.entries(colorway?.fabrics ?? {})

  function addFabric(event: FormEvent<HTMLFormElement>) {
    event.preventDefault()
    const form = event.currentTarget
    const name = String(new FormData(form).get('fabric') ?? '').trim()
    if (!FABRIC_NAME.test(name)) return setError('Name the fabric with letters, digits, spaces or dashes (up to 40).')
    if (fabrics.some(([existing]) => existing === name)) return setError(`There is already a fabric called ${name}.`)
    setError(null)
    store.run('addFabric', { fabric: name, colour: '#c8b89a' })
    store.chooseFabric(name)
    form.reset()
  }

  function addColorway() {
    let n = design.colorways.length + 1
    while (design.colorways.some((c) => c.name === `Colourway ${n}`)) n += 1
    const name = `Colourway ${n}`
    store.run('addColorway', { name, copyOf: colorway?.name })
    store.chooseColorway(name)
  }

  return (
    <section aria-labelledby="fabrics-heading" className="space-y-3">
      <h2 id="fabrics-heading" className="text-sm font-semibold uppercase tracking-wide text-stone-500">
        Fabrics
      </h2>
      <div className="flex items-center gap-2">
        <label htmlFor="colorway" className="text-xs font-medium text-stone-600">
          Colourway
        </label>
        <select
          id="colorway"
          value={colorway?.name}
          onChange={(event) => store.chooseColorway(event.target.value)}
          className="flex-1 rounded border border-stone-300 bg-white px-2 py-1 text-sm"
        >
          {design.colorways.map((c) => (
            <option key={c.name} value={c.name}>
              {c.name}
            </option>
          ))}
        </select>
        <button type="button" onClick={addColorway} className="rounded border border-stone-300 px-2 py-1 text-xs hover:bg-linen-100">
          New
        </button>
      </div>
      <ul className="grid grid-cols-2 gap-1.5" aria-label="Fabric swatches">
        {fabrics.map(([fabric, colour]) => (
          <li key={fabric} className="flex items-center gap-1">
            <button
              type="button"
              aria-pressed={activeFabric === fabric}
              onClick={() => store.fillWith(fabric)}
              className="flex min-w-0 flex-1 items-center gap-1.5 rounded border border-stone-300 bg-white px-1.5 py-1 text-left text-xs aria-pressed:border-thread-700 aria-pressed:ring-2 aria-pressed:ring-thread-600"
              aria-label={`Fill with ${fabric}`}
            >
              <span className="h-4 w-4 shrink-0 rounded-sm border border-stone-400" style={{ backgroundColor: colour }} aria-hidden />
              <span className="truncate">{fabric}</span>
            </button>
            <input
              type="color"
              value={colour}
              aria-label={`Colour of ${fabric} in ${colorway?.name}`}
              onChange={(event) => colorway && store.run('setFabricColour', { colorway: colorway.name, fabric, colour: event.target.value })}
              className="h-6 w-6 shrink-0 cursor-pointer rounded border border-stone-300"
            />
          </li>
        ))}
      </ul>
      <form onSubmit={addFabric} className="flex gap-1">
        <label htmlFor="new-fabric" className="sr-only">
          New fabric name
        </label>
        <input id="new-fabric" name="fabric" placeholder="new fabric, e.g. leaf-dark" className="min-w-0 flex-1 rounded border border-stone-300 bg-white px-2 py-1 text-xs" />
        <button type="submit" className="rounded border border-stone-300 px-2 py-1 text-xs hover:bg-linen-100">
          Add
        </button>
      </form>
      {error && <p role="alert" className="text-xs text-madder-700">{error}</p>}
      <LeafSpreadButton context={context} />
    </section>
  )
}
