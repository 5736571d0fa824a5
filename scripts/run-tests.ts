/**
 * npm test — every test, against real services started here and stopped at the end:
 *   1. ESLint and knip (unused files, exports, dependencies) over the whole project, as `npm run lint`;
 *   2. a throwaway PostgreSQL cluster in a temporary folder, on a free loopback port, with a
 *      throwaway password (in that folder, mode 600; the database URLs carry it);
 *   3. a throwaway S3-compatible object store (s3rver) in that folder, on a free loopback port;
 *   4. a mail catcher (maildev), SMTP and web view on free loopback ports: the app and the
 *      integration tests send to it, the tests read what came through its API (MAIL_CATCHER_URL);
 *      and the payment provider's local fake (scripts/payment-fake.ts) on a free loopback port: the
 *      integration tests point its webhooks at themselves, the end-to-end run at the app;
 *   5. unit and integration tests (vitest), the integration ones against that database, store and catcher;
 *   6. when the filters select an end-to-end test (or there are none), the app built and started
 *      on a free port with demo data in a second database, with the
 *      booklet worker (scripts/booklet-worker.ts) beside it on that database (the integration tests
 *      of booklets start their own worker, so that they know which process built what);
 *   7. end-to-end tests in headless Debian Chromium (playwright-core) against it.
 * Exits non-zero if anything failed, a lint finding included. Pass vitest filters after `--`, e.g.
 * `npm test -- shelf`; they narrow the tests, never the lint, which always covers every file.
 */
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { startMailCatcher, type MailCatcher } from './mail-catcher'
import { startObjectStore, type ObjectStore } from './object-store'
import { startPaymentFake, type PaymentFake } from './payment-fake'
import { freePort, run, startProcess, stopProcess, waitForHttp } from './processes'
import { startCluster, type Cluster } from './postgres'
import { selectsEndToEndTests } from './test-selection'

const filters = process.argv.slice(2)
const workFolder = fs.mkdtempSync(path.join(os.tmpdir(), 'wreathwright-test-'))
fs.chmodSync(workFolder, 0o755)
const reports = path.join(workFolder, 'reports')
fs.mkdirSync(reports)

let cluster: Cluster | undefined
let app: ReturnType<typeof startProcess> | undefined
let objectStore: ObjectStore | undefined
let mailCatcher: MailCatcher | undefined
let paymentFake: PaymentFake | undefined
let bookletWorker: ReturnType<typeof startProcess> | undefined

async function cleanUp(): Promise<void> {
  await stopProcess(app)
  await stopProcess(bookletWorker)
  await objectStore?.stop().catch((error: Error) => console.error(`tests: could not stop the object store: ${error.message}`))
  await mailCatcher?.stop().catch((error: Error) => console.error(`tests: could not stop the mail catcher: ${error.message}`))
  await paymentFake?.stop().catch((error: Error) => console.error(`tests: could not stop the payment fake: ${error.message}`))
  try {
    cluster?.stop()
  } catch (error) {
    console.error(`tests: could not stop PostgreSQL: ${(error as Error).message}`)
  }
  fs.rmSync(workFolder, { recursive: true, force: true })
}
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => void cleanUp().then(() => process.exit(130)))
}

interface VitestReport {
  numPassedTests: number
  numFailedTests: number
  numPendingTests: number
  numTodoTests: number
  testResults: {
    name: string
    status: string
    message?: string
    assertionResults: { status: string; fullName: string; failureMessages: string[] }[]
  }[]
}

/**
 * The failed tests of a vitest JSON report, a line each with the first line of its failure, so that
 * the end of a long run (all a CI log may keep) still says what failed.
 */
function failureLines(file: string): string[] {
  if (!fs.existsSync(file)) return []
  const report = JSON.parse(fs.readFileSync(file, 'utf8')) as VitestReport
  const firstLine = (text: string | undefined) => (text ?? '').split('\n').find((line) => line.trim() !== '')?.trim() ?? ''
  return report.testResults.flatMap((result) => {
    const where = path.relative(process.cwd(), result.name)
    const failedTests = result.assertionResults.filter((test) => test.status === 'failed')
    if (failedTests.length === 0) return result.status === 'failed' ? [`${where}: ${firstLine(result.message)}`] : []
    return failedTests.map((test) => `${where} > ${test.fullName}: ${firstLine(test.failureMessages[0])}`.slice(0, 400))
  })
}

/** Counts from vitest's JSON report, so the run can end on one plain "N passed, N failed" line. */
function readCounts(file: string): { passed: number; failed: number; skipped: number } {
  if (!fs.existsSync(file)) return { passed: 0, failed: 1, skipped: 0 }
  const report = JSON.parse(fs.readFileSync(file, 'utf8')) as VitestReport
  // A file that failed to load has no failed test but must still count as a failure.
  const brokenFiles = report.testResults.filter((result) => result.status === 'failed').length
  return {
    passed: report.numPassedTests,
    failed: report.numFailedTests > 0 ? report.numFailedTests : brokenFiles,
    skipped: report.numPendingTests + report.numTodoTests,
  }
}

const vitest = (projects: string[], report: string, env: NodeJS.ProcessEnv) =>
  run('npx', ['vitest', 'run', ...projects.flatMap((p) => ['--project', p]), '--reporter=default', '--reporter=json',
    `--outputFile.json=${report}`, ...(filters.length > 0 ? ['--passWithNoTests', ...filters] : [])], env)

