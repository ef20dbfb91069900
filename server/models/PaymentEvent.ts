import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A webhook event of the payment service already processed (its id is unique: a repeat is processed once). */
export class PaymentEvent extends Model<InferAttributes<PaymentEvent>, InferCreationAttributes<PaymentEvent>> {
  declare eventId: string;
  declare type: string;
  declare orderId: number | null;
  declare outcome: string | null;
  declare receivedAt: Date;

  static initModel(sequelize: Sequelize): void {
    PaymentEvent.init(
      {
        eventId: { type: DataTypes.STRING(255), primaryKey: true },
        type: { type: DataTypes.STRING(100), allowNull: false },
        orderId: { type: DataTypes.INTEGER, allowNull: true },
        outcome: { type: DataTypes.STRING(200), allowNull: true },
        receivedAt: { type: DataTypes.DATE, allowNull: false },
      },
      { sequelize, tableName: 'payment_events', timestamps: false },
    );
  }
}
