import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type SessionKind = 'practice' | 'league' | 'tournament';

/** A bowler's session at the lanes (table `sessions`): where, on which condition or pattern, when. Soft-deleted. */
export class BowlingSession extends Model<InferAttributes<BowlingSession>, InferCreationAttributes<BowlingSession>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare date: string;
  declare kind: SessionKind;
  declare centerId: number | null;
  declare conditionId: number | null;
  declare patternId: number | null;
  declare patternName: string | null;
  /** The league night this session is (the bowler's own league), if any. */
  declare leagueId: CreationOptional<number | null>;
  /** The lane pair bowled on, e.g. "13-14". */
  declare lanePair: CreationOptional<string | null>;
  declare notes: CreationOptional<string>;
  declare version: CreationOptional<number>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    BowlingSession.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER, allowNull: false },
        date: { type: DataTypes.DATEONLY, allowNull: false },
        kind: { type: DataTypes.STRING(12), allowNull: false },
        centerId: { type: DataTypes.INTEGER, allowNull: true },
        conditionId: { type: DataTypes.INTEGER, allowNull: true },
        patternId: { type: DataTypes.INTEGER, allowNull: true },
        patternName: { type: DataTypes.STRING(80), allowNull: true },
        leagueId: { type: DataTypes.INTEGER, allowNull: true },
        lanePair: { type: DataTypes.STRING(7), allowNull: true },
        notes: { type: DataTypes.STRING(2000), allowNull: false, defaultValue: '' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        deletedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'sessions', paranoid: true, version: true },
    );
  }
}
