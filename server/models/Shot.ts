import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One logged delivery: ball (with its surface then), boards, pins standing after it. Created once per idempotency key. */
export class Shot extends Model<InferAttributes<Shot>, InferCreationAttributes<Shot>> {
  declare id: CreationOptional<number>;
  declare sessionId: number;
  declare gameNumber: number;
  declare frame: number;
  declare delivery: number;
  declare ballId: number;
  declare surfaceGrit: number;
  declare surfacePolished: boolean;
  declare surfaceKey: string;
  declare feetBoard: number | null;
  declare targetBoard: number | null;
  declare breakpointBoard: number | null;
  declare standing: number[];
  declare foul: boolean;
  declare hit: 'pocket' | 'high' | 'light' | 'brooklyn' | 'miss' | null;
  declare note: string;
  /** The shot's own measured release, when logged. */
  declare speedMph: CreationOptional<number | null>;
  declare revRpm: CreationOptional<number | null>;
  declare idempotencyKey: string;
  declare requestHash: string;
  declare response: CreationOptional<Record<string, unknown>>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Shot.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        sessionId: { type: DataTypes.INTEGER, allowNull: false },
        gameNumber: { type: DataTypes.INTEGER, allowNull: false },
        frame: { type: DataTypes.INTEGER, allowNull: false },
        delivery: { type: DataTypes.INTEGER, allowNull: false },
        ballId: { type: DataTypes.INTEGER, allowNull: false },
        surfaceGrit: { type: DataTypes.INTEGER, allowNull: false },
        surfacePolished: { type: DataTypes.BOOLEAN, allowNull: false },
        surfaceKey: { type: DataTypes.STRING(40), allowNull: false },
        feetBoard: { type: DataTypes.REAL, allowNull: true },
        targetBoard: { type: DataTypes.REAL, allowNull: true },
        breakpointBoard: { type: DataTypes.REAL, allowNull: true },
        standing: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false },
        foul: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        hit: { type: DataTypes.STRING(10), allowNull: true },
        note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
        speedMph: { type: DataTypes.REAL, allowNull: true },
        revRpm: { type: DataTypes.INTEGER, allowNull: true },
        idempotencyKey: { type: DataTypes.STRING(100), allowNull: false },
        requestHash: { type: DataTypes.STRING(64), allowNull: false },
        response: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'shots' },
    );
  }
}
