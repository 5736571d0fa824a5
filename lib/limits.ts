/**
 * The limits of what is stored: the largest design, and the longest strings, the schemas accept.
 * Every limit is named once, here; the schemas (lib/schemas/) refuse anything larger with 422 (or
 * the command line with exit 2) naming the field and the limit, e.g. `design.seams: at most 400
 * seams`. geometry/README.md ("Input it assumes") lists the same table.
 *
 * Each limit is generous for any real design (a wreath repeat has tens of seams, a few dozen
 * leaves and berries) and small enough that the largest design plans, draws and saves quickly:
 * a design without limits was a way to stall the server (issue 10).
 */

/** Repeats around the ring: at least 2, at most 36 (10° each). The board, the schema and the shop's filter read these. */
export const MIN_REPEATS = 2
export const MAX_REPEATS = 36
/** Seams in repeat 0. */
export const MAX_SEAMS = 400
/** Leaf inserts (one or more per seam). */
export const MAX_LEAVES = 400
/** Stacked layers of one leaf. */
export const MAX_LAYERS_PER_LEAF = 8
/** Bias stems (rings of stem around the wreath). */
export const MAX_STEMS = 12
/** Berries. */
export const MAX_BERRIES = 400
/** Embroidered curls. */
export const MAX_CURLS = 100
/** Points of one curl. */
export const MAX_POINTS_PER_CURL = 100
/**
 * Areas a design names by a point: its fills, and the areas of a hand-set order (all sections
 * together). A repeat of 400 seams can have more areas than it has seams, hence more than 400.
 */
export const MAX_AREAS = 1000
/**
 * Sections of a hand-set order. Also the deepest join tree (`order.assembly`) accepted: a join
 * tree of n sections is at most n − 1 joins deep. Parsing a join tree recurses once per level,
 * so this also keeps parsing far from the call-stack limit (zod overflows near 2,000 levels).
 */
export const MAX_SECTIONS = 400
/** Colourways of a design. */
export const MAX_COLORWAYS = 24
/** Fabric roles given a colour in one colourway. */
export const MAX_FABRICS_PER_COLORWAY = 64

/** Pattern and design names, colourway names, display names: characters (UTF-16 code units). */
export const MAX_NAME_LENGTH = 120
/** Seam, leaf and section ids (labels): characters. */
export const MAX_ID_LENGTH = 64
/** Fabric roles ("background", "leaf-dark"): characters. */
export const MAX_ROLE_LENGTH = 64
/** An upload's key in the object store, as a design names a swatch image by it: characters (ASCII). */
export const MAX_UPLOAD_KEY_LENGTH = 200

/**
 * Bytes one person's uploads may take in the object store together, as stored (each image is
 * re-encoded and at most 1600 px on its longer side, so a theme photo takes about 0.2–2 MB and a
 * swatch a few kB): 200 MB (10^6 bytes a megabyte), room for a hundred full-size photos and
 * thousands of swatches. Our choice; an upload past it is refused (413) naming the quota and the
 * use, with nothing stored.
 */
export const MAX_STORED_UPLOAD_BYTES_PER_USER = 200_000_000

/**
 * A pattern's skill notes in the shop (what it asks of a quilter): characters, a paragraph or two,
 * not the booklet. Our choice; the table's check (migrations/20261202-0130-shop-listings.ts) holds
 * the same number.
 */
export const MAX_SKILL_NOTES_LENGTH = 2000

/** Rows of the designer's sales table a page holds unless it asks for another number (`GET /api/sales`, /sales): our choice. */
export const SALES_PAGE_SIZE = 50
/**
 * Most rows one page of `GET /api/sales` may ask for (`limit`): our choice, enough for any screen;
 * the CSV export reads every row, in batches of this size, and sends them as it reads them.
 */
export const MAX_SALES_PAGE_SIZE = 500

/** The longest number JSON.stringify writes: `-1.2345678901234567e-308`, 24 characters. */
const LONGEST_NUMBER = 24
/**
 * Bytes of one string at its longest: UTF-8 takes at most 3 bytes per UTF-16 code unit (a 4-byte
 * character is 2 units), and JSON.stringify escapes a quote or a backslash as 2 bytes; plus the
 * quotes around it.
 */
