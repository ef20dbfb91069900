import { DataTypes, type QueryInterface } from 'sequelize';

/** Users, their bowler profiles, password-reset tokens and the audit log. */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable(
      'users',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        password_hash: { type: DataTypes.STRING(100), allowNull: false },
        display_name: { type: DataTypes.STRING(80), allowNull: false },
        role: { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'bowler' },
        token_version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await qi.sequelize.query("ALTER TABLE users ADD CONSTRAINT users_role_check CHECK (role IN ('bowler','coach','proprietor','admin'))", {
      transaction,
    });
    await qi.createTable(
      'bowler_profiles',
      {
        user_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        hand: { type: DataTypes.STRING(5), allowNull: false },
        speed_mph: { type: DataTypes.REAL, allowNull: false },
        rev_rpm: { type: DataTypes.INTEGER, allowNull: false },
        axis_rotation_deg: { type: DataTypes.REAL, allowNull: false },
        axis_tilt_deg: { type: DataTypes.REAL, allowNull: false },
        pap_right_in: { type: DataTypes.REAL, allowNull: true },
        pap_up_in: { type: DataTypes.REAL, allowNull: true },
        units: { type: DataTypes.STRING(8), allowNull: false, defaultValue: 'imperial' },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await qi.createTable(
      'password_resets',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        expires_at: { type: DataTypes.DATE, allowNull: false },
        used_at: { type: DataTypes.DATE, allowNull: true },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await qi.createTable(
      'audit_events',
      {
        id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
        actor_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        action: { type: DataTypes.STRING(64), allowNull: false },
        subject_type: { type: DataTypes.STRING(32), allowNull: false },
        subject_id: { type: DataTypes.STRING(64), allowNull: false },
        details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        created_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await qi.addIndex('audit_events', ['subject_type', 'subject_id'], { transaction });
    await qi.addIndex('audit_events', ['created_at'], { transaction });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('audit_events');
  await qi.dropTable('password_resets');
  await qi.dropTable('bowler_profiles');
  await qi.dropTable('users');
}
