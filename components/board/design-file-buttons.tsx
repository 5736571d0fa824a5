'use client'

import { useRef, useState, type ChangeEvent } from 'react'
import { exportDesignFile, importDesignFile, DESIGN_FILE_MAX_BYTES } from '@/lib/board/design-file'
import type { BoardStore } from '@/lib/board/store'
import type { DesignIssue } from '@/lib/schemas/design'
import { downloadFile } from '@/components/ui/download'

type Notice = { readonly kind: 'done'; readonly text: string } | { readonly kind: 'refused'; readonly text: string; readonly issues: readonly DesignIssue[] }

/**
 * Export the board's design as a design file, or import one in its place (one undo step). An
 * invalid file changes nothing and its problems are listed by field.
 *
 * @example <DesignFileButtons store={store} />
 */
export function DesignFileButtons({ store }: { store: BoardStore }) {
  const input = useRef<HTMLInputElement>(null)
  const [notice, setNotice] = useState<Notice | null>(null)

  function exportFile() {
    const file = exportDesignFile(store.getState().history.present)
    downloadFile(file.text, file.fileName, file.mimeType)
    setNotice({ kind: 'done', text: `Exported ${file.fileName}.` })
  }

  async function importFile(event: ChangeEvent<HTMLInputElement>) {
    const file = event.currentTarget.files?.[0]
    // Cleared so choosing the same file again (after fixing it) still counts as a choice.
    event.currentTarget.value = ''
    if (!file) return
    // Checked before reading, so a wrong choice (a video, say) never loads into memory.
    if (file.size > DESIGN_FILE_MAX_BYTES) {
      return setNotice({ kind: 'refused', text: `${file.name} is too large to be a Wreathwright design file.`, issues: [] })
    }
    const result = importDesignFile(await file.text())
    if (!result.ok) return setNotice({ kind: 'refused', text: `${file.name}: ${result.message}`, issues: result.issues })
    store.run('replaceDesign', { design: result.design })
    setNotice({ kind: 'done', text: `Imported “${result.design.name}” from ${file.name}. Undo brings back the design you had.` })
  }

  return (
    <div className="space-y-2 text-sm">
      <div className="flex flex-wrap gap-2">
        <button type="button" onClick={exportFile} className="rounded border border-thread-700 px-3 py-1.5 text-thread-700 hover:bg-linen-100">
          Export design file
        </button>
        <button
          type="button"
          onClick={() => input.current?.click()}
          className="rounded border border-thread-700 px-3 py-1.5 text-thread-700 hover:bg-linen-100"
        >
          Import design file
        </button>
        <input
          ref={input}
          type="file"
          accept=".json,application/json"
          onChange={(event) => void importFile(event)}
          className="sr-only"
          tabIndex={-1}
          aria-hidden="true"
          data-testid="design-file-input"
        />
      </div>
      {notice?.kind === 'done' && (
        <p role="status" className="text-thread-700">
          {notice.text}
        </p>
      )}
      {notice?.kind === 'refused' && (
        <div role="alert" className="space-y-1 text-madder-700">
          <p>{notice.text}</p>
          {notice.issues.length > 0 && (
            <ul className="list-disc pl-5 font-mono text-xs">
              {notice.issues.map((issue, index) => (
                <li key={index}>
                  {issue.path}: {issue.message}
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </div>
  )
}
