import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Ball upkeep: games since the last oil extraction beside games since the last resurface, when each count was last
 * set (games logged with the ball after that moment are added to it), and the bowler's own intervals per ball
 * (null: the defaults).
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    const now = qi.sequelize.fn('now');
    await qi.addColumn('balls', 'games_since_extraction', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 }, { transaction });
    await qi.addColumn('balls', 'resurface_counted_at', { type: DataTypes.DATE, allowNull: false, defaultValue: now }, { transaction });
    await qi.addColumn('balls', 'extraction_counted_at', { type: DataTypes.DATE, allowNull: false, defaultValue: now }, { transaction });
    await qi.addColumn('balls', 'upkeep_resurface_games', { type: DataTypes.INTEGER, allowNull: true }, { transaction });
    await qi.addColumn('balls', 'upkeep_extraction_games', { type: DataTypes.INTEGER, allowNull: true }, { transaction });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    for (const c of [
      'games_since_extraction',
      'resurface_counted_at',
      'extraction_counted_at',
      'upkeep_resurface_games',
      'upkeep_extraction_games',
    ])
      await qi.removeColumn('balls', c, { transaction });
  });
}
