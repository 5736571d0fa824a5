import { spawnSync } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import fc from 'fast-check'
import { afterAll, describe, expect, it } from 'vitest'
import { MAX_DESIGN_FILE_BYTES, MAX_SEAMS, MAX_SECTIONS } from '../lib/limits'
import { runCli } from './cli'
import { hollyberryWreath } from './demo-wreath'

const folder = mkdtempSync(join(tmpdir(), 'wreathwright-cli-'))
let written = 0
function file(text: string): string {
  const path = join(folder, `design-${(written += 1)}.json`)
  writeFileSync(path, text)
  return path
}

const valid = {
  format: 'wreathwright-design',
  version: 1,
  name: 'X',
  units: 'in',
  ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' },
  seams: [
    { id: 's1', from: [3, 0], to: [3, Math.sqrt(72)] },
    { id: 's2', from: [0, 3], to: [Math.sqrt(72), 3] },
  ],
  leaves: [{ id: 'l1', seam: 's1', at: 0.2, side: 'left', length: 1, width: 0.5, layers: ['a'] }],
  order: null,
}

/** The CLI contract of geometry.md: exit 0 with a JSON plan, or exit 2 with one line and no stack. */
function expectContract(result: Awaited<ReturnType<typeof runCli>>): void {
  expect([0, 2]).toContain(result.code)
  if (result.code === 0) {
    expect(result.stderr).toBe('')
    expect(JSON.parse(result.stdout)).toHaveProperty('sewable')
  } else {
    expect(result.stdout).toBe('')
    expect(result.stderr.trimEnd().split('\n')).toHaveLength(1)
    expect(result.stderr).not.toMatch(/\n\s+at /)
  }
}

