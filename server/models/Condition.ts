import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { LaneSurface, Sweep } from '../../engine/types';
import type { PatternSummary } from '../../shared/patterns';

/** A published house condition: a snapshot of the pattern, never updated (corrections are new rows). */
export class Condition extends Model<InferAttributes<Condition>, InferCreationAttributes<Condition>> {
  declare id: CreationOptional<number>;
  declare centerId: number;
  declare patternId: number | null;
  declare patternName: string;
  declare sweeps: Sweep[];
  declare summary: PatternSummary;
  declare lanes: number[];
  declare validFrom: string;
  declare validTo: string | null;
  declare notes: string | null;
  /** The lane surface the condition is bowled on (default synthetic, medium friction). */
  declare laneKind: CreationOptional<LaneSurface['kind']>;
  declare laneFriction: CreationOptional<LaneSurface['friction']>;
  /** Recurring days it is in force on (ISO 8601: 1 Monday … 7 Sunday); null every day between its dates. */
  declare weekdays: CreationOptional<number[] | null>;
  declare publishedAt: Date;
  declare publishedBy: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Condition.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        centerId: { type: DataTypes.INTEGER, allowNull: false },
        patternId: { type: DataTypes.INTEGER, allowNull: true },
        patternName: { type: DataTypes.STRING(80), allowNull: false },
        sweeps: { type: DataTypes.JSONB, allowNull: false },
        summary: { type: DataTypes.JSONB, allowNull: false },
        lanes: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false },
        validFrom: { type: DataTypes.DATEONLY, allowNull: false },
        validTo: { type: DataTypes.DATEONLY, allowNull: true },
        notes: { type: DataTypes.STRING(2000), allowNull: true },
        laneKind: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'synthetic' },
        laneFriction: { type: DataTypes.STRING(6), allowNull: false, defaultValue: 'medium' },
        weekdays: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: true },
        publishedAt: { type: DataTypes.DATE, allowNull: false },
        publishedBy: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'conditions' },
    );
  }
}
