import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Currency, ServiceKind } from '../../shared/shop';

/** One line of a center's pro-shop price list. Optimistic locking: two people may edit it. */
export class ShopService extends Model<InferAttributes<ShopService>, InferCreationAttributes<ShopService>> {
  declare id: CreationOptional<number>;
  declare centerId: number;
  declare kind: ServiceKind;
  declare name: string;
  declare grit: number | null;
  declare description: string | null;
  declare priceCents: number;
  declare currency: CreationOptional<Currency>;
  declare active: CreationOptional<boolean>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    ShopService.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        centerId: { type: DataTypes.INTEGER, allowNull: false },
        kind: { type: DataTypes.STRING(20), allowNull: false },
        name: { type: DataTypes.STRING(80), allowNull: false },
        grit: { type: DataTypes.INTEGER, allowNull: true },
        description: { type: DataTypes.STRING(500), allowNull: true },
        priceCents: { type: DataTypes.INTEGER, allowNull: false },
        currency: { type: DataTypes.STRING(3), allowNull: false, defaultValue: 'usd' },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'shop_services', version: true },
    );
  }
}
