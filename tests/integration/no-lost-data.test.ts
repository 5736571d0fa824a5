/**
 * No lost data: a pattern save is one transaction (lib/services/patterns.ts `updatePattern`: the
 * pattern row with its summary columns, a revision row, and a state-change row when the state
 * moves). Here the database connection of a save is killed part way through — with
 * `pg_terminate_backend`, as a crash of the server process or a cut network would end it — and
 * the pattern must then be wholly at its old revision; the next save must then be wholly at the new.
 *
 * How the save is stopped at a chosen point without any hook in the app: a second connection holds
 * a lock the save's next statement needs (the pattern row, or the revisions or state-change table
 * in SHARE mode, which lets reads through and stops INSERTs), so the save waits right there with
 * everything before that point written in its open transaction. `pg_blocking_pids` finds the
 * waiting backend; that backend is terminated; the lock is let go.
 */
import pg from 'pg'
import { QueryTypes } from 'sequelize'
import { afterAll, afterEach, beforeEach, describe, expect, it } from 'vitest'
import { PATCH as updatePatternRoute } from '@/app/api/patterns/[id]/route'
import { database } from '@/lib/db'
import { designSummary } from '@/lib/design-summary'
import { emptyDesign } from '@/lib/new-design'
import type { DesignFile } from '@/lib/schemas/design'
import { Pattern, PatternRevision, PatternStateChange } from '@/models'
import { hollyberryWreath } from '@/scripts/demo-wreath'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { call } from '../support/requests'

const OLD_DESIGN: DesignFile = emptyDesign('Winter Star', { innerRadius: 0, outerRadius: 7, repeats: 6, repeatMode: 'rotate' })
const NEW_DESIGN: DesignFile = { ...hollyberryWreath, name: 'Winter Star' }

let blocker: pg.Client | undefined

beforeEach(freshDatabase)
afterEach(async () => {
  await blocker?.end().catch(() => undefined)
  blocker = undefined
})
afterAll(closeDatabase)

async function openBlocker(): Promise<pg.Client> {
  blocker = new pg.Client({ connectionString: process.env.DATABASE_URL })
  await blocker.connect()
  return blocker
}

/**
 * The backend waiting for a lock `holderPid` holds, with what it runs; waits up to 10 s for one.
 * Asked on a connection of its own: inside the holder's transaction pg_stat_activity would stay
 * as it was first read.
 */
async function waitingOn(holderPid: number): Promise<{ pid: number; query: string }> {
  const deadline = Date.now() + 10_000
  for (;;) {
    const rows = await database().query<{ pid: number; query: string }>(
      'SELECT pid, query FROM pg_stat_activity WHERE :holder = ANY(pg_blocking_pids(pid))',
      { replacements: { holder: holderPid }, type: QueryTypes.SELECT },
    )
    if (rows[0]) return rows[0]
    if (Date.now() > deadline) throw new Error('the save never reached the held lock')
    await new Promise((resolve) => setTimeout(resolve, 20))
  }
}

/** What is stored of the pattern, read fresh: the row, its revisions and its history. */
async function stored(id: string) {
  const pattern = await Pattern.findByPk(id)
  if (!pattern) throw new Error('the pattern is gone')
  const revisions = await PatternRevision.findAll({ where: { patternId: id }, order: [['revision', 'ASC']] })
  const changes = await PatternStateChange.findAll({ where: { patternId: id } })
  return { pattern, revisions, changes }
}

/** The row, its summary, its newest revision and its history all tell one story. */
function expectConsistent({ pattern, revisions, changes }: Awaited<ReturnType<typeof stored>>) {
  expect(revisions.map((revision) => revision.revision)).toEqual(Array.from({ length: pattern.revision }, (_, index) => index + 1))
  const newest = revisions.at(-1)!
  expect(newest.design).toEqual(pattern.design)
  expect(newest.name).toBe(pattern.name)
  expect(newest.state).toBe(pattern.state)
  const summary = designSummary(pattern.design)
  expect({ repeats: pattern.repeats, outerDiameterInches: pattern.outerDiameterInches, seamCount: pattern.seamCount }).toEqual(summary)
  // One state change per move: the history ends where the row stands.
  expect(changes.length).toBe(pattern.state === 'draft' ? 0 : 1)
}

