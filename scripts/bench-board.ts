/**
 * Board speed: while the end of a seam in a 40-area repeat is dragged across the board in
 * headless Chromium, the time from each pointer move to the canvas having drawn the result
 * (which the browser paints at the end of that frame). Prints the median and 95th percentile.
 * Goal (issue 5): median under 16 ms, 95th percentile under 33 ms on a 2-core machine.
 *
 * Starts its own throwaway PostgreSQL and the built app, like the test runner.
 */
import { launchBenchBrowser, percentile, signedInDesignerPage, startBenchApp } from './bench-app'

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

const bench = await startBenchApp({ demoData: true })
try {
  const base = bench.base
  const browser = await launchBenchBrowser()
  const page = await signedInDesignerPage(browser, base)
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
  await bench.stop()
}
