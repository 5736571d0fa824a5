import { spawn, type ChildProcess } from 'node:child_process'
import { randomUUID } from 'node:crypto'
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { GET as downloadRoute } from '@/app/api/booklets/[id]/download/route'
import { GET as statusRoute } from '@/app/api/booklets/[id]/route'
import { POST as requestRoute } from '@/app/api/licences/[id]/booklets/route'
import { linkSecret, signDownloadToken } from '@/lib/booklets/download-token'
import { openPdf, pageText } from '@/lib/booklet/test-support/read-pdf'
import { bookletSettings } from '@/lib/env'
import { BookletBuild, Licence, Order } from '@/models'
import { hollyberryWreath } from '@/scripts/demo-wreath'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { TEST_ORIGIN, call } from '../support/requests'

/**
 * Buyers' booklets end to end below the browser: the routes called in this process, the builds
 * done by a booklet worker this file starts as a child process (scripts/booklet-worker.ts), so the
 * test knows which process built each (its pid is in `built_by`) and that it is not this one.
 * The test runner starts a worker only for the end-to-end run, so none competes for these jobs.
 */

let worker: ChildProcess | undefined
let workerPid = 0

beforeAll(async () => {
  worker = spawn('npx', ['tsx', '--conditions=react-server', 'scripts/booklet-worker.ts'], {
    env: { ...process.env, BOOKLET_POLL_SECONDS: '0.5', BOOKLET_WORKER_CONCURRENCY: '2' },
    detached: true,
    stdio: ['ignore', 'pipe', 'inherit'],
  })
  workerPid = await new Promise<number>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('the booklet worker did not start within 30 s')), 30_000)
    let seen = ''
    worker!.stdout!.on('data', (chunk: Buffer) => {
      seen += chunk.toString()
      const ready = /booklet-worker: ready \(pid (\d+)/.exec(seen)
      if (ready) {
        clearTimeout(timer)
        resolve(Number(ready[1]))
      }
    })
    worker!.once('exit', (code) => reject(new Error(`the booklet worker exited (${code})`)))
  })
}, 60_000)

afterAll(async () => {
  if (worker?.pid && worker.exitCode === null) {
    const exited = new Promise((resolve) => worker!.once('exit', resolve))
    process.kill(-worker.pid, 'SIGTERM')
    await exited
  }
  await closeDatabase()
})

beforeEach(freshDatabase)

/** A published wreath, a buyer holding a licence to it, another quilter, and its designer. */
async function scene() {
  const designer = await createUser({ roles: ['quilter', 'designer'], displayName: 'Marta Lindqvist' })
  const pattern = await createPatternRow(designer, { name: 'Hollyberry Wreath', state: 'published', design: hollyberryWreath })
  await pattern.update({ priceCents: 1200, currency: 'GBP' })
  const buyer = await createUser({ displayName: 'Elsie Varga' })
  const other = await createUser({ displayName: 'Nora Quill' })
  const order = await Order.create({ id: randomUUID(), buyerId: buyer.id, patternId: pattern.id, amountCents: 1200, currency: 'GBP', checkoutSessionId: `cs_test_${randomUUID()}`, state: 'paid' })
  const licence = await Licence.create({ userId: buyer.id, patternId: pattern.id, orderId: order.id })
  await licence.reload()
  return { designer, pattern, buyer, other, licence, cookies: { buyer: await sessionCookieFor(buyer), other: await sessionCookieFor(other), designer: await sessionCookieFor(designer) } }
}

const ask = (licenceId: string, cookie: string | undefined, body: unknown) => call(requestRoute, { method: 'POST', cookie, params: { id: licenceId }, body })
const statusOf = (buildId: string, cookie: string | undefined) => call(statusRoute, { cookie, params: { id: buildId } })

/** Polls the status route until the build is ready (or failed), as the library page does. */
async function waitUntilBuilt(buildId: string, cookie: string) {
  const deadline = Date.now() + 45_000
  for (;;) {
    const answer = await statusOf(buildId, cookie)
    if (answer.json?.state === 'ready' || answer.json?.state === 'failed') return answer.json!
    if (Date.now() > deadline) throw new Error(`build ${buildId} still ${answer.json?.state} after 45 s`)
    await new Promise((resolve) => setTimeout(resolve, 250))
  }
}

