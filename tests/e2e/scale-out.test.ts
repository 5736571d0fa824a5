/**
 * Scale-out: two more instances of the built app (`next start` on two free loopback ports) beside
 * the one scripts/run-tests.ts started, all on the one database, object store and mail server, as
 * N web instances behind a load balancer would be. Nothing that matters lives in a web process:
 *   - a session made on instance A works on instance B, and signing out on B ends it on A;
 *   - rate limits count across instances (they are kept in PostgreSQL);
 *   - a job one instance queues (a message in the mail queue) is sent once, though three
 *     workers (every instance runs one, lib/jobs/worker.ts) compete for it.
 * The instances trust a proxy's X-Forwarded-For (TRUST_PROXY=true, as behind a load balancer), so
 * this test's requests count against a made-up client address of their own, not the other tests'.
 */
import type { ChildProcess } from 'node:child_process'
import { randomInt, randomUUID } from 'node:crypto'
import path from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { freePort, startProcess, stopProcess, waitForHttp } from '@/scripts/processes'
import { caughtMails, firstLink, waitForMail } from '../support/mail'

/** The address people use, which the balancer would answer on; the instances' origin check compares with it. */
const PUBLIC_URL = 'http://wreathwright.test'
const instances: { name: string; url: string; process: ChildProcess }[] = []

beforeAll(async () => {
  for (const name of ['A', 'B']) {
    const port = await freePort()
    const env = {
      ...process.env,
      NODE_ENV: 'production' as const,
      PUBLIC_URL,
      TRUST_PROXY: 'true',
      SESSION_COOKIE_SECURE: 'false',
      PORT: String(port),
    }
    const child = startProcess(path.join('node_modules', '.bin', 'next'), ['start', '--hostname', '127.0.0.1', '--port', String(port)], env, { quiet: true })
    instances.push({ name, url: `http://127.0.0.1:${port}`, process: child })
  }
  await Promise.all(instances.map((instance) => waitForHttp(`${instance.url}/api/health`)))
}, 90_000)

afterAll(async () => {
  await Promise.all(instances.map((instance) => stopProcess(instance.process)))
})

/** A client behind the balancer: its own address (TEST-NET-3, RFC 5737), the public origin. */
const clientAddress = () => `203.0.113.${randomInt(1, 255)}`

async function send(instance: (typeof instances)[number], method: string, route: string, options: { body?: unknown; cookie?: string; from: string }) {
  const headers = new Headers({ origin: PUBLIC_URL, 'x-forwarded-for': options.from })
  if (options.body !== undefined) headers.set('content-type', 'application/json')
  if (options.cookie) headers.set('cookie', options.cookie)
  const response = await fetch(`${instance.url}${route}`, { method, headers, body: options.body === undefined ? undefined : JSON.stringify(options.body) })
  const text = await response.text()
  // Tests read any field of an answer and check it with expect().
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  return { status: response.status, headers: response.headers, json: (text ? JSON.parse(text) : null) as Record<string, any> | null }
}

describe('two app instances on one database', () => {
  it('share sessions, rate limits and the job queue', async () => {
    const [a, b] = [instances[0]!, instances[1]!]
    const from = clientAddress()
    const email = `scale-out-${randomUUID().slice(0, 8)}@example.test`
    const password = 'several-hands-one-quilt'

    // Sign up on A: the verification message is queued in A's transaction.
    const signUp = await send(a, 'POST', '/api/auth/sign-up', { from, body: { email, password, displayName: 'Marigold Reed' } })
    expect(signUp.status).toBe(202)
    const mail = await waitForMail({ to: email, kind: 'verify-email' }, 20_000)
    // Three workers poll the queue every half second: give a second send every chance to happen.
    await new Promise((resolve) => setTimeout(resolve, 3_000))
    expect((await caughtMails()).filter((caught) => caught.to.includes(email))).toHaveLength(1)

    // The link's token works on B.
    const token = new URLSearchParams(new URL(firstLink(mail, '/verify-email')).hash.slice(1)).get('token')
    expect(token).toBeTruthy()
    expect((await send(b, 'POST', '/api/auth/verify-email', { from, body: { token } })).status).toBe(200)

    // A session made on A is a session on B.
    const signIn = await send(a, 'POST', '/api/auth/sign-in', { from, body: { email, password } })
    expect(signIn.status).toBe(200)
    const cookie = signIn.headers.get('set-cookie')!.split(';')[0]!
    const onB = await send(b, 'GET', '/api/account', { from, cookie })
    expect(onB.status).toBe(200)
    expect(onB.json?.account.email).toBe(email)
    expect((await send(a, 'GET', '/api/account', { from, cookie })).status).toBe(200)

    // Signing out on B ends it on A too, as soon as A hears of the change: A kept the session it
    // read, and drops it when the row change notice arrives (README, "Running on more than one
    // machine": about a millisecond; a second is the most this test waits).
    expect((await send(b, 'POST', '/api/auth/sign-out', { from, cookie })).status).toBe(200)
    await expect.poll(async () => (await send(a, 'GET', '/api/account', { from, cookie })).status, { timeout: 1_000, interval: 10 }).toBe(401)

    // Sign-in attempts for one account from one address are counted across both instances:
    // 10 in 15 minutes (lib/rate-limits.ts signInPerAccountAndAddress), then 429 on either.
    const guesser = clientAddress() === from ? '203.0.113.0' : clientAddress()
    for (let attempt = 0; attempt < 10; attempt += 1) {
      const answer = await send(attempt % 2 === 0 ? a : b, 'POST', '/api/auth/sign-in', { from: guesser, body: { email, password: `wrong-guess-${attempt}` } })
      expect(answer.status, `attempt ${attempt + 1}`).toBe(401)
    }
    for (const instance of [a, b]) {
      const refused = await send(instance, 'POST', '/api/auth/sign-in', { from: guesser, body: { email, password: 'wrong-guess-again' } })
      expect(refused.status, instance.name).toBe(429)
      expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0)
    }
  })
})
