/**
 * The drafting board's state, kept outside React. Components subscribe with
 * useSyncExternalStore; every change of the design goes through the command table and the undo
 * history, while the view (zoom, pan, side shown), the tool and the selection are never recorded.
 * Those change only through the store's named operations (`chooseTool`, `panBy`, `nextStep`, …),
 * so every button, shortcut and pointer gesture that does one thing does it the same way.
 */
import type { DesignFile } from '@/lib/schemas/design'
import { commands, normalizeDesign, type BoardDesign, type CommandArgs, type CommandName } from './commands'
import type { RepairPreview } from './repair-ghost'
import { fitView, panBy, zoomAt } from './view'
import {
  bailToMark,
  canRedo,
  canUndo,
  createHistory,
  markHistory,
  pushHistory,
  redoHistory,
  squashToMark,
  undoHistory,
  type History,
} from './history'

export type Tool = 'select' | 'seam' | 'fill' | 'leaf' | 'berry' | 'curl' | 'order'

export type Selection =
  | { readonly kind: 'seam'; readonly id: string }
  | { readonly kind: 'leaf'; readonly id: string }
  | { readonly kind: 'berry'; readonly index: number }
  | { readonly kind: 'curl'; readonly index: number }
  | null

/** Which face of the work the board shows: the quilt's right side, or the paper's printed side. */
export type Side = 'fabric' | 'printed'

export interface View {
  /** Screen pixels per design unit. */
  readonly zoom: number
  /** Where the ring's centre sits on the screen, in pixels. */
  readonly centre: readonly [number, number]
  readonly side: Side
}

export interface Snapping {
  /** All snapping off (the designer holds Alt). */
  readonly enabled: boolean
  readonly grid: boolean
  /** Grid step in design units. */
  readonly gridSize: number
  readonly angles: boolean
}

/** What the pointer is in the middle of drawing: shown on the board, never part of the design. */
export interface BoardDraft {
  /** A seam being drawn, from its first end to the pointer. */
  readonly seam: readonly [readonly [number, number], readonly [number, number]] | null
  /** Where the pointer snapped to, and onto what. */
  readonly snap: { readonly point: readonly [number, number]; readonly kind: string } | null
  /** Points of an embroidered curl being drawn. */
  readonly curl: readonly (readonly [number, number])[] | null
}

export interface BoardState {
  readonly history: History<BoardDesign>
  readonly tool: Tool
  readonly selection: Selection
  readonly view: View
  readonly snapping: Snapping
  readonly activeColorway: string
  readonly activeFabric: string | null
  /** Index of the sewing step highlighted by the step-through, or null. */
  readonly step: number | null
  /** Areas clicked so far while setting an order by hand, as sections of points. */
  readonly handOrderDraft: readonly (readonly (readonly [number, number])[])[] | null
  readonly draft: BoardDraft
  /** The plan problem under the pointer (or picked in the panel), shown with its message. */
  readonly shownProblem: number | null
  /** The suggested repair pointed at in the plan panel, drawn as a ghost on the ring (never recorded). */
  readonly shownRepair: RepairPreview | null
}

export interface BoardStore {
  getState(): BoardState
  subscribe(listener: () => void): () => void
  /** Runs a command and records it as one undo step (or as part of the current drag). */
  run<Name extends CommandName>(name: Name, args: CommandArgs<Name>): void
  /** Starts a drag: later commands become one undo step when it ends. */
  beginDrag(): void
  endDrag(): void
  cancelDrag(): void
  undo(): void
  redo(): void

  // Named operations on what is not the design, and so never undone.

  /** Picks a tool; the order tool starts a hand-set order from its first section. */
  chooseTool(tool: Tool): void
  select(selection: Selection): void
  /** Moves the board by screen pixels. */
  panBy(dx: number, dy: number): void
  /** Zooms by `factor` about a point on the screen, which stays where it is. */
  zoomAt(screen: readonly [number, number], factor: number): void
  /** Shows the whole ring in a board of this size (pixels). */
  fit(width: number, height: number): void
  showSide(side: Side): void
  toggleSide(): void
  setSnapping(change: Partial<Snapping>): void
  chooseColorway(name: string): void
  chooseFabric(name: string | null): void
  /** Chooses a fabric and the fill tool, to fill areas with it. */
  fillWith(fabric: string): void
  /** Highlights a sewing step (null: none). */
  showStep(step: number | null): void
  nextStep(): void
  previousStep(): void
  /** Shows a plan problem's message (null: none). */
  showProblem(index: number | null): void
  /** Draws a suggested repair as a ghost on the ring while it is pointed at (null: none). */
  showRepair(preview: RepairPreview | null): void
  /** What the pointer is drawing, shown on the board. */
  setDraft(change: Partial<BoardDraft>): void
  /** Escape: drops what is being drawn (a hand-set order starts again from its first section). */
  cancelDraft(): void
  /** Adds an area, named by a point, to the last section of the hand-set order being clicked. */
  addHandOrderArea(at: readonly [number, number]): void
  /** Starts the next section of the hand-set order being clicked. */
  newHandOrderSection(): void
  restartHandOrder(): void
  /** Leaves the order tool (the order, if set, is already a command of the design). */
  endHandOrder(): void
}

export const EMPTY_DRAFT: BoardDraft = { seam: null, snap: null, curl: null }

export const design = (state: BoardState): BoardDesign => state.history.present
export const canUndoBoard = (state: BoardState) => canUndo(state.history)
export const canRedoBoard = (state: BoardState) => canRedo(state.history)

