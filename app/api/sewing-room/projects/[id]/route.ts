import { BODY_LIMITS, route } from '@/lib/http'
import { keptJsonResponse } from '@/lib/kept-json'
import { deleteProject, loadProject, projectAnswer } from '@/lib/services/sewing-room'

/**
 * `GET /api/sewing-room/projects/:id` → the project's sewing plan as a PlanAnswer (each distinct
 * instruction once; lib/sewing-room/plan-answer.ts reads it back whole): for the project's owner
 * while they hold its licence or invitation; anyone else: 404. Kept by this process while
 * unchanged (lib/row-changes.ts); with an ETag, and 304 without a body to an If-None-Match naming
 * it (lib/kept-json.ts).
 */
export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => projectAnswer(user, params.id) },
  async ({ request, resource }) => keptJsonResponse(request, resource),
)

/** `DELETE /api/sewing-room/projects/:id` → `{ deleted: true }`: the owner deletes the project and its progress. */
export const DELETE = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => loadProject(user, params.id, 'sewing-room:delete') },
  async ({ resource }) => {
    await deleteProject(resource)
    return Response.json({ deleted: true })
  },
)
