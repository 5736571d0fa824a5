import 'server-only'
import { Op, Transaction, type WhereOptions } from 'sequelize'
import { authorize, type Actor } from '@/lib/authorization'
import { database } from '@/lib/db'
import { mailSettings, originSettings } from '@/lib/env'
import { ConflictError, NotFoundError, ValidationError } from '@/lib/errors'
import { queueMail } from '@/lib/mail/outbox'
import type { Role } from '@/lib/roles'
import {
  ADMIN_PAGE_SIZE,
  type AdminUserRow,
  type AuditEntryRow,
  type DesignerRequestDecision,
  type MailLogRow,
  type Page,
  type PageQuery,
  type UpdateUserInput,
  type UserListQuery,
  type UserSort,
} from '@/lib/schemas/admin'
import { setAccountDisabled } from '@/lib/services/accounts'
import { AdminAuditEntry, OutgoingMail, User } from '@/models'
import type { AdminAction } from '@/models/admin-audit-entry'

/**
 * The admin desk's use cases. Each asks lib/authorization.ts first, and each change runs in one
 * transaction together with its audit-log entry, so an action is never without its record and a
 * record never without its action.
 */

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/** How a person is named in the audit log: as they were at the time. */
const labelOf = (user: { displayName: string; email: string }) => `${user.displayName} <${user.email}>`

function toUserRow(user: User): AdminUserRow {
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    roles: user.roles,
    emailVerified: user.emailVerifiedAt !== null,
    disabledAt: user.disabledAt?.toISOString() ?? null,
    designerRequestedAt: user.designerRequestedAt?.toISOString() ?? null,
    joinedAt: user.createdAt.toISOString(),
  }
}

function pageOf<Row>(rows: Row[], page: number, total: number): Page<Row> {
  return { rows, page, pageSize: ADMIN_PAGE_SIZE, total, pageCount: Math.max(1, Math.ceil(total / ADMIN_PAGE_SIZE)) }
}

/** `%` and `_` in a search are letters, not wildcards (PostgreSQL's LIKE escapes with a backslash). */
const likeContaining = (search: string) => `%${search.toLowerCase().replace(/[\\%_]/g, (character) => `\\${character}`)}%`

/** Each sort of the users table, with `id` last so that equal names page in a fixed order. */
function userOrder(sort: UserSort) {
  const sequelize = database()
  const direction = sort.startsWith('-') ? 'DESC' : 'ASC'
  const column = { name: sequelize.fn('lower', sequelize.col('display_name')), email: sequelize.fn('lower', sequelize.col('email')), joined: sequelize.col('created_at') }[
    sort.replace('-', '') as 'name' | 'email' | 'joined'
  ]
  return [[column, direction], ['id', direction]] as [unknown, string][]
}

/** A page of the users table, searched by name or e-mail (in any letter case), filtered by state and sorted. */
export async function listUsers(actor: Actor, query: UserListQuery): Promise<Page<AdminUserRow>> {
  authorize(actor, 'manage-users')
  const sequelize = database()
  const conditions: WhereOptions[] = []
  if (query.q) {
    conditions.push({
      [Op.or]: [
        sequelize.where(sequelize.fn('lower', sequelize.col('display_name')), Op.like, likeContaining(query.q)),
        sequelize.where(sequelize.fn('lower', sequelize.col('email')), Op.like, likeContaining(query.q)),
      ],
    })
  }
  if (query.filter === 'disabled') conditions.push({ disabledAt: { [Op.ne]: null } })
  if (query.filter === 'unverified') conditions.push({ emailVerifiedAt: null })
  if (query.filter === 'designer-request') conditions.push({ designerRequestedAt: { [Op.ne]: null } })
  const where: WhereOptions = { [Op.and]: conditions }
  const { rows, count } = await User.findAndCountAll({
    where,
    attributes: { exclude: ['passwordHash'] },
    // @ts-expect-error Sequelize's OrderItem type does not admit a function call with a direction, which it accepts.
    order: userOrder(query.sort),
    limit: ADMIN_PAGE_SIZE,
    offset: (query.page - 1) * ADMIN_PAGE_SIZE,
  })
  return pageOf(rows.map(toUserRow), query.page, count)
}

async function findUser(id: string, transaction: Transaction): Promise<User> {
  const user = UUID.test(id) ? await User.findByPk(id, { transaction, lock: Transaction.LOCK.UPDATE }) : null
  if (!user) throw new NotFoundError('No such account.')
  return user
}

async function record(
  admin: User,
  action: AdminAction,
  target: User,
  details: Record<string, unknown>,
  transaction: Transaction,
): Promise<void> {
  await AdminAuditEntry.create(
    { actorId: admin.id, actorLabel: labelOf(admin), action, targetId: target.id, targetLabel: labelOf(target), details },
    { transaction },
  )
}

/** The admin as stored now (the session's copy of their name may be older). */
async function currentAdmin(actor: NonNullable<Actor>, transaction: Transaction): Promise<User> {
  const admin = await User.findByPk(actor.id, { transaction })
  if (!admin) throw new NotFoundError('Your account no longer exists.')
  return admin
}

/**
 * Grants and revokes roles (`roles` is the whole new set) and disables or re-enables the account,
 * one audit entry per change. Granting the designer role also settles a pending designer request.
 * An admin cannot take away their own admin role or disable themselves.
 */
