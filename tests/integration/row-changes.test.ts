import { randomUUID } from 'node:crypto'
import pg from 'pg'
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest'
import { GET as patternRoute } from '@/app/api/patterns/[id]/route'
import { GET as projectRoute } from '@/app/api/sewing-room/projects/[id]/route'
import { POST as startRoute } from '@/app/api/sewing-room/projects/route'
import { database } from '@/lib/db'
import { KEPT_AT_MOST_MS, KeptAnswers, rowChanges, type ChangeTag } from '@/lib/row-changes'
import type { PlanAnswer } from '@/lib/schemas/sewing-room'
import { readPlan } from '@/lib/sewing-room/plan-answer'
import { Licence, Order } from '@/models'
import { hollyberryWreath } from '@/scripts/demo-wreath'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { call } from '../support/requests'

/**
 * What a web process keeps (lib/row-changes.ts), against the real PostgreSQL: the triggers' notices
 * reach the feed; a kept answer is used without asking the database and dropped when a row it was
 * made from changes, by this process (at once) or by another connection (when the notice arrives);
 * kept answers never let someone read what they may not; nothing is kept while the feed is not
 * listening. "Another instance" is a plain pg client of its own, whose writes pass every hook.
 */

const feed = rowChanges()
let elsewhere: pg.Client

beforeAll(async () => {
  await freshDatabase()
  elsewhere = new pg.Client({ connectionString: process.env.DATABASE_URL })
  await elsewhere.connect()
})
beforeEach(async () => {
  feed.start(process.env.DATABASE_URL!)
  await until(() => feed.live, 'the feed to listen')
})
afterEach(() => feed.stop())
afterAll(async () => {
  await elsewhere.end()
  await closeDatabase()
})

async function until(condition: () => boolean, what: string, timeoutMs = 10_000): Promise<void> {
  const deadline = Date.now() + timeoutMs
  while (!condition()) {
    if (Date.now() > deadline) throw new Error(`gave up waiting for ${what}`)
    await new Promise((resolve) => setTimeout(resolve, 10))
  }
}

/** Runs `write` on the other connection and waits until the feed heard `tag`. */
async function changeElsewhere(tag: ChangeTag, sql: string, values: unknown[] = []): Promise<void> {
  let heard = false
  const stop = feed.subscribe((changed) => {
    if (changed === tag) heard = true
  })
  try {
    await elsewhere.query(sql, values)
    await until(() => heard, `the notice ${tag}`)
  } finally {
    stop()
  }
}

/**
 * Waits until every notice of a change committed so far has arrived: a listener gets notices in
 * commit order (PostgreSQL docs, NOTIFY), so one sent now arrives after them. An answer read while
 * the notice of an earlier write (a session just made) was on its way is rightly not kept.
 */
async function settle(): Promise<void> {
  const tag = `test:${randomUUID()}`
  await changeElsewhere(tag, `SELECT pg_notify('row_changes', $1)`, [tag])
}

/** How many statements this process sends to PostgreSQL while `run` runs. */
async function statementsDuring<T>(run: () => Promise<T>): Promise<{ result: T; statements: number }> {
  let statements = 0
  const count = () => {
    statements += 1
  }
  database().addHook('beforeQuery', 'count', count)
  try {
    return { result: await run(), statements }
  } finally {
    database().removeHook('beforeQuery', 'count')
  }
}

const readPattern = (cookie: string, id: string) => call(patternRoute, { cookie, params: { id } })
const getPlan = (cookie: string, id: string) => call(projectRoute, { cookie, params: { id } })

describe('the triggers', () => {
  it('notice a changed row by its table and id, a child row by its parent, and an emptied table by its name', async () => {
    const designer = await createUser({ roles: ['quilter', 'designer'] })
    const pattern = await createPatternRow(designer)
    await changeElsewhere(`patterns:${pattern.id}`, 'UPDATE patterns SET name = $1 WHERE id = $2', ['Renamed elsewhere', pattern.id])
    await changeElsewhere(`users:${designer.id}`, 'UPDATE users SET display_name = $1 WHERE id = $2', ['Renamed person', designer.id])
    await changeElsewhere(
      `patterns:${pattern.id}`,
      `INSERT INTO pattern_invitations (id, pattern_id, email, invited_by_id, expires_at, created_at)
       VALUES ($1, $2, $3, $4, now() + interval '1 day', now())`,
      [randomUUID(), pattern.id, 'tester@example.test', designer.id],
    )
    await changeElsewhere(`sessions:*`, 'TRUNCATE sessions')
  })
})

