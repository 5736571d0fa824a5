import { z } from 'zod'
import { ROLES } from '@/lib/roles'
import { text } from './text'

/**
 * The admin desk's inputs (app/(admin), app/api/admin): the query strings of its lists and the
 * bodies of its changes. The pages read their address's query with the same schemas as the API.
 */

/** Rows per page of every desk list: a screenful, and an OFFSET the indexes answer at once. */
export const ADMIN_PAGE_SIZE = 50

/** How the users table can be ordered; `-` is newest or Z first. Each has an index (migrations/20261202-0090-…). */
export const USER_SORTS = ['name', '-name', 'email', '-email', 'joined', '-joined'] as const
export type UserSort = (typeof USER_SORTS)[number]

const pageSchema = z.coerce
  .number({ error: 'A page is a whole number from 1.' })
  .int('A page is a whole number from 1.')
  .min(1, 'A page is a whole number from 1.')
  .max(100_000, 'There are not that many pages.')
  .default(1)

/** Which accounts the users table shows: everyone, or only those in one state. */
export const USER_FILTERS = ['all', 'disabled', 'unverified', 'designer-request'] as const

/**
 * `GET /api/admin/users?q=&sort=&page=&filter=`: `q` is found anywhere in a name or e-mail address,
 * in any letter case.
 */
export const userListQuerySchema = z
  .object({
    q: text({ max: 200, min: 0 }).default(''),
    filter: z.enum(USER_FILTERS, { error: `Filter by one of ${USER_FILTERS.join(', ')}.` }).default('all'),
    sort: z.enum(USER_SORTS, { error: `Sort by one of ${USER_SORTS.join(', ')}.` }).default('-joined'),
    page: pageSchema,
  })
  .strict()
export type UserListQuery = z.infer<typeof userListQuerySchema>

/** `GET /api/admin/audit?page=`, `GET /api/admin/mail?page=`, `GET /api/admin/designer-requests?page=`. */
export const pageQuerySchema = z.object({ page: pageSchema }).strict()
export type PageQuery = z.infer<typeof pageQuerySchema>

/**
 * `PATCH /api/admin/users/:id`: `roles` is the whole new set of roles (an unknown one is refused,
 * naming its place, e.g. `roles.1`); `disabled` disables or re-enables the account.
 */
export const updateUserSchema = z
  .object({
    roles: z
      .array(z.enum(ROLES, { error: `A role is one of ${ROLES.join(', ')}.` }), { error: 'Give the roles as a list.' })
      .max(ROLES.length * 2)
      .transform((roles) => ROLES.filter((role) => roles.includes(role)))
      .optional(),
    disabled: z.boolean({ error: 'Say true or false.' }).optional(),
  })
  .strict()
  .refine((input) => input.roles !== undefined || input.disabled !== undefined, {
    message: 'Change at least one of roles or disabled.',
    path: ['roles'],
  })
export type UpdateUserInput = z.infer<typeof updateUserSchema>

/** `POST /api/admin/designer-requests/:id`. */
export const designerRequestDecisionSchema = z
  .object({ decision: z.enum(['approve', 'decline'], { error: 'Decide approve or decline.' }) })
  .strict()
export type DesignerRequestDecision = z.infer<typeof designerRequestDecisionSchema>['decision']

/**
 * A query string as a plain object for the schemas above; a repeated name keeps its first value.
 *
 * @example queryObject(new URLSearchParams('q=ann&page=2&q=bob')) // { q: 'ann', page: '2' }
 */
export function queryObject(search: URLSearchParams): Record<string, string> {
  const object: Record<string, string> = {}
  for (const [name, value] of search) if (!(name in object)) object[name] = value
  return object
}

// The answers. The pages render on the server; these type what the API sends.

export interface AdminUserRow {
  readonly id: string
  readonly email: string
  readonly displayName: string
  readonly roles: readonly (typeof ROLES)[number][]
  readonly emailVerified: boolean
  /** ISO time the account was disabled, or null. */
  readonly disabledAt: string | null
  /** ISO time of a pending designer request, or null. */
  readonly designerRequestedAt: string | null
  readonly joinedAt: string
}

export interface AuditEntryRow {
  readonly id: string
  readonly actorId: string
  readonly actor: string
  readonly action: string
  readonly targetId: string | null
  readonly target: string | null
  readonly details: Record<string, unknown>
  readonly at: string
}

/** A line of the mail log: never the message itself, which may hold a link with a token. */
export interface MailLogRow {
  readonly id: string
  readonly to: string
  readonly kind: string
  readonly state: string
  readonly attempts: number
  readonly lastError: string | null
  readonly queuedAt: string
  readonly sentAt: string | null
}

/** One page of a desk list. */
export interface Page<Row> {
  readonly rows: readonly Row[]
  readonly page: number
  readonly pageSize: number
  readonly total: number
  readonly pageCount: number
}
