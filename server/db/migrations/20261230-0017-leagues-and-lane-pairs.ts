import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * A bowler's leagues (schedule, games a night, the league's handicap rule) and, on each session, the league
 * night it belongs to and the lane pair it was bowled on.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable(
      'leagues',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        name: { type: DataTypes.STRING(80), allowNull: false },
        center_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'centers', key: 'id' }, onDelete: 'SET NULL' },
        weekday: { type: DataTypes.SMALLINT, allowNull: true },
        season_start: { type: DataTypes.DATEONLY, allowNull: false },
        season_end: { type: DataTypes.DATEONLY, allowNull: true },
        games_per_night: { type: DataTypes.SMALLINT, allowNull: false, defaultValue: 3 },
        handicap_basis: { type: DataTypes.SMALLINT, allowNull: true },
        handicap_percent: { type: DataTypes.SMALLINT, allowNull: true },
        handicap_max: { type: DataTypes.SMALLINT, allowNull: true },
        entering_average: { type: DataTypes.SMALLINT, allowNull: true },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await qi.addIndex('leagues', ['user_id', 'season_start'], { transaction });
    await qi.addColumn(
      'sessions',
      'league_id',
      { type: DataTypes.INTEGER, allowNull: true, references: { model: 'leagues', key: 'id' }, onDelete: 'SET NULL' },
      { transaction },
    );
    await qi.addColumn('sessions', 'lane_pair', { type: DataTypes.STRING(7), allowNull: true }, { transaction });
    await qi.addIndex('sessions', ['league_id', 'date'], { transaction });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.removeColumn('sessions', 'lane_pair', { transaction });
    await qi.removeColumn('sessions', 'league_id', { transaction });
    await qi.dropTable('leagues', { transaction });
  });
}
