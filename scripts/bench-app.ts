/**
 * What the browser and request benchmarks share: a throwaway PostgreSQL, the built app started on
 * a free loopback port (as the test runner does), Debian's Chromium, and a signed-in demo designer.
 */
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { chromium, type Browser, type Page } from 'playwright-core'
import { DEMO_PASSWORD } from './demo-data'
import { startCluster } from './postgres'
import { freePort, run, startProcess, stopProcess, waitForHttp } from './processes'

/** The p-th percentile of sorted figures (nearest rank). */
export const percentile = (sorted: readonly number[], p: number): number => sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]!

export interface BenchApp {
  /** The app's origin, e.g. `http://127.0.0.1:41234`. */
  readonly base: string
  /** Stops the app and the database and removes the work folder. */
  stop(): Promise<void>
}

/** Migrates a fresh database (with the demo data when asked), builds the app and starts it. */
export async function startBenchApp({ demoData }: { demoData: boolean }): Promise<BenchApp> {
  const work = fs.mkdtempSync(path.join(os.tmpdir(), 'wreathwright-bench-'))
  fs.chmodSync(work, 0o755)
  const cluster = startCluster(path.join(work, 'postgres'), await freePort(), { throwaway: true, passwordFile: path.join(work, 'postgres.password') })
  let app: ReturnType<typeof startProcess> | undefined
  const stop = async () => {
    await stopProcess(app)
    cluster.stop()
    fs.rmSync(work, { recursive: true, force: true })
  }
  try {
    cluster.createDatabase('wreathwright_bench')
    const env = { ...process.env, DATABASE_URL: cluster.url('wreathwright_bench'), SESSION_COOKIE_SECURE: 'false', NEXT_TELEMETRY_DISABLED: '1' }
    const steps: [string, string[]][] = [['npx', ['tsx', 'scripts/migrate.ts', 'up']], ...(demoData ? [['npx', ['tsx', 'scripts/seed-demo.ts']] as [string, string[]]] : []), ['npx', ['next', 'build']]]
    for (const [command, args] of steps) {
      if ((await run(command, args, env)) !== 0) throw new Error(`${args.join(' ')} failed`)
    }
    const port = await freePort()
    const base = `http://127.0.0.1:${port}`
    app = startProcess('npx', ['next', 'start', '--hostname', '127.0.0.1', '--port', String(port)], { ...env, PUBLIC_URL: base }, { quiet: true })
    await waitForHttp(`${base}/api/health`)
    return { base, stop }
  } catch (error) {
    await stop()
    throw error
  }
}

/** Debian's Chromium, headless, with the flags this machine needs (no network of its own). */
export function launchBenchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  })
}

/** A page signed in as the demo designer Marguerite. */
export async function signedInDesignerPage(browser: Browser, base: string): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 1280, height: 800 } })
  await page.goto(`${base}/sign-in`)
  await page.getByLabel('E-mail address').fill('marguerite@bramblelane.example')
  await page.getByLabel('Password').fill(DEMO_PASSWORD)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.getByTestId('signed-in-as').waitFor()
  return page
}
