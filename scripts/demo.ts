/**
 * npm run demo — starts Wreathwright with demo data on http://127.0.0.1:3000.
 * PostgreSQL runs in a project-local cluster (.data/, or /var/lib/wreathwright when the project sits
 * under a folder the postgres user cannot enter). Data is kept between runs; the password of its
 * postgres role is in .data/postgres-<port>.password (mode 600). Ctrl-C stops everything this
 * script started.
 * Uploads go to a local S3-compatible object store (s3rver) on 127.0.0.1, objects kept in
 * .data/objects/, stopped with the rest.
 * Every message the app sends goes to a local mail catcher (maildev): SMTP on 127.0.0.1:54332, its
 * web view on http://127.0.0.1:54331, messages kept in .data/mail/, stopped with the rest.
 * Payments go to a local fake of the payment provider (scripts/payment-fake.ts) on
 * http://127.0.0.1:54333: its test payment page has "Pay" and "Cancel" buttons, and it sends the
 * signed events to the app's webhook. No money moves; it forgets everything when stopped.
 * Buyers' booklets are built by the booklet worker (scripts/booklet-worker.ts), a process of its
 * own beside the app, stopped with the rest.
 * Settings: WREATHWRIGHT_DB_PORT (default 54329), WREATHWRIGHT_S3_PORT (default 54330),
 * WREATHWRIGHT_MAIL_PORT (the catcher's web view, default 54331), WREATHWRIGHT_SMTP_PORT (default 54332),
 * WREATHWRIGHT_PAYMENTS_PORT (default 54333), PORT (default 3000).
 */
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { isPortTaken, run, startProcess, stopProcess, waitForHttp } from './processes'
import { startMailCatcher, type MailCatcher } from './mail-catcher'
import { startObjectStore, type ObjectStore } from './object-store'
import { startPaymentFake, type PaymentFake } from './payment-fake'
import { isClusterRunning, projectClusterFolder, projectPasswordFile, startCluster, type Cluster } from './postgres'

const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..')
const databasePort = Number(process.env.WREATHWRIGHT_DB_PORT ?? 54329)
const appPort = Number(process.env.PORT ?? 3000)
const objectStorePort = Number(process.env.WREATHWRIGHT_S3_PORT ?? 54330)
const mailWebPort = Number(process.env.WREATHWRIGHT_MAIL_PORT ?? 54331)
const smtpPort = Number(process.env.WREATHWRIGHT_SMTP_PORT ?? 54332)
const paymentsPort = Number(process.env.WREATHWRIGHT_PAYMENTS_PORT ?? 54333)

/** A problem the person running the demo can fix: one line on stderr, exit code 2, no stack trace. */
function refuse(message: string): never {
  console.error(`demo: ${message}`)
  process.exit(2)
}

if (await isPortTaken(appPort)) refuse(`something already listens on 127.0.0.1:${appPort}; stop it or set PORT`)
const clusterFolder = projectClusterFolder(projectRoot, databasePort)
// The demo's own PostgreSQL from an earlier run may still listen there: that one is reused.
const clusterWasRunning = isClusterRunning(clusterFolder)
if (!clusterWasRunning && (await isPortTaken(databasePort))) {
  refuse(`something else already listens on 127.0.0.1:${databasePort}, where the demo's PostgreSQL goes; stop it or set WREATHWRIGHT_DB_PORT`)
}

if (await isPortTaken(objectStorePort)) {
  refuse(`something already listens on 127.0.0.1:${objectStorePort}, where the demo's object store goes; stop it or set WREATHWRIGHT_S3_PORT`)
}
if (await isPortTaken(mailWebPort)) {
  refuse(`something already listens on 127.0.0.1:${mailWebPort}, where the demo's mail catcher shows its messages; stop it or set WREATHWRIGHT_MAIL_PORT`)
}
if (await isPortTaken(smtpPort)) {
  refuse(`something already listens on 127.0.0.1:${smtpPort}, where the demo's mail catcher takes messages; stop it or set WREATHWRIGHT_SMTP_PORT`)
}
if (await isPortTaken(paymentsPort)) {
  refuse(`something already listens on 127.0.0.1:${paymentsPort}, where the demo's payment fake goes; stop it or set WREATHWRIGHT_PAYMENTS_PORT`)
}

