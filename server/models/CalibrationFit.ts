import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A bowler's calibration on one pattern, fitted by the job worker from the input whose hash it keeps. */
export class CalibrationFit extends Model<InferAttributes<CalibrationFit>, InferCreationAttributes<CalibrationFit>> {
  declare bowlerId: number;
  declare patternId: number;
  declare inputHash: string;
  declare calibration: Record<string, unknown>;
  declare shots: number;
  declare fittedAt: Date;
  declare fitMs: CreationOptional<number>;

  static initModel(sequelize: Sequelize): void {
    CalibrationFit.init(
      {
        bowlerId: { type: DataTypes.INTEGER, primaryKey: true },
        patternId: { type: DataTypes.INTEGER, primaryKey: true },
        inputHash: { type: DataTypes.STRING(64), allowNull: false },
        calibration: { type: DataTypes.JSONB, allowNull: false },
        shots: { type: DataTypes.INTEGER, allowNull: false },
        fittedAt: { type: DataTypes.DATE, allowNull: false },
        fitMs: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      },
      { sequelize, tableName: 'calibration_fits', timestamps: false },
    );
  }
}
