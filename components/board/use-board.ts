'use client'

import { useSyncExternalStore } from 'react'
import type { BoardState, BoardStore } from '@/lib/board/store'

/**
 * Subscribes a component to one slice of the board's state. The selector must return a value
 * that stays identical while its part of the state is unchanged (a field, not a new object), so
 * a component re-renders only when what it draws changes.
 */
export function useBoard<T>(store: BoardStore, selector: (state: BoardState) => T): T {
  return useSyncExternalStore(
    store.subscribe,
    () => selector(store.getState()),
    () => selector(store.getState()),
  )
}
