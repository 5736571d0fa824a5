/**
 * Board speed: while the end of a seam in a 40-area repeat is dragged across the board in
 * headless Chromium, the time from each pointer move to the canvas having drawn the result
 * (which the browser paints at the end of that frame). Prints the median and 95th percentile.
 * Goal (issue 5): median under 16 ms, 95th percentile under 33 ms on a 2-core machine.
 *
 * Starts its own throwaway PostgreSQL and the built app, like the test runner.
 */
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { chromium } from 'playwright-core'
import { DEMO_PASSWORD } from './demo-data'
import { startCluster } from './postgres'
import { freePort, run, startProcess, stopProcess, waitForHttp } from './processes'

const MOVES = 200

/** 40 areas: 39 chords across a quarter of a 24 in ring, one section peeled band by band. */
function fortyAreaDesign() {
  const seams = Array.from({ length: 39 }, (_, i) => {
    const r = 0.3 * (i + 1)
    return { id: `c${i + 1}`, from: [r, 0], to: [0, r] }
  })
  return {
    format: 'wreathwright-design',
    version: 1,
    name: 'Bench rings',
    units: 'in',
    ring: { innerRadius: 0, outerRadius: 12, repeats: 4, repeatMode: 'rotate' },
    seams,
  }
}

const percentile = (sorted: number[], p: number) => sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]!

const work = fs.mkdtempSync(path.join(os.tmpdir(), 'wreathwright-bench-'))
fs.chmodSync(work, 0o755)
const cluster = startCluster(path.join(work, 'postgres'), await freePort(), { throwaway: true, passwordFile: path.join(work, 'postgres.password') })
let app: ReturnType<typeof startProcess> | undefined
try {
  cluster.createDatabase('wreathwright_bench')
  const env = { ...process.env, DATABASE_URL: cluster.url('wreathwright_bench'), SESSION_COOKIE_SECURE: 'false', NEXT_TELEMETRY_DISABLED: '1' }
  for (const [command, args] of [['npx', ['tsx', 'scripts/migrate.ts', 'up']], ['npx', ['tsx', 'scripts/seed-demo.ts']], ['npx', ['next', 'build']]] as const) {
    if ((await run(command, [...args], env)) !== 0) throw new Error(`${args.join(' ')} failed`)
  }
  const port = await freePort()
  const base = `http://127.0.0.1:${port}`
  app = startProcess('npx', ['next', 'start', '--hostname', '127.0.0.1', '--port', String(port)], { ...env, PUBLIC_URL: base }, { quiet: true })
  await waitForHttp(`${base}/api/health`)

  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  })
  const page = await browser.newPage({ viewport: { width: 1280, height: 800 } })
  await page.goto(`${base}/sign-in`)
  await page.getByLabel('E-mail address').fill('marguerite@bramblelane.example')
  await page.getByLabel('Password').fill(DEMO_PASSWORD)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.getByTestId('signed-in-as').waitFor()
  const id = await page.evaluate(async (design) => {
    const response = await fetch('/api/patterns', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ name: 'Bench rings', design }) })
    return ((await response.json()) as { pattern: { id: string } }).pattern.id
  }, fortyAreaDesign())
  await page.goto(`${base}/patterns/${id}/board`)
  await page.getByTestId('plan-panel').waitFor()
  await page.waitForFunction(() => window.wreathwrightStage && window.wreathwrightBoard)

  // tsx keeps function names with a helper that the page does not have.
  await page.evaluate('window.__name = (fn) => fn')
  // Record, in the page, when each pointer move arrived (the event's own time stamp) and when
  // the ring layer finished drawing; real mouse input comes through Chromium's input pipeline.
  await page.evaluate(() => {
    const stage = window.wreathwrightStage!
    const record = { moves: [] as number[], draws: [] as number[] }
    ;(window as unknown as { benchRecord: typeof record }).benchRecord = record
    stage.content.addEventListener('pointermove', (event) => record.moves.push(event.timeStamp), { capture: true })
    stage.getLayers()[0]!.on('draw.bench', () => record.draws.push(performance.now()))
  })
  const view = await page.evaluate(() => window.wreathwrightBoard!.getState().view)
  const box = (await page.getByTestId('board-canvas').boundingBox())!
  const screen = (x: number, y: number) => [box.x + view.centre[0] + x * view.zoom, box.y + view.centre[1] - y * view.zoom] as const
  // Seam c20 runs from (6, 0) to (0, 6); its upper end is dragged up and down the y axis.
  await page.mouse.move(...screen(0, 6))
  await page.mouse.down()
  for (let i = 0; i < MOVES; i += 1) {
    await page.mouse.move(...screen(0.02, 6 + 2.5 * Math.sin((i / MOVES) * Math.PI * 4)))
    // Pointer moves arrive at most once a frame from a real mouse.
    await page.waitForTimeout(16)
  }
  await page.mouse.up()
  await page.waitForTimeout(200)
  const record = await page.evaluate(() => (window as unknown as { benchRecord: { moves: number[]; draws: number[] } }).benchRecord)
  const timings = record.moves.flatMap((moved) => {
    const drawn = record.draws.find((time) => time >= moved)
    return drawn === undefined ? [] : [drawn - moved]
  })
  await browser.close()

  const sorted = [...timings].sort((a, b) => a - b)
  console.log(`board drag, 40-area repeat (${MOVES} pointer moves in headless Chromium):`)
  console.log(`  pointer move → canvas drawn: median ${percentile(sorted, 50).toFixed(1)} ms, 95th percentile ${percentile(sorted, 95).toFixed(1)} ms, worst ${sorted.at(-1)!.toFixed(1)} ms`)
  console.log('  goal: median < 16 ms, 95th percentile < 33 ms')
} finally {
  await stopProcess(app)
  cluster.stop()
  fs.rmSync(work, { recursive: true, force: true })
}
