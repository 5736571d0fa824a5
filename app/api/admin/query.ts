import type { z } from 'zod'
import { ValidationError } from '@/lib/errors'
import { fieldIssues } from '@/lib/http'
import { queryObject } from '@/lib/schemas/admin'

/** The request's query string read by `schema`: a 422 naming each parameter it refuses. */
export function parseQuery<Schema extends z.ZodType>(schema: Schema, request: Request): z.output<Schema> {
  const parsed = schema.safeParse(queryObject(new URL(request.url).searchParams))
  if (!parsed.success) throw new ValidationError(fieldIssues(parsed.error))
  return parsed.data
}
