import 'server-only'
import { Op, Transaction } from 'sequelize'
import { planDesign, type Plan, type Ring } from '@/geometry'
import { authorize, can, type Actor, type PatternFacts } from '@/lib/authorization'
import { database } from '@/lib/db'
import { NotFoundError, UnauthenticatedError, ValidationError, type FieldIssue } from '@/lib/errors'
import type { ReportMailData } from '@/lib/mail/kinds'
import { queueMail } from '@/lib/mail/outbox'
import { countReport, countReportMessage } from '@/lib/rate-limits'
import { changedAtPin, pinOf, stepLabels } from '@/lib/report-place'
import { parseDesign } from '@/lib/schemas/design'
import {
  REPORT_KIND_NAMES,
  REPORT_SEVERITY_NAMES,
  placeInWords,
  type CreateReportInput,
  type ReportFilter,
  type ReportMap,
  type ReportMessageView,
  type ReportPlace,
  type ReportState,
  type ReportView,
} from '@/lib/schemas/report'
import { appLink } from '@/lib/services/accounts'
import { testerIdsOf } from '@/lib/services/testers'
import { Pattern, Report, ReportMessage, ReportPhoto, Upload, User } from '@/models'
import type { ReportAuthorRole } from '@/models/report-message'

/**
 * Test reports (issue 13): a tester of a pattern files a report pointed at a place of it, with
 * photos; the designer, the testers and admins read the reports and write in their threads; the
 * designer (or an admin) resolves and reopens them. Each new report or answer is mailed, in the
 * same transaction, to the pattern's designer and testers but its author.
 */

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i
/** How much of a report's text a message quotes. */
const EXCERPT_CHARACTERS = 400

interface LoadedPattern {
  readonly pattern: Pattern
  readonly facts: PatternFacts & { readonly testerIds: readonly string[] }
}

async function loadPattern(id: string, transaction?: Transaction): Promise<LoadedPattern> {
  database()
  const pattern = UUID.test(id) ? await Pattern.findByPk(id, { transaction, lock: transaction ? Transaction.LOCK.SHARE : undefined }) : null
  if (!pattern) throw new NotFoundError('No such pattern.')
  const testerIds = await testerIdsOf(pattern.id, { transaction })
  return { pattern, facts: { ownerId: pattern.ownerId, state: pattern.state, testerIds } }
}

async function loadReport(id: string, transaction?: Transaction): Promise<{ report: Report } & LoadedPattern> {
  database()
  const report = UUID.test(id) ? await Report.findByPk(id, { transaction, lock: transaction ? Transaction.LOCK.UPDATE : undefined }) : null
  if (!report) throw new NotFoundError('No such report.')
  return { report, ...(await loadPattern(report.patternId, transaction)) }
}

/** Those who may not read a pattern's reports learn nothing: 404, as for a missing one. */
function mayRead(actor: Actor, facts: PatternFacts, what: 'pattern' | 'report'): asserts actor is NonNullable<Actor> {
  if (!actor) throw new UnauthenticatedError()
  if (!can(actor, 'read-reports', facts)) throw new NotFoundError(what === 'pattern' ? 'No such pattern.' : 'No such report.')
}

/** The permission step of `GET /api/patterns/:id/reports`. */
export async function authorizeReportsRead(actor: Actor, patternId: string): Promise<void> {
  if (!actor) throw new UnauthenticatedError()
  mayRead(actor, (await loadPattern(patternId)).facts, 'pattern')
}

/**
 * The permission step of filing (before the body is read): only a tester of the pattern files,
 * and each filing counts against the reports rate limit (429 past it).
 */
export async function beginReport(actor: Actor, patternId: string): Promise<void> {
  if (!actor) throw new UnauthenticatedError()
  const { facts } = await loadPattern(patternId)
  mayRead(actor, facts, 'pattern')
  authorize(actor, 'file-report', facts)
  await countReport(actor.id)
}