describe('a pattern read', () => {
  it('asks PostgreSQL nothing once kept, and reads a change made elsewhere once its notice arrives', async () => {
    const designer = await createUser({ roles: ['quilter', 'designer'] })
    const pattern = await createPatternRow(designer, { name: 'Kept ring' })
    const cookie = await sessionCookieFor(designer)
    await settle()
    expect((await readPattern(cookie, pattern.id)).json!.pattern.name).toBe('Kept ring')
    const again = await statementsDuring(() => readPattern(cookie, pattern.id))
    expect(again.result.status).toBe(200)
    expect(again.statements).toBe(0)
    expect(again.result.json!.pattern.name).toBe('Kept ring')

    await changeElsewhere(`patterns:${pattern.id}`, 'UPDATE patterns SET name = $1 WHERE id = $2', ['Renamed elsewhere', pattern.id])
    expect((await readPattern(cookie, pattern.id)).json!.pattern.name).toBe('Renamed elsewhere')
  })

  it('reads this process’s own write at once, without waiting for a notice', async () => {
    const designer = await createUser({ roles: ['quilter', 'designer'] })
    const pattern = await createPatternRow(designer, { name: 'Before' })
    const cookie = await sessionCookieFor(designer)
    await readPattern(cookie, pattern.id)
    await pattern.update({ name: 'After' })
    expect((await readPattern(cookie, pattern.id)).json!.pattern.name).toBe('After')
  })

  it('kept for its designer is still refused to anyone who may not read it', async () => {
    const designer = await createUser({ roles: ['quilter', 'designer'] })
    const stranger = await createUser()
    const pattern = await createPatternRow(designer)
    await readPattern(await sessionCookieFor(designer), pattern.id)
    expect((await readPattern(await sessionCookieFor(stranger), pattern.id)).status).toBe(404)
  })
})

describe('a session', () => {
  it('ended elsewhere is refused here once the notice arrives', async () => {
    const designer = await createUser({ roles: ['quilter', 'designer'] })
    const pattern = await createPatternRow(designer)
    const cookie = await sessionCookieFor(designer)
    expect((await readPattern(cookie, pattern.id)).status).toBe(200)
    const sessionId = cookie.split('=')[1]!
    await changeElsewhere(`sessions:${sessionId}`, 'DELETE FROM sessions WHERE id = $1', [sessionId])
    expect((await readPattern(cookie, pattern.id)).status).toBe(401)
  })

  it('of an account disabled elsewhere is refused here once the notice arrives', async () => {
    const designer = await createUser({ roles: ['quilter', 'designer'] })
    const pattern = await createPatternRow(designer)
    const cookie = await sessionCookieFor(designer)
    expect((await readPattern(cookie, pattern.id)).status).toBe(200)
    await changeElsewhere(`users:${designer.id}`, 'UPDATE users SET disabled_at = now() WHERE id = $1', [designer.id])
    expect((await readPattern(cookie, pattern.id)).status).toBe(401)
  })
})

describe('a sewing plan', () => {
  async function scene() {
    const designer = await createUser({ roles: ['quilter', 'designer'], displayName: 'Oona Bright' })
    const pattern = await createPatternRow(designer, { name: 'Hollyberry Wreath', state: 'published', design: hollyberryWreath })
    await pattern.update({ priceCents: 1200, currency: 'USD' })
    const buyer = await createUser()
    const order = await Order.create({ id: randomUUID(), buyerId: buyer.id, patternId: pattern.id, amountCents: 1200, currency: 'USD', checkoutSessionId: `cs_test_${randomUUID()}`, state: 'paid' })
    const licence = await Licence.create({ userId: buyer.id, patternId: pattern.id, orderId: order.id })
    const cookie = await sessionCookieFor(buyer)
    const started = await call(startRoute, { method: 'POST', cookie, body: { licenceId: licence.id, colorway: 0, diameterIn: 18, paper: 'letter' } })
    expect(started.status).toBe(201)
    const { project } = started.json!
    return { designer, pattern, licence, cookie, projectId: project.id as string }
  }

  it('shows a tick made elsewhere, a licence refunded elsewhere ends it, and it is never another quilter’s', async () => {
    const { licence, cookie, projectId } = await scene()
    await settle()
    const first = readPlan((await getPlan(cookie, projectId)).json! as PlanAnswer)
    const step = first.steps[0]!.id
    expect(first.steps[0]!.done).toBe(false)
    expect((await statementsDuring(() => getPlan(cookie, projectId))).statements).toBe(0)
    expect((await getPlan(await sessionCookieFor(await createUser()), projectId)).status).toBe(404)

    await changeElsewhere(
      `sewing_projects:${projectId}`,
      'INSERT INTO sewing_steps (project_id, step_id, done, updated_at) VALUES ($1, $2, true, now())',
      [projectId, step],
    )
    expect(readPlan((await getPlan(cookie, projectId)).json! as PlanAnswer).steps[0]!.done).toBe(true)

    await changeElsewhere(`licences:${licence.id}`, 'UPDATE licences SET revoked_at = now() WHERE id = $1', [licence.id])
    expect((await getPlan(cookie, projectId)).status).toBe(404)
  })

  it('shows the designer’s new name once it changes elsewhere', async () => {
    const { designer, cookie, projectId } = await scene()
    expect((await getPlan(cookie, projectId)).json!.project.designerName).toBe('Oona Bright')
    await changeElsewhere(`users:${designer.id}`, 'UPDATE users SET display_name = $1 WHERE id = $2', ['Oona Bright-Hale', designer.id])
    expect((await getPlan(cookie, projectId)).json!.project.designerName).toBe('Oona Bright-Hale')
  })
})

