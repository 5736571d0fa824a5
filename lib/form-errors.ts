import type { z } from 'zod'
import type { ApiIssue } from '@/lib/api-client'

/** Field path → first message, from a failed client-side parse or the server's 422 issues. */
export function errorsByField(issues: readonly (z.core.$ZodIssue | ApiIssue)[]): Record<string, string> {
  const errors: Record<string, string> = {}
  for (const issue of issues) {
    const path = typeof issue.path === 'string' ? issue.path : issue.path.map(String).join('.')
    errors[path] ??= issue.message
  }
  return errors
}
