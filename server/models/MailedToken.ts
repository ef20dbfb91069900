import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type ModelAttributes,
} from 'sequelize';

/**
 * A mailed one-time token (an address verification, a password reset): the user it belongs to, the hash of the token
 * mailed, when it expires and when it was used. Each kind is a model of its own on its own table.
 */
export abstract class MailedToken extends Model<InferAttributes<MailedToken>, InferCreationAttributes<MailedToken>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  /** SHA-256 of the token mailed to the user; the token itself is never stored. */
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** The columns of a mailed token's table (a new object for each model's `init`). */
export function mailedTokenColumns(): ModelAttributes<MailedToken, InferAttributes<MailedToken>> {
  return {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    userId: { type: DataTypes.INTEGER, allowNull: false },
    tokenHash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expiresAt: { type: DataTypes.DATE, allowNull: false },
    usedAt: { type: DataTypes.DATE, allowNull: true },
    createdAt: DataTypes.DATE,
    updatedAt: DataTypes.DATE,
  };
}
