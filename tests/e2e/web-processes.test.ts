/**
 * scripts/serve.ts: the built app as several web processes sharing one port (`npm start`; README,
 * "Running on more than one machine"). Two processes start and both listen; every request is
 * answered; a process that dies is started again while the other keeps answering; SIGTERM stops
 * them all; when they cannot start (the port taken) it stops with exit code 1. A WEB_PROCESSES that is not a number of processes is one line on stderr and exit 2.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process'
import { once } from 'node:events'
import net from 'node:net'
import path from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { freePort, stopProcess } from '@/scripts/processes'

const tsx = path.join('node_modules', '.bin', 'tsx')
let server: ChildProcess | undefined
afterAll(() => stopProcess(server))

/** The pids serve.ts reports as listening, in order, as they come. */
function listeningPids(child: ChildProcess): number[] {
  const pids: number[] = []
  let pending = ''
  child.stdout!.on('data', (chunk: Buffer) => {
    pending += chunk.toString('utf8')
    const lines = pending.split('\n')
    pending = lines.pop()!
    for (const line of lines) {
      const match = /^serve: web process (\d+) listening on /.exec(line)
      if (match) pids.push(Number(match[1]))
    }
  })
  return pids
}

async function until(condition: () => boolean, what: string, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs
  while (!condition()) {
    if (Date.now() > deadline) throw new Error(`waited ${timeoutMs / 1000} s for ${what}`)
    await new Promise((resolve) => setTimeout(resolve, 100))
  }
}

describe('the app as several web processes on one port', () => {
  it('starts them, starts one again when it dies, and stops them all', async () => {
    const port = await freePort()
    const base = `http://127.0.0.1:${port}`
    server = spawn(tsx, ['scripts/serve.ts', '--hostname', '127.0.0.1', '--port', String(port)], {
      env: { ...process.env, NODE_ENV: 'production', WEB_PROCESSES: '2', PUBLIC_URL: base, SESSION_COOKIE_SECURE: 'false', MAIL_WORKER: 'off', PAYMENTS_WORKER: 'off' },
      detached: true,
      stdio: ['ignore', 'pipe', 'inherit'],
    })
    const pids = listeningPids(server)
    await until(() => pids.length === 2, 'two web processes to listen')
    expect(new Set(pids).size).toBe(2)

    // Many requests at once, on connections of their own: every one answered.
    const answers = await Promise.all(Array.from({ length: 40 }, () => fetch(`${base}/api/health/bare`, { headers: { connection: 'close' } })))
    expect(answers.map((answer) => answer.status)).toEqual(Array(40).fill(200))

    // One dies: the other keeps answering, and a new one takes its place.
    process.kill(pids[0]!, 'SIGKILL')
    // Past the moment the first process learns of the death, before the replacement starts (1 s).
    await new Promise((resolve) => setTimeout(resolve, 300))
    expect((await fetch(`${base}/api/health`, { headers: { connection: 'close' } })).status).toBe(200)
    await until(() => pids.length === 3, 'the dead web process to be started again')
    expect(pids.slice(0, 2)).not.toContain(pids[2])
    expect((await fetch(`${base}/api/health`, { headers: { connection: 'close' } })).status).toBe(200)

    // SIGTERM to the group (as stopProcess and a service manager send it) ends every process.
    const stopped = stopProcess(server)
    await stopped
    expect(server.exitCode !== null || server.signalCode !== null).toBe(true)
    for (const pid of pids.slice(1)) expect(() => process.kill(pid, 0)).toThrow()
    server = undefined
  }, 120_000)

  it('stops with exit code 1 when its processes cannot start (the port taken)', async () => {
    const port = await freePort()
    const taken = net.createServer().listen(port, '127.0.0.1')
    await once(taken, 'listening')
    try {
      const result = spawnSync(tsx, ['scripts/serve.ts', '--hostname', '127.0.0.1', '--port', String(port)], {
        encoding: 'utf8',
        env: { ...process.env, NODE_ENV: 'production', WEB_PROCESSES: '2' },
        timeout: 60_000,
      })
      expect(result.status).toBe(1)
      expect(result.stderr).toContain('serve: it ended before it could answer; stopping')
    } finally {
      taken.close()
    }
  }, 90_000)

  for (const wrong of ['0', 'two', '1.5', '65']) {
    it(`refuses WEB_PROCESSES=${wrong} in one line with exit code 2`, () => {
      const result = spawnSync(tsx, ['scripts/serve.ts'], { encoding: 'utf8', env: { ...process.env, WEB_PROCESSES: wrong } })
      expect(result.status).toBe(2)
      expect(result.stderr.trim().split('\n')).toEqual([`serve: WEB_PROCESSES must be a whole number from 1 to 64 (got ${wrong})`])
    })
  }
})
