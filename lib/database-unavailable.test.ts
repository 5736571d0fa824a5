import pg from 'pg'
import {
  ConnectionAcquireTimeoutError,
  ConnectionRefusedError,
  DatabaseError,
  ForeignKeyConstraintError,
  HostNotFoundError,
  UniqueConstraintError,
} from 'sequelize'
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { DATABASE_RETRY_AFTER_SECONDS, isDatabaseUnavailable } from './database-unavailable'
import { BODY_LIMITS, route } from './http'

/** An error as node-postgres reports one the server sent (pg-protocol's DatabaseError). */
function serverError(code: string, message: string): Error {
  const error = new pg.DatabaseError(message, message.length, 'error')
  error.code = code
  return error
}

/** A socket error as Node reports it. */
function socketError(code: string): Error {
  return Object.assign(new Error(`connect ${code} 127.0.0.1:5432`), { code })
}

/** Sequelize's wrapper of a driver error met by a statement. */
function wrapped(original: Error): DatabaseError {
  return new DatabaseError(Object.assign(original, { sql: 'SELECT 1', parameters: {} }))
}

describe('isDatabaseUnavailable', () => {
  it('counts Sequelize connection errors: refused, host not found, no connection free in the pool', () => {
    expect(isDatabaseUnavailable(new ConnectionRefusedError(socketError('ECONNREFUSED')))).toBe(true)
    expect(isDatabaseUnavailable(new HostNotFoundError(socketError('ENOTFOUND')))).toBe(true)
    expect(isDatabaseUnavailable(new ConnectionAcquireTimeoutError(new Error('Operation timeout')))).toBe(true)
  })

  it('counts the server ending sessions, starting up, or full, raw or wrapped by Sequelize', () => {
    const restart = serverError('57P01', 'terminating connection due to administrator command')
    expect(isDatabaseUnavailable(restart)).toBe(true)
    expect(isDatabaseUnavailable(wrapped(serverError('57P01', 'terminating connection due to administrator command')))).toBe(true)
    expect(isDatabaseUnavailable(wrapped(serverError('57P03', 'the database system is starting up')))).toBe(true)
    expect(isDatabaseUnavailable(wrapped(serverError('53300', 'sorry, too many clients already')))).toBe(true)
    expect(isDatabaseUnavailable(wrapped(serverError('08006', 'connection failure')))).toBe(true)
  })

  it('counts a connection lost under a statement, and a socket error Sequelize names as the cause', () => {
    expect(isDatabaseUnavailable(wrapped(new Error('Connection terminated unexpectedly')))).toBe(true)
    expect(isDatabaseUnavailable(new Error('Client has encountered a connection error and is not queryable'))).toBe(true)
    expect(isDatabaseUnavailable(wrapped(socketError('ECONNRESET')))).toBe(true)
    // An AggregateError (one try per address) under a chain of causes.
    const tries = new AggregateError([socketError('ECONNREFUSED'), socketError('ECONNREFUSED')], 'connect failed')
    expect(isDatabaseUnavailable(new Error('could not queue', { cause: new DatabaseError(Object.assign(tries, { sql: 'SELECT 1', parameters: {} })) }))).toBe(true)
  })

  it('leaves everything else to be a 500 (or its own status): real faults stay visible', () => {
    expect(isDatabaseUnavailable(new Error('Cannot read properties of undefined'))).toBe(false)
    expect(isDatabaseUnavailable(wrapped(serverError('42P01', 'relation "nope" does not exist')))).toBe(false)
    expect(isDatabaseUnavailable(wrapped(serverError('57014', 'canceling statement due to statement timeout')))).toBe(false)
    expect(isDatabaseUnavailable(new UniqueConstraintError({ message: 'Validation error' }))).toBe(false)
    expect(isDatabaseUnavailable(new ForeignKeyConstraintError({ message: 'fk' }))).toBe(false)
    // A refused socket on its own may be the object store's, not the database's.
    expect(isDatabaseUnavailable(socketError('ECONNREFUSED'))).toBe(false)
    expect(isDatabaseUnavailable(null)).toBe(false)
    expect(isDatabaseUnavailable('57P01')).toBe(false)
    // A cause that points at itself ends the walk.
    const loop: Error & { cause?: unknown } = new Error('loop')
    loop.cause = loop
    expect(isDatabaseUnavailable(loop)).toBe(false)
  })
})

describe('route() when the database cannot be reached', () => {
  // The session step reads the cookie's name from the settings; no database is opened without a cookie.
  beforeEach(() => vi.stubEnv('DATABASE_URL', 'postgres://127.0.0.1:1/none'))
  afterEach(() => {
    vi.restoreAllMocks()
    vi.unstubAllEnvs()
  })

  const failingWith = (error: unknown) =>
    route({ bodyLimit: BODY_LIMITS.none, session: 'optional' }, async () => {
      throw error
    })

  it('answers 503 with Retry-After and a plain JSON message, and logs one line', async () => {
    const logged = vi.spyOn(console, 'error').mockImplementation(() => {})
    const response = await failingWith(new ConnectionRefusedError(socketError('ECONNREFUSED')))(new Request('http://127.0.0.1:3000/api/x'))
    expect(response.status).toBe(503)
    expect(response.headers.get('retry-after')).toBe(String(DATABASE_RETRY_AFTER_SECONDS))
    expect(await response.json()).toEqual({
      error: { message: `The database could not be reached, so nothing was changed; try again in ${DATABASE_RETRY_AFTER_SECONDS} seconds.`, retryAfterSeconds: DATABASE_RETRY_AFTER_SECONDS },
    })
    expect(logged).toHaveBeenCalledTimes(1)
    expect(String(logged.mock.calls[0]![0])).toMatch(/database unreachable, answered 503: .*ECONNREFUSED/)
  })

  it('still answers any other failure with a 500 and logs it whole', async () => {
    const logged = vi.spyOn(console, 'error').mockImplementation(() => {})
    const bug = new TypeError('Cannot read properties of undefined')
    const response = await failingWith(bug)(new Request('http://127.0.0.1:3000/api/x'))
    expect(response.status).toBe(500)
    expect(response.headers.get('retry-after')).toBeNull()
    expect(logged).toHaveBeenCalledWith(bug)
  })
})
