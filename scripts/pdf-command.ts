/**
 * The `pdf` subcommand: `cli pdf <design.json> --paper letter|legal|tabloid|a4|a3
 * [--colorway NAME] [--diameter INCHES] [--orientation portrait|landscape] [--margin INCHES]
 * [--overlap INCHES] [--parts cover,steps,…] --out <file.pdf>` writes the pattern booklet.
 *
 * Exit 0 when the file is written (also for a design that cannot be sewn: the cover says why);
 * exit 2 with one line on stderr for anything the user can fix; never a stack trace
 * (geometry.md, "Command-line contract").
 */
import { writeFile } from 'node:fs/promises'
import { buildBooklet } from '../lib/booklet/booklet'
import { BOOKLET_PARTS, bookletOptionsSchema, PAPER_NAMES, type BookletOptionsInput } from '../lib/schemas/booklet'
import { DesignFileError, readDesignFile } from './design-file'
import { parseCommandArguments, UsageError } from './command-arguments'

const USAGE = `usage: cli pdf <design.json> --paper ${PAPER_NAMES.join('|')} [--colorway NAME] [--diameter INCHES] [--orientation portrait|landscape] [--margin INCHES] [--overlap INCHES] [--parts ${BOOKLET_PARTS.join(',')}] --out <file.pdf>`

const FLAGS = ['--paper', '--colorway', '--diameter', '--orientation', '--margin', '--overlap', '--parts', '--out'] as const
type Flag = (typeof FLAGS)[number]

function lengthFlag(flags: Partial<Record<Flag, string>>, name: Flag): number | undefined {
  const text = flags[name]
  if (text === undefined) return undefined
  const value = Number(text)
  if (!Number.isFinite(value) || value <= 0 || text.trim() === '') throw new UsageError(`${name} must be a positive number of inches, got "${text}"`)
  return value
}

function oneLine(text: string): string {
  return text.replace(/\s+/g, ' ').trim()
}

/**
 * Runs `pdf` with its arguments (after the word `pdf`) and returns the exit code.
 *
 * @example await runPdfCommand(['wreath.json', '--paper', 'letter', '--out', 'wreath.pdf'], { stdout: console.log, stderr: console.error }) // 0
 */
export async function runPdfCommand(args: string[], io: { stdout(text: string): void; stderr(text: string): void }): Promise<number> {
  try {
    const { designPath, flags } = parseCommandArguments(args, FLAGS, USAGE)
    if (!flags['--paper']) throw new UsageError(`--paper is required (${PAPER_NAMES.join(', ')})`)
    if (!flags['--out']) throw new UsageError('--out <file.pdf> is required')
    const parsed = await readDesignFile(designPath)
    const input: BookletOptionsInput = {
      paper: flags['--paper'] as BookletOptionsInput['paper'],
      orientation: flags['--orientation'] as BookletOptionsInput['orientation'],
      colorway: flags['--colorway'],
      finishedDiameterInches: lengthFlag(flags, '--diameter'),
      marginInches: lengthFlag(flags, '--margin'),
      overlapInches: lengthFlag(flags, '--overlap'),
      parts: flags['--parts']?.split(',').map((part) => part.trim()) as BookletOptionsInput['parts'],
    }
    const options = bookletOptionsSchema.safeParse(input)
    if (!options.success) {
      const issue = options.error.issues[0]
      const flag = `--${String(issue?.path[0] ?? '').replace('finishedDiameterInches', 'diameter').replace('marginInches', 'margin').replace('overlapInches', 'overlap')}`
      throw new UsageError(`${flag}: ${issue?.message ?? 'invalid'}`)
    }
    const colorways = parsed.design.colorways
    if (options.data.colorway && !colorways.some((c) => c.name === options.data.colorway)) {
      throw new UsageError(`no colourway named "${options.data.colorway}"; this design has ${colorways.length ? colorways.map((c) => `"${c.name}"`).join(', ') : 'none'}`)
    }
    const bytes = buildBooklet(parsed.design, options.data)
    try {
      await writeFile(flags['--out'], bytes)
    } catch {
      throw new UsageError(`cannot write ${flags['--out']}`)
    }
    io.stdout(`wrote ${flags['--out']} (${bytes.length} bytes)\n`)
    return 0
  } catch (error) {
    // Anything unexpected is still one line: a stack trace is no message for a designer.
    const message = error instanceof UsageError || error instanceof DesignFileError ? error.message : `internal error: ${error instanceof Error ? error.message : String(error)}`
    io.stderr(`${oneLine(message)}\n`)
    return 2
  }
}
