import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'

export const ACCOUNT_TOKEN_PURPOSES = ['verify-email', 'reset-password', 'change-email'] as const
export type AccountTokenPurpose = (typeof ACCOUNT_TOKEN_PURPOSES)[number]

/** A single-use link sent by e-mail; only the token's SHA-256 hash is kept (lib/auth/account-tokens.ts). */
export class AccountToken extends Model<InferAttributes<AccountToken>, InferCreationAttributes<AccountToken>> {
  declare id: CreationOptional<string>
  declare userId: string
  declare purpose: AccountTokenPurpose
  declare tokenHash: string
  /** For 'change-email': the address the account moves to once the link is used. */
  declare newEmail: string | null
  declare expiresAt: Date
  declare usedAt: Date | null
  declare createdAt: CreationOptional<Date>
}

export function initAccountToken(sequelize: Sequelize): void {
  AccountToken.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      userId: { type: DataTypes.UUID, allowNull: false },
      purpose: { type: DataTypes.TEXT, allowNull: false },
      tokenHash: { type: DataTypes.TEXT, allowNull: false },
      newEmail: { type: DataTypes.TEXT, allowNull: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'account_tokens', modelName: 'AccountToken', updatedAt: false },
  )
}
