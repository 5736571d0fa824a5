import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'
import type { Role } from '@/lib/roles'

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<string>
  /** Stored lower-cased; a unique index on lower(email) also guards against mixed case. */
  declare email: string
  declare displayName: string
  declare passwordHash: string
  declare emailVerifiedAt: Date | null
  declare roles: Role[]
  /** When the person asked for a designer account at sign-up: a request an admin approves or not. */
  declare designerRequestedAt: Date | null
  /** Set by an admin: the account cannot sign in and has no sessions while this is set. */
  declare disabledAt: CreationOptional<Date | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
}

export function initUser(sequelize: Sequelize): void {
  User.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      email: { type: DataTypes.TEXT, allowNull: false },
      displayName: { type: DataTypes.TEXT, allowNull: false },
      passwordHash: { type: DataTypes.TEXT, allowNull: false },
      emailVerifiedAt: { type: DataTypes.DATE, allowNull: true },
      roles: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false },
      designerRequestedAt: { type: DataTypes.DATE, allowNull: true },
      disabledAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'users', modelName: 'User' },
  )
}
