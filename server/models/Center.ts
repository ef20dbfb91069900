import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A bowling center; a proprietor manages only the centers they own. */
export class Center extends Model<InferAttributes<Center>, InferCreationAttributes<Center>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare town: string;
  declare laneCount: number;
  /** IANA time zone name; the center's days (schedules, takings) are reckoned in it. */
  declare timeZone: CreationOptional<string>;
  declare ownerId: number | null;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Center.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(80), allowNull: false },
        town: { type: DataTypes.STRING(80), allowNull: false },
        laneCount: { type: DataTypes.INTEGER, allowNull: false },
        timeZone: { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' },
        ownerId: { type: DataTypes.INTEGER, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'centers', version: true },
    );
  }
}
