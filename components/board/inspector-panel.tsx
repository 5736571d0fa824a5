'use client'

import { useState } from 'react'
import { fabricDisplayName } from '@/geometry/fabric-requirements'
import { isPointedLeaf, LAYER_SCALE_RANGE, LAYER_TURN_LIMIT_DEGREES, leafLayers } from '@/geometry/leaf-template'
import { boardPlan } from '@/lib/board/board-plan'
import type { BoardDesign } from '@/lib/board/commands'
import { design as designOf, type BoardStore } from '@/lib/board/store'
import { designFileSchema } from '@/lib/schemas/design'
import { unitsPerInch } from '@/lib/units'
import { NumberField } from './number-field'
import { useBoard } from './use-board'

type Leaf = BoardDesign['leaves'][number]

const small = 'rounded border border-stone-300 px-2 py-1 text-xs hover:bg-linen-100'

const capitalised = (text: string): string => text.charAt(0).toUpperCase() + text.slice(1)

/** The fabric roles of the colourway shown, each with the name the designer reads (`fabricDisplayName`). */
interface Fabrics {
  readonly roles: string[]
  readonly nameOf: (fabric: string) => string
}

function FabricSelect({ id, label, value, fabrics, onChange }: { id: string; label: string; value: string; fabrics: Fabrics; onChange: (fabric: string) => void }) {
  const options = fabrics.roles.includes(value) ? fabrics.roles : [value, ...fabrics.roles]
  return (
    <div className="flex items-center gap-1">
      <label htmlFor={id} className="text-xs text-stone-600">
        {label}
      </label>
      <select id={id} value={value} onChange={(event) => onChange(event.target.value)} className="flex-1 rounded border border-stone-300 bg-white px-1 py-0.5 text-xs">
        {options.map((fabric) => (
          <option key={fabric} value={fabric}>
            {fabrics.nameOf(fabric)}
          </option>
        ))}
      </select>
    </div>
  )
}

/** Details of what is selected (a seam, leaf, berry or curl) and the appliqué stem ring. */
export function InspectorPanel({ store }: { store: BoardStore }) {
  const design = useBoard(store, designOf)
  const selection = useBoard(store, (state) => state.selection)
  const activeColorway = useBoard(store, (state) => state.activeColorway)
  const colorway = design.colorways.find((c) => c.name === activeColorway) ?? design.colorways[0]
  const fabrics: Fabrics = { roles: Object.keys(colorway?.fabrics ?? {}), nameOf: (fabric) => fabricDisplayName(colorway, fabric) }
  const units = design.units

  return (
    <section aria-labelledby="inspector-heading" className="space-y-3">
      <h2 id="inspector-heading" className="text-sm font-semibold uppercase tracking-wide text-stone-500">
        Selected
      </h2>
      {!selection && <p className="text-xs text-stone-500">Nothing selected. Use Select (V) and pick a seam, leaf, berry or curl.</p>}
      {selection?.kind === 'seam' && (() => {
        const seam = design.seams.find((s) => s.id === selection.id)
        if (!seam) return null
        return (
          <div className="space-y-1 text-xs">
            <p>
              Seam <strong>{seam.id}</strong> from ({seam.from.join(', ')}) to ({seam.to.join(', ')}) {units}
            </p>
            <p className="text-stone-500">Drag its square ends to move them. Leaves caught in it: {design.leaves.filter((l) => l.seam === seam.id).length}.</p>
            <button type="button" className={small} onClick={() => store.run('deleteSeam', { seamId: seam.id })}>
              Delete seam
            </button>
          </div>
        )
      })()}
      {selection?.kind === 'leaf' && (() => {
        const leaf = design.leaves.find((l) => l.id === selection.id)
        return leaf ? <LeafEditor key={leaf.id} store={store} design={design} leaf={leaf} fabrics={fabrics} /> : null
      })()}
      {selection?.kind === 'berry' && design.berries[selection.index] && (() => {
        const index = selection.index
        const berry = design.berries[index]!
        return (
          <div className="space-y-2">
            <NumberField id="berry-diameter" label="Finished diameter" value={berry.finishedDiameter} min={0} suffix={units} onCommit={(v) => v > 0 && store.run('updateBerry', { index, changes: { finishedDiameter: v } })} />
            <FabricSelect id="berry-fabric" label="Fabric" value={berry.fabric} fabrics={fabrics} onChange={(fabric) => store.run('updateBerry', { index, changes: { fabric } })} />
            <button type="button" className={small} onClick={() => store.run('deleteBerry', { index })}>
              Delete berry
            </button>
          </div>
        )
      })()}
      {selection?.kind === 'curl' && (
        <button type="button" className={small} onClick={() => store.run('deleteCurl', { index: selection.index })}>
          Delete curl
        </button>
      )}
      <StemRingEditor store={store} design={design} fabrics={fabrics} />
    </section>
  )
}

