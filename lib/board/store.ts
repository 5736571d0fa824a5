/**
 * The drafting board's state, kept outside React. Components subscribe with
 * useSyncExternalStore; every change of the design goes through the command table and the undo
 * history, while the view (zoom, pan, side shown), the tool and the selection are never recorded.
 */
import type { DesignFile } from '@/lib/schemas/design'
import { commands, normalizeDesign, type BoardDesign, type CommandArgs, type CommandName } from './commands'
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
  /** Changes that are not part of the design and so never undone. */
  update(change: Partial<Omit<BoardState, 'history'>>): void
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
    // A selection that points at something undone away is dropped.
    set(keepValidSelection({ ...state, history }))
  }

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
    update: (change) => set({ ...state, ...change }),
  }
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
