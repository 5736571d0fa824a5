'use client'

import { useState } from 'react'

/**
 * A number input that changes the design when the designer leaves it or presses Enter (not on
 * every keystroke, so typing "12" never passes through a 1-repeat ring). Escape restores it.
 */
export function NumberField({
  id,
  label,
  value,
  onCommit,
  error,
  step = 'any',
  min,
  max,
  suffix,
}: {
  id: string
  label: string
  value: number
  onCommit: (value: number) => void
  error?: string | null
  step?: number | 'any'
  min?: number
  max?: number
  suffix?: string
}) {
  const [text, setText] = useState(String(value))
  // A new value from outside (undo, another field) replaces the text; adjusted while rendering,
  // as React's "storing information from previous renders" recommends, not in an effect.
  const [shownValue, setShownValue] = useState(value)
  if (value !== shownValue) {
    setShownValue(value)
    setText(String(value))
  }
  const commit = () => {
    const parsed = Number(text)
    if (text.trim() === '' || !Number.isFinite(parsed)) return setText(String(value))
    if (parsed !== value) onCommit(parsed)
  }
  return (
    <div className="flex flex-col gap-0.5">
      <label htmlFor={id} className="text-xs font-medium text-stone-600">
        {label}
      </label>
      <div className="flex items-center gap-1">
        <input
          id={id}
          type="number"
          inputMode="decimal"
          value={text}
          step={step}
          min={min}
          max={max}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          onChange={(event) => setText(event.target.value)}
          onBlur={commit}
          onKeyDown={(event) => {
            if (event.key === 'Enter') commit()
            if (event.key === 'Escape') setText(String(value))
          }}
          className="w-24 rounded border border-stone-300 bg-white px-2 py-1 text-sm aria-invalid:border-madder-600"
        />
        {suffix && <span className="text-xs text-stone-500">{suffix}</span>}
      </div>
      {error && (
        <p id={`${id}-error`} role="alert" className="text-xs text-madder-700">
          {error}
        </p>
      )}
    </div>
  )
}
