import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * A publication's schedule: the recurring days it is in force on (league nights; ISO 8601 day numbers, 1 Monday …
 * 7 Sunday; null every day), its start and end being the center's own local days. Follows keep the row of an
 * e-mail unsubscribe for a while (`deleted_at`), so the follower can undo it from the same link.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.addColumn('conditions', 'weekdays', { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: true }, { transaction });
    await qi.addColumn('follows', 'deleted_at', { type: DataTypes.DATE, allowNull: true }, { transaction });
    await qi.sequelize.query(
      `ALTER TABLE conditions ADD CONSTRAINT conditions_weekdays_range CHECK (weekdays IS NULL OR weekdays <@ ARRAY[1,2,3,4,5,6,7])`,
      { transaction },
    );
    await qi.addIndex('conditions', ['center_id', 'valid_to'], { name: 'conditions_center_valid_to', transaction });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.removeIndex('conditions', 'conditions_center_valid_to', { transaction });
    await qi.sequelize.query('ALTER TABLE conditions DROP CONSTRAINT IF EXISTS conditions_weekdays_range', { transaction });
    await qi.removeColumn('conditions', 'weekdays', { transaction });
    await qi.removeColumn('follows', 'deleted_at', { transaction });
  });
}
