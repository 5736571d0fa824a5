/**
 * Reads a design file for the command line (`plan` and `pdf`): refuses a file larger than the
 * largest design (MAX_DESIGN_FILE_BYTES) before reading or parsing it, then parses the JSON and
 * the design. Every failure is a `DesignFileError` whose message is one line for stderr.
 */
import { open } from 'node:fs/promises'
import { MAX_DESIGN_FILE_BYTES } from '../lib/limits'
import { formatDesignIssue, parseDesign } from '../lib/schemas/design'

/** A design file the command line cannot use; the message names the file and the reason. */
export class DesignFileError extends Error {}

/**
 * The parsed design of the file at `path`, or a DesignFileError.
 *
 * @example (await readDesignFile('wreath.json')).design.seams.length // 12
 */
export async function readDesignFile(path: string): Promise<ReturnType<typeof parseDesign> & { ok: true }> {
  let text: string
  try {
    // Size first, from the open file: a 50 MB file is refused without being read into memory.
    const handle = await open(path, 'r')
    try {
      const { size } = await handle.stat()
      if (size > MAX_DESIGN_FILE_BYTES) {
        throw new DesignFileError(`${path} is too large for a design: ${size} bytes, at most ${MAX_DESIGN_FILE_BYTES} (the largest design the limits allow)`)
      }
      text = await handle.readFile('utf8')
    } finally {
      await handle.close()
    }
  } catch (error) {
    if (error instanceof DesignFileError) throw error
    throw new DesignFileError(`cannot read ${path}`)
  }
  let json: unknown
  try {
    json = JSON.parse(text)
  } catch (error) {
    throw new DesignFileError(`${path} is not valid JSON: ${error instanceof Error ? error.message : String(error)}`)
  }
  const result = parseDesign(json)
  if (!result.ok) {
    const first = result.issues[0]
    const more = result.issues.length > 1 ? ` (and ${result.issues.length - 1} more)` : ''
    throw new DesignFileError(`${path} is not a valid design: ${first ? formatDesignIssue(first) : 'unknown problem'}${more}`)
  }
  return result
}
