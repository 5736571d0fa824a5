import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize'
import type { Invitation } from './invitation'
import type { Licence } from './licence'
import type { Pattern } from './pattern'

/**
 * A quilter's make of one pattern in the sewing room (migrations/20261202-0150-…): under a licence
 * or a tester invitation (exactly one), at the pattern revision its checklist was made from, in one
 * colourway (by index), finished diameter and paper. Progress is in `sewing_steps`, step by step.
 */
export class SewingProject extends Model<InferAttributes<SewingProject>, InferCreationAttributes<SewingProject>> {
  declare id: string
  declare ownerId: string
  declare licenceId: string | null
  declare invitationId: string | null
  declare patternId: string
  /** pattern_revisions.id (a BIGINT, which pg hands back as a string). */
  declare patternRevisionId: string
  declare colorwayIndex: number
  declare diameterIn: number
  declare paper: string
  declare name: string | null
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  /** Present when loaded with `include` (lib/services/sewing-room.ts loadProject). */
  declare pattern?: NonAttribute<Pattern | null>
  declare licence?: NonAttribute<Licence | null>
  declare invitation?: NonAttribute<Invitation | null>
}

export function initSewingProject(sequelize: Sequelize): void {
  SewingProject.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true },
      ownerId: { type: DataTypes.UUID, allowNull: false },
      licenceId: { type: DataTypes.UUID, allowNull: true },
      invitationId: { type: DataTypes.UUID, allowNull: true },
      patternId: { type: DataTypes.UUID, allowNull: false },
      patternRevisionId: { type: DataTypes.BIGINT, allowNull: false },
      colorwayIndex: { type: DataTypes.INTEGER, allowNull: false },
      diameterIn: { type: DataTypes.DOUBLE, allowNull: false },
      paper: { type: DataTypes.TEXT, allowNull: false },
      name: { type: DataTypes.TEXT, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'sewing_projects', modelName: 'SewingProject' },
  )
}
