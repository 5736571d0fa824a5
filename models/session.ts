import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize'

/** A signed-in browser. The id is the secret in the session cookie (see lib/auth/lucia.ts). */
export class Session extends Model<InferAttributes<Session>, InferCreationAttributes<Session>> {
  declare id: string
  declare userId: string
  declare expiresAt: Date
}

export function initSession(sequelize: Sequelize): void {
  Session.init(
    {
      id: { type: DataTypes.TEXT, primaryKey: true },
      userId: { type: DataTypes.UUID, allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
    },
    { sequelize, tableName: 'sessions', modelName: 'Session', timestamps: false },
  )
}
