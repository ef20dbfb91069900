import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One arm of a trial as stored: the ball, and the surface its shots must have been thrown on (null: any). */
export interface StoredTrialArm {
  ballId: number;
  surfaceKey: string | null;
}

/** An equipment trial: the balls (or surfaces) a bowler compares, counting their shots from the start date on. */
export class Trial extends Model<InferAttributes<Trial>, InferCreationAttributes<Trial>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare createdBy: number;
  declare name: string;
  declare arms: StoredTrialArm[];
  declare patternId: number | null;
  declare startDate: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Trial.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER, allowNull: false },
        createdBy: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(80), allowNull: false },
        arms: { type: DataTypes.JSONB, allowNull: false },
        patternId: { type: DataTypes.INTEGER, allowNull: true },
        startDate: { type: DataTypes.DATEONLY, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'trials' },
    );
  }
}
