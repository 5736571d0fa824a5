'use client'

import type { ActionContext } from '@/lib/board/actions'
import { design as designOf, type BoardStore } from '@/lib/board/store'
import { AddFabricRoleForm, ColorwayControls, ColorwayFabrics } from './colorway-controls'
import { LeafSpreadButton } from './leaf-spread-button'
import { ThemePhoto } from './theme-photo'
import { useBoard } from './use-board'

/**
 * The colourways and their fabrics. Fabric roles (background, leaf-dark …) are shared by every
 * colourway; each colourway gives every role a fabric of its own: a name, a colour and a swatch
 * image, and has a theme-fabric photo of its own. Choosing a swatch picks it and the Fill tool.
 * Each block is its own component (colorway-controls.tsx, theme-photo.tsx).
 */
export function FabricPanel({ store, context }: { store: BoardStore; context: ActionContext }) {
  const design = useBoard(store, designOf)
  const activeColorway = useBoard(store, (state) => state.activeColorway)
  const activeFabric = useBoard(store, (state) => state.activeFabric)
  const colorway = design.colorways.find((c) => c.name === activeColorway) ?? design.colorways[0]

  return (
    <section aria-labelledby="fabrics-heading" className="space-y-3">
      <h2 id="fabrics-heading" className="text-sm font-semibold uppercase tracking-wide text-stone-500">
        Fabrics
      </h2>
      <ColorwayControls context={context} design={design} colorway={colorway} />
      <ColorwayFabrics store={store} colorway={colorway} activeFabric={activeFabric} />
      <ThemePhoto key={colorway?.name} store={store} colorway={colorway} />
      <AddFabricRoleForm store={store} design={design} />
      <LeafSpreadButton context={context} />
    </section>
  )
}
