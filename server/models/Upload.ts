import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class Upload extends Model<InferAttributes<Upload>, InferCreationAttributes<Upload>> {
  declare id: CreationOptional<number>;
  declare ownerId: number;
  declare storageKey: string;
  declare contentType: string;
  declare sizeBytes: number;
  declare originalName: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Upload.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        ownerId: { type: DataTypes.INTEGER, allowNull: false },
        storageKey: { type: DataTypes.STRING(100), allowNull: false, unique: true },
        contentType: { type: DataTypes.STRING(40), allowNull: false },
        sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
        originalName: { type: DataTypes.STRING(200), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'uploads' },
    );
  }
}
