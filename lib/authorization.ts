import type { Role } from '@/lib/roles'
import type { PatternState } from '@/lib/schemas/pattern'
import { ForbiddenError, NotFoundError, UnauthenticatedError } from '@/lib/errors'
import type { UploadKind } from '@/models/upload'

/**
 * Every permission rule of Wreathwright, in one place. Pages, route handlers, server actions and
 * services all ask `can` (or `authorize`, which throws); none decides on its own.
 */

/** The signed-in person, as far as permissions care; null when nobody is signed in. */
export type Actor = { readonly id: string; readonly roles: readonly Role[] } | null

/** An uploaded image, as far as permissions care (models/upload.ts). */
export interface UploadFacts {
  readonly ownerId: string
  /**
   * For a report photo: the patterns whose reports show it (through report_photos), with their
   * testers; their designers and testers may read it. Left out, it is shown to nobody else.
   */
  readonly reportPatterns?: readonly PatternFacts[]
  /**
   * For a swatch or theme photo: the patterns whose design uses it, with their testers (the
   * uploads service looks up only those the reader tests: lib/services/testers.ts). Left out,
   * nobody else sees it.
   */
  readonly designPatterns?: readonly PatternFacts[]
  /** What the upload is for. Left out, it counts as no cover (so it is never public). */
  readonly kind?: UploadKind
  /**
   * For a cover: the patterns that show it as their cover, each with whether an admin hid its
   * listing (lib/services/uploads.ts looks them up). Left out, it is shown to nobody else.
   */
  readonly coverOf?: readonly (PatternFacts & { readonly hidden: boolean })[]
}

/** What an upload is for: a designer's theme-fabric photos, swatches and shop covers; testers' report photos. */
export type UploadPurpose = 'fabric-photo' | 'swatch' | 'report-photo' | 'cover'

/** An order of the shop, as far as permissions care (models/order.ts). */
export interface OrderFacts {
  readonly buyerId: string | null
}

export interface PatternFacts {
  /** NULL for a published or retired pattern whose designer deleted their account. */
  readonly ownerId: string | null
  readonly state: PatternState
  /**
   * The people who hold an accepted, unexpired, not withdrawn invitation to test the pattern
   * (lib/services/invitations.ts `testerIdsOf`). Left out, nobody counts as a tester: a caller that
   * did not look them up grants no tester access.
   */
  readonly testerIds?: readonly string[]
  /**
   * The people who hold a licence to the pattern (the shop fills this in). Left out, nobody does.
   * A licence lets its holder read and print a published or retired pattern.
   */
  readonly licenceHolderIds?: readonly string[]
}

/**
 * A buyer's booklet built on the server (models/booklet-build.ts), as far as permissions care: who
 * asked for it, whether the licence it was built under is still live and who holds it, and the
 * pattern (with the licence holders filled in by the caller).
 */
export interface BookletFacts {
  readonly requesterId: string
  readonly licenceHolderId: string
  readonly licenceRevoked: boolean
  readonly pattern: PatternFacts
}

/**
 * A sewing project (models/sewing-project.ts), as far as permissions care: whose it is, and its
 * pattern with the holder of the project's own licence (live) or invitation (accepted, live) filled
 * in by the sewing-room service (lib/services/sewing-room.ts) — only that one grant counts.
 */
export interface SewingProjectFacts {
  readonly ownerId: string
  readonly pattern: PatternFacts
}

type Rules = {
  'create-pattern': (actor: NonNullable<Actor>) => boolean
  'list-own-patterns': (actor: NonNullable<Actor>) => boolean
  'read-pattern': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'update-pattern': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'delete-pattern': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'change-pattern-state': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'print-pattern': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'invite-testers': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'test-pattern': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'list-patterns-to-test': (actor: NonNullable<Actor>) => boolean
  'file-report': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'read-reports': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'answer-report': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'change-report-state': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'manage-users': (actor: NonNullable<Actor>) => boolean
  'decide-designer-requests': (actor: NonNullable<Actor>) => boolean
  'read-audit-log': (actor: NonNullable<Actor>) => boolean
  'read-mail-log': (actor: NonNullable<Actor>) => boolean
  'buy-pattern': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'read-order': (actor: NonNullable<Actor>, order: OrderFacts) => boolean
  'read-own-library': (actor: NonNullable<Actor>) => boolean
  'read-payment-log': (actor: NonNullable<Actor>) => boolean
  'refund-order': (actor: NonNullable<Actor>) => boolean
  'hide-listing': (actor: NonNullable<Actor>) => boolean
  'upload-image': (actor: NonNullable<Actor>, purpose: UploadPurpose) => boolean
  'read-upload': (actor: NonNullable<Actor>, upload: UploadFacts) => boolean
  'get-licensed-booklet': (actor: NonNullable<Actor>, booklet: BookletFacts) => boolean
  'read-own-sales': (actor: NonNullable<Actor>) => boolean
  'read-all-sales': (actor: NonNullable<Actor>) => boolean
  'read-pattern-sales': (actor: NonNullable<Actor>, pattern: PatternFacts) => boolean
  'sewing-room:list': (actor: NonNullable<Actor>) => boolean
  'sewing-room:start': (actor: NonNullable<Actor>, project: SewingProjectFacts) => boolean
  'sewing-room:read': (actor: NonNullable<Actor>, project: SewingProjectFacts) => boolean
  'sewing-room:update': (actor: NonNullable<Actor>, project: SewingProjectFacts) => boolean
  'sewing-room:delete': (actor: NonNullable<Actor>, project: SewingProjectFacts) => boolean
}

