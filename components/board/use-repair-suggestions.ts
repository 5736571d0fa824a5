'use client'

import { useEffect, useState } from 'react'
import { boardSuggestions, cachedBoardSuggestions, wantsSuggestions, type BoardSuggestions } from '@/lib/board/board-plan'
import type { BoardDesign } from '@/lib/board/commands'
import type { BoardStore } from '@/lib/board/store'
import { useBoard } from './use-board'

/**
 * How long the design must stay still before the repair search starts. The search runs on the
 * main thread within its budget (BOARD_REPAIR_BUDGET_MS); waiting for a pause keeps it off every
 * pointer move of a drag and every key of a typed radius.
 */
export const REPAIR_SEARCH_DELAY_MS = 300

/**
 * The repairs suggested for a design: null when it needs none (sewable in one section, or not a
 * valid design), 'looking' until the designer pauses and the search has run, then the result.
 * A design searched before (after an undo, say) gets its result at once.
 */
export function useRepairSuggestions(store: BoardStore, design: BoardDesign): BoardSuggestions | 'looking' | null {
  const dragging = useBoard(store, (state) => state.history.mark !== null)
  const wanted = wantsSuggestions(design)
  const [found, setFound] = useState<{ readonly design: BoardDesign; readonly result: BoardSuggestions } | null>(null)
  useEffect(() => {
    if (!wanted || dragging || cachedBoardSuggestions(design)) return
    const timer = setTimeout(() => setFound({ design, result: boardSuggestions(design) }), REPAIR_SEARCH_DELAY_MS)
    return () => clearTimeout(timer)
  }, [design, wanted, dragging])
  if (!wanted) return null
  return cachedBoardSuggestions(design) ?? (found?.design === design ? found.result : 'looking')
}
