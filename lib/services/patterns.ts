import 'server-only'
import { Transaction } from 'sequelize'
import { authorize, type Actor } from '@/lib/authorization'
import { database } from '@/lib/db'
import { ConflictError, NotFoundError, StoredDesignError, UnauthenticatedError, ValidationError } from '@/lib/errors'
import { emptyDesign } from '@/lib/new-design'
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
import { Pattern, PatternRevision } from '@/models'

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
    createdAt: pattern.createdAt.toISOString(),
    updatedAt: pattern.updatedAt.toISOString(),
  }
}

/** A stored design read through the design schema; one that no longer parses names its pattern. */
function storedDesign(pattern: Pattern): DesignFile {
  const parsed = parseDesign(pattern.design)
  if (!parsed.ok) throw new StoredDesignError(pattern, parsed.issues)
  return parsed.file
}

function toView(pattern: Pattern): PatternView {
  return { ...toSummary(pattern), ownerId: pattern.ownerId, design: storedDesign(pattern) }
}

/** What `listOwnPatterns` reads of a pattern: every field of PatternSummary, no design. */
const SHELF_COLUMNS = ['id', 'name', 'state', 'revision', 'repeats', 'outerDiameterInches', 'seamCount', 'createdAt', 'updatedAt'] satisfies (keyof Pattern)[]

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
  const pattern = await Pattern.findByPk(id, { transaction, lock: transaction ? Transaction.LOCK.UPDATE : undefined })
  if (!pattern) throw new NotFoundError('No such pattern.')
  return pattern
}

/**
 * The permission step of the routes under /api/patterns/:id (lib/http.ts runs it before reading the
 * body): the pattern must exist and be visible to the actor — 404 otherwise, the same for both —
 * and the action must be allowed (403). The services check again inside their transactions.
 */
export async function authorizePatternAction(
  actor: Actor,
  id: string,
  action: 'read-pattern' | 'update-pattern' | 'delete-pattern',
): Promise<void> {
  // A stranger learns nothing about ids: 401 before any lookup.
  if (!actor) throw new UnauthenticatedError()
  database()
  const pattern = await findPattern(id)
  authorize(actor, 'read-pattern', pattern)
  if (action !== 'read-pattern') authorize(actor, action, pattern)
}

export async function getPattern(actor: Actor, id: string): Promise<PatternView> {
  database()
  const pattern = await findPattern(id)
  authorize(actor, 'read-pattern', pattern)
  return toView(pattern)
}

/**
 * Saves a change made from `input.revision`. If the pattern has moved on since (another tab or
 * person saved), nothing is written and a 409 names the current revision. Each save adds an
 * immutable revision row in the same transaction as the change.
 */
export async function updatePattern(actor: Actor, id: string, input: UpdatePatternInput): Promise<PatternView> {
  return database().transaction(async (transaction) => {
    const pattern = await findPattern(id, transaction)
    authorize(actor, 'read-pattern', pattern)
    authorize(actor, 'update-pattern', pattern)
    if (input.state !== undefined && input.state !== pattern.state) {
      authorize(actor, 'change-pattern-state', pattern)
      if (!PATTERN_STATE_CHANGES[pattern.state as PatternState].includes(input.state)) {
        throw new ValidationError([
          { path: 'state', message: `A ${pattern.state} pattern cannot become ${input.state}.` },
        ])
      }
    }
    if (input.revision !== pattern.revision) {
      throw new ConflictError(
        `This pattern was saved elsewhere (now revision ${pattern.revision}; your change started from ${input.revision}).`,
        { currentRevision: pattern.revision },
      )
    }
    pattern.set({
      name: input.name ?? pattern.name,
      state: input.state ?? pattern.state,
      design: input.design ?? pattern.design,
      revision: pattern.revision + 1,
    })
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
    return toView(pattern)
  })
}

/** Deletes a pattern with its revisions. */
export async function deletePattern(actor: Actor, id: string): Promise<void> {
  await database().transaction(async (transaction) => {
    const pattern = await findPattern(id, transaction)
    authorize(actor, 'read-pattern', pattern)
    authorize(actor, 'delete-pattern', pattern)
    await pattern.destroy({ transaction })
  })
}

/** The saved revisions of a pattern, newest first (without their designs). */
export async function listRevisions(actor: Actor, id: string) {
  database()
  const pattern = await findPattern(id)
  authorize(actor, 'read-pattern', pattern)
  const revisions = await PatternRevision.findAll({
    where: { patternId: id },
    attributes: ['revision', 'name', 'state', 'createdAt'],
    order: [['revision', 'DESC']],
  })
  return revisions.map((r) => ({ revision: r.revision, name: r.name, state: r.state, createdAt: r.createdAt.toISOString() }))
}
