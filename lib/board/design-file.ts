/**
 * The design file (geometry.md, "Design file") in and out of the drafting board: export writes
 * what the board holds as readable JSON, import reads a file back and hands over a design only
 * when the whole file is valid, so a bad file can never half-replace the board.
 */
import { MAX_DESIGN_FILE_BYTES } from '@/lib/limits'
import { designFileSchema, type DesignFile, type DesignIssue } from '@/lib/schemas/design'

export const DESIGN_FILE_EXTENSION = '.wreathwright.json'
export const DESIGN_FILE_MIME_TYPE = 'application/json'

/**
 * The largest design file the board reads: the command line's limit (`MAX_DESIGN_FILE_BYTES`, room
 * for the largest design written indented, as export writes it), so every design the board can
 * export it can read back. Refusing a larger file keeps a wrong file from freezing the tab.
 */
export const DESIGN_FILE_MAX_BYTES = MAX_DESIGN_FILE_BYTES

/** The keys in the order geometry.md lists them, so exported files read the same way. */
const KEY_ORDER = ['format', 'version', 'name', 'units', 'ring', 'seams', 'fills', 'leaves', 'stems', 'berries', 'curls', 'colorways', 'order'] as const

export interface ExportedDesignFile {
  readonly fileName: string
  readonly text: string
  readonly mimeType: string
}

export type ImportedDesignFile =
  | { readonly ok: true; readonly design: DesignFile }
  | { readonly ok: false; readonly message: string; readonly issues: readonly DesignIssue[] }

/**
 * A file name from the design's name: lower case, letters and digits joined by hyphens.
 *
 * @example designFileName('Winter Star (sketch)') // 'winter-star-sketch.wreathwright.json'
 */
export function designFileName(name: string): string {
  const slug = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '') // accents off: "Rosé" → "rose"
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 80)
    .replace(/-+$/, '')
  return `${slug || 'design'}${DESIGN_FILE_EXTENSION}`
}

/**
 * The design as a file to download: two-space JSON in geometry.md's key order, ending in a newline.
 *
 * @example
 * const file = exportDesignFile(store.getState().history.present)
 * // file.fileName === 'winter-star.wreathwright.json'
 */
export function exportDesignFile(design: DesignFile): ExportedDesignFile {
  const ordered: Record<string, unknown> = {}
  for (const key of KEY_ORDER) if (design[key] !== undefined) ordered[key] = design[key]
  // Anything the schema may learn later still goes out, after the known keys.
  for (const [key, value] of Object.entries(design)) if (!(key in ordered) && value !== undefined) ordered[key] = value
  return { fileName: designFileName(design.name), text: `${JSON.stringify(ordered, null, 2)}\n`, mimeType: DESIGN_FILE_MIME_TYPE }
}

/**
 * Reads a design file's text: the design if the file is valid, otherwise a plain-words message
 * and each problem with the path of its field (`ring.outerRadius: …`).
 *
 * @example
 * const result = importDesignFile(await file.text())
 * if (result.ok) store.run('replaceDesign', { design: result.design })
 * else showProblems(result.message, result.issues)
 */
export function importDesignFile(text: string): ImportedDesignFile {
  if (text.length > DESIGN_FILE_MAX_BYTES) {
    return refuse('This file is too large to be a Wreathwright design file.', [])
  }
  if (text.trim() === '') return refuse('This file is empty.', [])
  let json: unknown
  try {
    // A byte-order mark from some editors is not part of the JSON.
    json = JSON.parse(text.replace(/^\uFEFF/, ''))
  } catch (error) {
    const detail = error instanceof Error ? error.message : String(error)
    return refuse('This file is not readable JSON, so it cannot be a design file.', [{ path: '(file)', message: detail }])
  }
  const parsed = designFileSchema.safeParse(json)
  if (parsed.success) return { ok: true, design: parsed.data }
  const issues = parsed.error.issues.map((issue) => ({ path: issue.path.map(String).join('.') || '(file)', message: issue.message }))
  if (!json || typeof json !== 'object' || (json as { format?: unknown }).format !== 'wreathwright-design') {
    return refuse('This is not a Wreathwright design file: it should say "format": "wreathwright-design".', issues)
  }
  const count = issues.length === 1 ? 'one problem' : `${issues.length} problems`
  return refuse(`This design file has ${count}; the board was left as it was.`, issues)
}

function refuse(message: string, issues: readonly DesignIssue[]): ImportedDesignFile {
  return { ok: false, message, issues }
}
