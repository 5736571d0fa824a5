'use client'

import { useState } from 'react'
import type { z } from 'zod'
import { ApiError, apiFetch } from '@/lib/api-client'
import { errorsByField } from '@/lib/form-errors'

/**
 * A form that checks its values with the same zod schema as the server, posts them as JSON and
 * shows the server's message and field errors. `onDone` runs after a successful answer, with the
 * values sent and the server's answer. `method` is POST unless given.
 */
export function useApiForm<Schema extends z.ZodType>(
  schema: Schema,
  url: string,
  onDone: (values: z.output<Schema>, answer: Record<string, unknown>) => void,
  method = 'POST',
) {
  const [errors, setErrors] = useState<Record<string, string>>({})
  const [message, setMessage] = useState<string | null>(null)
  const [busy, setBusy] = useState(false)

  async function submit(values: unknown): Promise<void> {
    const parsed = schema.safeParse(values)
    if (!parsed.success) return setErrors(errorsByField(parsed.error.issues))
    setErrors({})
    setMessage(null)
    setBusy(true)
    try {
      const answer = await apiFetch<Record<string, unknown>>(url, { method, json: parsed.data })
      setBusy(false)
      onDone(parsed.data, answer ?? {})
    } catch (error) {
      setBusy(false)
      if (error instanceof ApiError) {
        setErrors(errorsByField(error.issues))
        setMessage(error.message)
      } else setMessage('Could not reach Wreathwright. Check your connection and try again.')
    }
  }

  return { errors, message, busy, submit }
}
