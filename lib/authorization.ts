import type { Role } from '@/lib/roles'
import type { PatternState } from '@/lib/schemas/pattern'
import { ForbiddenError, NotFoundError, UnauthenticatedError } from '@/lib/errors'

/**
 * Every permission rule of Wreathwright, in one place. Pages, route handlers, server actions and
 * services all ask `can` (or `authorize`, which throws); none decides on its own.
 */

/** The signed-in person, as far as permissions care; null when nobody is signed in. */
export type Actor = { readonly id: string; readonly roles: readonly Role[] } | null

/** An uploaded image, as far as permissions care (models/upload.ts). */
export interface UploadFacts {
  readonly ownerId: string
}

/** What an upload is for: a designer's theme-fabric photos and swatches (covers and report photos later). */
export type UploadPurpose = 'fabric-photo' | 'swatch'

export interface PatternFacts {
  readonly ownerId: string
  readonly state: PatternState
}

type Rules = {
  'create-pattern': (actor: NonNullable<Actor>) => boolean
  'list-own-patterns': (actor: NonNullable<Actor>) => boolean
  'read-pattern': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'update-pattern': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'delete-pattern': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'change-pattern-state': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'manage-users': (actor: NonNullable<Actor>) => boolean
  'decide-designer-requests': (actor: NonNullable<Actor>) => boolean
  'read-audit-log': (actor: NonNullable<Actor>) => boolean
  'read-mail-log': (actor: NonNullable<Actor>) => boolean
  'upload-image': (actor: NonNullable<Actor>, purpose: UploadPurpose) => boolean
  'read-upload': (actor: NonNullable<Actor>, upload: UploadFacts) => boolean
}

export type Action = keyof Rules

const hasRole = (actor: NonNullable<Actor>, role: Role) => actor.roles.includes(role)
const isAdmin = (actor: NonNullable<Actor>) => hasRole(actor, 'admin')
/** A designer working on their own pattern. */
const isOwningDesigner = (actor: NonNullable<Actor>, pattern: PatternFacts) =>
  hasRole(actor, 'designer') && pattern.ownerId === actor.id

const rules: Rules = {
  'create-pattern': (actor) => hasRole(actor, 'designer') || isAdmin(actor),
  'list-own-patterns': (actor) => hasRole(actor, 'designer') || isAdmin(actor),
  // Testers (by invitation) and buyers (by licence) will read patterns once those features exist.
  'read-pattern': (actor, pattern) => pattern.ownerId === actor.id || isAdmin(actor),
  'update-pattern': (actor, pattern) => isOwningDesigner(actor, pattern) || isAdmin(actor),
  'delete-pattern': (actor, pattern) => isOwningDesigner(actor, pattern) || isAdmin(actor),
  'change-pattern-state': (actor, pattern) => isOwningDesigner(actor, pattern) || isAdmin(actor),
  // The admin desk (app/(admin)): people's roles and accounts, designer requests, and the logs of
  // what admins did and what mail went out — admins only.
  'manage-users': (actor) => isAdmin(actor),
  'decide-designer-requests': (actor) => isAdmin(actor),
  'read-audit-log': (actor) => isAdmin(actor),
  'read-mail-log': (actor) => isAdmin(actor),
  // Theme-fabric photos and swatches serve pattern design.
  'upload-image': (actor) => hasRole(actor, 'designer') || isAdmin(actor),
  // Uploads are private to their owner; admins may look at any (e.g. to review what was reported).
  'read-upload': (actor, upload) => upload.ownerId === actor.id || isAdmin(actor),
}

type ResourceOf<A extends Action> = Parameters<Rules[A]> extends [unknown, infer R] ? [resource: R] : []

/**
 * Whether the actor may take the action, e.g. `can(user, 'update-pattern', pattern)`.
 * Nobody signed in may do nothing.
 */
export function can<A extends Action>(actor: Actor, action: A, ...resource: ResourceOf<A>): boolean {
  if (!actor) return false
  const rule = rules[action] as (actor: NonNullable<Actor>, resource?: unknown) => boolean
  return rule(actor, resource[0])
}

/** The admin desk's actions: refused as 404, so that the desk's addresses are not even found by others. */
const ADMIN_DESK_ACTIONS: ReadonlySet<Action> = new Set(['manage-users', 'decide-designer-requests', 'read-audit-log', 'read-mail-log'])

/**
 * Throws unless the actor may take the action: 401 when nobody is signed in, otherwise 403 —
 * or 404 for reads and the admin desk, so that other designers' drafts and the desk cannot even be
 * found.
 */
export function authorize<A extends Action>(actor: Actor, action: A, ...resource: ResourceOf<A>): asserts actor is NonNullable<Actor> {
  if (!actor) throw new UnauthenticatedError()
  if (can(actor, action, ...resource)) return
  if (action === 'read-pattern') throw new NotFoundError('No such pattern.')
  if (action === 'read-upload') throw new NotFoundError('No such upload.')
  if (ADMIN_DESK_ACTIONS.has(action)) throw new NotFoundError()
  throw new ForbiddenError()
}
