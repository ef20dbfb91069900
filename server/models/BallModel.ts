import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { CoverType } from '../../engine/types';

/** A ball in the shared catalogue. */
export class BallModel extends Model<InferAttributes<BallModel>, InferCreationAttributes<BallModel>> {
  declare id: CreationOptional<number>;
  declare maker: string;
  declare name: string;
  declare coverType: CoverType;
  declare coreType: 'symmetric' | 'asymmetric';
  declare rg: number;
  declare differential: number;
  declare intermediateDifferential: number;
  declare factoryGrit: number;
  declare factoryPolished: boolean;
  declare hardnessD: number | null;
  declare releaseYear: number | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    BallModel.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        maker: { type: DataTypes.STRING(60), allowNull: false },
        name: { type: DataTypes.STRING(80), allowNull: false },
        coverType: { type: DataTypes.STRING(20), allowNull: false },
        coreType: { type: DataTypes.STRING(12), allowNull: false },
        rg: { type: DataTypes.DOUBLE, allowNull: false },
        differential: { type: DataTypes.DOUBLE, allowNull: false },
        intermediateDifferential: { type: DataTypes.DOUBLE, allowNull: false },
        factoryGrit: { type: DataTypes.INTEGER, allowNull: false },
        factoryPolished: { type: DataTypes.BOOLEAN, allowNull: false },
        hardnessD: { type: DataTypes.REAL, allowNull: true },
        releaseYear: { type: DataTypes.INTEGER, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'ball_models', version: true },
    );
  }
}
