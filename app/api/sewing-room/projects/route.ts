import { authorize } from '@/lib/authorization'
import { BODY_LIMITS, route } from '@/lib/http'
import { newProjectSchema } from '@/lib/schemas/sewing-room'
import { listProjects, startProject } from '@/lib/services/sewing-room'

/**
 * `GET /api/sewing-room/projects` → `{ projects: [ { id, name, patternId, patternName, designerName,
 * colorway: { index, name }, diameterIn, paper, licenceId, invitationId, done, total, nextStepLabel,
 * createdAt, updatedAt } ] }`: the person's own open projects, most recently worked on first.
 */
export const GET = route(
  { bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user }) => authorize(user, 'sewing-room:list') },
  async ({ user }) => Response.json({ projects: await listProjects(user) }),
)

/**
 * `POST /api/sewing-room/projects { licenceId | invitationId, colorway, diameterIn, paper, name? }` →
 * 201 `{ project }`: starts a project under the person's live licence or accepted invitation
 * (anyone else's, revoked or withdrawn: 404; a colourway the pattern lacks: 422 `colorway`).
 */
export const POST = route(
  { bodyLimit: BODY_LIMITS.form, session: 'required', permit: ({ user }) => authorize(user, 'sewing-room:list'), body: newProjectSchema },
  async ({ user, body }) => Response.json({ project: await startProject(user, body) }, { status: 201 }),
)
