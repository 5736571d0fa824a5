import 'server-only'
import { randomUUID } from 'node:crypto'
import { Op, QueryTypes } from 'sequelize'
import type { Design } from '@/geometry'
import { authorize, type Actor, type SewingProjectFacts } from '@/lib/authorization'
import type { BookletModel } from '@/lib/booklet/model'
import { database } from '@/lib/db'
import { ConflictError, NotFoundError, StoredDesignError, ValidationError } from '@/lib/errors'
import { keptJson, keptJsonSize, type KeptJson } from '@/lib/kept-json'
import { MAX_SEWING_PROJECTS_PER_PERSON } from '@/lib/limits'
import { countSewingProjectStart, countStepChange } from '@/lib/rate-limits'
import { KeptAnswers, type ChangeTag } from '@/lib/row-changes'
import { parseDesign } from '@/lib/schemas/design'
import type { NewProjectInput, ProjectDetail, ProjectStep, ProjectSummary, SewingPicture, StepProgress, StepUpdateInput } from '@/lib/schemas/sewing-room'
import { checklistOfModel, sewingModel, type Checklist } from '@/lib/sewing-room/checklist'
import { sewingPicture } from '@/lib/sewing-room/picture'
import { planAnswer } from '@/lib/sewing-room/plan-answer'
import { Invitation, Licence, Pattern, PatternRevision, SewingProject, SewingStep, User } from '@/models'

/**
 * The sewing room (issue 15): a quilter's projects, each one pattern made under their licence (or,
 * for a tester, their invitation) in a colourway, size and paper; its checklist
 * (lib/sewing-room/checklist.ts) is made from the pattern revision the project was started on, so
 * the steps — and the progress stored by step id — stay put while the designer edits. Progress is
 * one row per step, written one step at a time, so ticks from two devices merge by step.
 * Every rule is lib/authorization.ts's: someone else's project, or one whose licence was refunded
 * or whose invitation was withdrawn, is 404 like a missing one (as licences and booklets are).
 */

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/** A project with what the rules and the answers need. */
export interface LoadedProject {
  readonly project: SewingProject
  /** PROJECT_PATTERN_COLUMNS only. */
  readonly pattern: Pattern
  readonly facts: SewingProjectFacts
  /** The pattern's designer's name as the answers show it. */
  readonly designer: string
}

/** What a loaded project reads of its pattern. */
const PROJECT_PATTERN_COLUMNS = ['id', 'name', 'ownerId', 'state'] satisfies (keyof Pattern)[]
type PatternWithOwner = Pattern & { owner?: User | null }

// ---- the checklist of a revision, made once per (revision, colourway, diameter) ----

interface Worked {
  readonly model: BookletModel
  readonly checklist: Checklist
  readonly stepIds: ReadonlySet<string>
  picture?: SewingPicture
}

/**
 * Checklists worked out lately, by revision, colourway and diameter: planning a design takes a
 * tenth of a second or more, and every tick checks its step id against the checklist. A revision
 * never changes (its row is immutable), so an entry never goes stale; the oldest is dropped first.
 */
const worked = new Map<string, Worked>()
const WORKED_KEPT = 64

function workKey(project: Pick<SewingProject, 'patternRevisionId' | 'colorwayIndex' | 'diameterIn'>): string {
  return `${project.patternRevisionId}\u0000${project.colorwayIndex}\u0000${project.diameterIn}`
}

async function designOfRevision(revisionId: string, pattern: Pick<Pattern, 'id' | 'name'>): Promise<Design> {
  const row = await PatternRevision.findByPk(revisionId, { attributes: ['design'] })
  if (!row) throw new NotFoundError('No such project.')
  const parsed = parseDesign(row.design)
  if (!parsed.ok) throw new StoredDesignError(pattern, parsed.issues)
  return parsed.design
}

function work(design: Design, key: string, options: { colorway: number; diameterIn: number }): Worked {
  const model = sewingModel(design, options)
  const checklist = checklistOfModel(model)
  const entry: Worked = { model, checklist, stepIds: new Set(checklist.steps.map((step) => step.id)) }
  worked.set(key, entry)
  while (worked.size > WORKED_KEPT) worked.delete(worked.keys().next().value!)
  return entry
}

