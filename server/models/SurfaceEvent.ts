import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One change of a ball's surface (resurface, polish, shop work). */
export class SurfaceEvent extends Model<InferAttributes<SurfaceEvent>, InferCreationAttributes<SurfaceEvent>> {
  declare id: CreationOptional<number>;
  declare ballId: number;
  declare fromGrit: number | null;
  declare fromPolished: boolean | null;
  declare toGrit: number;
  declare toPolished: boolean;
  declare at: Date;
  declare byUserId: number | null;
  declare note: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    SurfaceEvent.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        ballId: { type: DataTypes.INTEGER, allowNull: false },
        fromGrit: { type: DataTypes.INTEGER, allowNull: true },
        fromPolished: { type: DataTypes.BOOLEAN, allowNull: true },
        toGrit: { type: DataTypes.INTEGER, allowNull: false },
        toPolished: { type: DataTypes.BOOLEAN, allowNull: false },
        at: { type: DataTypes.DATE, allowNull: false },
        byUserId: { type: DataTypes.INTEGER, allowNull: true },
        note: { type: DataTypes.STRING(500), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'surface_events' },
    );
  }
}
