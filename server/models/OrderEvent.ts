import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { OrderStatus } from '../../shared/shop';

/** One step of an order's history (who moved it to which status, and when). */
export class OrderEvent extends Model<InferAttributes<OrderEvent>, InferCreationAttributes<OrderEvent>> {
  declare id: CreationOptional<number>;
  declare orderId: number;
  declare status: OrderStatus;
  declare at: Date;
  declare byUserId: number | null;
  declare byName: string | null;
  declare note: string | null;
  /** The status a shop move left (so the move can be undone); null for other steps. */
  declare fromStatus: CreationOptional<OrderStatus | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    OrderEvent.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        orderId: { type: DataTypes.INTEGER, allowNull: false },
        status: { type: DataTypes.STRING(12), allowNull: false },
        at: { type: DataTypes.DATE, allowNull: false },
        byUserId: { type: DataTypes.INTEGER, allowNull: true },
        byName: { type: DataTypes.STRING(80), allowNull: true },
        note: { type: DataTypes.STRING(300), allowNull: true },
        fromStatus: { type: DataTypes.STRING(12), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'order_events' },
    );
  }
}
