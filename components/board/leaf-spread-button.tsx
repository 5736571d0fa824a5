'use client'

import { useState } from 'react'
import { spreadLeafFabrics } from '@/geometry/spread-leaf-fabrics'
import { boardActions, type ActionContext } from '@/lib/board/actions'
import type { BoardDesign } from '@/lib/board/commands'
import { design as designOf } from '@/lib/board/store'
import { useBoard } from './use-board'

/**
 * "Spread the leaf colours": one undoable step that deals the fabrics on the leaves out around
 * the ring. What it could not do (an odd count with two fabrics, mirror edges) is said beside
 * the button until the design changes again.
 */
export function LeafSpreadButton({ context }: { context: ActionContext }) {
  const { store } = context
  const design = useBoard(store, designOf)
  const [result, setResult] = useState<{ after: BoardDesign; messages: readonly string[] } | null>(null)

  function spread() {
    const before = designOf(store.getState())
    const { notes } = spreadLeafFabrics(before)
    boardActions.spreadLeafColours.run(context)
    const after = designOf(store.getState())
    const messages = notes.map((note) => note.message)
    setResult({ after, messages: after === before && messages.length === 0 ? ['The leaf colours are already spread.'] : messages })
  }

  const messages = result && result.after === design ? result.messages : []
  return (
    <div className="space-y-1">
      <button
        type="button"
        onClick={spread}
        disabled={design.leaves.length === 0}
        title={`${boardActions.spreadLeafColours.label}: neighbouring leaves get different fabrics, each fabric about as often as the others`}
        className="w-full rounded border border-stone-300 bg-white px-2 py-1 text-xs hover:bg-linen-100 disabled:opacity-40"
      >
        Spread the leaf colours
      </button>
      {messages.length > 0 && (
        <ul role="status" aria-label="Leaf colours" className="space-y-0.5 text-xs text-stone-600">
          {messages.map((message) => (
            <li key={message}>{message}</li>
          ))}
        </ul>
      )}
    </div>
  )
}