/** The permission step of an answer: the designer, a tester or an admin; counted against the answers rate limit. */
export async function beginReportMessage(actor: Actor, reportId: string): Promise<void> {
  if (!actor) throw new UnauthenticatedError()
  const { facts } = await loadReport(reportId)
  mayRead(actor, facts, 'report')
  authorize(actor, 'answer-report', facts)
  await countReportMessage(actor.id)
}

/** The permission step of reading one report. */
export async function authorizeReportRead(actor: Actor, reportId: string): Promise<void> {
  if (!actor) throw new UnauthenticatedError()
  mayRead(actor, (await loadReport(reportId)).facts, 'report')
}

/** The permission step of resolving or reopening: the pattern's designer or an admin (testers 403, others 404). */
export async function authorizeReportStateChange(actor: Actor, reportId: string): Promise<void> {
  if (!actor) throw new UnauthenticatedError()
  const { facts } = await loadReport(reportId)
  mayRead(actor, facts, 'report')
  authorize(actor, 'change-report-state', facts)
}

/** The plan of a pattern's design now, in inches, with its ring; null when the design does not read. */
function currentPlan(pattern: Pattern): { plan: Plan; ring: Ring } | null {
  const parsed = parseDesign(pattern.design)
  if (!parsed.ok) return null
  return { plan: planDesign(parsed.design, { suggestions: false }), ring: parsed.design.ring }
}

function roleIn(actor: NonNullable<Actor>, facts: PatternFacts): ReportAuthorRole {
  if (facts.ownerId === actor.id) return 'designer'
  if (facts.testerIds?.includes(actor.id)) return 'tester'
  return 'admin'
}

/** The report views of some reports of one pattern, with names, photos, threads and whether the design changed at each. */
async function toViews(reports: readonly Report[], pattern: Pattern, transaction?: Transaction): Promise<ReportView[]> {
  if (reports.length === 0) return []
  const ids = reports.map((report) => report.id)
  // One after another: inside a transaction both would share its one connection.
  const messages = await ReportMessage.findAll({ where: { reportId: { [Op.in]: ids } }, order: [['createdAt', 'ASC'], ['id', 'ASC']], transaction })
  const photos = await ReportPhoto.findAll({ where: { reportId: { [Op.in]: ids } }, order: [['position', 'ASC']], transaction })
  const personIds = [...new Set([...reports.map((r) => r.testerId), ...messages.map((m) => m.authorId)].filter((id): id is string => id !== null))]
  const people = new Map((await User.findAll({ where: { id: { [Op.in]: personIds } }, attributes: ['id', 'displayName'], transaction })).map((u) => [u.id, u.displayName]))
  const person = (id: string | null) => (id && people.has(id) ? { id, displayName: people.get(id)! } : null)
  const now = currentPlan(pattern)
  return reports.map((report) => ({
    id: report.id,
    patternId: report.patternId,
    tester: person(report.testerId),
    kind: report.kind,
    severity: report.severity,
    text: report.text,
    place: report.place,
    pin: report.pin ? { point: [report.pin.point[0], report.pin.point[1]], area: report.pin.area } : null,
    changedSince: now ? changedAtPin(report.pin, now.plan, now.ring) : false,
    state: report.state,
    revision: report.revision,
    photos: photos.filter((photo) => photo.reportId === report.id).map((photo) => ({ id: photo.uploadId, url: `/api/uploads/${photo.uploadId}` })),
    messages: messages
      .filter((message) => message.reportId === report.id)
      .map((message): ReportMessageView => ({
        id: message.id,
        author: person(message.authorId),
        authorRole: message.authorRole,
        text: message.text,
        createdAt: message.createdAt.toISOString(),
      })),
    createdAt: report.createdAt.toISOString(),
    updatedAt: report.updatedAt.toISOString(),
  }))
}

/** A pattern's reports, filtered by state, kind and tester, newest (or oldest) first. */
export async function listReports(actor: Actor, patternId: string, filter: ReportFilter): Promise<ReportView[]> {
  const { pattern, facts } = await loadPattern(patternId)
  mayRead(actor, facts, 'pattern')
  const where: Record<string, unknown> = { patternId }
  if (filter.state) where.state = filter.state
  if (filter.kind) where.kind = filter.kind
  if (filter.tester) where.testerId = filter.tester
  const direction = filter.sort === 'oldest' ? 'ASC' : 'DESC'
  const reports = await Report.findAll({ where, order: [['createdAt', direction], ['id', direction]] })
  return toViews(reports, pattern)
}

