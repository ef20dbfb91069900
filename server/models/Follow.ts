import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A bowler following a center: they get an e-mail at each publication (unsubscribe link without sign-in). */
export class Follow extends Model<InferAttributes<Follow>, InferCreationAttributes<Follow>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare centerId: number;
  declare unsubscribeToken: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  /** Set by an e-mail unsubscribe (kept so the same link can undo it); a follow removed in the app is deleted. */
  declare deletedAt: CreationOptional<Date | null>;

  static initModel(sequelize: Sequelize): void {
    Follow.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER, allowNull: false },
        centerId: { type: DataTypes.INTEGER, allowNull: false },
        unsubscribeToken: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
        deletedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'follows', paranoid: true },
    );
  }
}