async function workedFor(project: SewingProject, pattern: Pick<Pattern, 'id' | 'name'>): Promise<Worked> {
  const key = workKey(project)
  const hit = worked.get(key)
  if (hit) {
    // Most recently used last.
    worked.delete(key)
    worked.set(key, hit)
    return hit
  }
  const design = await designOfRevision(project.patternRevisionId, pattern)
  return work(design, key, { colorway: project.colorwayIndex, diameterIn: project.diameterIn })
}

// ---- the rules' facts ----

function isLiveInvitation(invitation: Invitation | null, now = new Date()): boolean {
  return !!invitation && invitation.userId !== null && invitation.acceptedAt !== null && invitation.withdrawnAt === null && invitation.expiresAt > now
}

/** The facts of a project (or of one about to be started) from its one grant. */
function factsOf(ownerId: string, pattern: Pattern, grant: { licence: Licence | null } | { invitation: Invitation | null }): SewingProjectFacts {
  if ('licence' in grant) {
    const { licence } = grant
    const live = !!licence && licence.revokedAt === null && licence.patternId === pattern.id
    return { ownerId, pattern: { ownerId: pattern.ownerId, state: pattern.state, licenceHolderIds: live ? [licence.userId] : [] } }
  }
  const { invitation } = grant
  const live = isLiveInvitation(invitation) && invitation!.patternId === pattern.id
  return { ownerId, pattern: { ownerId: pattern.ownerId, state: pattern.state, testerIds: live ? [invitation!.userId!] : [] } }
}

/**
 * The permission step of the project routes: the project, for its owner while they hold its
 * licence or invitation (`sewing-room:read` / `update`), or for its owner at all (`delete`);
 * 404 for anyone else, exactly like a missing project.
 */
export async function loadProject(actor: Actor, projectId: string, action: 'sewing-room:read' | 'sewing-room:update' | 'sewing-room:delete'): Promise<LoadedProject> {
  authorize(actor, 'sewing-room:list')
  database()
  // One statement: the project, its pattern (never the design: each revision's is read once, for
  // its checklist) with the designer's name, and its grant. Every read and tick of the sewing room
  // starts here (`npm run load`: plan and tick).
  const project = UUID.test(projectId)
    ? await SewingProject.findByPk(projectId, {
      include: [
        { model: Pattern, as: 'pattern', attributes: PROJECT_PATTERN_COLUMNS, include: [{ model: User, as: 'owner', attributes: ['displayName'] }] },
        { model: Licence, as: 'licence' },
        { model: Invitation, as: 'invitation' },
      ],
    })
    : null
  // Someone else's project is not looked into further: it is not found.
  const pattern = project && project.ownerId === actor.id ? (project.pattern as PatternWithOwner | null | undefined) : null
  if (!project || !pattern) throw new NotFoundError('No such project.')
  const grant = project.licenceId !== null ? { licence: project.licence ?? null } : { invitation: project.invitation ?? null }
  const facts = factsOf(project.ownerId, pattern, grant)
  authorize(actor, action, facts)
  return { project, pattern, facts, designer: pattern.owner?.displayName ?? FORMER_DESIGNER }
}

// ---- answers ----

async function designerNames(patterns: readonly Pattern[]): Promise<Map<string, string>> {
  const ownerIds = [...new Set(patterns.map((pattern) => pattern.ownerId).filter((id): id is string => id !== null))]
  const owners = ownerIds.length > 0 ? await User.findAll({ where: { id: { [Op.in]: ownerIds } }, attributes: ['id', 'displayName'] }) : []
  return new Map(owners.map((owner) => [owner.id, owner.displayName]))
}

/** The ids of the steps ticked done, by project. */
async function doneStepsOf(projectIds: readonly string[]): Promise<Map<string, Set<string>>> {
  const done = new Map<string, Set<string>>()
  if (projectIds.length === 0) return done
  const rows = await SewingStep.findAll({ where: { projectId: { [Op.in]: [...projectIds] }, done: true }, attributes: ['projectId', 'stepId'] })
  for (const row of rows) {
    const ids = done.get(row.projectId) ?? new Set<string>()
    ids.add(row.stepId)
    done.set(row.projectId, ids)
  }
  return done
}

