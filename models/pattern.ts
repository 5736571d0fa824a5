import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'
import { designSummary } from '@/lib/design-summary'
import type { PatternCurrency, PatternState } from '@/lib/schemas/pattern'
import type { ColourFamily } from '@/lib/shop/colour-families'
import { listingSummary, type ColorwaySwatches } from '@/lib/shop/listing-summary'

/** A pattern as it stands now; every saved state of it is also kept in PatternRevision. */
export class Pattern extends Model<InferAttributes<Pattern>, InferCreationAttributes<Pattern>> {
  declare id: CreationOptional<string>
  declare ownerId: string
  declare name: string
  declare state: CreationOptional<PatternState>
  /** The design file (format `wreathwright-design`, version 2; older rows upgraded by migration 20261202-0060), as the designer saved it. */
  declare design: unknown
  /** The design's summary (lib/design-summary.ts), written with it so the shelf never reads designs. */
  declare repeats: CreationOptional<number>
  declare outerDiameterInches: CreationOptional<number>
  declare seamCount: CreationOptional<number>
  /** What the pattern sells for, in integer cents of `currency`; both NULL until the designer sets a price (publishing needs one). */
  declare priceCents: CreationOptional<number | null>
  /** ISO 4217 code from PATTERN_CURRENCIES (lib/schemas/pattern.ts), set together with `priceCents`. */
  declare currency: CreationOptional<PatternCurrency | null>
  /** The shop's listing summary (lib/shop/listing-summary.ts, migration 20261202-0130), written with the design. */
  declare colourFamilies: CreationOptional<ColourFamily[]>
  declare colorwaySwatches: CreationOptional<ColorwaySwatches[]>
  /** The designer's short notes on the skills the pattern asks for, shown in the shop; NULL when none. */
  declare skillNotes: CreationOptional<string | null>
  /** When the pattern last became published (the shop's "newest"); set by the hook below. */
  declare publishedAt: CreationOptional<Date | null>
  /** When an admin hid the listing from the shop (lib/services/shop-listings.ts); NULL when listed. */
  declare hiddenAt: CreationOptional<Date | null>
  /** The designer's uploaded cover (an upload of kind `cover`, migration 20261202-0170); NULL: the shop draws the ring. */
  declare coverUploadId: CreationOptional<string | null>
  /** Goes up by one on every save; a save names the revision it started from. */
  declare revision: CreationOptional<number>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export function initPattern(sequelize: Sequelize): void {
  Pattern.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      ownerId: { type: DataTypes.UUID, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
      design: { type: DataTypes.JSONB, allowNull: false },
      repeats: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      outerDiameterInches: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
      seamCount: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      priceCents: { type: DataTypes.INTEGER, allowNull: true },
      currency: { type: DataTypes.TEXT, allowNull: true },
      colourFamilies: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] },
      colorwaySwatches: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      skillNotes: { type: DataTypes.TEXT, allowNull: true },
      publishedAt: { type: DataTypes.DATE, allowNull: true },
      hiddenAt: { type: DataTypes.DATE, allowNull: true },
      coverUploadId: { type: DataTypes.UUID, allowNull: true },
      revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    {
      sequelize,
      tableName: 'patterns',
      modelName: 'Pattern',
      hooks: {
        // Whoever saves a design (a service, a seed script, a test factory) saves its summary too.
        // beforeSave, not beforeValidate: Sequelize adds fields changed in this hook to the UPDATE.
        beforeSave(pattern) {
          if (pattern.isNewRecord || pattern.changed('design')) pattern.set({ ...designSummary(pattern.design), ...listingSummary(pattern.design) })
          // Going on sale (first time, or again after retiring) makes it the shop's newest.
          if (pattern.state === 'published' && (pattern.isNewRecord || pattern.changed('state'))) pattern.set({ publishedAt: new Date() })
        },
      },
    },
  )
}