export type Action = keyof Rules

const hasRole = (actor: NonNullable<Actor>, role: Role) => actor.roles.includes(role)
const isAdmin = (actor: NonNullable<Actor>) => hasRole(actor, 'admin')
/** A designer working on their own pattern. */
const isOwningDesigner = (actor: NonNullable<Actor>, pattern: PatternFacts) =>
  hasRole(actor, 'designer') && pattern.ownerId === actor.id

/**
 * A tester of the pattern: an accepted, live invitation, and the pattern in testing. Invitations
 * may be sent while it is still a draft, but testers see it only once the designer moves it to
 * testing, and not while it is back in draft for rework.
 */
const isTesterOf = (actor: NonNullable<Actor>, pattern: PatternFacts) =>
  pattern.state === 'testing' && (pattern.testerIds?.includes(actor.id) ?? false)
/** A licence holder of a pattern that is (or was) for sale: retiring it keeps their access. */
const isLicenceHolderOf = (actor: NonNullable<Actor>, pattern: PatternFacts) =>
  (pattern.state === 'published' || pattern.state === 'retired') && (pattern.licenceHolderIds?.includes(actor.id) ?? false)

const rules: Rules = {
  'create-pattern': (actor) => hasRole(actor, 'designer') || isAdmin(actor),
  'list-own-patterns': (actor) => hasRole(actor, 'designer') || isAdmin(actor),
  // Its owner, testers (by invitation, while it is in testing) and licence holders read a pattern.
  'read-pattern': (actor, pattern) =>
    pattern.ownerId === actor.id || isAdmin(actor) || isTesterOf(actor, pattern) || isLicenceHolderOf(actor, pattern),
  'update-pattern': (actor, pattern) => isOwningDesigner(actor, pattern) || isAdmin(actor),
  'delete-pattern': (actor, pattern) => isOwningDesigner(actor, pattern) || isAdmin(actor),
  'change-pattern-state': (actor, pattern) => isOwningDesigner(actor, pattern) || isAdmin(actor),
  // Printing the booklet (the print room): the designer, testers free of charge, licence holders.
  'print-pattern': (actor, pattern) =>
    isOwningDesigner(actor, pattern) || isAdmin(actor) || isTesterOf(actor, pattern) || isLicenceHolderOf(actor, pattern),
  // Inviting and withdrawing testers, and seeing who was invited (their e-mail addresses).
  'invite-testers': (actor, pattern) => isOwningDesigner(actor, pattern) || isAdmin(actor),
  // What only a tester does with a pattern (their booklet is marked as a test copy).
  'test-pattern': (actor, pattern) => isTesterOf(actor, pattern),
  // Anyone signed in has a (maybe empty) list of patterns they were invited to test.
  'list-patterns-to-test': () => true,
  // Test reports (lib/services/reports.ts): testers file them; the designer, the testers and admins
  // read them and write in their threads; only the designer (or an admin) resolves or reopens one.
  'file-report': (actor, pattern) => isTesterOf(actor, pattern),
  'read-reports': (actor, pattern) => pattern.ownerId === actor.id || isAdmin(actor) || isTesterOf(actor, pattern),
  'answer-report': (actor, pattern) => pattern.ownerId === actor.id || isAdmin(actor) || isTesterOf(actor, pattern),
  'change-report-state': (actor, pattern) => isOwningDesigner(actor, pattern) || isAdmin(actor),
  // The admin desk (app/(admin)): people's roles and accounts, designer requests, and the logs of
  // what admins did and what mail went out — admins only.
  'manage-users': (actor) => isAdmin(actor),
  'decide-designer-requests': (actor) => isAdmin(actor),
  'read-audit-log': (actor) => isAdmin(actor),
  'read-mail-log': (actor) => isAdmin(actor),
  // The shop: a quilter buys a published pattern that is not their own (its price is the
  // pattern's, read on the server). Holding a licence already is told apart by the service.
  'buy-pattern': (actor, pattern) => hasRole(actor, 'quilter') && pattern.state === 'published' && pattern.ownerId !== actor.id,
  // An order's progress (the checkout result page): its buyer, and admins.
  'read-order': (actor, order) => order.buyerId === actor.id || isAdmin(actor),
  // Everyone signed in has a (maybe empty) library of licences.
  'read-own-library': () => true,
  // The payment log (webhook calls, verified or refused, and their processing): admins only.
  'read-payment-log': (actor) => isAdmin(actor),
  // Refunding an order through the payment provider (from the payment log): admins only, recorded
  // in the audit log. Refused with 403, not hidden as the desk's pages are: the order's buyer and
  // its designer know the order exists.
  'refund-order': (actor) => isAdmin(actor),
  // Taking a published pattern's listing out of the shop (and back): admins only, recorded in the
  // audit log. Looking at the shop needs no rule: it is open to everyone, signed in or not.
  'hide-listing': (actor) => isAdmin(actor),
  // Theme-fabric photos and swatches serve pattern design; covers, a pattern's listing in the shop.
  // A report photo may come from anyone signed in (testers need no role); it stays private to
  // them until a report of a pattern they test shows it.
  'upload-image': (actor, purpose) => purpose === 'report-photo' || hasRole(actor, 'designer') || isAdmin(actor),
  // Uploads are private to their owner; admins may look at any (e.g. to review what was reported).
  // A report's photos are also shown to the pattern's designer and its testers.
  'read-upload': (actor, upload) =>
    isPublicUpload(upload) ||
    upload.ownerId === actor.id ||
    isAdmin(actor) ||
    (upload.reportPatterns ?? []).some((pattern) => pattern.ownerId === actor.id || isTesterOf(actor, pattern)) ||
    // The swatches and theme photos of a pattern in testing, for its testers' booklets.
    (upload.designPatterns ?? []).some((pattern) => isTesterOf(actor, pattern)),
  // A buyer's booklet built on the server (asked for, watched, downloaded): only the person who
  // holds the live licence it was built under, and asked for it — not even an admin, since its
  // pages carry the buyer's name. A refund (revoked licence) closes it.
  'get-licensed-booklet': (actor, booklet) =>
    booklet.requesterId === actor.id && booklet.licenceHolderId === actor.id && !booklet.licenceRevoked && isLicenceHolderOf(actor, booklet.pattern),
  // The sales table (lib/services/sales.ts): a designer sees the sales of their own patterns (the
  // buyers' display names, never their e-mail addresses); admins see every designer's.
  'read-own-sales': (actor) => hasRole(actor, 'designer') || isAdmin(actor),
  'read-all-sales': (actor) => isAdmin(actor),
  'read-pattern-sales': (actor, pattern) => isOwningDesigner(actor, pattern) || isAdmin(actor),
  // The sewing room (lib/services/sewing-room.ts): everyone signed in has a (maybe empty) list of
  // projects. A project is started, read and ticked only by its owner while they hold its grant:
  // the live licence it was made under (published or retired pattern), or the accepted invitation
  // (pattern in testing) — not even an admin, since it is someone's own work. A refund or a
  // withdrawn invitation closes it; its owner may still delete it.
  'sewing-room:list': () => true,
  'sewing-room:start': (actor, project) => holdsSewingGrant(actor, project),
  'sewing-room:read': (actor, project) => holdsSewingGrant(actor, project),
  'sewing-room:update': (actor, project) => holdsSewingGrant(actor, project),
  'sewing-room:delete': (actor, project) => project.ownerId === actor.id,
}