describe('cli plan', () => {
  afterAll(() => rmSync(folder, { recursive: true, force: true }))

  it('prints a plan for a valid design and exits 0', async () => {
    const result = await runCli(['plan', file(JSON.stringify(valid))])
    expect(result.code).toBe(0)
    const plan = JSON.parse(result.stdout)
    expect(plan.sections).toHaveLength(2)
  })

  it('exits 0 with a plan that says why when the design cannot be sewn', async () => {
    const dangling = { ...valid, seams: [{ id: 's1', from: [3, 0], to: [3, 2] }], leaves: [] }
    const result = await runCli(['plan', file(JSON.stringify(dangling))])
    expect(result.code).toBe(0)
    expect(JSON.parse(result.stdout).sewable).toBe(false)
  })

  it('prints the suggestions of the unsewable fixtures: the order Wreathwright chooses, a resized leaf', async () => {
    const fixture = (name: string) => join(import.meta.dirname, '..', 'geometry', 'fixtures', name, 'design.json')
    const order = JSON.parse((await runCli(['plan', fixture('hand-set-order-two-lines')])).stdout)
    expect(order.suggestions[0]).toMatchObject({ message: 'Let Wreathwright choose the order: sews in 1 section', sections: 1, clearsOrder: true })
    const leaf = JSON.parse((await runCli(['plan', fixture('leaf-too-wide-for-its-length')])).stdout)
    expect(leaf.suggestions[0]).toMatchObject({ message: 'Lengthen leaf 1 from 0.5 in to 1.625 in: sews in 1 section', leaves: [{ id: 'stubby', length: 1.625, width: 3 }] })
  })

  it('exits 2 with one line for malformed JSON, a wrong version, a negative radius and NaN', async () => {
    const cases = ['{"format": ', JSON.stringify({ ...valid, version: 3 }), JSON.stringify({ ...valid, ring: { ...valid.ring, outerRadius: -3 } }), JSON.stringify(valid).replace('"to":[3,', '"to":[NaN,')]
    for (const text of cases) {
      const result = await runCli(['plan', file(text)])
      expect(result.code, text).toBe(2)
      expectContract(result)
    }
    expect((await runCli(['plan', file(JSON.stringify({ ...valid, version: 3 }))])).stderr).toMatch(/version/)
  })

  it('refuses arguments plan does not take, in one line', async () => {
    const result = await runCli(['plan', file(JSON.stringify(valid)), '--paper', 'a4'])
    expect(result.code).toBe(2)
    expectContract(result)
  })

  it('hands pdf to the booklet command, which names a missing design file in one line', async () => {
    const result = await runCli(['pdf', 'no-such-design.json', '--paper', 'letter', '--out', 'x.pdf'])
    expect(result.code).toBe(2)
    expectContract(result)
    expect(result.stderr).toMatch(/no-such-design\.json/)
  })

  it('never crashes on fuzzed JSON', async () => {
    await fc.assert(
      fc.asyncProperty(fc.jsonValue(), async (json) => {
        expectContract(await runCli(['plan', file(JSON.stringify(json))]))
      }),
      { numRuns: 150 },
    )
  })

  it('never crashes on valid designs with one field fuzzed', async () => {
    const paths = [['name'], ['units'], ['ring', 'innerRadius'], ['ring', 'outerRadius'], ['ring', 'repeats'], ['ring', 'repeatMode'], ['seams', 0, 'from'], ['seams', 0, 'to', 1], ['seams', 1], ['leaves', 0, 'seam'], ['leaves', 0, 'at'], ['order'], ['extra']] as const
    await fc.assert(
      fc.asyncProperty(fc.constantFrom(...paths), fc.jsonValue(), async (path, value) => {
        const copy = structuredClone(valid) as Record<string, unknown>
        let node = copy as Record<string | number, unknown>
        for (const key of path.slice(0, -1)) node = node[key] as Record<string | number, unknown>
        node[path[path.length - 1] as string | number] = value
        expectContract(await runCli(['plan', file(JSON.stringify(copy))]))
      }),
      { numRuns: 300 },
    )
  })

  it('never crashes on random seams in a valid file', async () => {
    const point = fc.tuple(fc.double({ min: -20, max: 20, noNaN: true }), fc.double({ min: -20, max: 20, noNaN: true }))
    await fc.assert(
      fc.asyncProperty(fc.array(fc.tuple(point, point), { maxLength: 6 }), fc.integer({ min: 2, max: 36 }), async (pairs, repeats) => {
        const design = { ...valid, ring: { ...valid.ring, repeats }, leaves: [], seams: pairs.map(([from, to], i) => ({ id: `s${i}`, from, to })) }
        const result = await runCli(['plan', file(JSON.stringify(design))])
        expect(result.code).toBe(0)
        expectContract(result)
      }),
      { numRuns: 150 },
    )
  })

  it('refuses a 42,000-seam file (4.4 MB) by the seam limit, in one line and quickly', async () => {
    // The file of issue 10: it ran 143 s before it ended in "Maximum call stack size exceeded".
    const seams = Array.from({ length: 42_000 }, (_, i) => ({ id: `seam-${i}`, from: [1 + (i % 7), 0], to: [0, 1 + (i % 5)] }))
    const path = file(JSON.stringify({ ...valid, leaves: [], seams }, null, 1))
    const started = performance.now()
    for (const argv of [['plan', path], ['pdf', path, '--paper', 'letter', '--out', join(folder, 'x.pdf')]]) {
      const result = await runCli(argv)
      expect(result.code).toBe(2)
      expectContract(result)
      expect(result.stderr).toContain(`seams: at most ${MAX_SEAMS} seams`)
    }
    expect(performance.now() - started).toBeLessThan(5000)
  })

  it('refuses a file larger than the largest design before parsing its JSON', async () => {
    // Not even JSON: had it been parsed, the message would say so.
    const path = file(`[${' '.repeat(MAX_DESIGN_FILE_BYTES)}`)
    for (const argv of [['plan', path], ['pdf', path, '--paper', 'letter', '--out', join(folder, 'x.pdf')]]) {
      const result = await runCli(argv)
      expect(result.code).toBe(2)
      expectContract(result)
      expect(result.stderr).toContain(`too large for a design: ${MAX_DESIGN_FILE_BYTES + 1} bytes`)
    }
  })

  it('refuses a 5,000-deep assembly and NUL in the name in one line each, naming the field', async () => {
    // Written by hand: JSON.stringify itself recurses once per level.
    const assembly = `${'['.repeat(5000)}"A"${',"B"]'.repeat(5000)}`
    const order = JSON.stringify({ sections: [{ label: 'A', areas: [[1, 1]] }], assembly: 'PLACE' }).replace('"PLACE"', assembly)
    const deep = await runCli(['plan', file(JSON.stringify({ ...valid, order: 'ORDER' }).replace('"ORDER"', order))])
    expect(deep.code).toBe(2)
    expectContract(deep)
    expect(deep.stderr).toContain(`order.assembly: at most ${MAX_SECTIONS} levels`)
    const nul = await runCli(['plan', file(JSON.stringify({ ...valid, name: 'Acorn\u0000' }))])
    expect(nul.code).toBe(2)
    expectContract(nul)
    expect(nul.stderr).toMatch(/name: control characters/)
  })

  it('as a real process: exit code 2 and one line on stderr, no stack trace', async () => {
    const run = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/cli.ts', 'plan', file('[1, 2')], { encoding: 'utf8', cwd: join(import.meta.dirname, '..') })
    expect(run.status).toBe(2)
    expect(run.stdout).toBe('')
    expect(run.stderr.trimEnd().split('\n')).toHaveLength(1)
  })
})

describe('cli cutting', () => {
  const cuttingFolder = mkdtempSync(join(tmpdir(), 'wreathwright-cutting-'))
  afterAll(() => rmSync(cuttingFolder, { recursive: true, force: true }))
  let count = 0
  const designFile = (design: unknown): string => {
    const path = join(cuttingFolder, `design-${(count += 1)}.json`)
    writeFileSync(path, JSON.stringify(design))
    return path
  }
  const wreath = designFile(hollyberryWreath)

  it("prints the demo wreath's fabric requirements in the issue's shape, exit 0", async () => {
    const result = await runCli(['cutting', wreath])
    expect(result.code).toBe(0)
    expect(result.stderr).toBe('')
    const json = JSON.parse(result.stdout)
    expect(Object.keys(json)).toEqual(['colorway', 'widthOfFabricIn', 'extraPercent', 'fabrics', 'leaves', 'stem', 'binding', 'berries', 'problems'])
    // Defaults: the first colourway, 40 in usable width and 10 % extra (common practice).
    expect([json.colorway, json.widthOfFabricIn, json.extraPercent]).toEqual([hollyberryWreath.colorways![0]!.name, 40, 10])
    for (const fabric of json.fabrics) {
      expect(Object.keys(fabric)).toEqual(['fabric', 'name', 'color', 'pieces', 'cuts', 'lengthIn', 'yards', 'metres', 'fatQuarter', 'fatEighth'])
      expect(Object.keys(fabric.pieces[0])).toEqual(['for', 'widthIn', 'heightIn', 'count'])
      expect(Object.keys(fabric.cuts[0])).toEqual(['for', 'xIn', 'yIn', 'widthIn', 'heightIn'])
      // One cut per piece (counts expanded), each inside the usable width.
      expect(fabric.cuts).toHaveLength(fabric.pieces.reduce((sum: number, piece: { count: number }) => sum + piece.count, 0))
      for (const cut of fabric.cuts) expect(cut.xIn >= 0 && cut.xIn + cut.widthIn <= 40).toBe(true)
      // Yards: length + 10 %, rounded up to 1/8 yd = 4.5 in (common practice).
      expect(fabric.yards).toBe(Math.ceil((fabric.lengthIn * 1.1) / 4.5) / 8)
      // The colourway's display name of the fabric, never its role.
      const named = (hollyberryWreath.colorways![0]!.fabrics as Record<string, { name: string }>)[fabric.fabric]
      expect(fabric.name).toBe(named!.name)
    }
    // The stem: 2π × its radius + 4 in, cut 2 × 3/8 + 1/2 = 1 1/4 in wide (bias.ts).
    expect(json.stem).toMatchObject({ fabric: 'stem', cutWidthIn: 1.25 })
    expect(Object.keys(json.stem)).toEqual(['fabric', 'lengthIn', 'cutWidthIn', 'squareIn'])
    // The binding of an 18 in ring: 2π × 9 + 10 = 66.5 → 67 in, 2 1/4 in wide (common practice).
    expect(json.binding).toEqual({ fabric: 'binding', lengthIn: 67, cutWidthIn: 2.25 })
    expect(json.berries).toEqual([{ fabric: 'berry', count: 24, cutDiameterIn: 1.25 }])
    expect(json.leaves.every((leaf: { leaves: number; pieces: number }) => leaf.pieces === 2 * leaf.leaves)).toBe(true)
  })

  it('takes the colourway, the width of fabric and the extra from its options', async () => {
    const second = hollyberryWreath.colorways![1]?.name ?? hollyberryWreath.colorways![0]!.name
    const result = await runCli(['cutting', wreath, '--colorway', second, '--width-of-fabric', '20', '--extra=0'])
    expect(result.code).toBe(0)
    const json = JSON.parse(result.stdout)
    expect([json.colorway, json.widthOfFabricIn, json.extraPercent]).toEqual([second, 20, 0])
    for (const fabric of json.fabrics) {
      for (const cut of fabric.cuts) expect(cut.xIn + cut.widthIn).toBeLessThanOrEqual(20)
      expect(fabric.yards).toBe(Math.ceil(fabric.lengthIn / 4.5) / 8)
    }
  })

  it('lists a piece too wide for the fabric as a problem and still exits 0', async () => {
    // An 11 in berry: its cut circle's square is wider than 10 in, the narrowest width accepted.
    const bigBerry = designFile({ ...hollyberryWreath, berries: [{ ...hollyberryWreath.berries![0]!, finishedDiameter: 11 }] })
    const result = await runCli(['cutting', bigBerry, '--width-of-fabric', '10'])
    expect(result.code).toBe(0)
    const json = JSON.parse(result.stdout)
    expect(json.problems.length).toBeGreaterThan(0)
    expect(json.problems[0]).toMatchObject({ code: 'piece-too-wide' })
    expect(json.problems[0].message).toMatch(/wider than the usable width of 10 in/)
  })

  it('lists every stem ring when a design has several', async () => {
    const twoStems = { ...hollyberryWreath, stems: [{ radius: 7, finishedWidth: 0.375, fabric: 'stem' }, { radius: 5, finishedWidth: 0.25, fabric: 'vine' }] }
    const json = JSON.parse((await runCli(['cutting', designFile(twoStems)])).stdout)
    expect(json.stems.map((stem: { fabric: string }) => stem.fabric)).toEqual(['stem', 'vine'])
    expect(json.stem).toEqual(json.stems[0])
  })

  it('exits 2 with one line for an unknown colourway, a bad width or extra, an unknown option or a missing file', async () => {
    const cases: [string[], RegExp][] = [
      [['cutting', wreath, '--colorway', 'Nope'], /no colourway named "Nope"/],
      [['cutting', wreath, '--width-of-fabric', '-3'], /--width-of-fabric must be a positive number/],
      [['cutting', wreath, '--width-of-fabric', '0'], /--width-of-fabric must be a positive number/],
      [['cutting', wreath, '--width-of-fabric', 'wide'], /--width-of-fabric must be a positive number/],
      [['cutting', wreath, '--extra', '-1'], /--extra must be a percentage/],
      [['cutting', wreath, '--extra', 'NaN'], /--extra must be a percentage/],
      // The cutting settings' shared range (lib/schemas/cutting-settings.ts): 10–120 in, 0–100 %.
      [['cutting', wreath, '--width-of-fabric', '9.99'], /--width-of-fabric must be a positive number of inches from 10 to 120, got "9.99"/],
      [['cutting', wreath, '--extra', '101'], /--extra must be a percentage from 0 to 100, got "101"/],
      [['cutting', wreath, '--paper', 'a4'], /unknown option --paper/],
      [['cutting', wreath, '--extra', '5', '--extra', '6'], /given twice/],
      [['cutting'], /usage: cli cutting/],
      [['cutting', join(cuttingFolder, 'missing.json')], /cannot read/],
      [['cutting', designFile({ ...hollyberryWreath, version: 7 })], /not a valid design/],
    ]
    for (const [argv, message] of cases) {
      const result = await runCli(argv)
      expect(result.code, argv.join(' ')).toBe(2)
      expect(result.stdout).toBe('')
      expect(result.stderr.trimEnd().split('\n')).toHaveLength(1)
      expect(result.stderr).toMatch(message)
    }
  })

  it('never crashes on random seams: exit 0 with every cut inside the width', async () => {
    const point = fc.tuple(fc.double({ min: -20, max: 20, noNaN: true }), fc.double({ min: -20, max: 20, noNaN: true }))
    await fc.assert(
      fc.asyncProperty(fc.array(fc.tuple(point, point), { maxLength: 6 }), fc.integer({ min: 2, max: 36 }), async (pairs, repeats) => {
        const design = { ...valid, ring: { ...valid.ring, repeats }, seams: pairs.map(([from, to], i) => ({ id: `s${i}`, from, to })), leaves: [] }
        const result = await runCli(['cutting', designFile(design)])
        expect(result.code, result.stderr).toBe(0)
        const json = JSON.parse(result.stdout)
        for (const fabric of json.fabrics) for (const cut of fabric.cuts) expect(cut.xIn + cut.widthIn).toBeLessThanOrEqual(40)
      }),
      { numRuns: 60 },
    )
  })

  it('as a real process: JSON on stdout, exit 0', () => {
    const run = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/cli.ts', 'cutting', wreath, '--extra', '0'], { encoding: 'utf8', cwd: join(import.meta.dirname, '..') })
    expect(run.status).toBe(0)
    expect(JSON.parse(run.stdout).extraPercent).toBe(0)
  })
})