function LeafEditor({ store, design, leaf, fabrics }: { store: BoardStore; design: BoardDesign; leaf: Leaf; fabrics: Fabrics }) {
  const [error, setError] = useState<string | null>(null)
  const units = design.units
  const change = (changes: Partial<Leaf>) => {
    const next = { ...leaf, ...changes }
    const candidate = { ...design, leaves: design.leaves.map((l) => (l.id === leaf.id ? next : l)) }
    const parsed = designFileSchema.safeParse(candidate)
    if (!parsed.success) return setError(parsed.error.issues[0]?.message ?? 'Check the leaf.')
    if (!isPointedLeaf(next.length, next.width)) return setError('A pointed leaf must be longer than half its width.')
    setError(null)
    store.run('updateLeaf', { leafId: leaf.id, changes })
  }
  return (
    <div className="space-y-2" data-testid="leaf-editor">
      <p className="text-xs">
        <strong>{capitalised(boardPlan(design).leafNames.get(leaf.id) ?? 'leaf')}</strong>, lying on the {leaf.side} side of its seam, {Math.round(leaf.at * 100)} % along it.
      </p>
      <div className="grid grid-cols-2 gap-2">
        <NumberField id="leaf-length" label="Length" value={leaf.length} min={0} suffix={units} onCommit={(v) => change({ length: v })} />
        <NumberField id="leaf-width" label="Width" value={leaf.width} min={0} suffix={units} onCommit={(v) => change({ width: v })} />
        <NumberField id="leaf-angle" label="Tilt (°)" value={leaf.angle ?? 0} min={-75} max={75} step={5} onCommit={(v) => change({ angle: v })} />
        <NumberField id="leaf-at" label="Along seam (%)" value={Math.round(leaf.at * 100)} min={0} max={100} step={1} onCommit={(v) => change({ at: v / 100 })} />
      </div>
      {error && <p role="alert" className="text-xs text-madder-700">{error}</p>}
      <button type="button" className={small} onClick={() => store.run('flipLeafSide', { leafId: leaf.id })}>
        Flip to the other side
      </button>
      <LayerEditor store={store} leaf={leaf} fabrics={fabrics} />
      <button type="button" className={small} onClick={() => store.run('deleteLeaf', { leafId: leaf.id })}>
        Delete leaf
      </button>
    </div>
  )
}

/**
 * The stacked layers of a leaf, bottom first: each layer's fabric, its turn (degrees, on top of
 * the leaf's tilt) and its size (% of the leaf), so the layers beneath show. Unset values show the
 * default fan; "Default" puts a layer back on it.
 */
