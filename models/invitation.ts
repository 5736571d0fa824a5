import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'

/**
 * A designer's request that someone test a pattern, sent to an e-mail address. The verified owner
 * of that address claims it (`userId`, `acceptedAt`); from then until it expires or is withdrawn
 * that person is a tester of the pattern (lib/services/invitations.ts).
 */
export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<string>
  declare patternId: string
  /** Lower-case, as lib/schemas/account.ts's emailSchema leaves it. */
  declare email: string
  declare invitedById: string | null
  declare userId: string | null
  declare acceptedAt: Date | null
  declare withdrawnAt: Date | null
  declare expiresAt: Date
  declare createdAt: CreationOptional<Date>
}

export function initInvitation(sequelize: Sequelize): void {
  Invitation.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      patternId: { type: DataTypes.UUID, allowNull: false },
      email: { type: DataTypes.TEXT, allowNull: false },
      invitedById: { type: DataTypes.UUID, allowNull: true },
      userId: { type: DataTypes.UUID, allowNull: true },
      acceptedAt: { type: DataTypes.DATE, allowNull: true },
      withdrawnAt: { type: DataTypes.DATE, allowNull: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'pattern_invitations', modelName: 'Invitation', updatedAt: false },
  )
}