describe('kept answers', () => {
  const made = (answers: KeptAnswers<number>, key: string, tags: ChangeTag[] | null, during?: () => Promise<void>, until?: Date) => {
    let calls = 0
    const run = () =>
      answers.answer(key, async () => {
        calls += 1
        await during?.()
        return { value: calls, tags, until }
      })
    return { run, calls: () => calls }
  }

  it('are not kept when a row they were made from changed while they were made', async () => {
    const answers = new KeptAnswers<number>(10)
    const designer = await createUser({ roles: ['quilter', 'designer'] })
    const pattern = await createPatternRow(designer)
    const read = made(answers, 'a', [`patterns:${pattern.id}`], () => changeElsewhere(`patterns:${pattern.id}`, 'UPDATE patterns SET name = name WHERE id = $1', [pattern.id]))
    await read.run()
    await read.run()
    expect(read.calls()).toBe(2)
    const unrelated = made(answers, 'b', ['patterns:another'])
    await unrelated.run()
    await unrelated.run()
    expect(unrelated.calls()).toBe(1)
  })

  it('are not kept past their own end, nor past KEPT_AT_MOST_MS, nor without tags, and the oldest go first past the budget', async () => {
    const answers = new KeptAnswers<number>(2)
    const expiring = made(answers, 'soon', ['patterns:x'], undefined, new Date(Date.now() + 50))
    await expiring.run()
    await expiring.run()
    expect(expiring.calls()).toBe(1)
    await new Promise((resolve) => setTimeout(resolve, 80))
    await expiring.run()
    expect(expiring.calls()).toBe(2)

    const long = made(answers, 'long', ['patterns:long'])
    await long.run()
    vi.useFakeTimers({ toFake: ['Date'] })
    try {
      vi.setSystemTime(Date.now() + KEPT_AT_MOST_MS - 1_000)
      await long.run()
      expect(long.calls()).toBe(1)
      vi.setSystemTime(Date.now() + 2_000)
      await long.run()
      expect(long.calls()).toBe(2)
    } finally {
      vi.useRealTimers()
    }

    const untagged = made(answers, 'never', null)
    await untagged.run()
    await untagged.run()
    expect(untagged.calls()).toBe(2)

    const [one, two, three] = ['one', 'two', 'three'].map((key) => made(answers, key, [`patterns:${key}`]))
    await one!.run()
    await two!.run()
    await three!.run()
    expect(answers.size).toBe(2)
    await one!.run()
    expect(one!.calls()).toBe(2)
  })

  it('are all dropped when the feed loses its connection, none kept until it listens again', async () => {
    const answers = new KeptAnswers<number>(10)
    const read = made(answers, 'a', ['patterns:a'])
    await read.run()
    expect(answers.size).toBe(1)
    await elsewhere.query(`SELECT pg_terminate_backend(pid) FROM pg_stat_activity WHERE application_name = 'wreathwright-row-changes'`)
    await until(() => !feed.live, 'the feed to notice its connection broke')
    expect(answers.size).toBe(0)
    await read.run()
    if (!feed.live) expect(answers.size).toBe(0)
    await until(() => feed.live, 'the feed to listen again')
    await read.run()
    await read.run()
    expect(answers.size).toBe(1)
  })
})
