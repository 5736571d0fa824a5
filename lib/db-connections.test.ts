import { afterEach, describe, expect, it, vi } from 'vitest'
import { createSequelize } from './db'

/** The pg Client class Sequelize makes its connections with. */
function clientClassOf(sequelize: ReturnType<typeof createSequelize>) {
  return (sequelize as unknown as { connectionManager: { lib: { Client: new (config: object) => import('pg').Client } } }).connectionManager.lib.Client
}

describe("the pool's connections and their 'error' event (PostgreSQL restarting under the app)", () => {
  afterEach(() => vi.restoreAllMocks())

  it('listen from the moment they are made, so a 57P01 read before Sequelize adds its listener is not an uncaught exception', async () => {
    const logged = vi.spyOn(console, 'error').mockImplementation(() => {})
    const sequelize = createSequelize('postgres://wreathwright@127.0.0.1:1/none')
    const client = new (clientClassOf(sequelize))({ host: '127.0.0.1', port: 1 })
    expect(client.listenerCount('error')).toBe(1)
    const restart = Object.assign(new Error('terminating connection due to administrator command'), { code: '57P01' })
    // Without a listener, emit('error') throws the error itself (what ended up as uncaught).
    expect(() => client.emit('error', restart)).not.toThrow()
    // Logged, one line naming the code, and marked so the pool's validate drops it.
    expect(logged).toHaveBeenCalledTimes(1)
    expect(String(logged.mock.calls[0]![0])).toMatch(/^database: a connection broke \(57P01\): terminating connection due to administrator command/)
    // The socket's end that follows is the same failure: not a second line.
    expect(() => client.emit('error', new Error('Connection terminated unexpectedly'))).not.toThrow()
    expect(logged).toHaveBeenCalledTimes(1)
    const manager = (sequelize as unknown as { connectionManager: { validate(connection: unknown): boolean } }).connectionManager
    expect(manager.validate(client)).toBe(false)
    expect(manager.validate(new (clientClassOf(sequelize))({}))).toBe(true)
    await sequelize.close()
  })

  it('keeps the rest of pg that Sequelize reads (types) beside the client', () => {
    const sequelize = createSequelize('postgres://wreathwright@127.0.0.1:1/none')
    const lib = (sequelize as unknown as { connectionManager: { lib: { types: { getTypeParser: unknown } } } }).connectionManager.lib
    expect(typeof lib.types.getTypeParser).toBe('function')
  })
})
