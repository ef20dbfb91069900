import {
  DataTypes,
  Model,
  type NonAttribute,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { Sweep } from '../../engine/types';
import type { PatternSummary, PatternVisibility } from '../../shared/patterns';

/** An oil pattern: its sweeps and the engine's summary of them, computed on every save. */
export class Pattern extends Model<InferAttributes<Pattern>, InferCreationAttributes<Pattern>> {
  declare id: CreationOptional<number>;
  declare ownerId: number | null;
  declare name: string;
  declare description: string | null;
  declare sweeps: Sweep[];
  declare summary: PatternSummary;
  declare visibility: CreationOptional<PatternVisibility>;
  declare centerId: CreationOptional<number | null>;
  /** Loaded with `include: owner` where lists show the owner's name. */
  declare owner?: NonAttribute<{ displayName: string } | null>;
  declare version: CreationOptional<number>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Pattern.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        ownerId: { type: DataTypes.INTEGER, allowNull: true },
        name: { type: DataTypes.STRING(80), allowNull: false },
        description: { type: DataTypes.STRING(1000), allowNull: true },
        sweeps: { type: DataTypes.JSONB, allowNull: false },
        summary: { type: DataTypes.JSONB, allowNull: false },
        visibility: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'published' },
        centerId: { type: DataTypes.INTEGER, allowNull: true, defaultValue: null },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        deletedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      // modelName fixed: the lists' sort expressions name the table alias "Pattern", which must not follow the class
      // name (the production bundle may rename the class)
      { sequelize, modelName: 'Pattern', tableName: 'patterns', paranoid: true, version: true },
    );
  }
}
