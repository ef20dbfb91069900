import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Currency } from '../../shared/shop';

/** One card-payment attempt of an order: a checkout session at the payment service and what became of it. */
export class Payment extends Model<InferAttributes<Payment>, InferCreationAttributes<Payment>> {
  declare id: CreationOptional<number>;
  declare orderId: number;
  /** Null while the checkout is being created at the payment service (status `creating`). */
  declare checkoutSessionId: CreationOptional<string | null>;
  /** The idempotency key the checkout session was created with (recorded before the service is called). */
  declare idempotencyKey: CreationOptional<string | null>;
  /** Why this payment is being refunded automatically (set when its `refund` job is queued). */
  declare autoRefundReason: CreationOptional<string | null>;
  declare paymentIntentId: CreationOptional<string | null>;
  declare amountCents: number;
  declare currency: Currency;
  declare status: CreationOptional<'creating' | 'open' | 'paid' | 'expired' | 'refunded'>;
  declare refundId: CreationOptional<string | null>;
  declare refundedCents: CreationOptional<number>;
  declare paidAt: CreationOptional<Date | null>;
  declare refundedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Payment.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        orderId: { type: DataTypes.INTEGER, allowNull: false },
        checkoutSessionId: { type: DataTypes.STRING(255), allowNull: true, unique: true },
        idempotencyKey: { type: DataTypes.STRING(255), allowNull: true, unique: true },
        autoRefundReason: { type: DataTypes.STRING(200), allowNull: true },
        paymentIntentId: { type: DataTypes.STRING(255), allowNull: true },
        amountCents: { type: DataTypes.INTEGER, allowNull: false },
        currency: { type: DataTypes.STRING(3), allowNull: false },
        status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'open' },
        refundId: { type: DataTypes.STRING(255), allowNull: true },
        refundedCents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        paidAt: { type: DataTypes.DATE, allowNull: true },
        refundedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'payments' },
    );
  }
}
