/**
 * npm run load — how the built app holds under many connections (issue 17, item 5). A figure, not
 * a test: it prints, and exits 0 whether the goals are met or not (a missed goal says MISSED).
 *
 * On loopback, in a throwaway PostgreSQL cluster and object store (as `npm run bench` does): the
 * database is migrated and seeded with the demo data, the app is built (`next build`; set
 * LOAD_SKIP_BUILD=1 to reuse a build of this checkout) and started with `next start` through
 * scripts/serve.ts, one process per core as `npm start` runs it unless LOAD_WEB_PROCESSES says
 * otherwise.
 * Then autocannon, in this process, asks each target at 50 and then 200 connections for 20 s
 * (LOAD_SECONDS), each run also capped at MAX_REQUESTS_PER_RUN requests, the whole script at
 * DEADLINE_MS. LOAD_ONLY=a,b measures only the named targets beside the bare handler. The targets:
 *   - bare          GET /api/health/bare, a constant: the framework's own cost per request;
 *   - shop list     GET /api/shop/patterns, the shop's first page, no session;
 *   - one statement GET /api/health, whose only work is `SELECT 1` through the app's Sequelize: what
 *                   one round trip to PostgreSQL costs (a probe, held to no errors only);
 *   - shop page     GET /shop, the same page as HTML (a page: held to no errors only);
 *   - pattern read  GET /api/patterns/:id as its designer (the demo's Hollyberry Wreath);
 *   - plan          GET /api/sewing-room/projects/:id, the sewing plan of a quilter's project
 *                   (its checklist of steps in sewing order, drawn from the pattern's plan, with
 *                   progress and picture), TICK_PROJECTS projects in turn, each as its quilter;
 *   - plan refresh  the same with If-None-Match naming each plan's current ETag, as the sewing
 *                   room asks every half minute: 304 without the plan (any other status an error);
 *   - pattern page  GET /shop/:id, a listed pattern's page, its covers drawn from the plan (a page);
 *   - tick          PATCH /api/sewing-room/projects/:id/steps, the sewing room's tick: TICK_PROJECTS
 *                   quilters each with a project of the demo wreath, ticking and unticking its
 *                   steps in turn;
 *   - sign-in       POST /api/auth/sign-in, the right password, through argon2.
 * For each it prints requests/s, p50 and p99 latency and errors (connection errors, time-outs and
 * any answer that is not 2xx, or not the target's own status), beside the bare handler's figures
 * at the same connections, as a ratio. Goals (issue 17): no errors anywhere; for reads at 50
 * connections a p99 under 100 ms and at least 40 % of the bare handler's requests/s.
 *
 * Sign-in's limits (lib/rate-limits.ts) count every attempt from its start and give a successful
 * one back, so many sign-ins in flight for one account or from one address would be refused with
 * 429 — the limits doing their job, not a failure of the load. So the sign-ins rotate over
 * SIGN_IN_ACCOUNTS accounts, each from an address of its own (198.18.0.0/15, the range RFC 2544
 * sets aside for benchmarks), as people behind a load balancer would: the app runs with
 * TRUST_PROXY=true and each request carries X-Forwarded-For. A 429 here would count as an error.
 *
 * autocannon shares the machine's cores with the app and PostgreSQL: the figures are this
 * machine's, for comparing runs on it, not a capacity promise.
 */
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import autocannon from 'autocannon'
import { startObjectStore, type ObjectStore } from './object-store'
import { startCluster, type Cluster } from './postgres'
import { freePort, run, startProcess, stopProcess, waitForHttp } from './processes'

/** The connection counts of issue 17; LOAD_CONNECTIONS=50 (a comma list) measures only those. */
const CONNECTIONS = process.env.LOAD_CONNECTIONS ? process.env.LOAD_CONNECTIONS.split(',').map(Number) : [50, 200]
if (CONNECTIONS.some((count) => !Number.isInteger(count) || count < 1)) {
  console.error(`load: LOAD_CONNECTIONS must list whole numbers of connections, e.g. 50,200 (got ${process.env.LOAD_CONNECTIONS})`)
  process.exit(2)
}
/**
 * The app's web processes (scripts/serve.ts), LOAD_WEB_PROCESSES: by default as many as `npm
 * start` runs, one per core, so that the figures are the app's as it is started (README, "Load
 * test", has one process's figures beside them).
 */
