/**
 * The same lib/booklet code in a real browser: bundled for the browser with esbuild and run in
 * headless Chromium, it writes a PDF there too (the print dialog builds booklets this way).
 */
import { execFileSync } from 'node:child_process'
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { chromium } from 'playwright-core'
import { describe, expect, it } from 'vitest'

const CHROMIUM = '/usr/bin/chromium'
const root = join(import.meta.dirname, '..', '..')

describe.skipIf(!existsSync(CHROMIUM))('the booklet in a browser', () => {
  it('builds a PDF in headless Chromium from the browser bundle', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'booklet-browser-'))
    const entry = join(folder, 'entry.ts')
    writeFileSync(entry, [
      "import { buildBooklet } from '@/lib/booklet/booklet'",
      "import { designFrom, wreathFile } from '@/lib/booklet/test-support/designs'",
      "const bytes = buildBooklet(designFrom(wreathFile()), { paper: 'a4', finishedDiameterInches: 24 })",
      '// @ts-expect-error a test-only global',
      'window.booklet = { length: bytes.length, head: String.fromCharCode(...bytes.slice(0, 5)) }',
    ].join('\n'))
    const bundle = join(folder, 'bundle.js')
    execFileSync(join(root, 'node_modules', '.bin', 'esbuild'), [entry, '--bundle', '--platform=browser', '--format=iife', `--alias:@=${root}`, `--outfile=${bundle}`, '--log-level=error'], { cwd: root })
    const browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: ['--no-sandbox', '--disable-gpu', '--no-first-run'] })
    try {
      const page = await browser.newPage()
      const errors: string[] = []
      page.on('pageerror', (error) => errors.push(String(error)))
      await page.setContent('<html><body></body></html>')
      await page.addScriptTag({ content: readFileSync(bundle, 'utf8') })
      const result = await page.evaluate(() => (window as unknown as { booklet: { length: number; head: string } }).booklet)
      expect(errors).toEqual([])
      expect(result.head).toBe('%PDF-')
      expect(result.length).toBeGreaterThan(10_000)
    } finally {
      await browser.close()
    }
  }, 60_000)
})
