import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class Lane extends Model<InferAttributes<Lane>, InferCreationAttributes<Lane>> {
  declare id: CreationOptional<number>;
  declare centerId: number;
  declare number: number;
  declare notes: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Lane.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        centerId: { type: DataTypes.INTEGER, allowNull: false },
        number: { type: DataTypes.INTEGER, allowNull: false },
        notes: { type: DataTypes.STRING(200), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'lanes' },
    );
  }
}
