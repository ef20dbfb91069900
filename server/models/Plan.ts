import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A coach's surface, layout or line advice for a student (shown on the student's Home). */
export class Plan extends Model<InferAttributes<Plan>, InferCreationAttributes<Plan>> {
  declare id: CreationOptional<number>;
  declare coachId: number;
  declare studentId: number;
  declare title: string;
  declare kind: 'surface' | 'layout' | 'line';
  declare body: string;
  declare ballId: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Plan.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        coachId: { type: DataTypes.INTEGER, allowNull: false },
        studentId: { type: DataTypes.INTEGER, allowNull: false },
        title: { type: DataTypes.STRING(120), allowNull: false },
        kind: { type: DataTypes.STRING(10), allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
        ballId: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'plans' },
    );
  }
}
