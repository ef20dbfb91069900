import { DataTypes, type QueryInterface } from 'sequelize';

const ts = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

/** The shared ball catalogue, owned balls with their surface history, and oil patterns. */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable(
      'ball_models',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        maker: { type: DataTypes.STRING(60), allowNull: false },
        name: { type: DataTypes.STRING(80), allowNull: false },
        cover_type: { type: DataTypes.STRING(20), allowNull: false },
        core_type: { type: DataTypes.STRING(12), allowNull: false },
        rg: { type: DataTypes.DOUBLE, allowNull: false },
        differential: { type: DataTypes.DOUBLE, allowNull: false },
        intermediate_differential: { type: DataTypes.DOUBLE, allowNull: false },
        factory_grit: { type: DataTypes.INTEGER, allowNull: false },
        factory_polished: { type: DataTypes.BOOLEAN, allowNull: false },
        hardness_d: { type: DataTypes.REAL, allowNull: true },
        release_year: { type: DataTypes.INTEGER, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('ball_models', ['maker', 'name'], { unique: true, transaction });
    await qi.createTable(
      'balls',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        owner_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        ball_model_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'ball_models', key: 'id' }, onDelete: 'SET NULL' },
        name: { type: DataTypes.STRING(80), allowNull: false },
        maker: { type: DataTypes.STRING(60), allowNull: true },
        nickname: { type: DataTypes.STRING(60), allowNull: true },
        weight_lb: { type: DataTypes.REAL, allowNull: false },
        rg: { type: DataTypes.DOUBLE, allowNull: false },
        differential: { type: DataTypes.DOUBLE, allowNull: false },
        intermediate_differential: { type: DataTypes.DOUBLE, allowNull: false },
        cover_type: { type: DataTypes.STRING(20), allowNull: false },
        core_type: { type: DataTypes.STRING(12), allowNull: false },
        hardness_d: { type: DataTypes.REAL, allowNull: true },
        surface_grit: { type: DataTypes.INTEGER, allowNull: false },
        polished: { type: DataTypes.BOOLEAN, allowNull: false },
        layout: { type: DataTypes.JSONB, allowNull: true },
        games_since_resurface: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'active' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        deleted_at: { type: DataTypes.DATE, allowNull: true },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('balls', ['owner_id', 'deleted_at'], { transaction });
    await qi.createTable(
      'surface_events',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        ball_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'balls', key: 'id' }, onDelete: 'CASCADE' },
        from_grit: { type: DataTypes.INTEGER, allowNull: true },
        from_polished: { type: DataTypes.BOOLEAN, allowNull: true },
        to_grit: { type: DataTypes.INTEGER, allowNull: false },
        to_polished: { type: DataTypes.BOOLEAN, allowNull: false },
        at: { type: DataTypes.DATE, allowNull: false },
        by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        note: { type: DataTypes.STRING(500), allowNull: true },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('surface_events', ['ball_id', 'at'], { transaction });
    await qi.createTable(
      'patterns',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        owner_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        name: { type: DataTypes.STRING(80), allowNull: false },
        description: { type: DataTypes.STRING(1000), allowNull: true },
        sweeps: { type: DataTypes.JSONB, allowNull: false },
        summary: { type: DataTypes.JSONB, allowNull: false },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        deleted_at: { type: DataTypes.DATE, allowNull: true },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('patterns', ['name'], { transaction });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('patterns');
  await qi.dropTable('surface_events');
  await qi.dropTable('balls');
  await qi.dropTable('ball_models');
}
