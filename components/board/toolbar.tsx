'use client'

import { boardActions, type ActionContext, type BoardActionName } from '@/lib/board/actions'
import { canRedoBoard, canUndoBoard, type Tool } from '@/lib/board/store'
import { useBoard } from './use-board'

const TOOLS: readonly { tool: Tool; action: BoardActionName; label: string }[] = [
  { tool: 'select', action: 'selectTool', label: 'Select' },
  { tool: 'seam', action: 'seamTool', label: 'Seam' },
  { tool: 'fill', action: 'fillTool', label: 'Fill' },
  { tool: 'leaf', action: 'leafTool', label: 'Leaf' },
  { tool: 'berry', action: 'berryTool', label: 'Berry' },
  { tool: 'curl', action: 'curlTool', label: 'Curl' },
  { tool: 'order', action: 'orderTool', label: 'Order' },
]

const button = 'rounded border border-stone-300 bg-white px-2.5 py-1 text-sm hover:bg-linen-100 disabled:opacity-40'
const pressed = 'aria-pressed:border-thread-700 aria-pressed:bg-thread-700 aria-pressed:text-white'

/** Tools, history, sides and zoom: every button runs the same action as its shortcut. */
export function Toolbar({ context }: { context: ActionContext }) {
  const { store } = context
  const tool = useBoard(store, (state) => state.tool)
  const side = useBoard(store, (state) => state.view.side)
  const canUndo = useBoard(store, canUndoBoard)
  const canRedo = useBoard(store, canRedoBoard)
  const snapping = useBoard(store, (state) => state.snapping)
  const hasSelection = useBoard(store, (state) => state.selection !== null)
  const run = (name: BoardActionName) => boardActions[name].run(context)
  const shortcut = (name: BoardActionName) => boardActions[name].keys[0]?.replace('Mod+', 'Ctrl+').toUpperCase()

  return (
    <div role="toolbar" aria-label="Drafting tools" className="flex flex-wrap items-center gap-1.5 border-b border-linen-200 bg-white px-3 py-2">
      <div role="group" aria-label="Tool" className="flex flex-wrap gap-1">
        {TOOLS.map(({ tool: name, action, label }) => (
          <button key={name} type="button" aria-pressed={tool === name} title={`${boardActions[action].label} (${shortcut(action)})`} className={`${button} ${pressed}`} onClick={() => run(action)}>
            {label}
          </button>
        ))}
      </div>
      <span className="mx-1 h-6 w-px bg-stone-200" aria-hidden />
      <button type="button" className={button} disabled={!canUndo} onClick={() => run('undo')} title="Undo (Ctrl+Z)">
        Undo
      </button>
      <button type="button" className={button} disabled={!canRedo} onClick={() => run('redo')} title="Redo (Ctrl+Shift+Z)">
        Redo
      </button>
      <button type="button" className={button} disabled={!hasSelection} onClick={() => run('deleteSelection')} title="Delete (Del)">
        Delete
      </button>
      <span className="mx-1 h-6 w-px bg-stone-200" aria-hidden />
      <div role="group" aria-label="Side shown" className="flex gap-1">
        <button type="button" aria-pressed={side === 'fabric'} className={`${button} ${pressed}`} onClick={() => side !== 'fabric' && run('toggleSide')} title="As the finished quilt looks (P)">
          Fabric side
        </button>
        <button type="button" aria-pressed={side === 'printed'} className={`${button} ${pressed}`} onClick={() => side !== 'printed' && run('toggleSide')} title="Mirrored, as printed on the foundation paper (P)">
          Printed side
        </button>
      </div>
      <span className="mx-1 h-6 w-px bg-stone-200" aria-hidden />
      <button type="button" className={button} onClick={() => run('zoomOut')} aria-label="Zoom out" title="Zoom out (−)">
        −
      </button>
      <button type="button" className={button} onClick={() => run('fit')} title="Fit to the board (0)">
        Fit
      </button>
      <button type="button" className={button} onClick={() => run('zoomIn')} aria-label="Zoom in" title="Zoom in (+)">
        +
      </button>
      <span className="mx-1 h-6 w-px bg-stone-200" aria-hidden />
      <label className="flex items-center gap-1 text-sm">
        <input type="checkbox" checked={snapping.grid} onChange={(event) => store.setSnapping({ grid: event.target.checked })} />
        Grid
      </label>
      <label className="flex items-center gap-1 text-sm">
        <input type="checkbox" checked={snapping.angles} onChange={(event) => store.setSnapping({ angles: event.target.checked })} />
        15° steps
      </label>
      <button type="button" className={`${button} ml-auto`} onClick={() => run('help')} title="Shortcuts (?)">
        Shortcuts
      </button>
    </div>
  )
}
