/**
 * What the designer was looking at on a pattern's board — the side shown and the colourway —
 * kept in the browser so a reload opens the board as it was left. Not part of the design and
 * never undone.
 */
import type { BoardState, Side } from './store'

export type PreferenceStorage = Pick<Storage, 'getItem' | 'setItem'>

export interface ViewPreferences {
  readonly side: Side
  readonly colorway: string | null
}

const key = (patternId: string) => `wreathwright:view:${patternId}`

/** The preferences saved for a pattern, or null (none yet, or unreadable). */
export function readViewPreferences(storage: PreferenceStorage | null, patternId: string): ViewPreferences | null {
  try {
    const value = JSON.parse(storage?.getItem(key(patternId)) ?? 'null') as Partial<ViewPreferences> | null
    if (!value || (value.side !== 'fabric' && value.side !== 'printed')) return null
    return { side: value.side, colorway: typeof value.colorway === 'string' ? value.colorway : null }
  } catch {
    return null
  }
}

export function writeViewPreferences(storage: PreferenceStorage | null, patternId: string, state: Pick<BoardState, 'view' | 'activeColorway'>): void {
  try {
    storage?.setItem(key(patternId), JSON.stringify({ side: state.view.side, colorway: state.activeColorway }))
  } catch {
    // A full or refused storage only costs the designer their view on reload.
  }
}
