import type { InputHTMLAttributes } from 'react'

/** A labelled input with its error message tied to it for screen readers. */
export function Field({
  label,
  error,
  id,
  ...input
}: InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; id: string }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-stone-700">
        {label}
      </label>
      <input
        id={id}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className="rounded border border-stone-300 bg-white px-3 py-2 aria-invalid:border-madder-600"
        {...input}
      />
      {error && (
        <p id={`${id}-error`} className="text-sm text-madder-700">
          {error}
        </p>
      )}
    </div>
  )
}
