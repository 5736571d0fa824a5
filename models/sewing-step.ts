import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'

/**
 * One step's progress in a sewing project: ticked or not, and a note. Keyed by the project and the
 * checklist's stable step id, so each step is written on its own (lib/services/sewing-room.ts
 * writes it with one INSERT … ON CONFLICT per change).
 */
export class SewingStep extends Model<InferAttributes<SewingStep>, InferCreationAttributes<SewingStep>> {
  declare projectId: string
  declare stepId: string
  declare done: CreationOptional<boolean>
  declare note: CreationOptional<string | null>
  declare updatedAt: CreationOptional<Date>
}

export function initSewingStep(sequelize: Sequelize): void {
  SewingStep.init(
    {
      projectId: { type: DataTypes.UUID, primaryKey: true },
      stepId: { type: DataTypes.TEXT, primaryKey: true },
      done: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      note: { type: DataTypes.TEXT, allowNull: true },
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'sewing_steps', modelName: 'SewingStep', createdAt: false },
  )
}
