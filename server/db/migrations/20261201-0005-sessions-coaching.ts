import { DataTypes, type QueryInterface } from 'sequelize';

const ts = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

/**
 * Shot logs (sessions and their shots, each shot created once per idempotency key), coach ↔ student links,
 * a coach's plans for a student and annotations on sessions.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable(
      'sessions',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        date: { type: DataTypes.DATEONLY, allowNull: false },
        kind: { type: DataTypes.STRING(12), allowNull: false },
        center_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'centers', key: 'id' }, onDelete: 'SET NULL' },
        condition_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'conditions', key: 'id' }, onDelete: 'SET NULL' },
        pattern_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'patterns', key: 'id' }, onDelete: 'SET NULL' },
        // The pattern's name when the session was created (a condition is a snapshot; a pattern may be renamed or deleted later).
        pattern_name: { type: DataTypes.STRING(80), allowNull: true },
        notes: { type: DataTypes.STRING(2000), allowNull: false, defaultValue: '' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        deleted_at: { type: DataTypes.DATE, allowNull: true },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('sessions', ['user_id', 'date'], { transaction });
    await qi.addIndex('sessions', ['pattern_id'], { transaction });

    await qi.createTable(
      'shots',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        session_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'sessions', key: 'id' }, onDelete: 'CASCADE' },
        game_number: { type: DataTypes.INTEGER, allowNull: false },
        frame: { type: DataTypes.INTEGER, allowNull: false },
        delivery: { type: DataTypes.INTEGER, allowNull: false },
        ball_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'balls', key: 'id' }, onDelete: 'CASCADE' },
        // The ball's surface when the shot was thrown (it may be resurfaced later).
        surface_grit: { type: DataTypes.INTEGER, allowNull: false },
        surface_polished: { type: DataTypes.BOOLEAN, allowNull: false },
        surface_key: { type: DataTypes.STRING(40), allowNull: false },
        feet_board: { type: DataTypes.REAL, allowNull: true },
        target_board: { type: DataTypes.REAL, allowNull: true },
        breakpoint_board: { type: DataTypes.REAL, allowNull: true },
        standing: { type: DataTypes.ARRAY(DataTypes.INTEGER), allowNull: false },
        foul: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        hit: { type: DataTypes.STRING(10), allowNull: true },
        note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
        idempotency_key: { type: DataTypes.STRING(100), allowNull: false },
        // sha256 of the request body: the same key with another body is a conflict, not a retry.
        request_hash: { type: DataTypes.STRING(64), allowNull: false },
        // The first answer, returned again verbatim for a retried request.
        response: { type: DataTypes.JSONB, allowNull: false },
        ...ts,
      },
      { transaction },
    );
    // A retried request never stores a second row: the database refuses the same key twice in a session.
    await qi.addIndex('shots', ['session_id', 'idempotency_key'], { unique: true, name: 'shots_session_idempotency_key', transaction });
    // One row per delivery of a game, whatever the keys.
    await qi.addIndex('shots', ['session_id', 'game_number', 'frame', 'delivery'], {
      unique: true,
      name: 'shots_session_delivery',
      transaction,
    });
    await qi.addIndex('shots', ['ball_id'], { transaction });

    await qi.createTable(
      'coach_links',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        coach_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        student_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        email: { type: DataTypes.STRING(254), allowNull: false },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'pending' },
        accepted_at: { type: DataTypes.DATE, allowNull: true },
        revoked_at: { type: DataTypes.DATE, allowNull: true },
        revoked_by: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        ...ts,
      },
      { transaction },
    );
    // At most one live (pending or active) link per coach and e-mail.
    await qi.sequelize.query(
      `CREATE UNIQUE INDEX coach_links_live ON coach_links (coach_id, email) WHERE status IN ('pending', 'active')`,
      { transaction },
    );
    await qi.addIndex('coach_links', ['student_id', 'status'], { transaction });
    await qi.addIndex('coach_links', ['email'], { transaction });

    await qi.createTable(
      'plans',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        coach_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        student_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        title: { type: DataTypes.STRING(120), allowNull: false },
        kind: { type: DataTypes.STRING(10), allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
        ball_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'balls', key: 'id' }, onDelete: 'SET NULL' },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('plans', ['student_id', 'created_at'], { transaction });

    await qi.createTable(
      'annotations',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        session_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'sessions', key: 'id' }, onDelete: 'CASCADE' },
        author_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        game_number: { type: DataTypes.INTEGER, allowNull: true },
        frame: { type: DataTypes.INTEGER, allowNull: true },
        text: { type: DataTypes.STRING(2000), allowNull: false },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('annotations', ['session_id'], { transaction });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('annotations');
  await qi.dropTable('plans');
  await qi.dropTable('coach_links');
  await qi.dropTable('shots');
  await qi.dropTable('sessions');
}
