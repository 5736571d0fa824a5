'use client'

import { boardActions } from '@/lib/board/actions'

/** Every shortcut of the board, read from the same table the keys use. */
export function HelpPanel({ onClose }: { onClose: () => void }) {
  return (
    <section role="dialog" aria-label="Keyboard shortcuts" className="absolute right-4 top-4 z-10 max-h-[80%] w-80 overflow-auto rounded-lg border border-stone-300 bg-white p-4 shadow-lg">
      <div className="mb-2 flex items-center justify-between">
        <h2 className="font-semibold">Keyboard shortcuts</h2>
        <button type="button" onClick={onClose} className="text-sm text-thread-700 underline" autoFocus>
          Close
        </button>
      </div>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
        {Object.values(boardActions).map((action) => (
          <div key={action.label} className="contents">
            <dt>
              {action.keys.length === 0 && <span className="text-xs text-stone-500">button</span>}
              {action.keys.map((key) => (
                <kbd key={key} className="mr-1 rounded border border-stone-300 bg-linen-50 px-1 font-mono text-xs">
                  {key.replace('Mod+', 'Ctrl+')}
                </kbd>
              ))}
            </dt>
            <dd>{action.label}</dd>
          </div>
        ))}
        <dt>
          <kbd className="rounded border border-stone-300 bg-linen-50 px-1 font-mono text-xs">Alt</kbd>
        </dt>
        <dd>Hold while drawing to turn snapping off</dd>
        <dt>
          <kbd className="rounded border border-stone-300 bg-linen-50 px-1 font-mono text-xs">Esc</kbd>
        </dt>
        <dd>Stop drawing or dragging and put things back</dd>
        <dt>
          <kbd className="rounded border border-stone-300 bg-linen-50 px-1 font-mono text-xs">Enter</kbd>
        </dt>
        <dd>Finish a curl</dd>
        <dt className="text-xs text-stone-500">Wheel / right-drag</dt>
        <dd>Zoom at the pointer / pan</dd>
      </dl>
    </section>
  )
}
