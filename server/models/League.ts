import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A bowler's league for a season: where and when it bowls, games a night, and its handicap rule (null basis: scratch). */
export class League extends Model<InferAttributes<League>, InferCreationAttributes<League>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare name: string;
  declare centerId: number | null;
  /** 0 Sunday … 6 Saturday; null when it has no fixed night. */
  declare weekday: number | null;
  declare seasonStart: string;
  declare seasonEnd: string | null;
  declare gamesPerNight: number;
  declare handicapBasis: number | null;
  declare handicapPercent: number | null;
  declare handicapMax: number | null;
  declare enteringAverage: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    League.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(80), allowNull: false },
        centerId: { type: DataTypes.INTEGER, allowNull: true },
        weekday: { type: DataTypes.SMALLINT, allowNull: true },
        seasonStart: { type: DataTypes.DATEONLY, allowNull: false },
        seasonEnd: { type: DataTypes.DATEONLY, allowNull: true },
        gamesPerNight: { type: DataTypes.SMALLINT, allowNull: false, defaultValue: 3 },
        handicapBasis: { type: DataTypes.SMALLINT, allowNull: true },
        handicapPercent: { type: DataTypes.SMALLINT, allowNull: true },
        handicapMax: { type: DataTypes.SMALLINT, allowNull: true },
        enteringAverage: { type: DataTypes.SMALLINT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'leagues' },
    );
  }
}
