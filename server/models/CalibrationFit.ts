import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/**
 * A bowler's calibration on one pattern, on one lane surface, with the pattern's sweeps as fitted (a published
 * condition's may differ from the pattern's present ones), fitted by the job worker from the input whose hash it keeps.
 */
export class CalibrationFit extends Model<InferAttributes<CalibrationFit>, InferCreationAttributes<CalibrationFit>> {
  declare bowlerId: number;
  declare patternId: number;
  declare laneKind: 'wood' | 'synthetic';
  declare laneFriction: 'low' | 'medium' | 'high';
  declare patternHash: string;
  /** The published condition the fit was asked for (a refit asks for it again), or null for a pattern on a lane surface. */
  declare conditionId: number | null;
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
        laneKind: { type: DataTypes.STRING(10), primaryKey: true },
        laneFriction: { type: DataTypes.STRING(6), primaryKey: true },
        patternHash: { type: DataTypes.STRING(64), primaryKey: true },
        conditionId: { type: DataTypes.INTEGER, allowNull: true },
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