function summaryOf(project: SewingProject, pattern: Pattern, designer: string, entry: Worked, done: ReadonlySet<string>): ProjectSummary {
  const steps = entry.checklist.steps
  const next = steps.find((step) => !done.has(step.id)) ?? null
  return {
    id: project.id,
    name: project.name,
    patternId: pattern.id,
    patternName: pattern.name,
    designerName: designer,
    colorway: { index: project.colorwayIndex, name: entry.model.colorway?.name ?? null },
    diameterIn: project.diameterIn,
    paper: project.paper,
    licenceId: project.licenceId,
    invitationId: project.invitationId,
    done: steps.filter((step) => done.has(step.id)).length,
    total: steps.length,
    nextStepLabel: next?.label ?? null,
    createdAt: project.createdAt.toISOString(),
    updatedAt: project.updatedAt.toISOString(),
  }
}

const FORMER_DESIGNER = 'A former designer'

/**
 * The person's projects that are open to them (their licence live, or their invitation live and
 * the pattern in testing), most recently worked on first.
 */
export async function listProjects(actor: Actor): Promise<ProjectSummary[]> {
  authorize(actor, 'sewing-room:list')
  database()
  const projects = await SewingProject.findAll({ where: { ownerId: actor.id }, order: [['updatedAt', 'DESC'], ['id', 'ASC']] })
  const patterns = new Map(
    (await Pattern.findAll({ where: { id: { [Op.in]: [...new Set(projects.map((p) => p.patternId))] } }, attributes: PROJECT_PATTERN_COLUMNS })).map((pattern) => [pattern.id, pattern]),
  )
  const licenceIds = projects.flatMap((p) => (p.licenceId ? [p.licenceId] : []))
  const invitationIds = projects.flatMap((p) => (p.invitationId ? [p.invitationId] : []))
  const licences = new Map((licenceIds.length > 0 ? await Licence.findAll({ where: { id: { [Op.in]: licenceIds } } }) : []).map((l) => [l.id, l]))
  const invitations = new Map((invitationIds.length > 0 ? await Invitation.findAll({ where: { id: { [Op.in]: invitationIds } } }) : []).map((i) => [i.id, i]))
  const names = await designerNames([...patterns.values()])
  const done = await doneStepsOf(projects.map((p) => p.id))
  const summaries: ProjectSummary[] = []
  for (const project of projects) {
    const pattern = patterns.get(project.patternId)
    if (!pattern) continue
    const grant = project.licenceId ? { licence: licences.get(project.licenceId) ?? null } : { invitation: invitations.get(project.invitationId ?? '') ?? null }
    const facts = factsOf(project.ownerId, pattern, grant)
    // Closed projects (refunded, withdrawn) are left out, as the library leaves out revoked licences.
    if (!canRead(actor, facts)) continue
    const entry = await workedFor(project, pattern)
    summaries.push(summaryOf(project, pattern, pattern.ownerId ? (names.get(pattern.ownerId) ?? FORMER_DESIGNER) : FORMER_DESIGNER, entry, done.get(project.id) ?? new Set()))
  }
  return summaries
}

function canRead(actor: Actor, facts: SewingProjectFacts): boolean {
  try {
    authorize(actor, 'sewing-room:read', facts)
    return true
  } catch {
    return false
  }
}

/**
 * Starts a project (`POST /api/sewing-room/projects`) under the person's live licence, or their
 * accepted invitation to test a pattern in testing; anyone else's, a revoked licence or a
 * withdrawn invitation: 404. The colourway must be one of the pattern's (422 `colorway`). The
 * checklist is made from the pattern's current revision, and worked out at once.
 *
 * @example const project = await startProject(user, { licenceId, colorway: 0, diameterIn: 18, paper: 'letter' })
 */
