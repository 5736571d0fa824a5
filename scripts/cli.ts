/**
 * The command line: `npm run -s cli -- plan <design.json>` prints the sewing plan as JSON.
 *
 * Exit 0 with a plan even when the design cannot be sewn (the plan says why); exit 2 with one
 * line on stderr when the input is not a valid design; never a stack trace (geometry.md,
 * "Command-line contract").
 */
import { pathToFileURL } from 'node:url'
import { planDesign } from '../geometry/plan'
import { UsageError } from './command-arguments'
import { DesignFileError, readDesignFile } from './design-file'
import { runCuttingCommand } from './cutting-command'
import { runPdfCommand } from './pdf-command'

function oneLine(text: string): string {
  return text.replace(/\s+/g, ' ').trim()
}

async function readDesign(path: string | undefined): ReturnType<typeof readDesignFile> {
  if (!path) throw new UsageError('usage: cli plan <design.json>')
  return readDesignFile(path)
}

/** What a run writes and returns, so tests can run the CLI in-process. */
export interface CliResult {
  readonly code: number
  readonly stdout: string
  readonly stderr: string
}

async function plan(args: readonly string[]): Promise<CliResult> {
  if (args.length > 1) throw new UsageError(`plan takes one design file, got: ${args.join(' ')}; usage: cli plan <design.json>`)
  const { design } = await readDesign(args[0])
  return { code: 0, stdout: `${JSON.stringify(planDesign(design), null, 2)}\n`, stderr: '' }
}

/** The PDF booklet (`pdf <design.json> --paper … --out <file.pdf>`), see scripts/pdf-command.ts. */
async function pdf(args: readonly string[]): Promise<CliResult> {
  let stdout = ''
  let stderr = ''
  const code = await runPdfCommand([...args], { stdout: (text) => (stdout += text), stderr: (text) => (stderr += text) })
  return { code, stdout, stderr }
}

/** What to buy and how to cut it (`cutting <design.json> [--colorway NAME] …`), see scripts/cutting-command.ts. */
const cutting = (args: readonly string[]): Promise<CliResult> => runCuttingCommand(args)

const commands: Record<string, (args: readonly string[]) => CliResult | Promise<CliResult>> = { plan, pdf, cutting }

/**
 * Runs one command line (without `node` and the script) and returns its exit code and output.
 * Never throws: invalid input and unexpected failures alike become one line on stderr, exit 2.
 *
 * @example (await runCli(['plan', 'design.json'])).code // 0, or 2 for an invalid design
 */
export async function runCli(argv: readonly string[]): Promise<CliResult> {
  try {
    const [name, ...args] = argv
    const command = name ? commands[name] : undefined
    if (!command) throw new UsageError(`usage: cli <${Object.keys(commands).join('|')}> <design.json> …`)
    return await command(args)
  } catch (error) {
    // Anything unexpected is still one line: a stack trace is no message for a designer.
    const message = error instanceof UsageError || error instanceof DesignFileError ? error.message : `internal error: ${error instanceof Error ? error.message : String(error)}`
    return { code: 2, stdout: '', stderr: `${oneLine(message)}\n` }
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const result = await runCli(process.argv.slice(2))
  process.stdout.write(result.stdout)
  process.stderr.write(result.stderr)
  process.exitCode = result.code
}
