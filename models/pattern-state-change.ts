import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'
import type { PatternState } from '@/lib/schemas/pattern'

/** One move of a pattern from a state to another: who made it and when (its history on the pattern page). */
export class PatternStateChange extends Model<InferAttributes<PatternStateChange>, InferCreationAttributes<PatternStateChange>> {
  declare id: CreationOptional<string>
  declare patternId: string
  declare fromState: PatternState
  declare toState: PatternState
  /** NULL once the person's account is deleted. */
  declare changedById: string | null
  declare createdAt: CreationOptional<Date>
}

export function initPatternStateChange(sequelize: Sequelize): void {
  PatternStateChange.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      patternId: { type: DataTypes.UUID, allowNull: false },
      fromState: { type: DataTypes.TEXT, allowNull: false },
      toState: { type: DataTypes.TEXT, allowNull: false },
      changedById: { type: DataTypes.UUID, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'pattern_state_changes', modelName: 'PatternStateChange', updatedAt: false },
  )
}