export async function startProject(actor: Actor, input: NewProjectInput): Promise<ProjectSummary> {
  authorize(actor, 'sewing-room:list')
  database()
  // Every attempt counts, a refused one too (lib/rate-limits.ts): each costs lookups and a plan.
  await countSewingProjectStart(actor.id)
  let pattern: Pattern | null = null
  let facts: SewingProjectFacts | null = null
  if (input.licenceId !== undefined) {
    const licence = await Licence.findByPk(input.licenceId)
    pattern = licence && licence.userId === actor.id ? await Pattern.findByPk(licence.patternId) : null
    if (pattern) facts = factsOf(actor.id, pattern, { licence })
  } else if (input.invitationId !== undefined) {
    const invitation = await Invitation.findByPk(input.invitationId)
    pattern = invitation && invitation.userId === actor.id ? await Pattern.findByPk(invitation.patternId) : null
    if (pattern) facts = factsOf(actor.id, pattern, { invitation })
  }
  if (!pattern || !facts) throw new NotFoundError('No such licence or invitation of yours.')
  authorize(actor, 'sewing-room:start', facts)
  const revision = await PatternRevision.findOne({ where: { patternId: pattern.id, revision: pattern.revision }, attributes: ['id', 'design'] })
  if (!revision) throw new NotFoundError('No such licence or invitation of yours.')
  const parsed = parseDesign(revision.design)
  if (!parsed.ok) throw new StoredDesignError(pattern, parsed.issues)
  const colorways = parsed.design.colorways.length
  if (input.colorway >= Math.max(colorways, 1)) {
    throw new ValidationError([{ path: 'colorway', message: colorways === 0 ? 'This pattern has no colourways: choose 0.' : `This pattern has ${colorways} colourway${colorways === 1 ? '' : 's'}: choose 0 to ${colorways - 1}.` }])
  }
  const count = await SewingProject.count({ where: { ownerId: actor.id } })
  if (count >= MAX_SEWING_PROJECTS_PER_PERSON) {
    throw new ConflictError(`You already keep ${MAX_SEWING_PROJECTS_PER_PERSON} sewing projects, the most there may be; delete a finished one first.`)
  }
  const project = await SewingProject.create({
    id: randomUUID(),
    ownerId: actor.id,
    licenceId: input.licenceId ?? null,
    invitationId: input.invitationId ?? null,
    patternId: pattern.id,
    patternRevisionId: String(revision.id),
    colorwayIndex: input.colorway,
    diameterIn: input.diameterIn,
    paper: input.paper,
    name: input.name ?? null,
  })
  const entry = work(parsed.design, workKey(project), { colorway: project.colorwayIndex, diameterIn: project.diameterIn })
  const names = await designerNames([pattern])
  return summaryOf(project, pattern, pattern.ownerId ? (names.get(pattern.ownerId) ?? FORMER_DESIGNER) : FORMER_DESIGNER, entry, new Set())
}

/** A project's plan: the project, its groups with progress, every step with its own, the next step and the picture. */
async function projectDetail(loaded: LoadedProject): Promise<ProjectDetail> {
  const { project, pattern, designer } = loaded
  const entry = await workedFor(project, pattern)
  entry.picture ??= sewingPicture(entry.model)
  const rows = await SewingStep.findAll({ where: { projectId: project.id }, attributes: ['stepId', 'done', 'note', 'updatedAt'] })
  const progress = new Map(rows.map((row) => [row.stepId, row]))
  const steps: ProjectStep[] = entry.checklist.steps.map((step) => {
    const row = progress.get(step.id)
    return { ...step, done: row?.done ?? false, note: row?.note ?? null, updatedAt: row ? row.updatedAt.toISOString() : null }
  })
  const done = new Set(steps.filter((step) => step.done).map((step) => step.id))
  const groups = entry.checklist.groups.map((group) => {
    const ofGroup = steps.filter((step) => step.group === group.id)
    return { ...group, done: ofGroup.filter((step) => step.done).length, total: ofGroup.length }
  })
  return {
    project: summaryOf(project, pattern, designer, entry, done),
    groups,
    steps,
    nextStepId: steps.find((step) => !step.done)?.id ?? null,
    picture: entry.picture,
  }
}

