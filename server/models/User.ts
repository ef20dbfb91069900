import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { primaryRole, type Role } from '../../shared/auth';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare passwordHash: string;
  declare displayName: string;
  declare role: CreationOptional<Role>;
  /** Every role held; `role` is the highest of them. */
  declare roles: CreationOptional<Role[]>;
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
        roles: { type: DataTypes.ARRAY(DataTypes.STRING(16)), allowNull: false, defaultValue: ['bowler'] },
        tokenVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        emailVerifiedAt: { type: DataTypes.DATE, allowNull: true, defaultValue: null },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'users' },
    );
    // `role` and `roles` stay in step: a new set decides the highest role; a lone `role` written by older code
    // (or a new user given only a role) becomes the whole set.
    User.addHook('beforeSave', (u: User) => {
      if (u.isNewRecord) {
        const onlyDefault = !u.roles || (u.roles.length === 1 && u.roles[0] === 'bowler');
        if (onlyDefault) u.roles = [u.role ?? 'bowler'];
        else u.role = primaryRole(u.roles);
        return;
      }
      if (u.changed('roles')) u.role = primaryRole(u.roles);
      else if (u.changed('role')) u.roles = [u.role];
    });
  }
}
