import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { wreathFile } from '../lib/booklet/test-support/designs'
import { runPdfCommand } from './pdf-command'

const folder = mkdtempSync(join(tmpdir(), 'pdf-command-'))
const designPath = join(folder, 'wreath.json')
writeFileSync(designPath, JSON.stringify(wreathFile()))

async function run(args: string[]) {
  let stdout = ''
  let stderr = ''
  const code = await runPdfCommand(args, { stdout: (t) => { stdout += t }, stderr: (t) => { stderr += t } })
  return { code, stdout, stderr }
}

describe('cli pdf', () => {
  it('writes a PDF booklet to --out', async () => {
    const out = join(folder, 'wreath.pdf')
    const result = await run([designPath, '--paper', 'a4', '--colorway', 'Frost', '--diameter', '24', '--out', out])
    expect(result.stderr).toBe('')
    expect(result.code).toBe(0)
    expect(readFileSync(out).subarray(0, 5).toString()).toBe('%PDF-')
  })

  it.each([
    [['--paper', 'letter', '--out', 'x.pdf'], /usage/],
    [[designPath, '--paper', 'b5', '--out', 'x.pdf'], /--paper/],
    [[designPath, '--paper', 'letter'], /--out/],
    [[designPath, '--paper', 'letter', '--diameter', 'NaN', '--out', 'x.pdf'], /--diameter/],
    [[designPath, '--paper', 'letter', '--diameter', '-3', '--out', 'x.pdf'], /--diameter/],
    [[designPath, '--paper', 'letter', '--colorway', 'Summer', '--out', 'x.pdf'], /no colourway named "Summer"/],
    [[designPath, '--paper', 'letter', '--bogus', '1', '--out', 'x.pdf'], /unknown option --bogus/],
    [[join(folder, 'missing.json'), '--paper', 'letter', '--out', 'x.pdf'], /cannot read/],
  ])('exits 2 with one line for %j', async (args, message) => {
    const result = await run(args)
    expect(result.code).toBe(2)
    expect(result.stderr).toMatch(message)
    expect(result.stderr.trim().split('\n')).toHaveLength(1)
    expect(result.stderr).not.toMatch(/\n\s+at /)
  })

  it('exits 2 naming the field of an invalid design', async () => {
    const bad = join(folder, 'bad.json')
    writeFileSync(bad, JSON.stringify({ ...wreathFile(), ring: { innerRadius: 0, outerRadius: -1, repeats: 4, repeatMode: 'rotate' } }))
    const result = await run([bad, '--paper', 'letter', '--out', join(folder, 'bad.pdf')])
    expect(result.code).toBe(2)
    expect(result.stderr).toMatch(/ring\.outerRadius/)
    const notJson = join(folder, 'broken.json')
    writeFileSync(notJson, '{ "format": ')
    expect((await run([notJson, '--paper', 'letter', '--out', join(folder, 'b.pdf')])).stderr).toMatch(/not valid JSON/)
  })
})
