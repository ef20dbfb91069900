import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { User } from './User';

/** An answer to a coach's plan, by its student or its coach. */
export class PlanReply extends Model<InferAttributes<PlanReply>, InferCreationAttributes<PlanReply>> {
  declare id: CreationOptional<number>;
  declare planId: number;
  declare authorId: number;
  declare text: string;
  declare author?: NonAttribute<User>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    PlanReply.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        planId: { type: DataTypes.INTEGER, allowNull: false },
        authorId: { type: DataTypes.INTEGER, allowNull: false },
        text: { type: DataTypes.STRING(2000), allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'plan_replies' },
    );
  }
}
