import { Op, QueryTypes } from 'sequelize'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { GET as listUsers } from '@/app/api/admin/users/route'
import { database } from '@/lib/db'
import { User } from '@/models'
import { closeDatabase, freshDatabase } from '../support/database'
import { createUser, sessionCookieFor } from '../support/factories'
import { call } from '../support/requests'

/** Thousands of people, made in one bulk insert: the users table as a busy site would have it. */
const PEOPLE = 3000
const FIRST = ['Ada', 'Bram', 'Cora', 'Dov', 'Edda', 'Finn', 'Gala', 'Hal', 'Ines', 'Jory', 'Kit', 'Lumi']
const LAST = ['Ashdown', 'Birchley', 'Cotter', 'Dunmore', 'Eskdale', 'Fallow', 'Greaves', 'Hollis', 'Inchbold', 'Jessop']

let cookie: string

beforeAll(async () => {
  await freshDatabase()
  const odile = await createUser({ email: 'odile@desk.test', displayName: 'Odile Admin', roles: ['admin'] })
  cookie = await sessionCookieFor(odile)
  const joined = Date.parse('2026-01-01T00:00:00Z')
  await User.bulkCreate(
    Array.from({ length: PEOPLE }, (_, i) => ({
      email: `person${String(i).padStart(4, '0')}@crowd.example`,
      displayName: `${FIRST[i % FIRST.length]} ${LAST[Math.floor(i / FIRST.length) % LAST.length]} ${i}`,
      passwordHash: 'not-a-hash: these people never sign in',
      roles: ['quilter' as const],
      emailVerifiedAt: null,
      designerRequestedAt: null,
      // One a minute, so that "joined" orders them by number.
      createdAt: new Date(joined + i * 60_000),
    })),
  )
  // A name with the wildcards of LIKE in it, which a search must read as letters.
  await createUser({ email: 'percent@crowd.example', displayName: 'Mae 100%_sure' })
}, 120_000)
afterAll(closeDatabase)

type Row = { displayName: string; email: string; joinedAt: string }
const get = async (query: string) => call(listUsers, { cookie, path: `/api/admin/users${query}` })

