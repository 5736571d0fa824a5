import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'
import type { PatternState } from '@/lib/schemas/pattern'

/** One saved state of a pattern. Immutable: the database refuses updates (see its migration). */
export class PatternRevision extends Model<
  InferAttributes<PatternRevision>,
  InferCreationAttributes<PatternRevision>
> {
  declare id: CreationOptional<number>
  declare patternId: string
  declare revision: number
  declare name: string
  declare state: PatternState
  declare design: unknown
  declare savedById: string | null
  declare createdAt: CreationOptional<Date>
}

export function initPatternRevision(sequelize: Sequelize): void {
  PatternRevision.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      patternId: { type: DataTypes.UUID, allowNull: false },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: false },
      state: { type: DataTypes.TEXT, allowNull: false },
      design: { type: DataTypes.JSONB, allowNull: false },
      savedById: { type: DataTypes.UUID, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'pattern_revisions', modelName: 'PatternRevision', updatedAt: false },
  )
}