/**
 * Sewing plans (`GET /api/sewing-room/projects/:id`'s JSON, about 32 kB for the demo wreath) read
 * lately, with who may read them, by project: kept until the project, a tick, its pattern, the
 * designer's name or its grant changes, or the invitation expires (lib/row-changes.ts).
 */
const keptPlans = new KeptAnswers<{ readonly ownerId: string; readonly facts: SewingProjectFacts; readonly json: KeptJson }>(
  32 * 1024 * 1024,
  (plan) => keptJsonSize(plan.json),
)

/**
 * `GET /api/sewing-room/projects/:id`'s answer as kept JSON (lib/kept-json.ts), for the project's
 * owner while they hold its grant (else 404), from what this process kept when it can (`npm run
 * load`, plan).
 *
 * @example keptJsonResponse(request, await projectAnswer(user, id))
 */
export async function projectAnswer(actor: Actor, projectId: string): Promise<KeptJson> {
  authorize(actor, 'sewing-room:list')
  const plan = await keptPlans.answer(projectId, async () => {
    const loaded = await loadProject(actor, projectId, 'sewing-room:read')
    const { project, pattern, facts } = loaded
    const tags: ChangeTag[] = [`sewing_projects:${project.id}`, `patterns:${pattern.id}`]
    if (pattern.ownerId) tags.push(`users:${pattern.ownerId}`)
    tags.push(project.licenceId !== null ? `licences:${project.licenceId}` : `pattern_invitations:${project.invitationId}`)
    const json = keptJson(planAnswer(await projectDetail(loaded)))
    return { value: { ownerId: project.ownerId, facts, json }, tags, until: project.invitation?.expiresAt ?? null }
  })
  // Someone else's project is not found, as in loadProject.
  if (plan.ownerId !== actor.id) throw new NotFoundError('No such project.')
  authorize(actor, 'sewing-room:read', plan.facts)
  return plan.json
}

/**
 * Ticks, unticks or notes one step (`PATCH /api/sewing-room/projects/:id/steps`): only the fields
 * given change, in one statement for that step alone, so a tick from another device on another
 * step is never overwritten and the same step keeps the last write. Sending the same change again
 * leaves the same state. A step id not in the checklist: 422 `stepId`.
 */
export async function updateStep(loaded: LoadedProject, input: StepUpdateInput): Promise<StepProgress> {
  const { project, pattern } = loaded
  // Counted for the project's owner, the only one who may change its steps (loadProject checked).
  await countStepChange(project.ownerId)
  const entry = await workedFor(project, pattern)
  if (!entry.stepIds.has(input.stepId)) throw new ValidationError([{ path: 'stepId', message: 'This project\u2019s checklist has no such step.' }])
  const setNote = input.note !== undefined
  const note = input.note === undefined || input.note === null || input.note === '' ? null : input.note
  const sequelize = database()
  return sequelize.transaction(async (transaction) => {
    const [row] = await sequelize.query<{ step_id: string; done: boolean; note: string | null; updated_at: Date }>(
      `INSERT INTO sewing_steps (project_id, step_id, done, note, updated_at)
       VALUES (:projectId, :stepId, :done, :note, now())
       ON CONFLICT (project_id, step_id) DO UPDATE SET
         done = CASE WHEN :setDone THEN EXCLUDED.done ELSE sewing_steps.done END,
         note = CASE WHEN :setNote THEN EXCLUDED.note ELSE sewing_steps.note END,
         updated_at = now()
       RETURNING step_id, done, note, updated_at`,
      {
        replacements: { projectId: project.id, stepId: input.stepId, done: input.done ?? false, note, setDone: input.done !== undefined, setNote },
        type: QueryTypes.SELECT,
        transaction,
      },
    )
    await SewingProject.update({ updatedAt: new Date() }, { where: { id: project.id }, transaction, silent: false })
    return { id: row!.step_id, done: row!.done, note: row!.note, updatedAt: new Date(row!.updated_at).toISOString() }
  })
}

/** Deletes a project and its progress (`DELETE /api/sewing-room/projects/:id`), for its owner. */
export async function deleteProject(loaded: LoadedProject): Promise<void> {
  await loaded.project.destroy()
}
