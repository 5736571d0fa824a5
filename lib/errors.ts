/**
 * Failures a service reports to its caller. lib/http.ts turns each into its HTTP status;
 * anything else is a programming error and becomes a 500 without details.
 */
export class ServiceError extends Error {
  constructor(
    message: string,
    readonly status: number,
  ) {
    super(message)
    this.name = new.target.name
  }
}

/** The request needs a signed-in person. */
export class UnauthenticatedError extends ServiceError {
  constructor(message = 'Sign in first.') {
    super(message, 401)
  }
}

/** The signed-in person may not do this. */
export class ForbiddenError extends ServiceError {
  constructor(message = 'You are not allowed to do that.') {
    super(message, 403)
  }
}

export class NotFoundError extends ServiceError {
  constructor(message = 'Not found.') {
    super(message, 404)
  }
}

/** The thing changed since the caller last saw it (e.g. a stale pattern revision). */
export class ConflictError extends ServiceError {
  constructor(
    message: string,
    readonly details: Record<string, unknown> = {},
  ) {
    super(message, 409)
  }
}

/**
 * A pattern's stored design no longer reads as a design (a hand edit of the database, or a format
 * change without a migration). Names the pattern and the fields, so it can be found and repaired;
 * the answer is deliberate JSON, never a stack trace. 500: the fault is the server's data, not
 * the request.
 */
export class StoredDesignError extends ServiceError {
  readonly details: { readonly patternId: string; readonly patternName: string; readonly issues: readonly FieldIssue[] }

  constructor(pattern: { readonly id: string; readonly name: string }, issues: readonly FieldIssue[]) {
    const first = issues[0]
    super(
      `The saved design of the pattern “${pattern.name}” (${pattern.id}) can no longer be read` +
        (first ? ` (design.${first.path}: ${first.message}).` : '.') +
        ' Nothing was changed; save a valid design over it to repair it.',
      500,
    )
    this.details = { patternId: pattern.id, patternName: pattern.name, issues }
  }
}

export interface FieldIssue {
  /** Dotted path of the offending field, e.g. `design.ring.outerRadius`. */
  readonly path: string
  readonly message: string
}

/** The input is well-formed JSON but not acceptable; names every offending field. */
export class ValidationError extends ServiceError {
  constructor(
    readonly issues: readonly FieldIssue[],
    message = `Please check ${issues.map((issue) => issue.path).join(', ')}.`,
  ) {
    super(message, 422)
  }
}

/** A rate limit of lib/rate-limits.ts was reached: 429, with `Retry-After` in whole seconds. */
export class TooManyRequestsError extends ServiceError {
  constructor(
    message: string,
    readonly retryAfterSeconds: number,
  ) {
    super(message, 429)
  }
}
