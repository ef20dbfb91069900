import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type CoachLinkStatus = 'pending' | 'active' | 'revoked';

/** A coach's invitation to a student by e-mail; active once the student accepts, revocable by either. */
export class CoachLink extends Model<InferAttributes<CoachLink>, InferCreationAttributes<CoachLink>> {
  declare id: CreationOptional<number>;
  declare coachId: number;
  declare studentId: number | null;
  declare email: string;
  declare status: CreationOptional<CoachLinkStatus>;
  declare acceptedAt: Date | null;
  declare revokedAt: Date | null;
  declare revokedBy: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    CoachLink.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        coachId: { type: DataTypes.INTEGER, allowNull: false },
        studentId: { type: DataTypes.INTEGER, allowNull: true },
        email: { type: DataTypes.STRING(254), allowNull: false },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'pending' },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
        revokedBy: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'coach_links' },
    );
  }
}
