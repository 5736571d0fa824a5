/**
 * What the toolbar buttons, the keyboard shortcuts and the help panel offer: one table, so a
 * shortcut always does exactly what its button does.
 */
import { freeColorwayName } from './commands'
import { design, type BoardStore, type Tool } from './store'

export interface ActionContext {
  readonly store: BoardStore
  /** Shows the whole ring on the board. */
  fit(): void
  toggleHelp(): void
  /** The middle of the canvas on screen, for zooming by keyboard. */
  canvasCentre(): readonly [number, number]
}

export interface BoardAction {
  readonly label: string
  /** Keys as `event.key`, with `Mod+` for Ctrl (or ⌘ on a Mac) and `Shift+` where it matters. */
  readonly keys: readonly string[]
  run(context: ActionContext): void
}

const tool = (name: Tool, label: string, key: string): BoardAction => ({
  label,
  keys: [key],
  run: ({ store }) => store.chooseTool(name),
})

function deleteSelection({ store }: ActionContext): void {
  const { selection } = store.getState()
  if (!selection) return
  if (selection.kind === 'seam') store.run('deleteSeam', { seamId: selection.id })
  if (selection.kind === 'leaf') store.run('deleteLeaf', { leafId: selection.id })
  if (selection.kind === 'berry') store.run('deleteBerry', { index: selection.index })
  if (selection.kind === 'curl') store.run('deleteCurl', { index: selection.index })
  store.select(null)
}

const PAN_STEP_PIXELS = 60

/** The colourway the board shows (the first when the chosen one is gone). */
function shownColorway(store: BoardStore): string | undefined {
  const { activeColorway } = store.getState()
  const colorways = design(store.getState()).colorways
  return (colorways.find((c) => c.name === activeColorway) ?? colorways[0])?.name
}

/** Runs a colourway command that adds one, and shows the colourway it added. */
function showAdded(store: BoardStore, add: () => void): void {
  const before = new Set(design(store.getState()).colorways.map((c) => c.name))
  add()
  const added = design(store.getState()).colorways.find((c) => !before.has(c.name))
  if (added) store.chooseColorway(added.name)
}

export const boardActions = {
  selectTool: tool('select', 'Select and move', 'v'),
  seamTool: tool('seam', 'Draw seams', 's'),
  fillTool: tool('fill', 'Fill areas with the chosen fabric', 'f'),
  leafTool: tool('leaf', 'Place leaf inserts on seams', 'l'),
  berryTool: tool('berry', 'Place berries', 'b'),
  curlTool: tool('curl', 'Draw embroidered curls', 'c'),
  orderTool: tool('order', 'Set the sewing order by hand', 'o'),
  undo: { label: 'Undo', keys: ['Mod+z'], run: ({ store }) => store.undo() },
  redo: { label: 'Redo', keys: ['Mod+Shift+z', 'Mod+y'], run: ({ store }) => store.redo() },
  deleteSelection: { label: 'Delete the selected seam, leaf, berry or curl', keys: ['Delete', 'Backspace'], run: deleteSelection },
  toggleSide: {
    label: 'Switch between fabric side and printed side',
    keys: ['p'],
    run: ({ store }) => store.toggleSide(),
  },
  fit: { label: 'Fit the ring to the board', keys: ['0'], run: (context) => context.fit() },
  zoomIn: { label: 'Zoom in', keys: ['+', '='], run: (c) => c.store.zoomAt(c.canvasCentre(), 1.25) },
  zoomOut: { label: 'Zoom out', keys: ['-'], run: (c) => c.store.zoomAt(c.canvasCentre(), 0.8) },
  panLeft: { label: 'Pan left', keys: ['ArrowLeft'], run: ({ store }) => store.panBy(PAN_STEP_PIXELS, 0) },
  panRight: { label: 'Pan right', keys: ['ArrowRight'], run: ({ store }) => store.panBy(-PAN_STEP_PIXELS, 0) },
  panUp: { label: 'Pan up', keys: ['ArrowUp'], run: ({ store }) => store.panBy(0, PAN_STEP_PIXELS) },
  panDown: { label: 'Pan down', keys: ['ArrowDown'], run: ({ store }) => store.panBy(0, -PAN_STEP_PIXELS) },
  // A button in the fabric panel; no letter key says "spread", so it has none.
  spreadLeafColours: {
    label: 'Spread the leaf colours around the ring',
    keys: [],
    run: ({ store }) => store.run('spreadLeafColours', {}),
  },
  // Buttons in the fabric panel, for the colourway the board shows; no keys.
  newColorway: {
    label: 'New colourway (a copy of the one shown, to recolour)',
    keys: [],
    run: ({ store }) =>
      showAdded(store, () => store.run('addColorway', { name: freeColorwayName(design(store.getState()), `Colourway ${design(store.getState()).colorways.length + 1}`), copyOf: shownColorway(store) })),
  },
  duplicateColorway: {
    label: 'Duplicate the colourway shown',
    keys: [],
    run: ({ store }) => {
      const shown = shownColorway(store)
      if (shown !== undefined) showAdded(store, () => store.run('duplicateColorway', { colorway: shown }))
    },
  },
  deleteColorway: {
    label: 'Delete the colourway shown (a design keeps at least one)',
    keys: [],
    run: ({ store }) => {
      const shown = shownColorway(store)
      if (shown !== undefined) store.run('deleteColorway', { colorway: shown })
    },
  },
  nextStep: { label: 'Next sewing step', keys: [']'], run: ({ store }) => store.nextStep() },
  previousStep: { label: 'Previous sewing step', keys: ['['], run: ({ store }) => store.previousStep() },
  help: { label: 'Show or hide this list of shortcuts', keys: ['?'], run: (context) => context.toggleHelp() },
} satisfies Record<string, BoardAction>

export type BoardActionName = keyof typeof boardActions

/** The key of an event as the table writes it, e.g. `Mod+Shift+z`. */
export function keyOf(event: Pick<KeyboardEvent, 'key' | 'ctrlKey' | 'metaKey' | 'shiftKey'>): string {
  const modifier = event.ctrlKey || event.metaKey ? 'Mod+' : ''
  // Shift only matters with Mod: '?' and '+' already carry it in the key itself.
  const shift = modifier && event.shiftKey ? 'Shift+' : ''
  const key = event.key.length === 1 ? event.key.toLowerCase() : event.key
  return `${modifier}${shift}${key}`
}

/** The action a key press asks for, if any. */
export function actionForKey(key: string): BoardActionName | null {
  for (const [name, action] of Object.entries(boardActions) as [BoardActionName, BoardAction][]) {
    if (action.keys.includes(key)) return name
  }
  return null
}
