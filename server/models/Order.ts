import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { Currency, OrderStatus, PaymentStatus, ServiceKind } from '../../shared/shop';
import type { OrderEvent } from './OrderEvent';

/** A pro-shop order: the service, its price and the ball are copied when ordered (the price list may change later). */
export class Order extends Model<InferAttributes<Order>, InferCreationAttributes<Order>> {
  declare id: CreationOptional<number>;
  /** The bowler who ordered; null for a walk-in order taken at the counter. */
  declare userId: number | null;
  /** A walk-in customer's name and contact (no account). */
  declare customerName: CreationOptional<string | null>;
  declare customerContact: CreationOptional<string | null>;
  declare centerId: number;
  declare serviceId: number | null;
  declare ballId: number | null;
  declare serviceKind: ServiceKind;
  declare serviceName: string;
  declare grit: number | null;
  declare ballName: string;
  declare amountCents: number;
  declare currency: Currency;
  declare status: CreationOptional<OrderStatus>;
  declare paymentStatus: CreationOptional<PaymentStatus>;
  declare lastPaymentError: CreationOptional<string | null>;
  declare notes: string | null;
  declare paidAt: CreationOptional<Date | null>;
  declare readyAt: CreationOptional<Date | null>;
  declare collectedAt: CreationOptional<Date | null>;
  declare refundedAt: CreationOptional<Date | null>;
  declare cancelledAt: CreationOptional<Date | null>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare events?: NonAttribute<OrderEvent[]>;

  static initModel(sequelize: Sequelize): void {
    Order.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER, allowNull: true },
        customerName: { type: DataTypes.STRING(80), allowNull: true },
        customerContact: { type: DataTypes.STRING(120), allowNull: true },
        centerId: { type: DataTypes.INTEGER, allowNull: false },
        serviceId: { type: DataTypes.INTEGER, allowNull: true },
        ballId: { type: DataTypes.INTEGER, allowNull: true },
        serviceKind: { type: DataTypes.STRING(20), allowNull: false },
        serviceName: { type: DataTypes.STRING(80), allowNull: false },
        grit: { type: DataTypes.INTEGER, allowNull: true },
        ballName: { type: DataTypes.STRING(150), allowNull: false },
        amountCents: { type: DataTypes.INTEGER, allowNull: false },
        currency: { type: DataTypes.STRING(3), allowNull: false },
        status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'ordered' },
        paymentStatus: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'unpaid' },
        lastPaymentError: { type: DataTypes.STRING(500), allowNull: true },
        notes: { type: DataTypes.STRING(1000), allowNull: true },
        paidAt: { type: DataTypes.DATE, allowNull: true },
        readyAt: { type: DataTypes.DATE, allowNull: true },
        collectedAt: { type: DataTypes.DATE, allowNull: true },
        refundedAt: { type: DataTypes.DATE, allowNull: true },
        cancelledAt: { type: DataTypes.DATE, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'orders', version: true },
    );
  }
}
