import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'

/** What an admin did; the table's check constraint holds the same list (migrations/20261202-0090-…). */
export const ADMIN_ACTIONS = [
  'grant-role',
  'revoke-role',
  'disable-account',
  'enable-account',
  'approve-designer-request',
  'decline-designer-request',
  // The shop (migrations/20261202-0130-…): an admin takes a listing out of the shop, or puts it back.
  'hide-listing',
  'show-listing',
  // An admin refunds an order through the payment provider (migrations/20261202-0161-…).
  'refund-order',
] as const
export type AdminAction = (typeof ADMIN_ACTIONS)[number]

/**
 * One line of the admin audit log: who (`actor`), what (`action`, `details`), whom (`target`),
 * when. Rows are only ever inserted: the database refuses UPDATE, DELETE and TRUNCATE. Labels keep
 * the name and e-mail as they were, since entries outlive the accounts they name.
 */
export class AdminAuditEntry extends Model<InferAttributes<AdminAuditEntry>, InferCreationAttributes<AdminAuditEntry>> {
  /** BIGINT: node-postgres reads it as a string. */
  declare id: CreationOptional<string>
  declare actorId: string
  /** e.g. `Odile Fairweather <odile@wreathwright.example>` */
  declare actorLabel: string
  declare action: AdminAction
  declare targetId: string | null
  declare targetLabel: string | null
  /** e.g. `{ role: 'designer' }`; never a secret. */
  declare details: CreationOptional<Record<string, unknown>>
  declare createdAt: CreationOptional<Date>
}

export function initAdminAuditEntry(sequelize: Sequelize): void {
  AdminAuditEntry.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      actorId: { type: DataTypes.UUID, allowNull: false },
      actorLabel: { type: DataTypes.TEXT, allowNull: false },
      action: { type: DataTypes.TEXT, allowNull: false },
      targetId: { type: DataTypes.UUID, allowNull: true },
      targetLabel: { type: DataTypes.TEXT, allowNull: true },
      details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: 'admin_audit_entries', modelName: 'AdminAuditEntry', updatedAt: false },
  )
}
