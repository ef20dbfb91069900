import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class BowlerProfile extends Model<InferAttributes<BowlerProfile>, InferCreationAttributes<BowlerProfile>> {
  declare userId: number;
  declare hand: 'right' | 'left';
  declare speedMph: number;
  declare revRpm: number;
  declare axisRotationDeg: number;
  declare axisTiltDeg: number;
  declare papRightIn: number | null;
  declare papUpIn: number | null;
  declare units: 'imperial' | 'metric';
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    BowlerProfile.init(
      {
        userId: { type: DataTypes.INTEGER, primaryKey: true },
        hand: { type: DataTypes.STRING(5), allowNull: false },
        speedMph: { type: DataTypes.REAL, allowNull: false },
        revRpm: { type: DataTypes.INTEGER, allowNull: false },
        axisRotationDeg: { type: DataTypes.REAL, allowNull: false },
        axisTiltDeg: { type: DataTypes.REAL, allowNull: false },
        papRightIn: { type: DataTypes.REAL, allowNull: true },
        papUpIn: { type: DataTypes.REAL, allowNull: true },
        units: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'imperial' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'bowler_profiles', version: true },
    );
  }
}
