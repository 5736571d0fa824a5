'use client'

import { useState, type ChangeEvent, type FormEvent } from 'react'
import { fabricRoleInWords } from '@/geometry/fabric-requirements'
import { boardActions, type ActionContext } from '@/lib/board/actions'
import type { BoardDesign } from '@/lib/board/commands'
import type { BoardStore } from '@/lib/board/store'
import { MAX_COLORWAYS } from '@/lib/limits'
import { colorwayNameSchema, fabricNameSchema, fabricRoleSchema } from '@/lib/schemas/design'
import { sendImage, tooLarge } from './upload-image'

type Colorway = BoardDesign['colorways'][number]

const button = 'rounded border border-stone-300 px-2 py-1 text-xs hover:bg-linen-100 disabled:opacity-40 disabled:hover:bg-transparent'

/** The first message of a failed parse, for a form's alert. */
const firstMessage = (result: { success: boolean; error?: { issues: readonly { message: string }[] } }): string | null =>
  result.success ? null : (result.error?.issues[0]?.message ?? 'not valid')

/**
 * The colourways of the design: choose the one the board shows, and create, duplicate, rename,
 * move and delete them. Every change is an undoable board command; names are checked with the
 * design file's own schema (`colorwayNameSchema`) before the command runs.
 */
export function ColorwayControls({ context, design, colorway }: { context: ActionContext; design: BoardDesign; colorway: Colorway | undefined }) {
  const { store } = context
  const [renaming, setRenaming] = useState(false)
  const [error, setError] = useState<string | null>(null)
  const index = design.colorways.findIndex((c) => c === colorway)
  const full = design.colorways.length >= MAX_COLORWAYS

  function rename(event: FormEvent<HTMLFormElement>) {
    event.preventDefault()
    if (!colorway) return
    const parsed = colorwayNameSchema.safeParse(new FormData(event.currentTarget).get('colorway-name') ?? '')
    if (!parsed.success) return setError(`Colourway name: ${firstMessage(parsed)}.`)
    if (parsed.data !== colorway.name && design.colorways.some((c) => c.name === parsed.data)) return setError(`There is already a colourway called ${parsed.data}.`)
    setError(null)
    setRenaming(false)
    store.run('renameColorway', { colorway: colorway.name, name: parsed.data })
  }

  return (
    <div className="space-y-1.5">
      <div className="flex items-center gap-2">
        <label htmlFor="colorway" className="text-xs font-medium text-stone-600">
          Colourway
        </label>
        <select
          id="colorway"
          value={colorway?.name}
          onChange={(event) => store.chooseColorway(event.target.value)}
          className="min-w-0 flex-1 rounded border border-stone-300 bg-white px-2 py-1 text-sm"
        >
          {design.colorways.map((c) => (
            <option key={c.name} value={c.name}>
              {c.name}
            </option>
          ))}
        </select>
      </div>
      <div className="flex flex-wrap gap-1" role="group" aria-label="Colourway actions">
        <button type="button" onClick={() => boardActions.newColorway.run(context)} disabled={full} title={boardActions.newColorway.label} className={button}>
          New
        </button>
        <button type="button" onClick={() => boardActions.duplicateColorway.run(context)} disabled={full || !colorway} title={boardActions.duplicateColorway.label} className={button}>
          Duplicate
        </button>
        <button type="button" onClick={() => { setRenaming(!renaming); setError(null) }} disabled={!colorway} aria-expanded={renaming} className={button}>
          Rename
        </button>
        <button type="button" onClick={() => colorway && store.run('moveColorway', { colorway: colorway.name, by: -1 })} disabled={index <= 0} className={button} aria-label="Move the colourway earlier">
          ↑
        </button>
        <button
          type="button"
          onClick={() => colorway && store.run('moveColorway', { colorway: colorway.name, by: 1 })}
          disabled={index < 0 || index >= design.colorways.length - 1}
          className={button}
          aria-label="Move the colourway later"
        >
          ↓
        </button>
        <button
          type="button"
          onClick={() => boardActions.deleteColorway.run(context)}
          disabled={design.colorways.length <= 1}
          title={design.colorways.length <= 1 ? 'A design keeps at least one colourway.' : boardActions.deleteColorway.label}
          className={button}
        >
          Delete
        </button>
      </div>
      {renaming && colorway && (
        <form onSubmit={rename} className="flex gap-1" key={colorway.name}>
          <label htmlFor="colorway-name" className="sr-only">
            New name of the colourway
          </label>
          <input id="colorway-name" name="colorway-name" defaultValue={colorway.name} autoFocus className="min-w-0 flex-1 rounded border border-stone-300 bg-white px-2 py-1 text-xs" />
          <button type="submit" className={button}>
            Save name
          </button>
        </form>
      )}
      {error && <p role="alert" className="text-xs text-madder-700">{error}</p>}
    </div>
  )
}