const stringBytes = (length: number): number => 3 * length + 2
/** A point `[x, y]` and the comma after it. */
const POINT_BYTES = 2 * LONGEST_NUMBER + 4
/**
 * Keys, braces, commas and short values (enums) of one item of a list: a bound, not a count (the
 * longest item, a leaf, spells 95 characters of keys and punctuation).
 */
const ITEM_OVERHEAD = 120

/**
 * The largest design in bytes, as JSON.stringify writes it (no indentation): every list at its
 * limit, every string at its longest in 3-byte characters, every number at its longest. About
 * 3.2 MB. The route wrapper sizes the largest body of a design from it (a body slightly larger
 * than the design it carries: add the other fields' room).
 */
export const MAX_DESIGN_BYTES = (() => {
  const seams = MAX_SEAMS * (stringBytes(MAX_ID_LENGTH) + 2 * POINT_BYTES + ITEM_OVERHEAD)
  const layer = stringBytes(MAX_ROLE_LENGTH) + 2 * LONGEST_NUMBER + ITEM_OVERHEAD
  const leaves = MAX_LEAVES * (2 * stringBytes(MAX_ID_LENGTH) + 5 * LONGEST_NUMBER + MAX_LAYERS_PER_LEAF * layer + ITEM_OVERHEAD)
  const stems = MAX_STEMS * (2 * LONGEST_NUMBER + stringBytes(MAX_ROLE_LENGTH) + ITEM_OVERHEAD)
  const berries = MAX_BERRIES * (POINT_BYTES + LONGEST_NUMBER + stringBytes(MAX_ROLE_LENGTH) + ITEM_OVERHEAD)
  const curls = MAX_CURLS * (MAX_POINTS_PER_CURL * POINT_BYTES + ITEM_OVERHEAD)
  const fills = MAX_AREAS * (POINT_BYTES + stringBytes(MAX_ROLE_LENGTH) + ITEM_OVERHEAD)
  // Each fabric of a colourway: its role, then `{"name":…,"color":"#rrggbb","swatch":…}` (the
  // swatch key is ASCII, one byte a character), keys and punctuation 40 bytes.
  const fabric = stringBytes(MAX_ROLE_LENGTH) + stringBytes(MAX_NAME_LENGTH) + 9 + (MAX_UPLOAD_KEY_LENGTH + 2) + 40
  const colorways = MAX_COLORWAYS * (stringBytes(MAX_NAME_LENGTH) + MAX_FABRICS_PER_COLORWAY * fabric + ITEM_OVERHEAD)
  // Every area of the order once; every section's label once in the sections, once in the join tree.
  const order = MAX_AREAS * POINT_BYTES + MAX_SECTIONS * (2 * stringBytes(MAX_ID_LENGTH) + ITEM_OVERHEAD)
  // Name, format, version, units, the ring, the binding and the top-level keys.
  const rest = stringBytes(MAX_NAME_LENGTH) + 10 * LONGEST_NUMBER + stringBytes(MAX_ROLE_LENGTH) + 10 * ITEM_OVERHEAD
  return seams + leaves + stems + berries + curls + fills + colorways + order + rest
})()

/**
 * The largest design file the command line reads, in bytes: twice MAX_DESIGN_BYTES, room for a
 * file indented for reading (`JSON.stringify(design, null, 2)` adds less than the text itself).
 * A larger file is refused before its JSON is parsed.
 */
export const MAX_DESIGN_FILE_BYTES = 2 * MAX_DESIGN_BYTES

/** A sewing-room note on one step ("used the darker green here"): characters. Room for a few lines, our choice. */
export const MAX_SEWING_NOTE_LENGTH = 1000
/** A sewing-room step id (`r3:area:A4`, `leaves:<fabric role>`): characters; the longest the checklist makes is a role (64) and a prefix. */
export const MAX_SEWING_STEP_ID_LENGTH = 200
/** Sewing projects one person may keep (several per licence are allowed): our choice, far above a lifetime of quilts, so rows cannot be piled up without end. */
export const MAX_SEWING_PROJECTS_PER_PERSON = 200
