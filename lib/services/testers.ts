import 'server-only'
import { Op, type Transaction } from 'sequelize'
import { database } from '@/lib/db'
import { Invitation } from '@/models'

/**
 * Who tests a pattern now, from its invitations (lib/services/invitations.ts sends and claims them;
 * this file only reads them, so that the pattern service can ask without importing that one). A
 * tester is the claimant of an accepted invitation that is neither withdrawn nor expired.
 */

/** The conditions of an invitation that makes its person a tester now: claimed, not withdrawn, not expired. */
function liveAndAccepted(now: Date) {
  return { userId: { [Op.ne]: null }, acceptedAt: { [Op.ne]: null }, withdrawnAt: null, expiresAt: { [Op.gt]: now } }
}

/**
 * The ids of the people who are testers of the pattern now (accepted, not withdrawn, not expired),
 * for PatternFacts' `testerIds`.
 *
 * @example const facts = { ownerId: pattern.ownerId, state: pattern.state, testerIds: await testerIdsOf(pattern.id) }
 */
export async function testerIdsOf(patternId: string, options: { transaction?: Transaction } = {}): Promise<string[]> {
  database()
  const rows = await Invitation.findAll({
    where: { patternId, ...liveAndAccepted(new Date()) },
    attributes: ['userId'],
    transaction: options.transaction,
  })
  return [...new Set(rows.map((row) => row.userId as string))]
}

/**
 * Whether the person holds a live, accepted invitation to test the pattern (whatever the pattern's
 * state: lib/authorization.ts adds that testers see a pattern only while it is in testing).
 *
 * @example if (await isTesterOf(user.id, pattern.id)) …
 */
export async function isTesterOf(userId: string, patternId: string, options: { transaction?: Transaction } = {}): Promise<boolean> {
  database()
  const found = await Invitation.findOne({
    where: { patternId, ...liveAndAccepted(new Date()), userId },
    attributes: ['id'],
    transaction: options.transaction,
  })
  return found !== null
}
