import 'server-only'
import { Op, UniqueConstraintError, type Transaction } from 'sequelize'
import { z } from 'zod'
import { authorize, type Actor } from '@/lib/authorization'
import { database } from '@/lib/db'
import { originSettings } from '@/lib/env'
import { ConflictError, NotFoundError, ValidationError } from '@/lib/errors'
import { queueMail } from '@/lib/mail/outbox'
import { countInvitation } from '@/lib/rate-limits'
import type { CreateInvitationInput, InvitationState, InvitationView } from '@/lib/schemas/invitation'
import type { PatternState } from '@/lib/schemas/pattern'
import { Invitation, Pattern, User } from '@/models'
import { readablePattern } from './patterns'

export { isTesterOf, testerIdsOf } from './testers'

/**
 * Testers by invitation (issue 13). A designer invites an e-mail address to test a pattern while
 * it is a draft or in testing (testers see it only while it is in testing: lib/authorization.ts).
 * The invitation is claimed by the verified owner of the address: at once when that account
 * exists and is verified, otherwise when the address is confirmed after signing up
 * (`claimInvitationsOf`, called by lib/services/accounts.ts). Claimed, it makes its person a
 * tester of that pattern until it expires (TESTER_INVITATION_DAYS, 30 by default) or the designer
 * withdraws it.
 */

/** States a pattern may be in to invite testers: they are asked before or during the test round. */
const INVITING_STATES: readonly PatternState[] = ['draft', 'testing']

/**
 * How long an invitation stands, in days: the setting TESTER_INVITATION_DAYS (1–365), 30 when
 * unset. Read on each use, so a test may change it.
 */
export function invitationLifetimeDays(): number {
  const parsed = z.coerce.number().int().min(1).max(365).default(30).safeParse(process.env.TESTER_INVITATION_DAYS || undefined)
  if (!parsed.success) throw new Error('TESTER_INVITATION_DAYS: a whole number of days from 1 to 365')
  return parsed.data
}

const DAY_MS = 24 * 60 * 60 * 1000

/** The tester's page of a pattern (app/(testing)/testing/[id]). */
export const testingPath = (patternId: string) => `/testing/${patternId}`

function stateOf(invitation: Invitation, now: Date): InvitationState {
  if (invitation.withdrawnAt) return 'withdrawn'
  if (invitation.expiresAt <= now) return 'expired'
  return invitation.acceptedAt ? 'accepted' : 'waiting'
}

function toView(invitation: Invitation & { tester?: User | null }, now = new Date()): InvitationView {
  return {
    id: invitation.id,
    email: invitation.email,
    state: stateOf(invitation, now),
    testerName: invitation.tester?.displayName ?? null,
    createdAt: invitation.createdAt.toISOString(),
    expiresAt: invitation.expiresAt.toISOString(),
  }
}

/** An absolute link into the app (as lib/services/accounts.ts makes them; not imported, since that service calls this one). */
const appLink = (path: string) => new URL(path, originSettings().origins[0]).toString()

/** A date as the e-mail says it: "2 January 2027" (UTC, so every reader sees the same day). */
const inWords = (date: Date) => new Intl.DateTimeFormat('en-GB', { dateStyle: 'long', timeZone: 'UTC' }).format(date)

/**
 * Invites `input.email` to test the pattern and e-mails them, in one transaction. Only the
 * pattern's designer (or an admin), only while it is a draft or in testing, at most
 * RATE_LIMITS.invitationsPerDesigner an hour. An address already invited (and not withdrawn or
 * expired) is refused with 409; an expired invitation is replaced by the new one.
 *
 * @example await inviteTester(designer, pattern.id, { email: 'sam@example.com' }) // { id, email, state: 'waiting', … }
 */
export async function inviteTester(actor: Actor, patternId: string, input: CreateInvitationInput): Promise<InvitationView> {
  const { facts } = await readablePattern(actor, patternId)
  authorize(actor, 'invite-testers', facts)
  await countInvitation(actor.id)
  try {
    return await database().transaction(async (transaction) => {
      const { pattern } = await readablePattern(actor, patternId, transaction)
      if (!INVITING_STATES.includes(pattern.state)) {
        throw new ConflictError(`Testers are invited while the pattern is a draft or in testing; this one is ${pattern.state}.`)
      }
      const now = new Date()
      const invitee = await User.findOne({ where: { email: input.email }, transaction })
      if (invitee && invitee.id === pattern.ownerId) throw new ValidationError([{ path: 'email', message: 'That is your own address: invite someone else.' }])
      const earlier = await Invitation.findOne({ where: { patternId, email: input.email, withdrawnAt: null }, transaction, lock: transaction.LOCK.UPDATE })
      if (earlier && earlier.expiresAt > now) throw new ConflictError(`${input.email} is invited already.`)
      // An expired invitation makes way for the new one; it stays in the list as expired.
      if (earlier) await earlier.update({ withdrawnAt: now }, { transaction })
      const claimsNow = Boolean(invitee && invitee.emailVerifiedAt && !invitee.disabledAt)
      const invitation = await Invitation.create(
        {
          patternId,
          email: input.email,
          invitedById: actor.id,
          userId: claimsNow ? invitee!.id : null,
          acceptedAt: claimsNow ? now : null,
          withdrawnAt: null,
          expiresAt: new Date(now.getTime() + invitationLifetimeDays() * DAY_MS),
          createdAt: now,
        },
        { transaction },
      )
      const designer = await User.findByPk(actor.id, { attributes: ['displayName'], transaction })
      await queueMail(
        {
          to: input.email,
          kind: 'tester-invitation',
          data: {
            displayName: invitee?.displayName ?? 'there',
            designerName: designer?.displayName ?? 'A Wreathwright designer',
            patternName: pattern.name,
            hasAccount: claimsNow,
            // Sign-up keeps `next` through sign-in, and confirming the address claims the invitation
            // and offers the pattern; an existing account signs in from the sign-up page.
            actionUrl: claimsNow ? appLink(testingPath(patternId)) : appLink(`/sign-up?next=${encodeURIComponent(testingPath(patternId))}`),
            expiresOn: inWords(invitation.expiresAt),
          },
          userId: invitee?.id ?? null,
        },
        { transaction },
      )
      return toView(Object.assign(invitation, { tester: claimsNow ? invitee : null }), now)
    })
  } catch (error) {
    // Two invitations of one address at the same moment: the second finds the first.
    if (error instanceof UniqueConstraintError) throw new ConflictError(`${input.email} is invited already.`)
    throw error
  }
}