/** One report with its thread. */
export async function getReport(actor: Actor, reportId: string): Promise<ReportView> {
  const { report, pattern, facts } = await loadReport(reportId)
  mayRead(actor, facts, 'report')
  return (await toViews([report], pattern))[0]!
}

/** The place checked against the pattern's plan now: an area label or a step it does not have is refused, naming the field. */
function checkPlace(place: ReportPlace, plan: { plan: Plan; ring: Ring } | null): FieldIssue[] {
  const issues: FieldIssue[] = []
  const labels = plan ? stepLabels(plan.plan) : []
  if (place.area !== undefined && !plan?.plan.areas.some((area) => area.label === place.area)) {
    issues.push({ path: 'place.area', message: `This pattern's plan has no area ${place.area}${labels.length ? ` (its areas are ${labels[0]} to ${labels.at(-1)})` : ''}.` })
  }
  if (place.step !== undefined && place.step > labels.length) {
    issues.push({ path: 'place.step', message: labels.length ? `This pattern's plan has ${labels.length} steps.` : "This pattern's plan has no steps." })
  }
  if (place.point && plan) {
    const radius = Math.hypot(place.point[0], place.point[1])
    if (radius > plan.ring.outerRadius) issues.push({ path: 'place.point', message: 'This point lies outside the ring.' })
  }
  return issues
}

/** Mails a new report or answer to the pattern's designer and testers but its author, in the transaction. */
async function mailEveryoneBut(
  authorId: string,
  facts: LoadedPattern['facts'],
  kind: 'report-filed' | 'report-answered',
  data: Omit<ReportMailData, 'displayName'>,
  transaction: Transaction,
): Promise<void> {
  const ids = [...new Set([facts.ownerId, ...facts.testerIds])].filter((id): id is string => id !== null && id !== authorId)
  if (ids.length === 0) return
  const people = await User.findAll({ where: { id: { [Op.in]: ids }, disabledAt: null }, attributes: ['id', 'email', 'displayName'], order: [['id', 'ASC']], transaction })
  for (const person of people) {
    await queueMail({ to: person.email, kind, data: { ...data, displayName: person.displayName }, userId: person.id }, { transaction })
  }
}

function excerpt(text: string): string {
  return text.length > EXCERPT_CHARACTERS ? `${text.slice(0, EXCERPT_CHARACTERS - 1)}…` : text
}

const reportLink = (report: Report) => appLink(`/patterns/${report.patternId}/reports?report=${report.id}`)

/**
 * Files a report against the pattern's current revision: its place checked against the plan, its
 * photos the tester's own report photos, its pin worked out now; mailed to the designer and the
 * other testers.
 */
export async function fileReport(actor: Actor, patternId: string, input: CreateReportInput): Promise<ReportView> {
  return database().transaction(async (transaction) => {
    const { pattern, facts } = await loadPattern(patternId, transaction)
    mayRead(actor, facts, 'pattern')
    authorize(actor, 'file-report', facts)
    const plan = currentPlan(pattern)
    const issues = checkPlace(input.place, plan)
    const photoIds = input.photoIds ?? []
    if (photoIds.length > 0) {
      const own = await Upload.findAll({ where: { id: { [Op.in]: photoIds }, ownerId: actor.id, kind: 'report-photo' }, attributes: ['id'], transaction })
      const found = new Set(own.map((upload) => upload.id))
      photoIds.forEach((id, index) => {
        if (!found.has(id)) issues.push({ path: `photoIds.${index}`, message: 'No such photo among your report photos.' })
      })
    }
    if (issues.length > 0) throw new ValidationError(issues)
    const pin = plan ? pinOf(input.place, plan.plan, plan.ring) : null
    const report = await Report.create(
      { patternId: pattern.id, testerId: actor.id, kind: input.kind, severity: input.severity, text: input.text, place: input.place, pin, revision: pattern.revision },
      { transaction },
    )
    await ReportPhoto.bulkCreate(photoIds.map((uploadId, position) => ({ reportId: report.id, uploadId, position })), { transaction })
    const author = await User.findByPk(actor.id, { attributes: ['displayName'], transaction })
    await mailEveryoneBut(
      actor.id,
      facts,
      'report-filed',
      {
        patternName: pattern.name,
        authorName: author?.displayName ?? 'A tester',
        kindName: REPORT_KIND_NAMES[report.kind],
        severityName: REPORT_SEVERITY_NAMES[report.severity],
        placeText: placeInWords(report.place),
        excerpt: excerpt(report.text),
        reportUrl: reportLink(report),
      },
      transaction,
    )
    return (await toViews([report], pattern, transaction))[0]!
  })
}

