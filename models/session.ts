import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'

/** A signed-in browser. The id is the secret in the session cookie (see lib/auth/lucia.ts). */
export class Session extends Model<InferAttributes<Session>, InferCreationAttributes<Session>> {
  declare id: string
  declare userId: string
  declare expiresAt: Date
  /** The browser's User-Agent when the session began, to name the device on the account page. */
  declare userAgent: CreationOptional<string | null>
  /** When the session was last used, to a few minutes (lib/auth/session.ts). */
  declare lastSeenAt: CreationOptional<Date>
}

export function initSession(sequelize: Sequelize): void {
  Session.init(
    {
      id: { type: DataTypes.TEXT, primaryKey: true },
      userId: { type: DataTypes.UUID, allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      userAgent: { type: DataTypes.TEXT, allowNull: true },
      lastSeenAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
    },
    { sequelize, tableName: 'sessions', modelName: 'Session', timestamps: false },
  )
}
