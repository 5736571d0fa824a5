/** Which kinds of test a run of `npm test -- <filters>` selects (scripts/run-tests.ts). */
import { spawnSync } from 'node:child_process'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'

/**
 * Whether the filters select any end-to-end test, asked of vitest itself (`vitest list`, which
 * collects file names without running anything), so the same filters mean the same files here as
 * in the run. Without filters every e2e test runs. Only the e2e tests need the built app: no
 * integration test starts it (the two-instance test is tests/e2e/scale-out.test.ts), so a filter
 * that selects integration tests alone can skip the build. When vitest cannot answer, the answer is
 * yes: building for nothing costs minutes, skipping a build a test needs would cost the test.
 */
export function selectsEndToEndTests(filters: readonly string[], folder: string = os.tmpdir()): boolean {
  if (filters.length === 0) return true
  const listFile = path.join(folder, `e2e-files-${process.pid}-${Date.now()}.json`)
  try {
    const listed = spawnSync('npx', ['vitest', 'list', '--project', 'e2e', '--filesOnly', `--json=${listFile}`, '--passWithNoTests', ...filters], {
      stdio: ['ignore', 'ignore', 'inherit'],
      env: process.env,
    })
    if (listed.status !== 0 || !fs.existsSync(listFile)) return true
    const files = JSON.parse(fs.readFileSync(listFile, 'utf8')) as unknown
    return !Array.isArray(files) || files.length > 0
  } catch {
    return true
  } finally {
    fs.rmSync(listFile, { force: true })
  }
}
