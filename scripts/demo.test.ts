/**
 * `npm run demo` refuses a taken port with one plain line and exit code 2, before it starts
 * anything. The ports are held here by a plain TCP server, as another program would hold them.
 */
import { spawn } from 'node:child_process'
import net from 'node:net'
import path from 'node:path'
import { afterEach, describe, expect, it } from 'vitest'
import { freePort } from './processes'

const projectRoot = path.resolve(import.meta.dirname, '..')
const servers: net.Server[] = []

/** Listens on a free loopback port, as another program would, and returns the port. */
async function occupyPort(): Promise<number> {
  const server = net.createServer((socket) => socket.destroy())
  servers.push(server)
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve))
  return (server.address() as net.AddressInfo).port
}

afterEach(async () => {
  await Promise.all(servers.splice(0).map((server) => new Promise((resolve) => server.close(resolve))))
})

function runDemo(env: Record<string, string>): Promise<{ code: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/demo.ts'], { cwd: projectRoot, env: { ...process.env, ...env } })
    let stdout = ''
    let stderr = ''
    child.stdout.on('data', (chunk) => (stdout += chunk))
    child.stderr.on('data', (chunk) => (stderr += chunk))
    child.once('exit', (code) => resolve({ code, stdout, stderr }))
  })
}

describe('npm run demo on a taken port', () => {
  it('says in one line that the app port is taken and exits 2', async () => {
    const appPort = await occupyPort()
    const result = await runDemo({ PORT: String(appPort), WREATHWRIGHT_DB_PORT: String(await freePort()) })
    expect(result.code).toBe(2)
    expect(result.stderr.trim().split('\n')).toEqual([`demo: something already listens on 127.0.0.1:${appPort}; stop it or set PORT`])
    expect(result.stdout).toBe('')
  }, 30_000)

  it('says in one line that the database port is taken by something else and exits 2', async () => {
    const databasePort = await occupyPort()
    const result = await runDemo({ PORT: String(await freePort()), WREATHWRIGHT_DB_PORT: String(databasePort) })
    expect(result.code).toBe(2)
    expect(result.stderr.trim().split('\n')).toEqual([
      `demo: something else already listens on 127.0.0.1:${databasePort}, where the demo's PostgreSQL goes; stop it or set WREATHWRIGHT_DB_PORT`,
    ])
    expect(result.stdout).toBe('')
  }, 30_000)

  it("says in one line that the object store's port is taken and exits 2, before starting PostgreSQL", async () => {
    const objectStorePort = await occupyPort()
    const databasePort = await freePort()
    const result = await runDemo({ PORT: String(await freePort()), WREATHWRIGHT_DB_PORT: String(databasePort), WREATHWRIGHT_S3_PORT: String(objectStorePort) })
    expect(result.code).toBe(2)
    expect(result.stderr.trim().split('\n')).toEqual([
      `demo: something already listens on 127.0.0.1:${objectStorePort}, where the demo's object store goes; stop it or set WREATHWRIGHT_S3_PORT`,
    ])
    expect(result.stdout).toBe('')
  }, 30_000)

  it.each([
    ['WREATHWRIGHT_MAIL_PORT', "where the demo's mail catcher shows its messages"],
    ['WREATHWRIGHT_SMTP_PORT', "where the demo's mail catcher takes messages"],
    ['WREATHWRIGHT_PAYMENTS_PORT', "where the demo's payment fake goes"],
  ])("says in one line that the mail catcher's or the payment fake's %s is taken and exits 2, before starting PostgreSQL", async (setting, where) => {
    const takenPort = await occupyPort()
    const free = {
      WREATHWRIGHT_S3_PORT: String(await freePort()),
      WREATHWRIGHT_MAIL_PORT: String(await freePort()),
      WREATHWRIGHT_SMTP_PORT: String(await freePort()),
      WREATHWRIGHT_PAYMENTS_PORT: String(await freePort()),
    }
    const result = await runDemo({ PORT: String(await freePort()), WREATHWRIGHT_DB_PORT: String(await freePort()), ...free, [setting]: String(takenPort) })
    expect(result.code).toBe(2)
    expect(result.stderr.trim().split('\n')).toEqual([`demo: something already listens on 127.0.0.1:${takenPort}, ${where}; stop it or set ${setting}`])
    expect(result.stdout).toBe('')
  }, 30_000)
})
