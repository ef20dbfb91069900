import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Account security: a verified e-mail address (users.email_verified_at, set from a mailed one-time token in
 * email_verifications), and at most one open password-reset token per user (older open tokens are closed
 * first; a partial unique index keeps it so).
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.addColumn('users', 'email_verified_at', { type: DataTypes.DATE, allowNull: true }, { transaction });
    await qi.createTable(
      'email_verifications',
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
    await qi.sequelize.query('CREATE UNIQUE INDEX email_verifications_one_open ON email_verifications (user_id) WHERE used_at IS NULL', {
      transaction,
    });
    await qi.sequelize.query(
      `UPDATE password_resets p SET used_at = now(), updated_at = now()
       WHERE p.used_at IS NULL AND p.id <> (SELECT max(q.id) FROM password_resets q WHERE q.user_id = p.user_id AND q.used_at IS NULL)`,
      { transaction },
    );
    await qi.sequelize.query('CREATE UNIQUE INDEX password_resets_one_open ON password_resets (user_id) WHERE used_at IS NULL', {
      transaction,
    });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.sequelize.query('DROP INDEX IF EXISTS password_resets_one_open', { transaction });
    await qi.dropTable('email_verifications', { transaction });
    await qi.removeColumn('users', 'email_verified_at', { transaction });
  });
}