/** Every invitation of the pattern, newest first, for its designer (and admins). */
export async function listInvitations(actor: Actor, patternId: string): Promise<InvitationView[]> {
  const { facts } = await readablePattern(actor, patternId)
  authorize(actor, 'invite-testers', facts)
  const rows = await Invitation.findAll({
    where: { patternId },
    include: [{ model: User, as: 'tester', attributes: ['displayName'] }],
    order: [['createdAt', 'DESC'], ['id', 'ASC']],
  })
  const now = new Date()
  return rows.map((row) => toView(row, now))
}

/**
 * Withdraws an invitation: its person stops being a tester of the pattern at once (a waiting one
 * can no longer be claimed). Withdrawing twice changes nothing.
 *
 * @example await withdrawInvitation(designer, pattern.id, invitation.id)
 */
export async function withdrawInvitation(actor: Actor, patternId: string, invitationId: string): Promise<InvitationView> {
  return database().transaction(async (transaction) => {
    const { facts } = await readablePattern(actor, patternId, transaction)
    authorize(actor, 'invite-testers', facts)
    const id = z.uuid().safeParse(invitationId)
    const invitation = id.success
      ? await Invitation.findOne({
          where: { id: id.data, patternId },
          include: [{ model: User, as: 'tester', attributes: ['displayName'] }],
          transaction,
        })
      : null
    if (!invitation) throw new NotFoundError('No such invitation.')
    if (!invitation.withdrawnAt) await invitation.update({ withdrawnAt: new Date() }, { transaction })
    return toView(invitation)
  })
}

/**
 * Claims the waiting, unexpired invitations sent to the person's address, once the address is
 * known to be theirs (confirmed by its link). Returns the patterns they now test, newest
 * invitation first, so the confirmation can lead straight to one.
 *
 * @example const patternIds = await claimInvitationsOf({ id: user.id, email: user.email }, transaction)
 */
export async function claimInvitationsOf(user: { readonly id: string; readonly email: string }, transaction: Transaction): Promise<string[]> {
  const now = new Date()
  const waiting = await Invitation.findAll({
    where: { email: user.email.toLowerCase(), userId: null, withdrawnAt: null, expiresAt: { [Op.gt]: now } },
    order: [['createdAt', 'DESC']],
    transaction,
    lock: transaction.LOCK.UPDATE,
  })
  for (const invitation of waiting) await invitation.update({ userId: user.id, acceptedAt: now }, { transaction })
  return waiting.map((invitation) => invitation.patternId)
}

/** Where a confirmed address leads: the pattern of the newest invitation it claimed, if any. */
export function afterClaimPath(patternIds: readonly string[]): string | null {
  return patternIds[0] ? testingPath(patternIds[0]) : null
}

/** A pattern on the tester's list. */
export interface PatternToTest {
  /** The live, accepted invitation: what a tester's sewing project is started under. */
  readonly invitationId: string
  readonly patternId: string
  readonly name: string
  readonly state: PatternState
  readonly designerName: string | null
  readonly expiresAt: string
  /** Whether the tester can open it now (it is in testing). */
  readonly open: boolean
}

/**
 * The patterns the actor was invited to test and holds a live invitation to, newest first. One
 * back in draft (being reworked) is listed but not open; published or retired ones leave the list.
 */
export async function listPatternsToTest(actor: Actor): Promise<PatternToTest[]> {
  authorize(actor, 'list-patterns-to-test')
  database()
  const rows = await Invitation.findAll({
    where: { userId: actor.id, acceptedAt: { [Op.ne]: null }, withdrawnAt: null, expiresAt: { [Op.gt]: new Date() } },
    include: [
      {
        model: Pattern,
        where: { state: INVITING_STATES },
        attributes: ['id', 'name', 'state'],
        include: [{ model: User, as: 'owner', attributes: ['displayName'] }],
      },
    ],
    order: [['createdAt', 'DESC']],
  })
  return rows.map((row) => {
    const pattern = (row as Invitation & { Pattern: Pattern & { owner?: User | null } }).Pattern
    return {
      invitationId: row.id,
      patternId: pattern.id,
      name: pattern.name,
      state: pattern.state,
      designerName: pattern.owner?.displayName ?? null,
      expiresAt: row.expiresAt.toISOString(),
      open: pattern.state === 'testing',
    }
  })
}
