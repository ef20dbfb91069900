import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { CoverType } from '../../engine/types';
import type { Layout } from '../../shared/balls';
import type { SurfaceEvent } from './SurfaceEvent';

/** A ball a bowler owns; specs are copied from the catalogue model (or entered by hand). Soft-deleted. */
export class Ball extends Model<InferAttributes<Ball>, InferCreationAttributes<Ball>> {
  declare id: CreationOptional<number>;
  declare ownerId: number;
  declare ballModelId: number | null;
  declare name: string;
  declare maker: string | null;
  declare nickname: string | null;
  declare weightLb: number;
  declare rg: number;
  declare differential: number;
  declare intermediateDifferential: number;
  declare coverType: CoverType;
  declare coreType: 'symmetric' | 'asymmetric';
  declare hardnessD: number | null;
  /** Year the ball model was approved (the catalogue model's release year; null when entered by hand): the hardness limit depends on it. */
  declare approvalYear: CreationOptional<number | null>;
  declare surfaceGrit: number;
  declare polished: boolean;
  declare layout: Layout | null;
  declare photoUploadId: CreationOptional<number | null>;
  declare gamesSinceResurface: CreationOptional<number>;
  declare gamesSinceExtraction: CreationOptional<number>;
  /** When gamesSinceResurface / gamesSinceExtraction were last set: games logged with the ball after it add to them. */
  declare resurfaceCountedAt: CreationOptional<Date>;
  declare extractionCountedAt: CreationOptional<Date>;
  /** The bowler's own upkeep intervals for this ball, games (null: the defaults). */
  declare upkeepResurfaceGames: CreationOptional<number | null>;
  declare upkeepExtractionGames: CreationOptional<number | null>;
  declare status: CreationOptional<'active' | 'retired' | 'in-shop'>;
  declare version: CreationOptional<number>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare surfaceEvents?: NonAttribute<SurfaceEvent[]>;

  static initModel(sequelize: Sequelize): void {
    Ball.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        ownerId: { type: DataTypes.INTEGER, allowNull: false },
        ballModelId: { type: DataTypes.INTEGER, allowNull: true },
        name: { type: DataTypes.STRING(80), allowNull: false },
        maker: { type: DataTypes.STRING(60), allowNull: true },
        nickname: { type: DataTypes.STRING(60), allowNull: true },
        weightLb: { type: DataTypes.REAL, allowNull: false },
        rg: { type: DataTypes.DOUBLE, allowNull: false },
        differential: { type: DataTypes.DOUBLE, allowNull: false },
        intermediateDifferential: { type: DataTypes.DOUBLE, allowNull: false },
        coverType: { type: DataTypes.STRING(20), allowNull: false },
        coreType: { type: DataTypes.STRING(12), allowNull: false },
        hardnessD: { type: DataTypes.REAL, allowNull: true },
        approvalYear: { type: DataTypes.INTEGER, allowNull: true },
        surfaceGrit: { type: DataTypes.INTEGER, allowNull: false },
        polished: { type: DataTypes.BOOLEAN, allowNull: false },
        layout: { type: DataTypes.JSONB, allowNull: true },
        photoUploadId: { type: DataTypes.INTEGER, allowNull: true },
        gamesSinceResurface: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        gamesSinceExtraction: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        resurfaceCountedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        extractionCountedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        upkeepResurfaceGames: { type: DataTypes.INTEGER, allowNull: true },
        upkeepExtractionGames: { type: DataTypes.INTEGER, allowNull: true },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'active' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        deletedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      {
        sequelize,
        tableName: 'balls',
        paranoid: true,
        version: true,
        hooks: {
          // One home for the rule: whoever sets a games-since count (a resurface, an extraction, an edit) restarts
          // the logged games added to it from now.
          beforeSave: (b: Ball) => {
            if (!b.isNewRecord && b.changed('gamesSinceResurface')) b.resurfaceCountedAt = new Date();
            if (!b.isNewRecord && b.changed('gamesSinceExtraction')) b.extractionCountedAt = new Date();
          },
        },
      },
    );
  }
}
