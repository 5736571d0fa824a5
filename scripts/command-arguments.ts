/** What the command line's subcommands share: the one-line usage error and the option reader. */

/** A message for the user: one line on stderr, exit 2. */
export class UsageError extends Error {}

/**
 * Reads `<design.json>` and `--flag value` / `--flag=value` options: an unknown, valueless or
 * repeated option, or anything but exactly one design file, is a UsageError naming it.
 *
 * @example parseCommandArguments(['a.json', '--extra=5'], ['--extra'], 'usage: …').flags // { '--extra': '5' }
 */
export function parseCommandArguments<Flag extends string>(
  args: readonly string[],
  known: readonly Flag[],
  usage: string,
): { designPath: string; flags: Partial<Record<Flag, string>> } {
  const flags: Partial<Record<Flag, string>> = {}
  const positional: string[] = []
  for (let i = 0; i < args.length; i += 1) {
    const arg = args[i]!
    if (!arg.startsWith('--')) {
      positional.push(arg)
      continue
    }
    const [name, inline] = arg.includes('=') ? [arg.slice(0, arg.indexOf('=')), arg.slice(arg.indexOf('=') + 1)] : [arg, undefined]
    if (!(known as readonly string[]).includes(name)) throw new UsageError(`unknown option ${name}; ${usage}`)
    const value = inline ?? args[(i += 1)]
    if (value === undefined || value === '') throw new UsageError(`${name} needs a value`)
    if (flags[name as Flag] !== undefined) throw new UsageError(`${name} is given twice`)
    flags[name as Flag] = value
  }
  if (positional.length !== 1) throw new UsageError(positional.length === 0 ? usage : `expected one design file, got ${positional.length}; ${usage}`)
  return { designPath: positional[0]!, flags }
}
