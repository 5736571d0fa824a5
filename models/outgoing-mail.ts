import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'
import type { MailKind, MailState } from '@/lib/mail/kinds'

/**
 * A message the product sends, as the admin's mail log shows it: to whom, what kind, where it
 * stands. No subject or body is kept here (a link in it may be a secret); the message itself waits
 * in the queue (pg-boss) until the worker renders and sends it (lib/mail/).
 */
export class OutgoingMail extends Model<InferAttributes<OutgoingMail>, InferCreationAttributes<OutgoingMail>> {
  declare id: CreationOptional<string>
  declare toAddress: string
  declare kind: MailKind
  declare state: CreationOptional<MailState>
  /** Sending tries so far, the successful one included. */
  declare attempts: CreationOptional<number>
  /** Why the last try failed (an SMTP error code and message; never the message's content). */
  declare lastError: CreationOptional<string | null>
  /** Whose message it is; kept as null when that account is deleted. */
  declare userId: string | null
  declare createdAt: CreationOptional<Date>
  declare sentAt: CreationOptional<Date | null>
}

export function initOutgoingMail(sequelize: Sequelize): void {
  OutgoingMail.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
      toAddress: { type: DataTypes.TEXT, allowNull: false },
      kind: { type: DataTypes.TEXT, allowNull: false },
      state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'queued' },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      lastError: { type: DataTypes.TEXT, allowNull: true },
      userId: { type: DataTypes.UUID, allowNull: true },
      createdAt: DataTypes.DATE,
      sentAt: { type: DataTypes.DATE, allowNull: true },
    },
    { sequelize, tableName: 'outgoing_mails', modelName: 'OutgoingMail', updatedAt: false },
  )
}
