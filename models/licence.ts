import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize'
import type { Pattern } from './pattern'

/**
 * A buyer's personal licence to a pattern (all colourways, any size and paper), granted by a paid
 * order and revoked by its refund. Its number (`WL-001001`, from the database's sequence) is what
 * people quote and what the buyer's booklet prints.
 */
export class Licence extends Model<InferAttributes<Licence>, InferCreationAttributes<Licence>> {
  declare id: CreationOptional<string>
  declare number: CreationOptional<string>
  declare userId: string
  declare patternId: string
  declare orderId: string
  declare grantedAt: CreationOptional<Date>
  declare revokedAt: CreationOptional<Date | null>
  /** Its pattern, when a query includes it (`as: 'pattern'`). */
  declare pattern?: NonAttribute<Pattern>
}

export function initLicence(sequelize: Sequelize): void {
  Licence.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      // Filled in by the column's default (the sequence); never written by the app.
      number: { type: DataTypes.TEXT, allowNull: false, defaultValue: sequelize.literal(`'WL-' || to_char(nextval('licence_numbers'), 'FM000000')`) },
      userId: { type: DataTypes.UUID, allowNull: false },
      patternId: { type: DataTypes.UUID, allowNull: false },
      orderId: { type: DataTypes.UUID, allowNull: false },
      grantedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
    },
    { sequelize, tableName: 'licences', modelName: 'Licence', timestamps: false },
  )
}