const failedSteps: string[] = []
const baseEnv = { ...process.env, NEXT_TELEMETRY_DISABLED: '1' }
// Only the e2e tests need the built app: an integration-only filter skips building it (minutes).
const endToEnd = selectsEndToEndTests(filters, reports)
// Lint first: it needs no services, and a finding fails the run however the tests go.
console.log('\n== lint (ESLint, then knip for unused files, exports and dependencies) ==')
if ((await run('npx', ['eslint', '--max-warnings', '0', '.'], baseEnv)) !== 0) failedSteps.push('lint')
if ((await run('npx', ['knip'], baseEnv)) !== 0) failedSteps.push('unused code')
try {
  const databasePort = await freePort()
  cluster = startCluster(path.join(workFolder, 'postgres'), databasePort, {
    throwaway: true,
    passwordFile: path.join(workFolder, 'postgres.password'),
  })
  cluster.createDatabase('wreathwright_test')
  cluster.createDatabase('wreathwright_e2e')
  objectStore = await startObjectStore(path.join(workFolder, 'objects'), await freePort(), 'wreathwright-test')
  mailCatcher = await startMailCatcher(path.join(workFolder, 'mail'), await freePort(), await freePort())
  // The app's mail settings, plus the catcher's address for the tests that read what it caught.
  const mailEnv = { ...mailCatcher.env, MAIL_CATCHER_URL: mailCatcher.url }
  paymentFake = await startPaymentFake({ port: await freePort() })
  // Quick polling, so a webhook's effect (a licence) shows within a second.
  const paymentEnv = { ...paymentFake.env, PAYMENTS_POLL_SECONDS: '0.5' }

  console.log('\n== unit and integration tests ==')
  const testEnv = {
    ...baseEnv,
    ...objectStore.env,
    ...mailEnv,
    ...paymentEnv,
    // Quick retries and polling, so a test of a failing SMTP server sees the last try within seconds.
    MAIL_RETRY_LIMIT: '2',
    MAIL_RETRY_DELAY_SECONDS: '1',
    MAIL_POLL_SECONDS: '0.5',
    DATABASE_URL: cluster.url('wreathwright_test'),
    NODE_ENV: 'test' as const,
  }
  if ((await vitest(['unit', 'integration'], path.join(reports, 'unit.json'), testEnv)) !== 0) failedSteps.push('unit/integration')

  if (!endToEnd) {
    console.log('\n== end-to-end tests: none selected by the filter, so the app is not built ==')
  } else {
    console.log('\n== build and start the app for end-to-end tests ==')
    const e2eEnv = { ...baseEnv, ...objectStore.env, ...mailEnv, ...paymentEnv, MAIL_POLL_SECONDS: '0.5', DATABASE_URL: cluster.url('wreathwright_e2e'), SESSION_COOKIE_SECURE: 'false' }
    const prepared =
      (await run('npx', ['tsx', 'scripts/migrate.ts', 'up'], e2eEnv)) === 0 &&
      (await run('npx', ['tsx', 'scripts/seed-demo.ts'], e2eEnv)) === 0 &&
      (await run('npx', ['next', 'build'], e2eEnv)) === 0
    if (!prepared) {
      failedSteps.push('app build')
    } else {
      const appPort = await freePort()
      // The app's own origin, for its origin check: the loopback address it is started on here.
      const appEnv = { ...e2eEnv, PUBLIC_URL: `http://127.0.0.1:${appPort}` }
      // The provider's events go to the app's webhook from here on (the integration tests had them).
      paymentFake.setWebhookUrl(`http://127.0.0.1:${appPort}/api/webhooks/payments`)
      app = startProcess('npx', ['next', 'start', '--hostname', '127.0.0.1', '--port', String(appPort)], appEnv, { quiet: true })
      bookletWorker = startProcess('npx', ['tsx', '--conditions=react-server', 'scripts/booklet-worker.ts'], { ...appEnv, BOOKLET_POLL_SECONDS: '0.5' }, { quiet: true })
      await waitForHttp(`http://127.0.0.1:${appPort}/api/health`)
      console.log('\n== end-to-end tests (headless Chromium) ==')
      const browserEnv = { ...e2eEnv, E2E_BASE_URL: `http://127.0.0.1:${appPort}` }
      if ((await vitest(['e2e'], path.join(reports, 'e2e.json'), browserEnv)) !== 0) failedSteps.push('e2e')
    }
  }
} catch (error) {
  console.error(`tests: ${(error as Error).message}`)
  failedSteps.push('setup')
}

const reportFiles = [path.join(reports, 'unit.json'), path.join(reports, 'e2e.json')]
const failures = reportFiles.flatMap(failureLines)
const counts = reportFiles
  .filter((file) => fs.existsSync(file))
  .map(readCounts)
  .reduce((sum, c) => ({ passed: sum.passed + c.passed, failed: sum.failed + c.failed, skipped: sum.skipped + c.skipped }), {
    passed: 0,
    failed: 0,
    skipped: 0,
  })
await cleanUp()
if (failures.length > 0) console.error(`\ntests: what failed:\n${failures.map((line) => `  ${line}`).join('\n')}`)
if (failedSteps.length > 0) console.error(`\ntests: failed steps: ${failedSteps.join(', ')}`)
const failed = counts.failed || (failedSteps.length > 0 ? 1 : 0)
console.log(`\n${counts.passed} passed, ${failed} failed${counts.skipped ? `, ${counts.skipped} skipped` : ''}`)
process.exit(failedSteps.length > 0 ? 1 : 0)
