import 'server-only'
import { Transaction } from 'sequelize'
import { authorize, can, type Actor, type PatternFacts } from '@/lib/authorization'
import { database } from '@/lib/db'
import { ConflictError, NotFoundError, StoredDesignError, UnauthenticatedError, ValidationError } from '@/lib/errors'
import { keptJson, keptJsonSize, type KeptJson } from '@/lib/kept-json'
import { emptyDesign } from '@/lib/new-design'
import { readinessProblems } from '@/lib/pattern-readiness'
import { KeptAnswers } from '@/lib/row-changes'
import { parseDesign, type DesignFile } from '@/lib/schemas/design'
import {
  PATTERN_STATE_CHANGES,
  patternIdSchema,
  type CreatePatternInput,
  type PatternState,
  type PatternSummary,
  type PatternView,
  type UpdatePatternInput,
} from '@/lib/schemas/pattern'
import { Pattern, PatternRevision, PatternStateChange, User } from '@/models'
import { LIVE_TESTER_IDS, liveTesterIdsOf, testerIdsOf, testersLiveUntil } from './testers'

// The answers' shapes are the schemas the browser parses them with (lib/schemas/pattern.ts).
export type { PatternSummary, PatternView }

function toSummary(pattern: Pattern): PatternSummary {
  return {
    id: pattern.id,
    name: pattern.name,
    state: pattern.state,
    revision: pattern.revision,
    repeats: pattern.repeats,
    outerDiameterInches: pattern.outerDiameterInches,
    seamCount: pattern.seamCount,
    priceCents: pattern.priceCents ?? null,
    currency: pattern.currency ?? null,
    createdAt: pattern.createdAt.toISOString(),
    updatedAt: pattern.updatedAt.toISOString(),
  }
}

/**
 * Designs already read through the schema, by pattern, each kept while its stored JSON is the same
 * text (the text is the key, not the revision: a restore or a hand edit may change a design under
 * the same number). For the demo wreath the schema costs about a third of a millisecond of the web
 * process per read under load (`npm run load`, pattern read), the comparison a few microseconds.
 * Frozen, as every reader shares one; the oldest goes first past KEPT_DESIGN_CHARACTERS in all.
 */
const keptDesigns = new Map<string, { text: string; file: DesignFile }>()
const KEPT_DESIGN_CHARACTERS = 16 * 1024 * 1024
let keptCharacters = 0

function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object' && !Object.isFrozen(value)) {
    Object.freeze(value)
    for (const inner of Object.values(value)) deepFreeze(inner)
  }
  return value
}

/** A stored design read through the design schema; one that no longer parses names its pattern. */
function storedDesign(pattern: Pattern): DesignFile {
  const text = JSON.stringify(pattern.design)
  const kept = keptDesigns.get(pattern.id)
  if (kept?.text === text) return kept.file
  const parsed = parseDesign(pattern.design)
  if (!parsed.ok) throw new StoredDesignError(pattern, parsed.issues)
  if (kept) {
    keptDesigns.delete(pattern.id)
    keptCharacters -= kept.text.length
  }
  if (text.length <= KEPT_DESIGN_CHARACTERS) {
    keptDesigns.set(pattern.id, { text, file: deepFreeze(parsed.file) })
    keptCharacters += text.length
  }
  for (const [id, oldest] of keptDesigns) {
    if (keptCharacters <= KEPT_DESIGN_CHARACTERS) break
    keptDesigns.delete(id)
    keptCharacters -= oldest.text.length
  }
  return parsed.file
}

/** A pattern as the API answers it, design included, from a row already loaded and authorized. */
function toView(pattern: Pattern): PatternView {
  return { ...toSummary(pattern), ownerId: pattern.ownerId, design: storedDesign(pattern) }
}

/** What `listOwnPatterns` reads of a pattern: every field of PatternSummary, no design. */
const SHELF_COLUMNS = ['id', 'name', 'state', 'revision', 'repeats', 'outerDiameterInches', 'seamCount', 'priceCents', 'currency', 'createdAt', 'updatedAt'] satisfies (keyof Pattern)[]