/** Calls the download route with a link the status gave (a path with its query). */
async function download(url: string, cookie: string | undefined) {
  const request = new Request(`${TEST_ORIGIN}${url}`, { headers: cookie ? { cookie } : {} })
  const id = url.split('/')[3]!
  const response = await downloadRoute(request, { params: Promise.resolve({ id }) })
  return { status: response.status, headers: response.headers, bytes: new Uint8Array(await response.arrayBuffer()) }
}

describe("a buyer's booklet", () => {
  it('is built by the worker process, with the name and licence number at the foot of every page, and downloads only for its holder', async () => {
    const { buyer, licence, cookies } = await scene()
    const asked = await ask(licence.id, cookies.buyer, { paper: 'a4', orientation: 'portrait', colorway: hollyberryWreath.colorways![1]!.name, diameterIn: 20 })
    expect(asked.status).toBe(202)
    expect(asked.json).toMatchObject({ id: expect.any(String), state: 'queued' })
    const done = await waitUntilBuilt(asked.json!.id, cookies.buyer)
    expect(done).toMatchObject({ state: 'ready', url: expect.stringMatching(/^\/api\/booklets\/[0-9a-f-]{36}\/download\?token=/) })
    const row = await BookletBuild.findByPk(asked.json!.id)
    // The answers name no object key: the store is reached only through the download route.
    expect(row!.objectKey).toMatch(/booklets\/[0-9a-f-]{36}\.pdf$/)
    expect(JSON.stringify(done)).not.toContain(row!.objectKey!)
    expect(JSON.stringify(asked.json)).not.toContain('.pdf')
    expect(row!.builtBy).toMatch(new RegExp(`:${workerPid}$`))
    expect(workerPid).not.toBe(process.pid)
    expect(row!.userId).toBe(buyer.id)

    const file = await download(done.url, cookies.buyer)
    expect(file.status).toBe(200)
    expect(file.headers.get('content-type')).toBe('application/pdf')
    expect(file.headers.get('content-disposition')).toBe('attachment; filename="hollyberry-wreath-a4.pdf"')
    const pdf = await openPdf(file.bytes)
    expect(pdf.numPages).toBe(row!.pageCount)
    expect(pdf.numPages).toBeGreaterThan(3)
    for (let page = 1; page <= pdf.numPages; page += 1) {
      const text = (await pageText(pdf, page)).map((item) => item.text).join(' ')
      expect(text, `page ${page}`).toContain(`Licence ${licence.number} – for personal use, not for resale or sharing · Elsie Varga`)
    }

    // Another quilter with the very link, and nobody signed in, get nothing.
    expect((await download(done.url, cookies.other)).status).toBe(404)
    expect((await download(done.url, undefined)).status).toBe(401)
    expect((await statusOf(asked.json!.id, cookies.other)).status).toBe(404)
    expect((await statusOf(asked.json!.id, cookies.designer)).status).toBe(404)
  })

  it('is refused to another quilter, the designer, a stranger and a revoked licence', async () => {
    const { licence, cookies } = await scene()
    expect((await ask(licence.id, cookies.other, { paper: 'letter' })).status).toBe(404)
    expect((await ask(licence.id, cookies.designer, { paper: 'letter' })).status).toBe(404)
    expect((await ask(licence.id, undefined, { paper: 'letter' })).status).toBe(401)
    expect((await ask('not-a-licence', cookies.buyer, { paper: 'letter' })).status).toBe(404)
    expect(await BookletBuild.count()).toBe(0)

    const asked = await ask(licence.id, cookies.buyer, { paper: 'letter' })
    const done = await waitUntilBuilt(asked.json!.id, cookies.buyer)
    await licence.update({ revokedAt: new Date() })
    expect((await ask(licence.id, cookies.buyer, { paper: 'letter' })).status).toBe(404)
    expect((await statusOf(asked.json!.id, cookies.buyer)).status).toBe(404)
    expect((await download(done.url, cookies.buyer)).status).toBe(404)
  })

  it('checks its options with the booklet schema and the design’s colourways', async () => {
    const { licence, cookies } = await scene()
    const badPaper = await ask(licence.id, cookies.buyer, { paper: 'napkin' })
    expect(badPaper.status).toBe(422)
    expect(badPaper.json!.error.issues[0].path).toBe('paper')
    const badSize = await ask(licence.id, cookies.buyer, { paper: 'letter', diameterIn: -3 })
    expect(badSize.json!.error.issues[0].path).toBe('diameterIn')
    const extra = await ask(licence.id, cookies.buyer, { paper: 'letter', parts: ['cover'] })
    expect(extra.status).toBe(422)
    const badColourway = await ask(licence.id, cookies.buyer, { paper: 'letter', colorway: 'Not a colourway' })
    expect(badColourway.status).toBe(422)
    expect(badColourway.json!.error.issues[0].path).toBe('colorway')
    expect(await BookletBuild.count()).toBe(0)
  })

  it('asked for again with the same options is the one build, served from the store', async () => {
    const { licence, cookies } = await scene()
    const first = await ask(licence.id, cookies.buyer, { paper: 'letter' })
    // Asked again at once (the defaults spelt out): the same build, still on its way.
    const again = await ask(licence.id, cookies.buyer, { paper: 'letter', orientation: 'portrait' })
    expect(again.json!.id).toBe(first.json!.id)
    await waitUntilBuilt(first.json!.id, cookies.buyer)
    const later = await ask(licence.id, cookies.buyer, { paper: 'letter' })
    expect(later.status).toBe(200)
    expect(later.json).toMatchObject({ id: first.json!.id, state: 'ready', url: expect.any(String) })
    const row = await BookletBuild.findByPk(first.json!.id)
    expect(row!.attempts).toBe(1)
    expect(await BookletBuild.count()).toBe(1)
    // Other options are another booklet.
    const landscape = await ask(licence.id, cookies.buyer, { paper: 'letter', orientation: 'landscape' })
    expect(landscape.json!.id).not.toBe(first.json!.id)
  })

  it('counts each request against the person’s booklet limit: 30 an hour, then 429 with Retry-After', async () => {
    const { licence, cookies } = await scene()
    // RATE_LIMITS.bookletBuildsPerUser: 30 an hour (lib/rate-limits.ts). Asking again for the same
    // booklet is cheap but still counted, so a script cannot poll by asking.
    for (let index = 0; index < 30; index += 1) expect((await ask(licence.id, cookies.buyer, { paper: 'letter' })).status).toBeLessThan(300)
    const refused = await ask(licence.id, cookies.buyer, { paper: 'letter' })
    expect(refused.status).toBe(429)
    expect(Number(refused.headers.get('retry-after'))).toBeGreaterThan(0)
    // Someone else's requests are theirs to count.
    const { licence: theirs, cookies: theirCookies } = await scene()
    expect((await ask(theirs.id, theirCookies.buyer, { paper: 'letter' })).status).toBe(202)
  })

  it('downloads only through an unexpired link signed for this build and this person', async () => {
    const { buyer, other, licence, cookies } = await scene()
    const asked = await ask(licence.id, cookies.buyer, { paper: 'letter' })
    const done = await waitUntilBuilt(asked.json!.id, cookies.buyer)
    const base = `/api/booklets/${asked.json!.id}/download?token=`
    const secret = linkSecret(bookletSettings().linkSecret)
    const now = Math.floor(Date.now() / 1000)
    const expired = signDownloadToken({ buildId: asked.json!.id, userId: buyer.id, expiresAt: now - 1 }, secret)
    expect((await download(`${base}${expired}`, cookies.buyer)).status).toBe(403)
    const forged = signDownloadToken({ buildId: asked.json!.id, userId: buyer.id, expiresAt: now + 600 }, 'a guessed secret that is long enough')
    expect((await download(`${base}${forged}`, cookies.buyer)).status).toBe(403)
    const othersToken = signDownloadToken({ buildId: asked.json!.id, userId: other.id, expiresAt: now + 600 }, secret)
    expect((await download(`${base}${othersToken}`, cookies.buyer)).status).toBe(403)
    expect((await download(`/api/booklets/${asked.json!.id}/download`, cookies.buyer)).status).toBe(403)
    const token = new URL(done.url, TEST_ORIGIN).searchParams.get('token')!
    const [payload, signature] = token.split('.') as [string, string]
    expect((await download(`${base}${payload}.${signature.slice(1)}x`, cookies.buyer)).status).toBe(403)
    // The good link still works.
    expect((await download(done.url, cookies.buyer)).status).toBe(200)
  })
})