/** The owner of a sewing project who still holds the licence or invitation it is made under. */
function holdsSewingGrant(actor: NonNullable<Actor>, project: SewingProjectFacts): boolean {
  return project.ownerId === actor.id && (isLicenceHolderOf(actor, project.pattern) || isTesterOf(actor, project.pattern))
}

/**
 * Whether everyone, signed in or not, may read an upload: only a cover, and only while a pattern
 * that shows it is listed in the shop (published, not hidden by an admin) — the shop shows it to
 * visitors. No other kind of upload is ever public. The uploads service asks this before it asks
 * `authorize(actor, 'read-upload', …)`, which needs someone signed in.
 *
 * @example isPublicUpload({ ownerId: 'u1', kind: 'cover', coverOf: [{ ownerId: 'u1', state: 'published', hidden: false }] }) // true
 */
export function isPublicUpload(upload: UploadFacts): boolean {
  return upload.kind === 'cover' && (upload.coverOf ?? []).some((pattern) => pattern.state === 'published' && !pattern.hidden)
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
const ADMIN_DESK_ACTIONS: ReadonlySet<Action> = new Set(['manage-users', 'decide-designer-requests', 'read-audit-log', 'read-mail-log', 'read-payment-log', 'hide-listing', 'refund-order'])

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
  if (action === 'read-order') throw new NotFoundError('No such order.')
  if (action === 'get-licensed-booklet') throw new NotFoundError('No such booklet.')
  if (action === 'read-pattern-sales') throw new NotFoundError('No such pattern.')
  // Someone else's project (or one whose grant is gone) is not found, exactly like a missing one.
  if (action === 'sewing-room:start') throw new NotFoundError('No such licence or invitation of yours.')
  if (action.startsWith('sewing-room:')) throw new NotFoundError('No such project.')
  if (ADMIN_DESK_ACTIONS.has(action)) throw new NotFoundError()
  throw new ForbiddenError()
}
