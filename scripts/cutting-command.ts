/**
 * The `cutting` subcommand: `cli cutting <design.json> [--colorway NAME] [--width-of-fabric IN]
 * [--extra PERCENT]` prints what to buy and how to cut it for one colourway as JSON (the shape is
 * in geometry/README.md, "`cutting` on the command line"; the arithmetic is geometry's).
 *
 * Exit 0 with the JSON (also when a piece is too wide for the fabric: `problems` says so); exit 2
 * with one line on stderr for anything the user can fix; never a stack trace.
 */
import { fabricRequirements, type FabricRequirements } from '../geometry/fabric-requirements'
import { planDesign } from '../geometry/plan'
import { OUTPUT_DECIMALS } from '../geometry/tolerances'
import { DEFAULT_EXTRA_PERCENT, DEFAULT_WIDTH_OF_FABRIC_INCHES } from '../geometry/yardage'
import { EXTRA_PERCENT_RANGE, extraPercentSchema, WIDTH_OF_FABRIC_RANGE_INCHES, widthOfFabricSchema } from '../lib/schemas/cutting-settings'
import { DesignFileError, readDesignFile } from './design-file'
import { parseCommandArguments, UsageError } from './command-arguments'

const USAGE = 'usage: cli cutting <design.json> [--colorway NAME] [--width-of-fabric IN] [--extra PERCENT]'
const FLAGS = ['--colorway', '--width-of-fabric', '--extra'] as const
type Flag = (typeof FLAGS)[number]

/**
 * A number flag checked by the cutting settings' shared schema (the fabric page and the booklet
 * accept the same range).
 */
function numberFlag(text: string | undefined, name: Flag, what: string, schema: typeof widthOfFabricSchema | typeof extraPercentSchema): number | undefined {
  if (text === undefined) return undefined
  const value = Number(text)
  if (text.trim() === '' || !schema.safeParse(value).success) throw new UsageError(`${name} must be ${what}, got "${text}"`)
  return value
}

const [leastWidth, mostWidth] = WIDTH_OF_FABRIC_RANGE_INCHES
const [leastExtra, mostExtra] = EXTRA_PERCENT_RANGE

const round = (value: number): number => Number(value.toFixed(OUTPUT_DECIMALS))

/** The requirements in the command's JSON shape: the geometry's result without what only screens draw. */
function toJson(result: FabricRequirements): unknown {
  const stemLine = (stem: FabricRequirements['stems'][number]) => ({ fabric: stem.fabric, lengthIn: stem.lengthIn, cutWidthIn: round(stem.cutWidthIn), squareIn: stem.squareIn })
  return {
    colorway: result.colorway,
    widthOfFabricIn: result.widthOfFabricIn,
    extraPercent: result.extraPercent,
    fabrics: result.fabrics.map((fabric) => ({
      fabric: fabric.fabric,
      name: fabric.name,
      color: fabric.color,
      pieces: fabric.pieces.map((piece) => ({ for: piece.for, widthIn: round(piece.widthIn), heightIn: round(piece.heightIn), count: piece.count })),
      cuts: fabric.cuts.map((cut) => ({ for: cut.for, xIn: round(cut.xIn), yIn: round(cut.yIn), widthIn: round(cut.widthIn), heightIn: round(cut.heightIn) })),
      lengthIn: round(fabric.lengthIn),
      yards: fabric.yards,
      metres: fabric.metres,
      fatQuarter: fabric.fatQuarter,
      fatEighth: fabric.fatEighth,
    })),
    leaves: result.leaves,
    stem: result.stems[0] ? stemLine(result.stems[0]) : null,
    // The issue's shape has one stem line; a design with several stem rings lists them all too.
    ...(result.stems.length > 1 ? { stems: result.stems.map(stemLine) } : {}),
    binding: { fabric: result.binding.fabric, lengthIn: result.binding.lengthIn, cutWidthIn: round(result.binding.cutWidthIn) },
    berries: result.berries.map((berry) => ({ ...berry, cutDiameterIn: round(berry.cutDiameterIn) })),
    problems: result.problems,
  }
}

/**
 * Runs `cutting` with its arguments (after the word `cutting`) and returns what to print.
 *
 * @example (await runCuttingCommand(['wreath.json', '--colorway', 'Autumn'])).code // 0
 */
export async function runCuttingCommand(args: readonly string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  try {
    const { designPath, flags } = parseCommandArguments(args, FLAGS, USAGE)
    const widthOfFabricIn = numberFlag(flags['--width-of-fabric'], '--width-of-fabric', `a positive number of inches from ${leastWidth} to ${mostWidth}`, widthOfFabricSchema) ?? DEFAULT_WIDTH_OF_FABRIC_INCHES
    const extraPercent = numberFlag(flags['--extra'], '--extra', `a percentage from ${leastExtra} to ${mostExtra}`, extraPercentSchema) ?? DEFAULT_EXTRA_PERCENT
    const { design } = await readDesignFile(designPath)
    const name = flags['--colorway']
    const colorway = name === undefined ? (design.colorways[0] ?? null) : design.colorways.find((candidate) => candidate.name === name)
    if (colorway === undefined) {
      const known = design.colorways.map((candidate) => `"${candidate.name}"`).join(', ')
      throw new UsageError(`${designPath} has no colourway named "${name}"${known ? `; it has ${known}` : '; it has none'}`)
    }
    const result = fabricRequirements(design, planDesign(design, { suggestions: false }), colorway, { widthOfFabricIn, extraPercent })
    return { code: 0, stdout: `${JSON.stringify(toJson(result), null, 2)}\n`, stderr: '' }
  } catch (error) {
    if (!(error instanceof UsageError) && !(error instanceof DesignFileError)) throw error
    return { code: 2, stdout: '', stderr: `${error.message.replace(/\s+/g, ' ').trim()}\n` }
  }
}