/** The designer's own patterns, most recently changed first. */
export async function listOwnPatterns(actor: Actor): Promise<PatternSummary[]> {
  authorize(actor, 'list-own-patterns')
  database()
  // The shelf's columns only, never the designs (megabytes each at the limit): the summary is kept beside them.
  const patterns = await Pattern.findAll({
    where: { ownerId: actor.id },
    attributes: SHELF_COLUMNS,
    order: [['updatedAt', 'DESC'], ['id', 'ASC']],
  })
  return patterns.map(toSummary)
}

/** Creates a pattern and its first revision in one transaction. */
export async function createPattern(actor: Actor, input: CreatePatternInput): Promise<PatternView> {
  authorize(actor, 'create-pattern')
  const design = input.design ?? emptyDesign(input.name)
  return database().transaction(async (transaction) => {
    const pattern = await Pattern.create({ ownerId: actor.id, name: input.name, design }, { transaction })
    await PatternRevision.create(
      { patternId: pattern.id, revision: 1, name: pattern.name, state: pattern.state, design, savedById: actor.id },
      { transaction },
    )
    return toView(pattern)
  })
}

async function findPattern(id: string, transaction?: Transaction): Promise<Pattern> {
  if (!patternIdSchema.safeParse(id).success) throw new NotFoundError('No such pattern.')
  // With its testers now, in the same statement (patternFacts reads them from it).
  const pattern = await Pattern.findByPk(id, { transaction, lock: transaction ? Transaction.LOCK.UPDATE : undefined, attributes: { include: [LIVE_TESTER_IDS] } })
  if (!pattern) throw new NotFoundError('No such pattern.')
  return pattern
}

/**
 * What the permission rules need of a pattern: owner, state and its testers now (accepted, live
 * invitations). Licence holders are the shop's to add (PatternFacts.licenceHolderIds).
 *
 * @example authorize(user, 'print-pattern', await patternFacts(pattern))
 */
export async function patternFacts(pattern: Pattern, transaction?: Transaction): Promise<PatternFacts> {
  return { ownerId: pattern.ownerId, state: pattern.state, testerIds: liveTesterIdsOf(pattern) ?? (await testerIdsOf(pattern.id, { transaction })) }
}

/**
 * A pattern the actor may read (else 404, as for a missing one), with its permission facts, for
 * the other services of a pattern (invitations, reports).
 *
 * @example const { pattern, facts } = await readablePattern(user, id, transaction)
 */
export async function readablePattern(actor: Actor, id: string, transaction?: Transaction): Promise<{ pattern: Pattern; facts: PatternFacts }> {
  if (!actor) throw new UnauthenticatedError()
  database()
  const pattern = await findPattern(id, transaction)
  const facts = await patternFacts(pattern, transaction)
  authorize(actor, 'read-pattern', facts)
  return { pattern, facts }
}

/**
 * Pattern answers (`GET /api/patterns/:id`'s JSON) read lately, with the facts that decide who may
 * read them, by pattern: kept until the pattern or one of its invitations changes or a tester's
 * invitation expires (lib/row-changes.ts); at most KEPT_DESIGN_CHARACTERS of JSON in all.
 */
const keptPatternAnswers = new KeptAnswers<{ readonly facts: PatternFacts; readonly json: KeptJson }>(KEPT_DESIGN_CHARACTERS, (answer) => keptJsonSize(answer.json))

/**
 * `GET /api/patterns/:id`'s answer as kept JSON (lib/kept-json.ts), for an actor who may read the
 * pattern (else 404, as for a missing one), from what this process kept when it can (a pattern
 * read asks PostgreSQL nothing then: `npm run load`, pattern read).
 *
 * @example keptJsonResponse(request, await patternAnswer(user, id))
 */
