import { QueryTypes, type QueryInterface, type Transaction } from 'sequelize'

/**
 * Design format version 2 (lib/schemas/design.ts): a colourway gives each fabric role a fabric
 * `{ name, color, swatch? }` where version 1 gave it only a colour. `up` rewrites every stored
 * pattern's design of version 1 to version 2, each colour becoming a fabric named by its role in
 * words ("leaf-dark" → "Leaf dark"), exactly as the reader upgrades a version 1 file. `down` turns
 * version 2 designs back into version 1: each fabric keeps only its colour, so display names and
 * swatches are lost on the way down (version 1 has nowhere to keep them).
 *
 * Revisions (pattern_revisions) are not migrated, on purpose: they are the history of what was
 * saved, kept as it was (a trigger refuses any change to them), and every reader of a design goes
 * through the design schema, which upgrades a version 1 design on read. An old revision therefore
 * reads as version 2 without being rewritten.
 *
 * The upgrade rule is copied here rather than imported, so this migration keeps doing what it did
 * when it ran, whatever the application code becomes. A design that is not an object, or whose
 * colourways are not a list, is left as it is (the schema reports it when it is read).
 */

const BATCH = 100

type Json = Record<string, unknown>

const isRecord = (value: unknown): value is Json => typeof value === 'object' && value !== null && !Array.isArray(value)

/** "leaf-dark" → "Leaf dark": dashes, underscores and runs of spaces become one space, the first letter a capital. */
function roleInWords(role: string): string {
  const words = role.replace(/[-_\s]+/g, ' ').trim()
  return words.charAt(0).toUpperCase() + words.slice(1)
}

function mapFabrics(design: Json, change: (role: string, fabric: unknown) => unknown): Json {
  if (!Array.isArray(design.colorways)) return design
  return {
    ...design,
    colorways: design.colorways.map((colorway: unknown) =>
      isRecord(colorway) && isRecord(colorway.fabrics)
        ? { ...colorway, fabrics: Object.fromEntries(Object.entries(colorway.fabrics).map(([role, fabric]) => [role, change(role, fabric)])) }
        : colorway,
    ),
  }
}

/** A version 1 design as version 2. */
function toVersion2(design: Json): Json {
  return { ...mapFabrics(design, (role, color) => ({ name: roleInWords(role), color })), version: 2 }
}

/** A version 2 design as version 1: each fabric its colour only. */
function toVersion1(design: Json): Json {
  return { ...mapFabrics(design, (_role, fabric) => (isRecord(fabric) ? fabric.color : fabric)), version: 1 }
}

/** Rewrites, batch by batch in id order, every pattern whose design is of version `from`. */
async function rewrite(queryInterface: QueryInterface, from: number, change: (design: Json) => Json): Promise<void> {
  const sequelize = queryInterface.sequelize
  await sequelize.transaction(async (transaction: Transaction) => {
    let after = '00000000-0000-0000-0000-000000000000'
    for (;;) {
      const rows = await sequelize.query<{ id: string; design: unknown }>(
        `SELECT id, design FROM patterns WHERE id > :after AND jsonb_typeof(design) = 'object' AND design ->> 'version' = :version
         ORDER BY id LIMIT :batch`,
        { replacements: { after, version: String(from), batch: BATCH }, type: QueryTypes.SELECT, transaction },
      )
      for (const row of rows) {
        if (!isRecord(row.design) || (row.design.colorways !== undefined && !Array.isArray(row.design.colorways))) continue
        await sequelize.query('UPDATE patterns SET design = :design::jsonb WHERE id = :id', {
          replacements: { id: row.id, design: JSON.stringify(change(row.design)) },
          transaction,
        })
      }
      if (rows.length < BATCH) break
      after = rows[rows.length - 1]!.id
    }
  })
}

export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await rewrite(queryInterface, 1, toVersion2)
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await rewrite(queryInterface, 2, toVersion1)
}
