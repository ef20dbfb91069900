import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A note on a session (optionally on one game or frame), by the bowler or a linked coach. */
export class Annotation extends Model<InferAttributes<Annotation>, InferCreationAttributes<Annotation>> {
  declare id: CreationOptional<number>;
  declare sessionId: number;
  declare authorId: number;
  declare gameNumber: number | null;
  declare frame: number | null;
  declare text: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Annotation.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        sessionId: { type: DataTypes.INTEGER, allowNull: false },
        authorId: { type: DataTypes.INTEGER, allowNull: false },
        gameNumber: { type: DataTypes.INTEGER, allowNull: true },
        frame: { type: DataTypes.INTEGER, allowNull: true },
        text: { type: DataTypes.STRING(2000), allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'annotations' },
    );
  }
}
