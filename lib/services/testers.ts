import 'server-only'
import { literal, Op, QueryTypes, type Transaction } from 'sequelize'
import type { PatternFacts } from '@/lib/authorization'
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

/** The same conditions in SQL, for an invitation row named `alias`. */
const liveAndAcceptedSql = (alias: string) =>
  `${alias}.user_id IS NOT NULL AND ${alias}.accepted_at IS NOT NULL AND ${alias}.withdrawn_at IS NULL AND ${alias}.expires_at > now()`

/**
 * testerIdsOf as a column of a query of patterns (`attributes: { include: [LIVE_TESTER_IDS] }`),
 * read back with `liveTesterIdsOf`: one statement for a pattern and its testers, as every request
 * about a pattern makes (lib/services/patterns.ts readablePattern).
 */
export const LIVE_TESTER_IDS: [ReturnType<typeof literal>, string] = [
  literal(`ARRAY(SELECT DISTINCT i.user_id FROM pattern_invitations i WHERE i.pattern_id = "Pattern"."id" AND ${liveAndAcceptedSql('i')})`),
  'liveTesterIds',
]

/** The tester ids a pattern was read with (LIVE_TESTER_IDS), or undefined if it was read without. */
export function liveTesterIdsOf(pattern: { get(key: string): unknown }): string[] | undefined {
  const ids = pattern.get('liveTesterIds')
  return Array.isArray(ids) ? (ids as string[]) : undefined
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
 * When the first of the pattern's testers stops being one by the clock alone (the earliest expiry
 * of its live, accepted invitations), or null: until then its testers change only with a row.
 *
 * @example const until = await testersLiveUntil(pattern.id)
 */
export async function testersLiveUntil(patternId: string): Promise<Date | null> {
  const [row] = await database().query<{ until: Date | string | null }>(
    `SELECT min(i.expires_at) AS until FROM pattern_invitations i WHERE i.pattern_id = :patternId AND ${liveAndAcceptedSql('i')}`,
    { replacements: { patternId }, type: QueryTypes.SELECT },
  )
  return row?.until ? new Date(row.until) : null
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

/**
 * The patterns in testing that `userId` tests now and whose design names the upload (a swatch or
 * a colourway's theme photo): their testers may see it, so their booklets show the swatches. An
 * upload id is a UUID, so finding it in the design's text finds exactly its uses.
 *
 * @example const designPatterns = await testedPatternsShowing(actor.id, upload.id)
 */
export async function testedPatternsShowing(userId: string, uploadId: string): Promise<PatternFacts[]> {
  const rows = await database().query<{ id: string; owner_id: string | null }>(
    `SELECT DISTINCT p.id, p.owner_id FROM patterns p
       JOIN pattern_invitations i ON i.pattern_id = p.id
      WHERE i.user_id = :userId AND ${liveAndAcceptedSql('i')}
        AND p.state = 'testing' AND strpos(p.design::text, :uploadId) > 0`,
    { replacements: { userId, uploadId }, type: QueryTypes.SELECT },
  )
  return rows.map((row) => ({ ownerId: row.owner_id, state: 'testing', testerIds: [userId] }))
}
