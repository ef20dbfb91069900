import { DataTypes, type QueryInterface } from 'sequelize';

/** A student's (or the coach's) answers to a coach's plan, in order. */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable(
      'plan_replies',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        plan_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'plans', key: 'id' }, onDelete: 'CASCADE' },
        author_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        text: { type: DataTypes.STRING(2000), allowNull: false },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await qi.addIndex('plan_replies', ['plan_id', 'created_at'], { transaction });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('plan_replies');
}