/**
 * The fabrics of one colourway, one row per fabric role: its chip (the swatch image when it has
 * one, else its colour; choosing it picks the Fill tool with that fabric), its display name and
 * its colour, both edited in place, and its swatch image, uploaded (`kind=swatch`) or removed
 * with `setFabricSwatch`, one undoable step each. The role is shown in words beside the name
 * ("Leaf dark"), never as its key.
 */
export function ColorwayFabrics({ store, colorway, activeFabric }: { store: BoardStore; colorway: Colorway | undefined; activeFabric: string | null }) {
  const [error, setError] = useState<string | null>(null)
  const [sending, setSending] = useState<string | null>(null)
  const fabrics = Object.entries(colorway?.fabrics ?? {})

  function rename(fabric: string, value: string, current: string) {
    if (!colorway || value === current) return
    const parsed = fabricNameSchema.safeParse(value)
    if (!parsed.success) return setError(`${fabricRoleInWords(fabric)}: ${firstMessage(parsed)}.`)
    setError(null)
    store.run('renameFabric', { colorway: colorway.name, fabric, name: parsed.data })
  }

  async function uploadSwatch(fabric: string, name: string, event: ChangeEvent<HTMLInputElement>) {
    const file = event.currentTarget.files?.[0]
    event.currentTarget.value = ''
    if (!file || !colorway) return
    const refusal = tooLarge(file.size, 'swatch image')
    if (refusal) return setError(`${name}: ${refusal}`)
    setError(null)
    setSending(fabric)
    try {
      const stored = await sendImage(file, 'swatch', 'swatch image')
      store.run('setFabricSwatch', { colorway: colorway.name, fabric, swatch: stored.id })
    } catch (failure) {
      setError(`${name}: ${(failure as Error).message}`)
    } finally {
      setSending(null)
    }
  }

  return (
    <>
      <ul className="space-y-1" aria-label="Fabric swatches">
        {fabrics.map(([fabric, { name, color, swatch }]) => (
          <li key={fabric} className="flex items-center gap-1" data-fabric={fabric} data-swatch={swatch}>
            <button
              type="button"
              aria-pressed={activeFabric === fabric}
              onClick={() => store.fillWith(fabric)}
              className="h-6 w-6 shrink-0 rounded border border-stone-400 bg-cover bg-center aria-pressed:ring-2 aria-pressed:ring-thread-600"
              // A swatch that can no longer be read leaves the colour showing.
              style={{ backgroundColor: color, ...(swatch && { backgroundImage: `url(/api/uploads/${swatch})` }) }}
              aria-label={`Fill with ${name}`}
              title={`Fill with ${name}`}
            />
            <div className="min-w-0 flex-1">
              <div className="flex items-baseline justify-between gap-1">
                <span className="truncate text-[10px] uppercase tracking-wide text-stone-500">{fabricRoleInWords(fabric)}</span>
                {sending === fabric ? (
                  <span className="shrink-0 text-[10px] text-stone-500">sending…</span>
                ) : swatch ? (
                  <button
                    type="button"
                    className="shrink-0 text-[10px] text-stone-600 underline hover:text-madder-700"
                    aria-label={`Remove the swatch image of ${name}`}
                    onClick={() => colorway && store.run('setFabricSwatch', { colorway: colorway.name, fabric, swatch: null })}
                  >
                    remove image
                  </button>
                ) : (
                  <label className="shrink-0 cursor-pointer text-[10px] text-stone-600 underline hover:text-thread-700">
                    add image
                    <input
                      type="file"
                      accept="image/jpeg,image/png,image/webp"
                      aria-label={`Swatch image of ${name} (JPEG, PNG or WebP, up to 10 MB)`}
                      className="sr-only"
                      disabled={sending !== null}
                      onChange={(event) => uploadSwatch(fabric, name, event)}
                    />
                  </label>
                )}
              </div>
              <input
                key={`${colorway?.name}\u0000${name}`}
                defaultValue={name}
                aria-label={`Name of the ${fabricRoleInWords(fabric).toLowerCase()} fabric in ${colorway?.name}`}
                onBlur={(event) => rename(fabric, event.currentTarget.value, name)}
                onKeyDown={(event) => {
                  if (event.key === 'Enter') rename(fabric, event.currentTarget.value, name)
                  if (event.key === 'Escape') event.currentTarget.value = name
                }}
                className="w-full min-w-0 rounded border border-stone-300 bg-white px-1.5 py-0.5 text-xs"
              />
            </div>
            <input
              type="color"
              value={color}
              aria-label={`Colour of ${name} in ${colorway?.name}`}
              onChange={(event) => colorway && store.run('setFabricColour', { colorway: colorway.name, fabric, colour: event.target.value })}
              className="h-6 w-6 shrink-0 cursor-pointer rounded border border-stone-300"
            />
          </li>
        ))}
      </ul>
      {error && <p role="alert" className="text-xs text-madder-700">{error}</p>}
    </>
  )
}