const WEB_PROCESSES = Number(process.env.LOAD_WEB_PROCESSES ?? os.availableParallelism())
if (!Number.isInteger(WEB_PROCESSES) || WEB_PROCESSES < 1) {
  console.error(`load: LOAD_WEB_PROCESSES must be a whole number of processes (got ${process.env.LOAD_WEB_PROCESSES})`)
  process.exit(2)
}
const SECONDS = Number(process.env.LOAD_SECONDS ?? 20)
/** A cap on each run besides its time (the bare handler answers a few thousand a second here). */
const MAX_REQUESTS_PER_RUN = 200_000
/** The whole script, build included: past this everything is stopped and the script fails. */
const DEADLINE_MS = 30 * 60_000
/** An answer slower than this counts as a time-out (an error). */
const TIMEOUT_SECONDS = 30
const WARM_UP_SECONDS = 3
/**
 * A target that goes through many different requests in turn (the plan's projects) is warmed up
 * until it went through them this many times per web process at least: connections are handed to
 * the processes in turn, and each process keeps its own answers (lib/row-changes.ts), so three
 * seconds made one process keep only some of the 300 plans and the rest were made while measured.
 */
const WARM_UP_ROUNDS_PER_PROCESS = 2
const SIGN_IN_ACCOUNTS = 1000
/**
 * Quilters ticking, each in a project of their own (the first of the sign-in accounts): enough that
 * none of them passes the per-person limit of step changes (lib/rate-limits.ts, 600 a minute) below
 * 3,000 ticks a second in all, so a 429 is a real error.
 */
const TICK_PROJECTS = 300
/** Goals (issue 17). */
const READ_P99_GOAL_MS = 100
const READ_SHARE_GOAL = 0.4

/**
 * 'read': an API read issue 17 names (the shop list, a pattern, a plan), held to the read goals;
 * 'page': a server-rendered page, measured beside them and held to no errors (each is rendered
 * anew by React: a page's CSP nonce is its own); 'write': held to no errors; 'probe': a yardstick
 * between the bare handler and the reads, held to no errors.
 */
type Kind = 'bare' | 'probe' | 'read' | 'page' | 'write'
interface Target {
  readonly name: string
  readonly kind: Kind
  readonly label: string
  readonly options: Partial<autocannon.Options>
  /** How many different requests it goes through in turn (projects, accounts), if more than one. */
  readonly rotation?: number
  /** The status every answer should have, when not any 2xx (the plan refresh's 304). */
  readonly status?: number
  /** Run before its warm-up each time it is measured (the plan refresh asks for the plans' current tags). */
  readonly prepare?: () => Promise<void>
}
interface Figures {
  readonly target: Target
  readonly connections: number
  readonly requestsPerSecond: number
  readonly p50: number
  readonly p99: number
  readonly errors: number
  /** Status codes other than 2xx, and connection errors, with their counts. */
  readonly errorKinds: string
  readonly total: number
  /** The average answer's size in bytes, headers included (what the app writes per request). */
  readonly bytesPerAnswer: number
}

const work = fs.mkdtempSync(path.join(os.tmpdir(), 'wreathwright-load-'))
fs.chmodSync(work, 0o755)
let cluster: Cluster | undefined
let objectStore: ObjectStore | undefined
let app: ReturnType<typeof startProcess> | undefined

async function stopAll(): Promise<void> {
  await stopProcess(app)
  await objectStore?.stop().catch(() => undefined)
  try {
    cluster?.stop()
  } catch {
    // Already stopped: nothing to do.
  }
  fs.rmSync(work, { recursive: true, force: true })
}