export async function patternAnswer(actor: Actor, id: string): Promise<KeptJson> {
  if (!actor) throw new UnauthenticatedError()
  database()
  const { facts, json } = await keptPatternAnswers.answer(id, async () => {
    const pattern = await findPattern(id)
    const [facts, until] = await Promise.all([patternFacts(pattern), testersLiveUntil(id)])
    return { value: { facts, json: keptJson({ pattern: toView(pattern) }) }, tags: [`patterns:${id}`], until }
  })
  authorize(actor, 'read-pattern', facts)
  return json
}

/**
 * The permission step of the routes under /api/patterns/:id (lib/http.ts runs it before reading the
 * body): the pattern must exist and be visible to the actor — 404 otherwise, the same for both —
 * and the action must be allowed (403). The services check again inside their transactions.
 */
export async function authorizePatternAction(
  actor: Actor,
  id: string,
  action: 'read-pattern' | 'update-pattern' | 'delete-pattern' | 'print-pattern' | 'invite-testers',
): Promise<void> {
  // A stranger learns nothing about ids: 401 before any lookup.
  if (!actor) throw new UnauthenticatedError()
  const { facts } = await readablePattern(actor, id)
  if (action !== 'read-pattern') authorize(actor, action, facts)
}

export async function getPattern(actor: Actor, id: string): Promise<PatternView> {
  const { pattern } = await readablePattern(actor, id)
  return toView(pattern)
}

/** The notice a tester's booklet carries on every page (lib/booklet: `footer`). */
export const TEST_COPY_NOTICE = 'test copy – not for sale'

/** A pattern as the print room gets it: the view, and the footer its booklets must carry (a tester's name and notice), if any. */
export interface PrintablePattern {
  readonly pattern: PatternView
  readonly footer: { readonly person: string; readonly notice: string } | null
  /** Whether the actor prints as a tester (free, marked as a test copy). */
  readonly asTester: boolean
}

/**
 * The pattern for the print room: its designer and admins print it plain; a tester prints it free
 * with "test copy – not for sale" and their name in every page's footer. Anyone else: 404.
 *
 * @example const { pattern, footer } = await getPatternForPrint(user, id)
 */
export async function getPatternForPrint(actor: Actor, id: string): Promise<PrintablePattern> {
  const { pattern, facts } = await readablePattern(actor, id)
  authorize(actor, 'print-pattern', facts)
  // The designer of a pattern who is also its tester (an admin testing) still prints a plain copy.
  const asTester = can(actor, 'test-pattern', facts) && !can(actor, 'update-pattern', facts)
  if (!asTester) return { pattern: toView(pattern), footer: null, asTester }
  const person = await User.findByPk(actor.id, { attributes: ['displayName'] })
  return { pattern: toView(pattern), footer: { person: person?.displayName ?? 'a tester', notice: TEST_COPY_NOTICE }, asTester }
}

/** Why a pattern may not move to `to` now; the first rule that refuses names it (field `state`). */
function refuseStateChange(pattern: Pattern, to: PatternState): void {
  const refuse = (message: string): never => {
    throw new ValidationError([{ path: 'state', message }], `The pattern cannot become ${to}: ${message}.`)
  }
  if (!PATTERN_STATE_CHANGES[pattern.state as PatternState].includes(to)) refuse(`a ${pattern.state} pattern cannot become ${to}`)
  if (to === 'testing' || to === 'published') {
    const parsed = parseDesign(pattern.design)
    if (!parsed.ok) refuse('the design cannot be read')
    else {
      const problem = readinessProblems(parsed.design)[0]
      if (problem) refuse(problem.message)
    }
  }
  if (to === 'published' && (pattern.priceCents === null || pattern.priceCents === undefined || !pattern.currency)) refuse('it needs a price')
}

/**
 * Saves a change made from `input.revision`. If the pattern has moved on since (another tab or
 * person saved), nothing is written and a 409 names the current revision. Each save adds an
 * immutable revision row in the same transaction as the change.
 */