let cluster: Cluster
try {
  cluster = startCluster(clusterFolder, databasePort, { passwordFile: projectPasswordFile(projectRoot, databasePort) })
  cluster.createDatabase('wreathwright')
} catch (error) {
  console.error(`demo: could not start PostgreSQL: ${(error as Error).message.trim()}`)
  process.exit(1)
}
let objectStore: ObjectStore
try {
  objectStore = await startObjectStore(path.join(projectRoot, '.data', 'objects'), objectStorePort, 'wreathwright')
} catch (error) {
  console.error(`demo: could not start the object store: ${(error as Error).message.trim()}`)
  if (!clusterWasRunning) cluster.stop()
  process.exit(1)
}
let mailCatcher: MailCatcher
try {
  mailCatcher = await startMailCatcher(path.join(projectRoot, '.data', 'mail'), mailWebPort, smtpPort)
} catch (error) {
  console.error(`demo: could not start the mail catcher: ${(error as Error).message.trim()}`)
  await objectStore.stop().catch(() => undefined)
  if (!clusterWasRunning) cluster.stop()
  process.exit(1)
}
let paymentFake: PaymentFake
try {
  paymentFake = await startPaymentFake({ port: paymentsPort, webhookUrl: `http://127.0.0.1:${appPort}/api/webhooks/payments` })
} catch (error) {
  console.error(`demo: could not start the payment fake: ${(error as Error).message.trim()}`)
  await mailCatcher.stop().catch(() => undefined)
  await objectStore.stop().catch(() => undefined)
  if (!clusterWasRunning) cluster.stop()
  process.exit(1)
}
const env = {
  ...process.env,
  ...objectStore.env,
  ...mailCatcher.env,
  ...paymentFake.env,
  DATABASE_URL: cluster.url('wreathwright'),
  NEXT_TELEMETRY_DISABLED: '1',
  // The demo serves plain http on loopback; a Secure cookie would not be sent back.
  SESSION_COOKIE_SECURE: 'false',
  // The app's own origin, for its origin check: the loopback address it is started on.
  PUBLIC_URL: `http://127.0.0.1:${appPort}`,
}
process.env.DATABASE_URL = env.DATABASE_URL
// The seed runs in this process and stores the demo's report photos in the object store.
Object.assign(process.env, objectStore.env)

let app: ReturnType<typeof startProcess> | undefined
let bookletWorker: ReturnType<typeof startProcess> | undefined
let stopping = false
async function stopAll(code: number): Promise<never> {
  if (!stopping) {
    stopping = true
    await stopProcess(app)
    await stopProcess(bookletWorker)
    await objectStore.stop().catch((error: Error) => console.error(`demo: could not stop the object store: ${error.message}`))
    await mailCatcher.stop().catch((error: Error) => console.error(`demo: could not stop the mail catcher: ${error.message}`))
    await paymentFake.stop().catch((error: Error) => console.error(`demo: could not stop the payment fake: ${error.message}`))
    if (!clusterWasRunning) {
      try {
        cluster.stop()
      } catch (error) {
        console.error(`demo: could not stop PostgreSQL: ${(error as Error).message}`)
      }
    }
  }
  process.exit(code)
}
process.on('SIGINT', () => void stopAll(0))
process.on('SIGTERM', () => void stopAll(0))

try {
  if ((await run('npx', ['tsx', 'scripts/migrate.ts', 'up'], env)) !== 0) throw new Error('migrations failed')
  const { seedDemoData, DEMO_PEOPLE, DEMO_PASSWORD } = await import('./demo-data')
  const { closeDatabase } = await import('../lib/db')
  const loaded = await seedDemoData()
  await closeDatabase()
  console.log(`demo: demo data ready (${loaded.people} people and ${loaded.patterns} patterns added this time)`)

  if ((await run('npx', ['next', 'build'], env)) !== 0) throw new Error('next build failed')
  app = startProcess('npx', ['next', 'start', '--hostname', '127.0.0.1', '--port', String(appPort)], env)
  app.once('exit', (code) => !stopping && void stopAll(code ?? 1))
  await waitForHttp(`http://127.0.0.1:${appPort}/api/health`)
  bookletWorker = startProcess('npx', ['tsx', '--conditions=react-server', 'scripts/booklet-worker.ts'], env, { quiet: true })
  bookletWorker.once('exit', (code) => !stopping && void stopAll(code ?? 1))

  console.log(`
Wreathwright is running. What the demo started, one line each:
app: http://127.0.0.1:${appPort}
database: http://127.0.0.1:${databasePort} (PostgreSQL; data in ${cluster.folder}, password in ${projectPasswordFile(projectRoot, databasePort)})
object-store: ${objectStore.url} (S3-compatible, bucket ${objectStore.bucket}; data in ${objectStore.folder})
mail: ${mailCatcher.url} (every message the app sends, caught; SMTP on 127.0.0.1:${mailCatcher.smtpPort})
payments: ${paymentFake.url} (the payment provider's local fake: test payment pages, signed events to the app; no money moves)
booklet-worker: started (pid ${bookletWorker.pid}; builds buyers' booklets off the web process)

Demo sign-ins (password for all: ${DEMO_PASSWORD}):
${DEMO_PEOPLE.map((person) => `  ${person.email.padEnd(34)} ${person.note}`).join('\n')}

Press Ctrl-C to stop.`)
} catch (error) {
  console.error(`demo: ${(error as Error).message}`)
  await stopAll(1)
}