/** Adds an answer to a report's thread and mails it to the designer and testers but its author. */
export async function answerReport(actor: Actor, reportId: string, text: string): Promise<ReportView> {
  return database().transaction(async (transaction) => {
    const { report, pattern, facts } = await loadReport(reportId, transaction)
    mayRead(actor, facts, 'report')
    authorize(actor, 'answer-report', facts)
    await ReportMessage.create({ reportId: report.id, authorId: actor.id, authorRole: roleIn(actor, facts), text }, { transaction })
    report.changed('updatedAt', true)
    await report.save({ transaction })
    const author = await User.findByPk(actor.id, { attributes: ['displayName'], transaction })
    await mailEveryoneBut(
      actor.id,
      facts,
      'report-answered',
      {
        patternName: pattern.name,
        authorName: author?.displayName ?? 'Someone',
        kindName: REPORT_KIND_NAMES[report.kind],
        severityName: REPORT_SEVERITY_NAMES[report.severity],
        placeText: placeInWords(report.place),
        excerpt: excerpt(text),
        reportUrl: reportLink(report),
      },
      transaction,
    )
    return (await toViews([report], pattern, transaction))[0]!
  })
}

/** Resolves or reopens a report: the pattern's designer or an admin. */
export async function changeReportState(actor: Actor, reportId: string, state: ReportState): Promise<ReportView> {
  return database().transaction(async (transaction) => {
    const { report, pattern, facts } = await loadReport(reportId, transaction)
    mayRead(actor, facts, 'report')
    authorize(actor, 'change-report-state', facts)
    if (report.state !== state) {
      report.state = state
      await report.save({ transaction })
    }
    return (await toViews([report], pattern, transaction))[0]!
  })
}

/**
 * The patterns whose reports show an upload, with their testers: what lib/authorization.ts's
 * 'read-upload' needs to let their designers and testers see a report photo.
 */
export async function reportPatternsOfPhoto(uploadId: string): Promise<PatternFacts[]> {
  database()
  const links = await ReportPhoto.findAll({ where: { uploadId }, attributes: ['reportId'] })
  if (links.length === 0) return []
  const reports = await Report.findAll({ where: { id: { [Op.in]: links.map((link) => link.reportId) } }, attributes: ['patternId'] })
  const patternIds = [...new Set(reports.map((report) => report.patternId))]
  return Promise.all(patternIds.map(async (id) => (await loadPattern(id)).facts))
}

/** What the reports page needs: the plan's area labels in sewing order (step n is the n-th) and what the person may do. */
export async function reportPlaces(actor: Actor, patternId: string): Promise<{ areas: string[]; map: ReportMap | null; patternName: string; canFile: boolean; canChangeState: boolean }> {
  const { pattern, facts } = await loadPattern(patternId)
  mayRead(actor, facts, 'pattern')
  const plan = currentPlan(pattern)
  return {
    areas: plan ? stepLabels(plan.plan) : [],
    map: plan ? { ring: plan.ring, areas: plan.plan.areas.map((area) => ({ label: area.label, polygon: area.polygon.map((p) => [p[0], p[1]] as [number, number]), point: [area.point[0], area.point[1]] as [number, number] })) } : null,
    patternName: pattern.name,
    canFile: can(actor, 'file-report', facts),
    canChangeState: can(actor, 'change-report-state', facts),
  }
}
