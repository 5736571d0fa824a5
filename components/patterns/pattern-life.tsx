'use client'

import { useRouter } from 'next/navigation'
import { useState, type FormEvent } from 'react'
import { Field } from '@/components/ui/field'
import { ApiError, apiFetch } from '@/lib/api-client'
import { errorsByField } from '@/lib/form-errors'
import { PATTERN_CURRENCIES, PATTERN_STATE_CHANGES, patternPriceSchema, type PatternCurrency, type PatternState } from '@/lib/schemas/pattern'
import { centsFromAmount, amountFromCents, STATE_NAMES } from './pattern-life-words'

/** The words on the button that moves a pattern from `from` to `to`. */
function moveLabel(from: PatternState, to: PatternState): string {
  if (to === 'testing') return 'Move to testing'
  if (to === 'draft') return 'Back to draft'
  if (to === 'retired') return 'Retire from the shop'
  return from === 'retired' ? 'Publish again' : 'Publish'
}

/**
 * The pattern's state and the moves open from it. A refused move shows the rule that refused it
 * (the server's 422 on `state`); a done one reloads the page, with its history.
 *
 * @example <PatternStateControls patternId={pattern.id} state={pattern.state} revision={pattern.revision} />
 */
export function PatternStateControls({ patternId, state, revision }: { patternId: string; state: PatternState; revision: number }) {
  const router = useRouter()
  const [error, setError] = useState<string | null>(null)
  const [busy, setBusy] = useState(false)

  async function move(to: PatternState): Promise<void> {
    setBusy(true)
    setError(null)
    try {
      await apiFetch(`/api/patterns/${patternId}`, { method: 'PATCH', json: { revision, state: to } })
      router.refresh()
    } catch (caught) {
      setError(caught instanceof ApiError ? (caught.issues.find((issue) => issue.path === 'state')?.message ?? caught.message) : 'Could not reach Wreathwright. Try again.')
    } finally {
      setBusy(false)
    }
  }

  return (
    <div className="space-y-2" data-testid="pattern-state">
      <p>
        This pattern is <strong data-testid="pattern-state-name">{STATE_NAMES[state]}</strong>.
      </p>
      <div className="flex flex-wrap gap-2">
        {PATTERN_STATE_CHANGES[state].map((to) => (
          <button
            key={to}
            type="button"
            disabled={busy}
            onClick={() => void move(to)}
            className="rounded border border-stone-300 px-3 py-1.5 text-sm hover:bg-linen-100 disabled:opacity-60"
          >
            {moveLabel(state, to)}
          </button>
        ))}
      </div>
      {error && (
        <p role="alert" className="text-sm text-madder-700">
          Not moved: {error}.
        </p>
      )}
    </div>
  )
}

/**
 * The price the pattern sells for: an amount in its currency (whole cents) and the currency.
 *
 * @example <PriceForm patternId={pattern.id} revision={pattern.revision} priceCents={pattern.priceCents} currency={pattern.currency} />
 */
export function PriceForm({
  patternId,
  revision,
  priceCents,
  currency,
}: {
  patternId: string
  revision: number
  priceCents: number | null
  currency: PatternCurrency | null
}) {
  const router = useRouter()
  const [errors, setErrors] = useState<Record<string, string>>({})
  const [message, setMessage] = useState<string | null>(null)
  const [busy, setBusy] = useState(false)

  async function onSubmit(event: FormEvent<HTMLFormElement>): Promise<void> {
    event.preventDefault()
    const form = new FormData(event.currentTarget)
    const cents = centsFromAmount(String(form.get('amount') ?? ''))
    if (cents === null) return setErrors({ priceCents: 'Write the price as an amount, e.g. 12.50.' })
    const parsed = patternPriceSchema.safeParse({ priceCents: cents, currency: form.get('currency') })
    if (!parsed.success) return setErrors(errorsByField(parsed.error.issues))
    setErrors({})
    setMessage(null)
    setBusy(true)
    try {
      await apiFetch(`/api/patterns/${patternId}`, { method: 'PATCH', json: { revision, price: parsed.data } })
      setMessage('Price saved.')
      router.refresh()
    } catch (caught) {
      if (caught instanceof ApiError) {
        setErrors(Object.fromEntries(Object.entries(errorsByField(caught.issues)).map(([path, text]) => [path.replace(/^price\./, ''), text])))
        setMessage(caught.message)
      } else setMessage('Could not reach Wreathwright. Try again.')
    } finally {
      setBusy(false)
    }
  }

  return (
    <form onSubmit={(event) => void onSubmit(event)} noValidate className="flex flex-wrap items-end gap-3" aria-label="Price">
      <Field
        id="price-amount"
        name="amount"
        label="Price"
        inputMode="decimal"
        defaultValue={priceCents === null ? '' : amountFromCents(priceCents)}
        error={errors.priceCents}
        className="w-28 rounded border border-stone-300 bg-white px-3 py-2"
      />
      <div className="flex flex-col gap-1">
        <label htmlFor="price-currency" className="text-sm font-medium text-stone-700">
          Currency
        </label>
        <select id="price-currency" name="currency" defaultValue={currency ?? 'USD'} className="rounded border border-stone-300 bg-white px-3 py-2">
          {PATTERN_CURRENCIES.map((code) => (
            <option key={code} value={code}>
              {code}
            </option>
          ))}
        </select>
        {errors.currency && <p className="text-sm text-madder-700">{errors.currency}</p>}
      </div>
      <button type="submit" disabled={busy} className="rounded bg-thread-700 px-4 py-2 text-white hover:bg-thread-800 disabled:opacity-60">
        Save the price
      </button>
      {message && (
        <p role="status" className="w-full text-sm text-stone-700">
          {message}
        </p>
      )}
    </form>
  )
}