async function designerWithDraft() {
  const designer = await createUser({ roles: ['designer', 'quilter'] })
  const cookie = await sessionCookieFor(designer)
  const pattern = await createPatternRow(designer, { name: 'Winter Star', design: OLD_DESIGN })
  return { designer, cookie, pattern }
}

/** The save under test: the new design, a new name, and the move into testing (all three kinds of row). */
function save(cookie: string, id: string, revision: number) {
  return call(updatePatternRoute, {
    method: 'PATCH',
    path: `/api/patterns/${id}`,
    cookie,
    params: { id },
    body: { revision, name: 'Winter Star (tested)', design: NEW_DESIGN, state: 'testing' },
  })
}

const KILL_POINTS = [
  {
    where: 'before the pattern row is written (waiting for its row lock)',
    hold: (client: pg.Client, id: string) => client.query('BEGIN').then(() => client.query('SELECT id FROM patterns WHERE id = $1 FOR UPDATE', [id])),
    waitsIn: /FROM "patterns"/,
  },
  {
    where: 'after the pattern row is written, before its revision',
    hold: (client: pg.Client) => client.query('BEGIN').then(() => client.query('LOCK TABLE pattern_revisions IN SHARE MODE')),
    waitsIn: /^INSERT INTO "pattern_revisions"/,
  },
  {
    where: 'after the revision, before the state change is recorded',
    hold: (client: pg.Client) => client.query('BEGIN').then(() => client.query('LOCK TABLE pattern_state_changes IN SHARE MODE')),
    waitsIn: /^INSERT INTO "pattern_state_changes"/,
  },
] as const

describe('a save whose database connection is killed part way', () => {
  for (const point of KILL_POINTS) {
    it(`leaves the pattern wholly at the old revision when killed ${point.where}, and the next save lands whole`, async () => {
      const { cookie, pattern } = await designerWithDraft()
      const before = await stored(pattern.id)
      expectConsistent(before)

      const holder = await openBlocker()
      const holderPid = (await holder.query<{ pid: number }>('SELECT pg_backend_pid() AS pid')).rows[0]!.pid
      await point.hold(holder, pattern.id)
      const saving = save(cookie, pattern.id, 1)
      const waiting = await waitingOn(holderPid)
      expect(waiting.query).toMatch(point.waitsIn)
      const [terminated] = await database().query<{ done: boolean }>('SELECT pg_terminate_backend(:pid) AS done', {
        replacements: { pid: waiting.pid },
        type: QueryTypes.SELECT,
      })
      expect(terminated?.done).toBe(true)
      const answer = await saving
      await holder.query('ROLLBACK')

      // The client is told nothing was changed, and nothing was: the database ended the
      // connection (57P01), so the answer is 503 with Retry-After (lib/database-unavailable.ts).
      expect(answer.status).toBe(503)
      expect(answer.headers.get('retry-after')).toMatch(/^\d+$/)
      expect(answer.json?.error.message).toMatch(/nothing was changed/)
      const after = await stored(pattern.id)
      expectConsistent(after)
      expect(after.pattern.revision).toBe(1)
      expect(after.pattern.name).toBe('Winter Star')
      expect(after.pattern.state).toBe('draft')
      expect(after.pattern.design).toEqual(OLD_DESIGN)
      expect(after.pattern.seamCount).toBe(0)
      expect(after.revisions).toHaveLength(1)
      expect(after.changes).toHaveLength(0)

      // The app's pool dropped the dead connection: the same save, sent again, lands whole.
      const again = await save(cookie, pattern.id, 1)
      expect(again.status).toBe(200)
      expect(again.json?.pattern.revision).toBe(2)
      const saved = await stored(pattern.id)
      expectConsistent(saved)
      expect(saved.pattern.revision).toBe(2)
      expect(saved.pattern.name).toBe('Winter Star (tested)')
      expect(saved.pattern.state).toBe('testing')
      expect(saved.pattern.design).toEqual(NEW_DESIGN)
      expect(saved.pattern.seamCount).toBe(NEW_DESIGN.seams.length)
      expect(saved.revisions.map((revision) => revision.state)).toEqual(['draft', 'testing'])
    })
  }
})