export async function updatePattern(actor: Actor, id: string, input: UpdatePatternInput): Promise<PatternView> {
  return database().transaction(async (transaction) => {
    const { pattern, facts } = await readablePattern(actor, id, transaction)
    authorize(actor, 'update-pattern', facts)
    const from = pattern.state
    const changesState = input.state !== undefined && input.state !== from
    if (changesState) authorize(actor, 'change-pattern-state', facts)
    if (input.revision !== pattern.revision) {
      throw new ConflictError(
        `This pattern was saved elsewhere (now revision ${pattern.revision}; your change started from ${input.revision}).`,
        { currentRevision: pattern.revision },
      )
    }
    pattern.set({
      name: input.name ?? pattern.name,
      design: input.design ?? pattern.design,
      revision: pattern.revision + 1,
    })
    if (input.price !== undefined) {
      pattern.set({ priceCents: input.price?.priceCents ?? null, currency: input.price?.currency ?? null })
    }
    // The rules are checked against the pattern as this change leaves it (a price or a repaired
    // design sent with the state counts).
    if (changesState) refuseStateChange(pattern, input.state!)
    if (pattern.state === 'published' && !changesState && (pattern.priceCents == null || !pattern.currency)) {
      throw new ValidationError([{ path: 'price', message: 'a published pattern keeps its price; retire it first' }])
    }
    if (changesState) pattern.set({ state: input.state! })
    // A change to the name alone still counts as a change of the pattern.
    pattern.changed('updatedAt', true)
    await pattern.save({ transaction })
    await PatternRevision.create(
      {
        patternId: pattern.id,
        revision: pattern.revision,
        name: pattern.name,
        state: pattern.state,
        design: pattern.design,
        savedById: actor.id,
      },
      { transaction },
    )
    if (changesState) await PatternStateChange.create({ patternId: pattern.id, fromState: from, toState: pattern.state, changedById: actor.id }, { transaction })
    return toView(pattern)
  })
}

/** One move of a pattern, as its history lists it. */
export interface StateChangeView {
  readonly from: PatternState
  readonly to: PatternState
  /** The person's display name, or null once their account is gone. */
  readonly by: string | null
  readonly at: string
}

/**
 * The pattern's moves from state to state, oldest first: who and when. For its designer and
 * admins (testers do not see who else worked on it).
 *
 * @example (await listStateChanges(user, id))[0] // { from: 'draft', to: 'testing', by: 'Ada', at: '2026-12-02T…' }
 */
export async function listStateChanges(actor: Actor, id: string): Promise<StateChangeView[]> {
  const { facts } = await readablePattern(actor, id)
  authorize(actor, 'update-pattern', facts)
  const changes = await PatternStateChange.findAll({
    where: { patternId: id },
    include: [{ model: User, as: 'changedBy', attributes: ['displayName'] }],
    order: [['createdAt', 'ASC'], ['id', 'ASC']],
  })
  return changes.map((change) => ({
    from: change.fromState,
    to: change.toState,
    by: (change as PatternStateChange & { changedBy?: User | null }).changedBy?.displayName ?? null,
    at: change.createdAt.toISOString(),
  }))
}

/** Deletes a pattern with its revisions. */
export async function deletePattern(actor: Actor, id: string): Promise<void> {
  await database().transaction(async (transaction) => {
    const { pattern, facts } = await readablePattern(actor, id, transaction)
    authorize(actor, 'delete-pattern', facts)
    await pattern.destroy({ transaction })
  })
}

/** The saved revisions of a pattern, newest first (without their designs). */
export async function listRevisions(actor: Actor, id: string) {
  await readablePattern(actor, id)
  const revisions = await PatternRevision.findAll({
    where: { patternId: id },
    attributes: ['revision', 'name', 'state', 'createdAt'],
    order: [['revision', 'DESC']],
  })
  return revisions.map((r) => ({ revision: r.revision, name: r.name, state: r.state, createdAt: r.createdAt.toISOString() }))
}