/** "Leaf medium" → the role key `leaf-medium`: lower case, words joined by dashes. */
function fabricRoleKey(words: string): string {
  return words.trim().toLowerCase().replace(/[^\p{L}\p{N}]+/gu, '-').replace(/^-+|-+$/g, '')
}

/**
 * Adds a fabric role to every colourway (`addFabric`): the designer names it in words ("Leaf
 * medium"); each colourway's fabric for it starts with that name and a neutral colour.
 */
export function AddFabricRoleForm({ store, design }: { store: BoardStore; design: BoardDesign }) {
  const [error, setError] = useState<string | null>(null)

  function add(event: FormEvent<HTMLFormElement>) {
    event.preventDefault()
    const form = event.currentTarget
    const words = String(new FormData(form).get('fabric') ?? '')
    const name = fabricNameSchema.safeParse(words)
    if (!name.success) return setError(`Fabric role: ${firstMessage(name)}.`)
    const role = fabricRoleSchema.safeParse(fabricRoleKey(name.data))
    if (!role.success) return setError('Name the fabric role with letters or digits, e.g. Leaf medium.')
    if (design.colorways.some((c) => Object.hasOwn(c.fabrics, role.data))) return setError(`There is already a fabric role called ${fabricRoleInWords(role.data)}.`)
    setError(null)
    store.run('addFabric', { fabric: role.data, colour: '#c8b89a', name: name.data })
    store.chooseFabric(role.data)
    form.reset()
  }

  return (
    <>
      <form onSubmit={add} className="flex gap-1">
        <label htmlFor="new-fabric" className="sr-only">
          New fabric role
        </label>
        <input id="new-fabric" name="fabric" placeholder="new fabric role, e.g. Leaf medium" className="min-w-0 flex-1 rounded border border-stone-300 bg-white px-2 py-1 text-xs" />
        <button type="submit" className={button}>
          Add
        </button>
      </form>
      {error && <p role="alert" className="text-xs text-madder-700">{error}</p>}
    </>
  )
}
