import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Role } from '../../shared/auth';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare passwordHash: string;
  declare displayName: string;
  declare role: CreationOptional<Role>;
  /** Bumped to invalidate every token issued before (password reset). */
  declare tokenVersion: CreationOptional<number>;
  /** When the user proved they read their address (the mailed verification link); null until then. */
  declare emailVerifiedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    User.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        passwordHash: { type: DataTypes.STRING(100), allowNull: false },
        displayName: { type: DataTypes.STRING(80), allowNull: false },
        role: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'bowler' },
        tokenVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        emailVerifiedAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users' },
    );
  }
}