export async function updateUser(actor: Actor, id: string, input: UpdateUserInput): Promise<AdminUserRow> {
  authorize(actor, 'manage-users')
  return database().transaction(async (transaction) => {
    const user = await findUser(id, transaction)
    const admin = await currentAdmin(actor, transaction)
    const isSelf = user.id === admin.id
    if (isSelf && input.roles && !input.roles.includes('admin')) {
      throw new ValidationError([
        { path: 'roles', message: 'You cannot remove your own admin role: you would lose this desk at once. Ask another admin to do it.' },
      ])
    }
    if (isSelf && input.disabled === true) {
      throw new ValidationError([
        { path: 'disabled', message: 'You cannot disable your own account: you would be signed out with no admin left to undo it. Ask another admin.' },
      ])
    }
    if (input.roles) {
      const before = user.roles
      const granted = input.roles.filter((role) => !before.includes(role))
      const revoked = before.filter((role) => !input.roles!.includes(role))
      for (const role of granted) {
        const settlesRequest = role === 'designer' && user.designerRequestedAt !== null
        await record(admin, 'grant-role', user, settlesRequest ? { role, designerRequestSettled: true } : { role }, transaction)
        if (settlesRequest) user.designerRequestedAt = null
      }
      for (const role of revoked) await record(admin, 'revoke-role', user, { role }, transaction)
      user.roles = input.roles as Role[]
      await user.save({ transaction })
    }
    if (input.disabled !== undefined && input.disabled !== (user.disabledAt !== null)) {
      await setAccountDisabled(user.id, input.disabled, { transaction })
      await record(admin, input.disabled ? 'disable-account' : 'enable-account', user, {}, transaction)
    }
    await user.reload({ transaction })
    return toUserRow(user)
  })
}

/** Accounts waiting for a decision on their designer request, oldest request first. */
export async function listDesignerRequests(actor: Actor, query: PageQuery): Promise<Page<AdminUserRow>> {
  authorize(actor, 'decide-designer-requests')
  database()
  const { rows, count } = await User.findAndCountAll({
    where: { designerRequestedAt: { [Op.ne]: null } },
    attributes: { exclude: ['passwordHash'] },
    order: [['designerRequestedAt', 'ASC'], ['id', 'ASC']],
    limit: ADMIN_PAGE_SIZE,
    offset: (query.page - 1) * ADMIN_PAGE_SIZE,
  })
  return pageOf(rows.map(toUserRow), query.page, count)
}

/**
 * Approves (the designer role) or declines a pending designer request. Either way the request is
 * settled, the decision recorded in the audit log and a message queued to the person, all in one
 * transaction.
 */
export async function decideDesignerRequest(actor: Actor, id: string, decision: DesignerRequestDecision): Promise<AdminUserRow> {
  authorize(actor, 'decide-designer-requests')
  return database().transaction(async (transaction) => {
    const user = await findUser(id, transaction)
    const requestedAt = user.designerRequestedAt
    if (!requestedAt) throw new ConflictError('This account has no designer request waiting: it was decided already, or never made.')
    const admin = await currentAdmin(actor, transaction)
    const approved = decision === 'approve'
    if (approved && !user.roles.includes('designer')) user.roles = [...user.roles, 'designer']
    user.designerRequestedAt = null
    await user.save({ transaction })
    await record(admin, approved ? 'approve-designer-request' : 'decline-designer-request', user, { requestedAt: requestedAt.toISOString() }, transaction)
    const studioUrl = new URL('/patterns', originSettings().origins[0]).href
    await queueMail(
      { to: user.email, kind: 'designer-request-decided', data: { displayName: user.displayName, approved, studioUrl }, userId: user.id },
      { transaction },
    )
    return toUserRow(user)
  })
}

/** The audit log, newest first. */
export async function listAuditEntries(actor: Actor, query: PageQuery): Promise<Page<AuditEntryRow>> {
  authorize(actor, 'read-audit-log')
  database()
  const { rows, count } = await AdminAuditEntry.findAndCountAll({
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit: ADMIN_PAGE_SIZE,
    offset: (query.page - 1) * ADMIN_PAGE_SIZE,
  })
  const entries = rows.map((entry) => ({
    id: entry.id,
    actorId: entry.actorId,
    actor: entry.actorLabel,
    action: entry.action,
    targetId: entry.targetId,
    target: entry.targetLabel,
    details: entry.details,
    at: entry.createdAt.toISOString(),
  }))
  return pageOf(entries, query.page, count)
}

/** The outgoing mail log, newest first: addresses, kinds and states, never the messages. */
export async function listOutgoingMail(actor: Actor, query: PageQuery): Promise<Page<MailLogRow> & { mailViewUrl: string | null }> {
  authorize(actor, 'read-mail-log')
  database()
  const { rows, count } = await OutgoingMail.findAndCountAll({
    // Only these columns: whatever else a row holds (the message's data, with its links) stays put.
    attributes: ['id', 'toAddress', 'kind', 'state', 'attempts', 'lastError', 'createdAt', 'sentAt'],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit: ADMIN_PAGE_SIZE,
    offset: (query.page - 1) * ADMIN_PAGE_SIZE,
  })
  const mail = rows.map((row) => ({
    id: String(row.id),
    to: row.toAddress,
    kind: row.kind,
    state: row.state,
    attempts: row.attempts,
    lastError: row.lastError,
    queuedAt: row.createdAt.toISOString(),
    sentAt: row.sentAt?.toISOString() ?? null,
  }))
  return { ...pageOf(mail, query.page, count), mailViewUrl: mailSettings().viewUrl }
}
