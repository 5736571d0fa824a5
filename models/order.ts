import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize'

export type OrderState = 'pending' | 'paid' | 'refunded'

/**
 * A checkout someone started: the pattern, the amount read from it on the server at that moment,
 * and the provider's checkout session. Only a verified webhook moves it past 'pending'.
 */
export class Order extends Model<InferAttributes<Order>, InferCreationAttributes<Order>> {
  declare id: string
  /** NULL once the buyer's account is deleted (the designer's sales keep the row). */
  declare buyerId: string | null
  declare patternId: string
  declare amountCents: number
  /** ISO 4217, upper case (the provider's API writes it lower case). */
  declare currency: string
  declare state: CreationOptional<OrderState>
  declare checkoutSessionId: string
  declare paymentIntentId: CreationOptional<string | null>
  declare createdAt: CreationOptional<Date>
  declare updatedAt: CreationOptional<Date>
  declare paidAt: CreationOptional<Date | null>
  declare refundedAt: CreationOptional<Date | null>
  /** The colourway the buyer was looking at when they bought (a licence covers them all); NULL when none was named. */
  declare colorway: CreationOptional<string | null>
  /** When an admin asked the provider to refund the order; it stays 'paid' until the refund event arrives. */
  declare refundRequestedAt: CreationOptional<Date | null>
}

export function initOrder(sequelize: Sequelize): void {
  Order.init(
    {
      id: { type: DataTypes.UUID, primaryKey: true },
      buyerId: { type: DataTypes.UUID, allowNull: true },
      patternId: { type: DataTypes.UUID, allowNull: false },
      amountCents: { type: DataTypes.INTEGER, allowNull: false },
      currency: { type: DataTypes.TEXT, allowNull: false },
      state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'pending' },
      checkoutSessionId: { type: DataTypes.TEXT, allowNull: false },
      paymentIntentId: { type: DataTypes.TEXT, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
      paidAt: { type: DataTypes.DATE, allowNull: true },
      refundedAt: { type: DataTypes.DATE, allowNull: true },
      colorway: { type: DataTypes.TEXT, allowNull: true },
      refundRequestedAt: { type: DataTypes.DATE, allowNull: true },
    },
    { sequelize, tableName: 'orders', modelName: 'Order' },
  )
}