const watchdog = setTimeout(() => {
  console.error(`load: still running after ${DEADLINE_MS / 60_000} minutes; stopping`)
  void stopAll().finally(() => process.exit(1))
}, DEADLINE_MS)

/** Runs autocannon once; resolves to its result. */
function cannon(options: autocannon.Options): Promise<autocannon.Result> {
  return new Promise((resolve, reject) => {
    autocannon(options, (error, result) => (error ? reject(error) : resolve(result)))
  })
}

async function measure(base: string, target: Target, connections: number, seconds: number, requests = MAX_REQUESTS_PER_RUN): Promise<Figures> {
  const result = await cannon({
    url: base,
    connections,
    duration: seconds,
    maxOverallRequests: requests,
    timeout: TIMEOUT_SECONDS,
    ...target.options,
  })
  const unexpected = Object.entries(result.statusCodeStats ?? {}).filter(([status]) => (target.status ? status !== String(target.status) : !status.startsWith('2')))
  const kinds = unexpected.map(([status, stats]) => `${status}×${stats.count ?? 0}`)
  if (result.errors > 0) kinds.push(`connection errors×${result.errors} (time-outs ${result.timeouts})`)
  return {
    target,
    connections,
    requestsPerSecond: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    errors: result.errors + unexpected.reduce((sum, [, stats]) => sum + (stats.count ?? 0), 0),
    errorKinds: kinds.join(', '),
    total: result.requests.total,
    bytesPerAnswer: result.requests.total > 0 ? result.throughput.total / result.requests.total : 0,
  }
}

/** Verdicts on the goals, e.g. ['p99 143 ms ≥ 100 ms']; empty when every goal is met. */
function misses(figures: Figures, bare: Figures | undefined): string[] {
  const missed: string[] = []
  if (figures.errors > 0) missed.push(`${figures.errors} errors (${figures.errorKinds})`)
  if (figures.target.kind === 'read' && figures.connections === 50) {
    if (figures.p99 >= READ_P99_GOAL_MS) missed.push(`p99 ${figures.p99} ms ≥ ${READ_P99_GOAL_MS} ms`)
    const share = bare ? figures.requestsPerSecond / bare.requestsPerSecond : 0
    if (share < READ_SHARE_GOAL) missed.push(`${(share * 100).toFixed(0)} % of bare < ${READ_SHARE_GOAL * 100} %`)
  }
  return missed
}

function printTable(all: readonly Figures[]): boolean {
  const header = ['target', 'conns', 'req/s', 'p50 ms', 'p99 ms', 'errors', 'of bare', 'goals']
  const rows = all.map((figures) => {
    const bare = all.find((other) => other.target.kind === 'bare' && other.connections === figures.connections)
    const missed = misses(figures, bare)
    const share = bare && figures.target.kind !== 'bare' ? `${((figures.requestsPerSecond / bare.requestsPerSecond) * 100).toFixed(0)} %` : '-'
    return [
      figures.target.name,
      String(figures.connections),
      figures.requestsPerSecond.toFixed(0),
      String(figures.p50),
      String(figures.p99),
      String(figures.errors),
      share,
      missed.length > 0 ? `MISSED: ${missed.join('; ')}` : 'met',
    ]
  })
  const widths = header.map((title, column) => Math.max(title.length, ...rows.map((row) => row[column]!.length)))
  const line = (cells: string[]) => '  ' + cells.map((cell, column) => (column < 2 || column === 7 ? cell.padEnd(widths[column]!) : cell.padStart(widths[column]!))).join('  ').trimEnd()
  console.log(line(header))
  for (const row of rows) console.log(line(row))
  return rows.every((row) => row[7] === 'met')
}

