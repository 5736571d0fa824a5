'use client'

import type Konva from 'konva'
import Link from 'next/link'
import { useCallback, useEffect, useMemo, useRef, useState } from 'react'
import { actionForKey, boardActions, keyOf, type ActionContext } from '@/lib/board/actions'
import { createPointerController } from '@/lib/board/pointer'
import { createBoardStore, type BoardStore } from '@/lib/board/store'
import { readViewPreferences, writeViewPreferences } from '@/lib/board/view-preferences'
import type { DesignFile } from '@/lib/schemas/design'
import { BoardCanvas } from './board-canvas'
import { ConflictDialog } from './conflict-dialog'
import { DesignFileButtons } from './design-file-buttons'
import { DraftRecovery } from './draft-recovery'
import { FabricPanel } from './fabric-panel'
import { HelpPanel } from './help-panel'
import { InspectorPanel } from './inspector-panel'
import { PlanPanel } from './plan-panel'
import { ReportPins } from './report-pins'
import { RingPanel } from './ring-panel'
import { SaveStatus } from './save-status'
import { Toolbar } from './toolbar'
import { useAutosave } from './use-autosave'

/** How near, in screen pixels, the pointer must come to a seam or handle to catch it. */
const CATCH_PIXELS = 8

declare global {
  interface Window {
    /** The board's store, for end-to-end tests and the speed benchmark to read and drive. */
    wreathwrightBoard?: BoardStore
    /** The board's Konva stage, for the speed benchmark to time its draws. */
    wreathwrightStage?: Konva.Stage | null
  }
}

/** localStorage, or null where the browser refuses it (some private modes throw on access). */
function browserStorage(): Storage | null {
  try {
    return window.localStorage
  } catch {
    return null
  }
}

function isTyping(target: EventTarget | null): boolean {
  return target instanceof HTMLElement && (target.isContentEditable || ['INPUT', 'SELECT', 'TEXTAREA'].includes(target.tagName))
}

/** The drafting board: panels around a canvas, all drawing from one store. */
export function DraftingBoard({ patternId, patternName, revision, design }: { patternId: string; patternName: string; revision: number; design: DesignFile }) {
  const store = useMemo(() => {
    const saved = readViewPreferences(browserStorage(), patternId)
    const colorway = saved?.colorway && design.colorways?.some((c) => c.name === saved.colorway) ? saved.colorway : undefined
    const created = createBoardStore(design, colorway ? { activeColorway: colorway } : {})
    if (saved) created.showSide(saved.side)
    return created
  }, [design, patternId])
  const autosave = useAutosave({ patternId, revision, store })
  const canvasBox = useRef<HTMLDivElement>(null)
  const stageRef = useRef<Konva.Stage | null>(null)
  const [size, setSize] = useState({ width: 800, height: 600 })
  const [helpOpen, setHelpOpen] = useState(false)
  const pointer = useMemo(() => createPointerController(store, () => CATCH_PIXELS / store.getState().view.zoom), [store])

  const fit = useCallback(() => store.fit(size.width, size.height), [store, size])

  const context: ActionContext = useMemo(
    () => ({ store, fit, toggleHelp: () => setHelpOpen((open) => !open), canvasCentre: () => [size.width / 2, size.height / 2] }),
    [store, fit, size],
  )

  const lastSide = useRef(store.getState().view.side)
  const lastColorway = useRef(store.getState().activeColorway)
  // The side shown and the colourway outlive a reload (never the design: that is saved).
  useEffect(
    () =>
      store.subscribe(() => {
        const state = store.getState()
        if (state.view.side !== lastSide.current || state.activeColorway !== lastColorway.current) {
          lastSide.current = state.view.side
          lastColorway.current = state.activeColorway
          writeViewPreferences(browserStorage(), patternId, state)
        }
      }),
    [store, patternId],
  )

  useEffect(() => {
    window.wreathwrightBoard = store
    window.wreathwrightStage = stageRef.current
    return () => {
      if (window.wreathwrightBoard === store) delete window.wreathwrightBoard
    }
  }, [store])

  // The canvas fills its box; fit the ring when the box first gets its size.
  const firstFit = useRef(true)
  useEffect(() => {
    const box = canvasBox.current
    if (!box) return
    const observer = new ResizeObserver(([entry]) => {
      if (!entry) return
      const width = Math.max(200, Math.floor(entry.contentRect.width))
      const height = Math.max(200, Math.floor(entry.contentRect.height))
      setSize({ width, height })
      if (firstFit.current) {
        firstFit.current = false
        store.fit(width, height)
      }
    })
    observer.observe(box)
    return () => observer.disconnect()
  }, [store])

  useEffect(() => {
    function onKeyDown(event: KeyboardEvent) {
      if (isTyping(event.target) || document.querySelector('[role="dialog"][aria-modal="true"]')) return
      if (event.key === 'Escape') {
        pointer.cancel()
        setHelpOpen(false)
        return
      }
      if (event.key === 'Enter') return pointer.commit()
      const name = actionForKey(keyOf(event))
      if (!name) return
      event.preventDefault()
      boardActions[name].run(context)
    }
    window.addEventListener('keydown', onKeyDown)
    return () => window.removeEventListener('keydown', onKeyDown)
  }, [context, pointer])

  return (
    <div className="-mx-4 -my-6 flex h-[calc(100vh-57px)] min-h-[600px] flex-col">
      <div className="flex flex-wrap items-center gap-3 border-b border-linen-200 bg-linen-50 px-3 py-1.5">
        <Link href={`/patterns/${patternId}`} className="text-sm text-thread-700 hover:underline">
          ← {patternName}
        </Link>
        <SaveStatus autosave={autosave} />
        <div className="ml-auto">
          <DesignFileButtons store={store} />
        </div>
      </div>
      <DraftRecovery autosave={autosave} />
      <Toolbar context={context} />
      <div className="grid min-h-0 flex-1 grid-cols-1 md:grid-cols-[15rem_1fr] xl:grid-cols-[16rem_1fr_20rem]">
        <aside className="order-2 space-y-5 overflow-auto border-r border-linen-200 bg-linen-50 p-3 md:order-1" aria-label="Ring and fabrics">
          <RingPanel store={store} />
          <FabricPanel store={store} context={context} />
        </aside>
        <div ref={canvasBox} tabIndex={0} data-testid="board-canvas" className="relative order-1 min-h-[360px] overflow-hidden bg-stone-100 md:order-2" aria-label="Drafting board canvas" role="application">
          <BoardCanvas store={store} pointer={pointer} width={size.width} height={size.height} stageRef={stageRef} />
          <ReportPins store={store} patternId={patternId} />
          {helpOpen && <HelpPanel onClose={() => setHelpOpen(false)} />}
        </div>
        <aside className="order-3 space-y-5 overflow-auto border-l border-linen-200 bg-linen-50 p-3 md:col-span-2 xl:col-span-1" aria-label="Sewing plan and selection">
          <PlanPanel store={store} />
          <InspectorPanel store={store} />
        </aside>
      </div>
      <ConflictDialog autosave={autosave} />
    </div>
  )
}