export function initialBoardState(file: DesignFile, overrides: Partial<Omit<BoardState, 'history'>> = {}): BoardState {
  const normalized = normalizeDesign(file)
  const firstColorway = normalized.colorways[0]
  return {
    history: createHistory(normalized),
    tool: 'select',
    selection: null,
    view: { zoom: 30, centre: [400, 400], side: 'fabric' },
    snapping: { enabled: true, grid: true, gridSize: normalized.units === 'cm' ? 0.5 : 0.25, angles: true },
    activeColorway: firstColorway?.name ?? 'Main',
    activeFabric: Object.keys(firstColorway?.fabrics ?? {})[0] ?? null,
    step: null,
    handOrderDraft: null,
    draft: EMPTY_DRAFT,
    shownProblem: null,
    shownRepair: null,
    ...overrides,
  }
}

/** Creates a store for one design, e.g. `createBoardStore(pattern.design)`. */
export function createBoardStore(file: DesignFile, overrides: Partial<Omit<BoardState, 'history'>> = {}): BoardStore {
  let state = initialBoardState(file, overrides)
  const listeners = new Set<() => void>()
  const set = (next: BoardState) => {
    if (next === state) return
    state = next
    for (const listener of listeners) listener()
  }
  const setHistory = (history: History<BoardDesign>) => {
    if (history === state.history) return
    // A selection that points at something undone away is dropped; the active colourway follows
    // a rename and moves to a neighbour when it is deleted (or undone away). A repair's ghost
    // belongs to the design it was suggested for, so any change of the design takes it away.
    const shownRepair = history.present === state.history.present ? state.shownRepair : null
    set(keepActiveColorway(state.history.present, keepValidSelection({ ...state, history, shownRepair })))
  }

  /** Private: every caller goes through a named operation below. */
  const update = (change: Partial<Omit<BoardState, 'history'>>) => set({ ...state, ...change })
  const handOrder = () => (state.handOrderDraft && state.handOrderDraft.length > 0 ? state.handOrderDraft : [[]])

  return {
    getState: () => state,
    subscribe(listener) {
      listeners.add(listener)
      return () => listeners.delete(listener)
    },
    run(name, args) {
      const command = commands[name] as { run: (d: BoardDesign, a: typeof args) => BoardDesign }
      setHistory(pushHistory(state.history, command.run(state.history.present, args)))
    },
    beginDrag: () => setHistory(markHistory(state.history)),
    endDrag: () => setHistory(squashToMark(state.history)),
    cancelDrag: () => setHistory(bailToMark(state.history)),
    undo: () => setHistory(undoHistory(state.history)),
    redo: () => setHistory(redoHistory(state.history)),

    chooseTool: (tool) => update({ tool, handOrderDraft: tool === 'order' ? [[]] : null }),
    select: (selection) => update({ selection }),
    panBy: (dx, dy) => update({ view: panBy(state.view, dx, dy) }),
    zoomAt: (screen, factor) => update({ view: zoomAt(state.view, screen, factor) }),
    fit: (width, height) => update({ view: fitView(state.history.present.ring.outerRadius, width, height, state.view.side) }),
    showSide: (side) => update({ view: { ...state.view, side } }),
    toggleSide: () => update({ view: { ...state.view, side: state.view.side === 'fabric' ? 'printed' : 'fabric' } }),
    setSnapping: (change) => update({ snapping: { ...state.snapping, ...change } }),
    chooseColorway: (activeColorway) => update({ activeColorway }),
    chooseFabric: (activeFabric) => update({ activeFabric }),
    fillWith: (fabric) => update({ activeFabric: fabric, tool: 'fill', handOrderDraft: null }),
    showStep: (step) => update({ step }),
    nextStep: () => update({ step: state.step === null ? 0 : state.step + 1 }),
    previousStep: () => update({ step: Math.max(0, (state.step ?? 0) - 1) }),
    showProblem: (shownProblem) => update({ shownProblem }),
    showRepair: (shownRepair) => update({ shownRepair }),
    setDraft: (change) => update({ draft: { ...state.draft, ...change } }),
    cancelDraft: () => update({ draft: EMPTY_DRAFT, ...(state.tool === 'order' ? { handOrderDraft: [[]] } : {}) }),
    addHandOrderArea(at) {
      const sections = handOrder()
      update({ handOrderDraft: [...sections.slice(0, -1), [...sections[sections.length - 1]!, at]] })
    },
    newHandOrderSection: () => update({ handOrderDraft: [...handOrder(), []] }),
    restartHandOrder: () => update({ handOrderDraft: [[]] }),
    endHandOrder: () => update({ tool: 'select', handOrderDraft: null }),
  }
}

/**
 * The colourway shown stays the one chosen while it exists. When a command (or an undo) takes its
 * name away, the board shows the colourway now at its place in the list: the renamed one after a
 * rename, the next one (or the one before, for the last) after a delete.
 */
function keepActiveColorway(before: BoardDesign, state: BoardState): BoardState {
  const colorways = design(state).colorways
  if (colorways.some((c) => c.name === state.activeColorway)) return state
  const index = before.colorways.findIndex((c) => c.name === state.activeColorway)
  const next = colorways[Math.min(Math.max(index, 0), colorways.length - 1)]
  return next ? { ...state, activeColorway: next.name } : state
}

function keepValidSelection(state: BoardState): BoardState {
  const current = design(state)
  const selection = state.selection
  if (!selection) return state
  const stillThere =
    (selection.kind === 'seam' && current.seams.some((seam) => seam.id === selection.id)) ||
    (selection.kind === 'leaf' && current.leaves.some((leaf) => leaf.id === selection.id)) ||
    (selection.kind === 'berry' && selection.index < current.berries.length) ||
    (selection.kind === 'curl' && selection.index < current.curls.length)
  return stillThere ? state : { ...state, selection: null }
}
