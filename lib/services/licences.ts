import 'server-only'
import { Op } from 'sequelize'
import { authorize, can, type Actor, type PatternFacts } from '@/lib/authorization'
import { database } from '@/lib/db'
import { NotFoundError, StoredDesignError } from '@/lib/errors'
import { parseDesign, type DesignFile } from '@/lib/schemas/design'
import type { LibraryEntry } from '@/lib/schemas/shop'
import { Licence, Pattern, User } from '@/models'

/**
 * Licences (issue 14): what a verified, paid order grants its buyer. A live (unrevoked) licence
 * lets its holder read and print the pattern, in every colourway, also once it is retired; the
 * rules are lib/authorization.ts's, fed the holder through `PatternFacts.licenceHolderIds`.
 */

/** The person's live licence to the pattern, if they hold one. */
export async function liveLicenceOf(userId: string, patternId: string): Promise<Licence | null> {
  database()
  return Licence.findOne({ where: { userId, patternId, revokedAt: null }, order: [['grantedAt', 'ASC']] })
}

/**
 * A pattern's facts for the authorization rules, with the actor among its licence holders when
 * they hold a live licence to it (only the actor is looked up: the rules ask about them alone).
 */
export async function patternFactsWithLicence(actor: Actor, pattern: PatternFacts & { readonly id: string }): Promise<PatternFacts> {
  const holds = actor ? (await liveLicenceOf(actor.id, pattern.id)) !== null : false
  // Field by field: a model instance's attributes are getters that a spread would not copy.
  return { ownerId: pattern.ownerId, state: pattern.state, testerIds: pattern.testerIds, licenceHolderIds: holds && actor ? [actor.id] : [] }
}

/** The buyer's library: their live licences, newest first. */
export async function listLibrary(actor: Actor): Promise<LibraryEntry[]> {
  authorize(actor, 'read-own-library')
  database()
  const licences = await Licence.findAll({
    where: { userId: actor.id, revokedAt: null },
    include: [{ model: Pattern, as: 'pattern', attributes: ['id', 'name', 'state', 'ownerId'], include: [{ model: User, as: 'owner', attributes: ['displayName'] }] }],
    order: [['grantedAt', 'DESC'], ['id', 'ASC']],
  })
  return licences.flatMap((licence) => {
    const pattern = (licence as Licence & { pattern?: Pattern & { owner?: User | null } }).pattern
    if (!pattern || (pattern.state !== 'published' && pattern.state !== 'retired')) return []
    return [
      {
        id: licence.id,
        number: licence.number,
        patternId: pattern.id,
        patternName: pattern.name,
        designer: pattern.owner?.displayName ?? 'A former designer',
        grantedAt: licence.grantedAt.toISOString(),
        patternState: pattern.state,
      },
    ]
  })
}

/** What the licence holder's print room needs: the licence and the pattern's design file. */
export interface LicensedPattern {
  licence: { id: string; number: string; grantedAt: string }
  pattern: { id: string; name: string; revision: number; design: DesignFile }
}

/**
 * The design file of a licence's pattern, for its holder's print room (`GET /api/library/:id`).
 * Someone else's licence, a revoked one, or a pattern that is no longer for sale or kept: 404,
 * the same for each, after asking the rules ('print-pattern').
 */
export async function getLicensedPattern(actor: Actor, licenceId: string): Promise<LicensedPattern> {
  authorize(actor, 'read-own-library')
  database()
  const licence = /^[0-9a-f-]{36}$/i.test(licenceId)
    ? await Licence.findOne({ where: { id: licenceId, userId: actor.id, revokedAt: { [Op.is]: null } } })
    : null
  const pattern = licence ? await Pattern.findByPk(licence.patternId) : null
  if (!licence || !pattern) throw new NotFoundError('No such licence in your library.')
  if (!can(actor, 'print-pattern', await patternFactsWithLicence(actor, pattern))) throw new NotFoundError('No such licence in your library.')
  const parsed = parseDesign(pattern.design)
  if (!parsed.ok) throw new StoredDesignError(pattern, parsed.issues)
  return {
    licence: { id: licence.id, number: licence.number, grantedAt: licence.grantedAt.toISOString() },
    pattern: { id: pattern.id, name: pattern.name, revision: pattern.revision, design: parsed.file },
  }
}