describe('the users table with thousands of people', () => {
  it('pages in fifties without gaps or repeats, newest first by default', async () => {
    const first = await get('')
    expect(first.status).toBe(200)
    // 3000 generated + the admin + Mae = 3002 people; 3002 / 50 → 61 pages.
    expect(first.json).toMatchObject({ page: 1, pageSize: 50, total: PEOPLE + 2, pageCount: 61 })
    const second = await get('?page=2')
    const rows = [...first.json!.rows, ...second.json!.rows] as Row[]
    expect(new Set(rows.map((row) => row.email)).size).toBe(100)
    const times = rows.map((row) => row.joinedAt)
    expect(times).toEqual([...times].sort().reverse())
    const last = await get('?page=61')
    expect(last.json?.rows).toHaveLength(2)
    expect((await get('?page=62')).json?.rows).toEqual([])
  })

  it('sorts by name, e-mail and joining, both ways', async () => {
    for (const [sort, key] of [['name', 'displayName'], ['email', 'email'], ['joined', 'joinedAt']] as const) {
      for (const direction of ['', '-']) {
        const response = await get(`?sort=${direction}${sort}&page=3`)
        const values = (response.json!.rows as Row[]).map((row) => row[key].toLowerCase())
        // The test cluster is made with locale C.UTF-8 (scripts/postgres.ts): byte order, as JS compares these ASCII strings.
        const sorted = [...values].sort()
        expect(values, `${direction}${sort}`).toEqual(direction ? sorted.reverse() : sorted)
        expect(values).toHaveLength(50)
      }
    }
    const byName = await get('?sort=name')
    expect((byName.json!.rows as Row[])[0]!.displayName).toBe('Ada Ashdown 0')
  })

  it('finds a part of a name or e-mail address in any letter case', async () => {
    const byName = await get(`?q=${encodeURIComponent('hOLLIS 2')}`)
    const names = (byName.json!.rows as Row[]).map((row) => row.displayName)
    expect(names.length).toBeGreaterThan(0)
    for (const name of names) expect(name.toLowerCase()).toContain('hollis 2')
    expect(byName.json!.total).toBe(await User.count({ where: { displayName: { [Op.iLike]: '%hollis 2%' } } }))

    const byEmail = await get('?q=PERSON2999@')
    expect((byEmail.json!.rows as Row[]).map((row) => row.email)).toEqual(['person2999@crowd.example'])
  })

  it('shows only the disabled, the unverified or those asking to design when asked, together with a search', async () => {
    const [disabled, requester] = await User.findAll({ where: { email: ['person0001@crowd.example', 'person0002@crowd.example'] }, order: [['email', 'ASC']] })
    await disabled!.update({ disabledAt: new Date() })
    await requester!.update({ designerRequestedAt: new Date(), emailVerifiedAt: new Date() })
    const emails = async (query: string) => ((await get(query)).json!.rows as Row[]).map((row) => row.email)
    expect(await emails('?filter=disabled')).toEqual(['person0001@crowd.example'])
    expect(await emails('?filter=designer-request')).toEqual(['person0002@crowd.example'])
    // Everyone else made here is unverified: 3002 people less the one verified above.
    expect((await get('?filter=unverified')).json!.total).toBe(PEOPLE + 1)
    expect(await emails('?filter=unverified&q=person0002')).toEqual([])
    expect((await get('?filter=everyone')).json?.error.issues[0].path).toBe('filter')
    await disabled!.update({ disabledAt: null })
    await requester!.update({ designerRequestedAt: null, emailVerifiedAt: null })
  })

  it('reads % and _ in a search as letters', async () => {
    const response = await get(`?q=${encodeURIComponent('100%_')}`)
    expect((response.json!.rows as Row[]).map((row) => row.displayName)).toEqual(['Mae 100%_sure'])
    expect((await get(`?q=${encodeURIComponent('%')}`)).json!.total).toBe(1)
  })

  it('answers from the indexes made for it, not by reading every row (EXPLAIN of the queries the API sends)', async () => {
    await database().query('ANALYZE users')
    /** The plan of the page query (not the count) the request sends, read with EXPLAIN. */
    async function planOf(query: string, planOptions: { onlyBitmapScans?: boolean } = {}): Promise<string> {
      const sequelize = database()
      // Sequelize reads `options.logging` at each query; its type does not declare `options`.
      const options = (sequelize as unknown as { options: { logging: unknown } }).options
      const statements: string[] = []
      const logging = options.logging
      options.logging = (sql: string) => statements.push(sql.replace(/^Executing \([^)]*\): /, ''))
      try {
        await get(query)
      } finally {
        options.logging = logging
      }
      const select = statements.find((sql) => /^SELECT .* FROM "users"/.test(sql) && !sql.includes('count('))
      if (!select) throw new Error(`no page query among ${statements.join(' | ')}`)
      return sequelize.transaction(async (transaction) => {
        // A few thousand rows are few enough that reading them all (or walking the sort's index)
        // may be cheapest today; with both priced out, only a bitmap scan of an index whose
        // expression matches the search's is left, and the plan shows whether one can answer it.
        if (planOptions.onlyBitmapScans) {
          await sequelize.query('SET LOCAL enable_seqscan = off', { transaction })
          await sequelize.query('SET LOCAL enable_indexscan = off', { transaction })
        }
        const rows = await sequelize.query<{ 'QUERY PLAN': string }>(`EXPLAIN ${select}`, { type: QueryTypes.SELECT, transaction })
        return rows.map((row) => row['QUERY PLAN']).join('\n')
      })
    }
    expect(await planOf('?sort=name&page=3')).toContain('users_display_name_order')
    expect(await planOf('?sort=-joined&page=3')).toContain('users_created_at_order')
    expect(await planOf('?sort=email&page=3')).toContain('users_email_lower_unique')
    const search = await planOf('?q=person2999', { onlyBitmapScans: true })
    expect(search).toContain('users_display_name_trigram')
    expect(search).toContain('users_email_trigram')
  })

  it('names a bad parameter with 422', async () => {
    const sort = await get('?sort=password')
    expect(sort.status).toBe(422)
    expect(sort.json?.error.issues[0].path).toBe('sort')
    const page = await get('?page=0')
    expect(page.json?.error.issues[0].path).toBe('page')
    expect((await get('?size=1000')).status).toBe(422)
  })
})
