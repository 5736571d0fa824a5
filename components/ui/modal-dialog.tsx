'use client'

import { useEffect, useRef, type KeyboardEvent, type ReactNode } from 'react'

const FOCUSABLE = 'button:not([disabled]), [href], input:not([disabled]), [tabindex]:not([tabindex="-1"])'

/**
 * A dialog that must be answered: it covers the page, takes the focus to its first button, keeps
 * Tab and Shift+Tab among its own controls, and gives the focus back when it closes. It has no
 * close button on purpose; its content offers the choices.
 *
 * @example <ModalDialog titleId="t" describedById="d">…</ModalDialog>
 */
export function ModalDialog({ titleId, describedById, children }: { titleId: string; describedById: string; children: ReactNode }) {
  const panel = useRef<HTMLDivElement>(null)

  useEffect(() => {
    const before = document.activeElement instanceof HTMLElement ? document.activeElement : null
    panel.current?.querySelector<HTMLElement>(FOCUSABLE)?.focus()
    return () => {
      if (before?.isConnected) before.focus()
    }
  }, [])

  function keepFocusInside(event: KeyboardEvent<HTMLDivElement>) {
    if (event.key !== 'Tab' || !panel.current) return
    const focusable = [...panel.current.querySelectorAll<HTMLElement>(FOCUSABLE)]
    const first = focusable[0]
    const last = focusable.at(-1)
    if (!first || !last) return event.preventDefault()
    const active = document.activeElement
    if (event.shiftKey && (active === first || !panel.current.contains(active))) {
      event.preventDefault()
      last.focus()
    } else if (!event.shiftKey && (active === last || !panel.current.contains(active))) {
      event.preventDefault()
      first.focus()
    }
  }

  return (
    <div className="fixed inset-0 z-50 flex items-center justify-center bg-stone-900/40 p-4">
      <div
        ref={panel}
        role="dialog"
        aria-modal="true"
        aria-labelledby={titleId}
        aria-describedby={describedById}
        onKeyDown={keepFocusInside}
        className="w-full max-w-lg space-y-4 rounded-lg bg-white p-6 shadow-xl"
      >
        {children}
      </div>
    </div>
  )
}
