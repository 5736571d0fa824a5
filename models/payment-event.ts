import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'

/**
 * Where a webhook call stands in the payment log: 'refused' (bad or missing signature; nothing
 * else is trusted or kept of it), 'received' (verified, stored, its processing queued),
 * 'processed', or 'failed' (processing gave up after its retries).
 */
export type PaymentEventState = 'refused' | 'received' | 'processed' | 'failed'

/** One call to the payment webhook (lib/payments/webhook.ts), as the admin's payment log shows it. */
export class PaymentEvent extends Model<InferAttributes<PaymentEvent>, InferCreationAttributes<PaymentEvent>> {
  declare id: CreationOptional<string>
  declare providerEventId: string | null
  declare type: string | null
  declare state: PaymentEventState
  declare note: CreationOptional<string | null>
  declare paymentIntentId: CreationOptional<string | null>
  /** The verified event as the provider sent it; NULL for a refused call. */
  declare payload: CreationOptional<unknown>
  declare attempts: CreationOptional<number>
  declare receivedAt: CreationOptional<Date>
  declare processedAt: CreationOptional<Date | null>
}

export function initPaymentEvent(sequelize: Sequelize): void {
  PaymentEvent.init(
    {
      id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
      providerEventId: { type: DataTypes.TEXT, allowNull: true },
      type: { type: DataTypes.TEXT, allowNull: true },
      state: { type: DataTypes.TEXT, allowNull: false },
      note: { type: DataTypes.TEXT, allowNull: true },
      paymentIntentId: { type: DataTypes.TEXT, allowNull: true },
      payload: { type: DataTypes.JSONB, allowNull: true },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      receivedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      processedAt: { type: DataTypes.DATE, allowNull: true },
    },
    { sequelize, tableName: 'payment_events', modelName: 'PaymentEvent', timestamps: false },
  )
}
