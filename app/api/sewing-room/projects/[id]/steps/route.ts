import { BODY_LIMITS, route } from '@/lib/http'
import { stepUpdateSchema } from '@/lib/schemas/sewing-room'
import { loadProject, updateStep } from '@/lib/services/sewing-room'

/**
 * `PATCH /api/sewing-room/projects/:id/steps { stepId, done?, note? }` → `{ step: { id, done, note,
 * updatedAt } }`: one step per call, so ticks from two devices merge by step (the same step: the
 * last write wins). A step not in the checklist: 422 `stepId`. Only the owner holding the grant.
 */
export const PATCH = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.form, session: 'required', permit: ({ user, params }) => loadProject(user, params.id, 'sewing-room:update'), body: stepUpdateSchema },
  async ({ resource, body }) => Response.json({ step: await updateStep(resource, body) }),
)
