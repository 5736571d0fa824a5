/**
 * Board at the limit: how long a design at the limits of lib/limits.ts (400 seams, 400 berries,
 * 100 curls of 100 points) takes to open on the drafting board in headless Chromium, from the
 * navigation to the plan panel showing its plan. Prints the figure of each of a few openings.
 * Goal (issue 10): under 2 s. A figure, not a test.
 *
 * Starts its own throwaway PostgreSQL and the built app, like the test runner.
 */
import { MAX_BERRIES, MAX_CURLS, MAX_POINTS_PER_CURL, MAX_SEAMS } from '../lib/limits'
import { launchBenchBrowser, signedInDesignerPage, startBenchApp } from './bench-app'

const OPENINGS = 5

/** 400 chords across a quarter of a 24 in ring (401 areas, one section), with berries and curls at their limits. */
function designAtTheLimit() {
  const radius = 12
  const seams = Array.from({ length: MAX_SEAMS }, (_, i) => {
    const r = (11.9 * (i + 1)) / (MAX_SEAMS + 1)
    return { id: `c${i + 1}`, from: [r, 0], to: [0, r] }
  })
  const polar = (r: number, turn: number) => [r * Math.cos((turn * Math.PI) / 2), r * Math.sin((turn * Math.PI) / 2)]
  const berries = Array.from({ length: MAX_BERRIES }, (_, i) => ({ at: polar(3 + (i % 20) * 0.4, (i + 0.5) / MAX_BERRIES), finishedDiameter: 0.25, fabric: 'berry' }))
  const curls = Array.from({ length: MAX_CURLS }, (_, c) => ({
    points: Array.from({ length: MAX_POINTS_PER_CURL }, (_, p) => polar(2 + c * 0.09 + p * 0.002, (p + 1) / (MAX_POINTS_PER_CURL + 2))),
  }))
  return {
    format: 'wreathwright-design',
    version: 1,
    name: 'Bench limit',
    units: 'in',
    ring: { innerRadius: 0, outerRadius: radius, repeats: 4, repeatMode: 'rotate' },
    seams,
    berries,
    curls,
  }
}

const bench = await startBenchApp({ demoData: true })
try {
  const base = bench.base
  const browser = await launchBenchBrowser()
  const page = await signedInDesignerPage(browser, base)
  const created = await page.evaluate(async (design) => {
    const response = await fetch('/api/patterns', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ name: 'Bench limit', design }) })
    return { status: response.status, body: (await response.json()) as { pattern?: { id: string } } }
  }, designAtTheLimit())
  if (!created.body.pattern) throw new Error(`the design at the limit was refused: ${created.status} ${JSON.stringify(created.body)}`)
  const id = created.body.pattern.id

  const timings: number[] = []
  for (let i = 0; i < OPENINGS; i += 1) {
    const started = performance.now()
    await page.goto(`${base}/patterns/${id}/board`)
    // Opened: the canvas is on the page and the plan panel shows the plan of all 401 areas.
    await page.getByTestId('plan-status').filter({ hasText: '401 areas' }).waitFor({ timeout: 60_000 })
    await page.waitForFunction(() => window.wreathwrightStage && window.wreathwrightBoard, undefined, { polling: 'raf' })
    timings.push(performance.now() - started)
  }
  await browser.close()

  const sorted = [...timings].sort((a, b) => a - b)
  console.log(`board at the limit (${MAX_SEAMS} seams, ${MAX_BERRIES} berries, ${MAX_CURLS} curls of ${MAX_POINTS_PER_CURL} points; headless Chromium):`)
  console.log(`  navigation → plan shown: ${timings.map((t) => `${(t / 1000).toFixed(2)} s`).join(', ')}; median ${(sorted[OPENINGS >> 1]! / 1000).toFixed(2)} s`)
  console.log('  goal: under 2 s')
} finally {
  await bench.stop()
}
