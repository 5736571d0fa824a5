import { verifyRequestOrigin } from 'lucia'
import { z } from 'zod'
import { checkSession, sessionIdFromRequest, type CurrentUser } from '@/lib/auth/session'
import { ConflictError, ServiceError, StoredDesignError, ValidationError, type FieldIssue } from '@/lib/errors'

/**
 * The one wrapper every API route handler goes through. It
 * - refuses state-changing requests whose Origin is not this site (cross-site request forgery);
 * - finds the signed-in person from the session cookie and refreshes or clears that cookie;
 * - turns service errors into JSON with the right status, validation errors with field paths.
 */

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS'])

export interface RouteContext<Params> {
  readonly request: Request
  readonly user: CurrentUser | null
  readonly sessionId: string | null
  readonly params: Params
}

type Handler<Params> = (context: RouteContext<Params>) => Promise<Response>

/** True when the request comes from a page of this site (Origin matches Host). */
export function isSameOrigin(request: Request): boolean {
  const origin = request.headers.get('origin')
  const host = request.headers.get('x-forwarded-host') ?? request.headers.get('host')
  if (!origin || !host) return false
  return verifyRequestOrigin(origin, [host])
}

export function jsonError(status: number, message: string, extra: Record<string, unknown> = {}): Response {
  return Response.json({ error: { message, ...extra } }, { status })
}

/**
 * Wraps a route handler, e.g.
 * `export const GET = route(async ({ user }) => Response.json(await listPatterns(user)))`.
 */
export function route<Params = Record<string, never>>(handler: Handler<Params>) {
  return async (request: Request, context?: { params?: Promise<Params> }): Promise<Response> => {
    if (!SAFE_METHODS.has(request.method) && !isSameOrigin(request)) {
      return jsonError(403, 'This request did not come from a Wreathwright page.')
    }
    let response: Response
    let setCookie: string | null = null
    try {
      const sessionId = sessionIdFromRequest(request)
      const check = await checkSession(sessionId)
      setCookie = check.setCookie
      const params = ((await context?.params) ?? {}) as Params
      response = await handler({ request, user: check.user, sessionId: check.session?.id ?? null, params })
    } catch (error) {
      response = errorResponse(error)
    }
    if (setCookie && !response.headers.has('set-cookie')) response.headers.append('set-cookie', setCookie)
    return response
  }
}

function errorResponse(error: unknown): Response {
  if (error instanceof ValidationError) return jsonError(422, error.message, { issues: error.issues })
  if (error instanceof ConflictError) return jsonError(409, error.message, error.details)
  if (error instanceof StoredDesignError) return jsonError(error.status, error.message, error.details)
  if (error instanceof ServiceError) return jsonError(error.status, error.message)
  console.error(error)
  return jsonError(500, 'Something went wrong on our side; nothing was changed.')
}

/** Turns zod's issues into field paths such as `design.ring.outerRadius`. */
export function fieldIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => ({ path: issue.path.map(String).join('.') || '(body)', message: issue.message }))
}

/**
 * Reads a JSON body and checks it against a schema: malformed JSON is a 400, a body that does not
 * fit the schema a 422 naming each field.
 */
export async function parseBody<Schema extends z.ZodType>(request: Request, schema: Schema): Promise<z.output<Schema>> {
  let body: unknown
  try {
    body = await request.json()
  } catch {
    throw new ServiceError('The request body is not valid JSON.', 400)
  }
  const parsed = schema.safeParse(body)
  if (!parsed.success) throw new ValidationError(fieldIssues(parsed.error))
  return parsed.data
}
