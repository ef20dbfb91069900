import { DataTypes, type QueryInterface } from 'sequelize';

/** Equipment trials: a bowler's comparison of two or more balls (or surfaces) over the shots logged with each. */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable(
      'trials',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        created_by: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        name: { type: DataTypes.STRING(80), allowNull: false },
        arms: { type: DataTypes.JSONB, allowNull: false },
        pattern_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'patterns', key: 'id' }, onDelete: 'SET NULL' },
        start_date: { type: DataTypes.DATEONLY, allowNull: false },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await qi.addIndex('trials', ['user_id', 'created_at'], { transaction });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('trials');
}
