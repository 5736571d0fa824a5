/**
 * The sewing room's requests, from the browser. Inputs go through the server's own schemas
 * (lib/schemas/sewing-room.ts) before they leave, so the page and the route refuse the same things.
 */
import { z } from 'zod'
import { apiFetch, apiFetchTagged, type Tagged } from '@/lib/api-client'
import {
  newProjectSchema,
  stepUpdateSchema,
  type NewProjectInput,
  type PlanAnswer,
  type ProjectDetail,
  type ProjectSummary,
  type StepProgress,
  type StepUpdateInput,
} from '@/lib/schemas/sewing-room'
import { readPlan } from '@/lib/sewing-room/plan-answer'

const PROJECTS = '/api/sewing-room/projects'

/** The quilter's projects, most recently worked on first. */
export async function fetchProjects(): Promise<ProjectSummary[]> {
  return (await apiFetch<{ projects: ProjectSummary[] }>(PROJECTS, { cache: 'no-store' })).projects
}

/** A plan's answer read into the page's shape (lib/sewing-room/plan-answer.ts); one it cannot read is malformed. */
const planAnswerSchema = z
  .custom<PlanAnswer>((value) => typeof value === 'object' && value !== null && Array.isArray((value as PlanAnswer).words) && Array.isArray((value as PlanAnswer).steps))
  .transform((answer, context) => {
    try {
      return readPlan(answer)
    } catch (error) {
      context.addIssue({ code: 'custom', message: error instanceof Error ? error.message : String(error) })
      return z.NEVER
    }
  })

/**
 * One project with its checklist, progress and picture; given the answer already `known`, the
 * server sends the body again only if something changed (304 otherwise, and `known` comes back).
 */
export function fetchProject(projectId: string, known: Tagged<ProjectDetail> | null = null): Promise<Tagged<ProjectDetail>> {
  return apiFetchTagged(`${PROJECTS}/${encodeURIComponent(projectId)}`, known, { cache: 'no-store', schema: planAnswerSchema })
}

/** Starts a project (throws the schema's ZodError before sending anything it would refuse). */
export async function startProject(input: NewProjectInput): Promise<ProjectSummary> {
  const body = newProjectSchema.parse(input)
  return (await apiFetch<{ project: ProjectSummary }>(PROJECTS, { method: 'POST', json: body })).project
}

/** One step's change: its own request, so it never touches another step. */
export async function patchStep(projectId: string, update: StepUpdateInput): Promise<StepProgress> {
  const body = stepUpdateSchema.parse(update)
  return (await apiFetch<{ step: StepProgress }>(`${PROJECTS}/${encodeURIComponent(projectId)}/steps`, { method: 'PATCH', json: body })).step
}
