import { DataTypes, type QueryInterface } from 'sequelize';

const ts = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

/** Centers and their lanes, published conditions (immutable), follows and the e-mail outbox. */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable(
      'centers',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(80), allowNull: false },
        town: { type: DataTypes.STRING(80), allowNull: false },
        lane_count: { type: DataTypes.INTEGER, allowNull: false },
        owner_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('centers', ['owner_id'], { transaction });
    await qi.createTable(
      'lanes',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        center_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'centers', key: 'id' }, onDelete: 'CASCADE' },
        number: { type: DataTypes.INTEGER, allowNull: false },
        notes: { type: DataTypes.STRING(200), allowNull: true },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('lanes', ['center_id', 'number'], { unique: true, transaction });
    await qi.createTable(
      'conditions',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        center_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'centers', key: 'id' }, onDelete: 'CASCADE' },
        pattern_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'patterns', key: 'id' }, onDelete: 'SET NULL' },
        pattern_name: { type: DataTypes.STRING(80), allowNull: false },
        sweeps: { type: DataTypes.JSONB, allowNull: false },
        summary: { type: DataTypes.JSONB, allowNull: false },
        lanes: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false },
        valid_from: { type: DataTypes.DATEONLY, allowNull: false },
        valid_to: { type: DataTypes.DATEONLY, allowNull: true },
        notes: { type: DataTypes.STRING(2000), allowNull: true },
        published_at: { type: DataTypes.DATE, allowNull: false },
        published_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('conditions', ['center_id', 'published_at'], { transaction });
    // A publication is never overwritten: the database itself refuses UPDATE on conditions.
    await qi.sequelize.query(
      `CREATE FUNCTION conditions_immutable() RETURNS trigger AS $$ BEGIN RAISE EXCEPTION 'published conditions are immutable'; END $$ LANGUAGE plpgsql;
       CREATE TRIGGER conditions_no_update BEFORE UPDATE ON conditions FOR EACH ROW EXECUTE FUNCTION conditions_immutable();`,
      { transaction },
    );
    await qi.createTable(
      'follows',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        center_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'centers', key: 'id' }, onDelete: 'CASCADE' },
        unsubscribe_token: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('follows', ['user_id', 'center_id'], { unique: true, transaction });
    await qi.createTable(
      'mail_outbox',
      {
        id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
        to_address: { type: DataTypes.STRING(254), allowNull: false },
        subject: { type: DataTypes.STRING(200), allowNull: false },
        text: { type: DataTypes.TEXT, allowNull: false },
        html: { type: DataTypes.TEXT, allowNull: true },
        kind: { type: DataTypes.STRING(40), allowNull: false },
        ref: { type: DataTypes.STRING(64), allowNull: true },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'pending' },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        next_attempt_at: { type: DataTypes.DATE, allowNull: false },
        last_error: { type: DataTypes.STRING(500), allowNull: true },
        sent_at: { type: DataTypes.DATE, allowNull: true },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('mail_outbox', ['status', 'next_attempt_at'], { transaction });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('mail_outbox');
  await qi.dropTable('follows');
  await qi.sequelize.query('DROP TRIGGER IF EXISTS conditions_no_update ON conditions; DROP FUNCTION IF EXISTS conditions_immutable();');
  await qi.dropTable('conditions');
  await qi.dropTable('lanes');
  await qi.dropTable('centers');
}