function LayerEditor({ store, leaf, fabrics }: { store: BoardStore; leaf: Leaf; fabrics: Fabrics }) {
  const layers = leafLayers({ ...leaf, angle: leaf.angle ?? 0 })
  const leafId = leaf.id
  return (
    <fieldset className="space-y-1" data-testid="leaf-layers">
      <legend className="text-xs font-medium text-stone-600">Layers, bottom first</legend>
      <p className="text-xs text-stone-500">Turn and size each layer against the leaf so the ones beneath show.</p>
      {layers.map((layer, index) => {
        const own = leaf.layerOffsets?.[index]
        return (
          <div key={index} className="space-y-1 rounded border border-linen-200 p-1">
            <div className="flex items-center gap-1">
              <FabricSelect id={`leaf-layer-${index}`} label={`${index + 1}.`} value={layer.fabric} fabrics={fabrics} onChange={(fabric) => store.run('setLeafLayerFabric', { leafId, index, fabric })} />
              {leaf.layers.length > 1 && (
                <button type="button" className={small} aria-label={`Remove layer ${index + 1}`} onClick={() => store.run('removeLeafLayer', { leafId, index })}>
                  ×
                </button>
              )}
            </div>
            <div className="grid grid-cols-[1fr_1fr_auto] items-end gap-1">
              <NumberField
                id={`leaf-layer-${index}-turn`}
                label="Turn (°)"
                value={layer.turn}
                min={-LAYER_TURN_LIMIT_DEGREES}
                max={LAYER_TURN_LIMIT_DEGREES}
                step={5}
                onCommit={(turn) => store.run('setLeafLayerOffset', { leafId, index, turn })}
              />
              <NumberField
                id={`leaf-layer-${index}-size`}
                label="Size (%)"
                value={Math.round(layer.scale * 100)}
                min={LAYER_SCALE_RANGE[0] * 100}
                max={LAYER_SCALE_RANGE[1] * 100}
                step={5}
                onCommit={(percent) => store.run('setLeafLayerOffset', { leafId, index, scale: percent / 100 })}
              />
              {(own?.turn !== undefined || own?.scale !== undefined) && (
                <button type="button" className={small} aria-label={`Put layer ${index + 1} back on the default fan`} onClick={() => store.run('setLeafLayerOffset', { leafId, index, turn: null, scale: null })}>
                  Default
                </button>
              )}
            </div>
          </div>
        )
      })}
      <button type="button" className={small} onClick={() => store.run('addLeafLayer', { leafId, fabric: fabrics.roles[0] ?? leaf.layers[0]! })}>
        Add a layer on top
      </button>
    </fieldset>
  )
}

function StemRingEditor({ store, design, fabrics }: { store: BoardStore; design: BoardDesign; fabrics: Fabrics }) {
  const stem = design.stems[0]
  const units = design.units
  const perInch = unitsPerInch(units)
  return (
    <div className="space-y-2 border-t border-linen-200 pt-3">
      <label className="flex items-center gap-2 text-sm font-medium">
        <input
          type="checkbox"
          checked={Boolean(stem)}
          onChange={(event) =>
            store.run(
              'setStemRing',
              event.target.checked
                ? { radius: Math.round(design.ring.outerRadius * 0.8 * 100) / 100, finishedWidth: 0.375 * perInch, fabric: fabrics.roles[0] ?? 'stem' }
                : null,
            )
          }
        />
        Appliqué stem ring
      </label>
      {stem && (
        <div className="grid grid-cols-2 gap-2">
          <NumberField id="stem-radius" label="Radius" value={stem.radius} min={0} suffix={units} onCommit={(v) => v > 0 && store.run('setStemRing', { ...stem, radius: v })} />
          <NumberField id="stem-width" label="Finished width" value={stem.finishedWidth} min={0} suffix={units} onCommit={(v) => v > 0 && store.run('setStemRing', { ...stem, finishedWidth: v })} />
          <div className="col-span-2">
            <FabricSelect id="stem-fabric" label="Fabric" value={stem.fabric} fabrics={fabrics} onChange={(fabric) => store.run('setStemRing', { ...stem, fabric })} />
          </div>
        </div>
      )}
    </div>
  )
}