try {
  cluster = startCluster(path.join(work, 'postgres'), await freePort(), { throwaway: true, passwordFile: path.join(work, 'postgres.password') })
  cluster.createDatabase('wreathwright_load')
  objectStore = await startObjectStore(path.join(work, 'objects'), await freePort(), 'wreathwright-load')
  const port = await freePort()
  const base = `http://127.0.0.1:${port}`
  const env = {
    ...process.env,
    ...objectStore.env,
    DATABASE_URL: cluster.url('wreathwright_load'),
    SESSION_COOKIE_SECURE: 'false',
    NEXT_TELEMETRY_DISABLED: '1',
    PUBLIC_URL: base,
    MAIL_WORKER: 'off',
    // The sign-ins come from many addresses, as through a load balancer (see the top of this file).
    TRUST_PROXY: 'true',
  }
  const build = process.env.LOAD_SKIP_BUILD === '1' && fs.existsSync('.next/BUILD_ID') ? [] : [['next', 'build']]
  for (const args of [['tsx', 'scripts/migrate.ts', 'up'], ['tsx', 'scripts/seed-demo.ts'], ...build]) {
    if ((await run('npx', args, env)) !== 0) throw new Error(`${args.join(' ')} failed`)
  }
  app = startProcess('npx', ['tsx', 'scripts/serve.ts', '--hostname', '127.0.0.1', '--port', String(port)], { ...env, WEB_PROCESSES: String(WEB_PROCESSES) }, { quiet: true })
  await waitForHttp(`${base}/api/health`)

  // This process reads and writes the same database as the app, to find the demo's pattern and
  // make the accounts that sign in.
  Object.assign(process.env, env)
  const { database, closeDatabase } = await import('../lib/db')
  const { Licence, Order, Pattern, User } = await import('../models')
  const { hashPassword } = await import('../lib/auth/password')
  const { sessionCookieFor, TEST_PASSWORD } = await import('../tests/support/factories')
  database()
  const pattern = await Pattern.findOne({ where: { name: 'Hollyberry Wreath' } })
  if (!pattern?.ownerId) throw new Error('the demo data has no Hollyberry Wreath')
  const listed = await Pattern.findOne({ where: { state: 'published' }, order: [['name', 'ASC']] })
  if (!listed) throw new Error('the demo data lists no pattern in the shop')
  const designerCookie = await sessionCookieFor({ id: pattern.ownerId })
  const passwordHash = await hashPassword(TEST_PASSWORD)
  const emails = Array.from({ length: SIGN_IN_ACCOUNTS }, (_, index) => `load-${index}@load.example`)
  const accounts = await User.bulkCreate(
    emails.map((email, index) => ({ email, displayName: `Load Person ${index}`, passwordHash, roles: ['quilter' as const], emailVerifiedAt: new Date(), designerRequestedAt: null })),
  )
  // The sewing room: the first TICK_PROJECTS accounts buy the demo wreath and start a project of it.
  if (pattern.state !== 'published') await pattern.update({ state: 'published' })
  const quilters = []
  for (const quilter of accounts.slice(0, TICK_PROJECTS)) {
    const order = await Order.create({ id: crypto.randomUUID(), buyerId: quilter.id, patternId: pattern.id, amountCents: 1400, currency: 'USD', checkoutSessionId: `cs_load_${crypto.randomUUID()}`, state: 'paid' })
    const licence = await Licence.create({ userId: quilter.id, patternId: pattern.id, orderId: order.id })
    quilters.push({ licenceId: licence.id, cookie: await sessionCookieFor(quilter) })
  }
  await closeDatabase()
  const projects: { id: string; cookie: string }[] = []
  for (const { licenceId, cookie } of quilters) {
    const answer = await fetch(`${base}/api/sewing-room/projects`, {
      method: 'POST',
      headers: { cookie, origin: base, 'content-type': 'application/json' },
      body: JSON.stringify({ licenceId, colorway: 0, diameterIn: 18, paper: 'letter' }),
    })
    if (answer.status !== 201) throw new Error(`starting a sewing project: HTTP ${answer.status} ${await answer.text()}`)
    projects.push({ id: ((await answer.json()) as { project: { id: string } }).project.id, cookie })
  }
  const detail = await fetch(`${base}/api/sewing-room/projects/${projects[0]!.id}`, { headers: { cookie: projects[0]!.cookie } })
  const stepIds = ((await detail.json()) as { steps: { id: string }[] }).steps.map((step) => step.id)
  if (stepIds.length === 0) throw new Error('the demo wreath\'s project has no steps')

  let signIns = 0
  let ticks = 0
  let planReads = 0
  let planRefreshes = 0
  /** Each project's plan's current ETag, as a sewing room page holds it between refreshes. */
  const planTags = new Map<string, string>()
  const targets: Target[] = [
    { name: 'bare', kind: 'bare', label: 'GET /api/health/bare', options: { url: `${base}/api/health/bare` } },
    { name: 'shop list', kind: 'read', label: 'GET /api/shop/patterns', options: { url: `${base}/api/shop/patterns` } },
    { name: 'one statement', kind: 'probe', label: 'GET /api/health (SELECT 1: one round trip to PostgreSQL)', options: { url: `${base}/api/health` } },
    { name: 'shop page', kind: 'page', label: 'GET /shop, the shop list as HTML', options: { url: `${base}/shop` } },
    { name: 'pattern read', kind: 'read', label: `GET /api/patterns/:id (Hollyberry Wreath, as its designer)`, options: { url: `${base}/api/patterns/${pattern.id}`, headers: { cookie: designerCookie } } },
    {
      name: 'plan',
      kind: 'read',
      label: `GET /api/sewing-room/projects/:id (the sewing plan of a quilter's project: ${TICK_PROJECTS} projects in turn)`,
      rotation: TICK_PROJECTS,
      options: {
        requests: [
          {
            method: 'GET',
            setupRequest: (request) => {
              const project = projects[planReads++ % projects.length]!
              return { ...request, path: `/api/sewing-room/projects/${project.id}`, headers: { ...request.headers, cookie: project.cookie } }
            },
          },
        ],
      },
    },
    {
      name: 'plan refresh',
      kind: 'read',
      label: `GET /api/sewing-room/projects/:id with If-None-Match, as the sewing room asks every half minute: unchanged, 304`,
      rotation: TICK_PROJECTS,
      status: 304,
      prepare: async () => {
        for (const project of projects) {
          const answer = await fetch(`${base}/api/sewing-room/projects/${project.id}`, { headers: { cookie: project.cookie } })
          await answer.arrayBuffer()
          const etag = answer.headers.get('etag')
          if (answer.status !== 200 || !etag) throw new Error(`plan refresh: project ${project.id} answered HTTP ${answer.status} ${etag ? '' : 'without an ETag'}`.trim())
          planTags.set(project.id, etag)
        }
      },
      options: {
        requests: [
          {
            method: 'GET',
            setupRequest: (request) => {
              const project = projects[planRefreshes++ % projects.length]!
              return { ...request, path: `/api/sewing-room/projects/${project.id}`, headers: { ...request.headers, cookie: project.cookie, 'if-none-match': planTags.get(project.id)! } }
            },
          },
        ],
      },
    },
    { name: 'pattern page', kind: 'page', label: `GET /shop/:id (${listed.name}: its covers drawn from the plan)`, options: { url: `${base}/shop/${listed.id}` } },
    {
      name: 'tick',
      kind: 'write',
      label: `PATCH /api/sewing-room/projects/:id/steps (${TICK_PROJECTS} projects of ${stepIds.length} steps, ticked and unticked in turn)`,
      options: {
        requests: [
          {
            method: 'PATCH',
            setupRequest: (request) => {
              const index = ticks++
              const project = projects[index % projects.length]!
              const round = Math.floor(index / projects.length)
              return {
                ...request,
                path: `/api/sewing-room/projects/${project.id}/steps`,
                headers: { ...request.headers, cookie: project.cookie, origin: base, 'content-type': 'application/json' },
                body: JSON.stringify({ stepId: stepIds[round % stepIds.length], done: Math.floor(round / stepIds.length) % 2 === 0 }),
              }
            },
          },
        ],
      },
    },
    {
      name: 'sign-in',
      kind: 'write',
      label: `POST /api/auth/sign-in (${SIGN_IN_ACCOUNTS} accounts, each from its own address)`,
      options: {
        requests: [
          {
            method: 'POST',
            path: '/api/auth/sign-in',
            setupRequest: (request) => {
              const index = signIns++ % SIGN_IN_ACCOUNTS
              const address = `198.${18 + (index >> 16)}.${(index >> 8) & 255}.${index & 255}`
              return {
                ...request,
                headers: { ...request.headers, origin: base, 'content-type': 'application/json', 'x-forwarded-for': address },
                body: JSON.stringify({ email: emails[index], password: TEST_PASSWORD }),
              }
            },
          },
        ],
      },
    },
  ]

  // LOAD_ONLY=name,name measures only those targets (and the bare handler, the baseline).
  const only = process.env.LOAD_ONLY?.split(',').map((name) => name.trim())
  if (only) {
    const unknown = only.filter((name) => !targets.some((target) => target.name === name))
    if (unknown.length > 0) throw new Error(`LOAD_ONLY names no target ${unknown.join(', ')} (there are ${targets.map((target) => target.name).join(', ')})`)
    targets.splice(0, targets.length, ...targets.filter((target) => target.kind === 'bare' || only.includes(target.name)))
  }
  const loadAverage = () => os.loadavg().map((value) => value.toFixed(1)).join(' ')
  console.log(`\nload: ${base}, next start in ${WEB_PROCESSES} web process${WEB_PROCESSES === 1 ? '' : 'es'} (scripts/serve.ts), ${os.cpus().length} cores; each run ${SECONDS} s, at most ${MAX_REQUESTS_PER_RUN} requests`)
  // The machine's load before measuring: other work on its cores lowers every figure below.
  console.log(`  load average (1, 5, 15 min) before measuring: ${loadAverage()}`)
  for (const target of targets) console.log(`  ${target.name.padEnd(13)} ${target.label}`)
  const all: Figures[] = []
  for (const connections of CONNECTIONS) {
    for (const target of targets) {
      // Warm up right before each run: the first requests to a route load its bundle, V8 compiles
      // what runs hot, and the web process keeps the answers a read makes (lib/row-changes.ts),
      // which a target measured earlier may have changed (the tick drops its project's plan).
      await target.prepare?.()
      const warm = await measure(base, target, 10, WARM_UP_SECONDS)
      const stillToWarm = target.rotation ? target.rotation * WEB_PROCESSES * WARM_UP_ROUNDS_PER_PROCESS - warm.total : 0
      const more = stillToWarm > 0 ? await measure(base, target, 10, TIMEOUT_SECONDS, stillToWarm) : undefined
      for (const run of [warm, more]) if (run && run.errors > 0) console.log(`  warm-up of ${target.name}: ${run.errors} errors (${run.errorKinds})`)
      const figures = await measure(base, target, connections, SECONDS)
      all.push(figures)
      console.log(`  ${target.name} at ${connections}: ${figures.requestsPerSecond.toFixed(0)} req/s, p50 ${figures.p50} ms, p99 ${figures.p99} ms, ${(figures.bytesPerAnswer / 1024).toFixed(1)} KiB an answer, ${figures.errors} errors${figures.errorKinds ? ` (${figures.errorKinds})` : ''}`)
    }
  }
  console.log(`\nload: summary (goals: 0 errors; reads at 50 connections p99 < ${READ_P99_GOAL_MS} ms and ≥ ${READ_SHARE_GOAL * 100} % of bare req/s); load average after: ${loadAverage()}`)
  const met = printTable(all)
  console.log(met ? '\nload: every goal met' : '\nload: some goals MISSED (see the goals column)')
} catch (error) {
  console.error(`load: ${(error as Error).message}`)
  process.exitCode = 1
} finally {
  clearTimeout(watchdog)
  await stopAll()
}
