import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Running as several processes:
 *  - payments are recorded (with their idempotency key) before the payment service is called, so the row
 *    exists without a session yet (`creating`); an automatic refund's state is kept on the payment;
 *  - outbox rows are claimed (`sending`, `claimed_at`) and the claim committed before the mail is sent;
 *  - calibration fits are computed by the job worker and stored per bowler and pattern;
 *  - rate-limit counters, failed sign-ins and each user's last write live in the database, shared by every process.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.changeColumn(
      'payments',
      'checkout_session_id',
      { type: DataTypes.STRING(255), allowNull: true, unique: true },
      { transaction },
    );
    await qi.addColumn('payments', 'idempotency_key', { type: DataTypes.STRING(255), allowNull: true, unique: true }, { transaction });
    await qi.addColumn('payments', 'auto_refund_reason', { type: DataTypes.STRING(200), allowNull: true }, { transaction });
    await qi.addColumn('mail_outbox', 'claimed_at', { type: DataTypes.DATE, allowNull: true }, { transaction });

    await qi.createTable(
      'calibration_fits',
      {
        bowler_id: {
          type: DataTypes.INTEGER,
          allowNull: false,
          primaryKey: true,
          references: { model: 'users', key: 'id' },
          onDelete: 'CASCADE',
        },
        pattern_id: {
          type: DataTypes.INTEGER,
          allowNull: false,
          primaryKey: true,
          references: { model: 'patterns', key: 'id' },
          onDelete: 'CASCADE',
        },
        input_hash: { type: DataTypes.STRING(64), allowNull: false },
        calibration: { type: DataTypes.JSONB, allowNull: false },
        shots: { type: DataTypes.INTEGER, allowNull: false },
        fitted_at: { type: DataTypes.DATE, allowNull: false },
        fit_ms: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      },
      { transaction },
    );
    await qi.createTable(
      'rate_limit_hits',
      {
        key: { type: DataTypes.STRING(300), allowNull: false, primaryKey: true },
        hits: { type: DataTypes.INTEGER, allowNull: false },
        reset_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await qi.addIndex('rate_limit_hits', ['reset_at'], { transaction });
    await qi.createTable(
      'login_failures',
      {
        email: { type: DataTypes.STRING(254), allowNull: false, primaryKey: true },
        count: { type: DataTypes.INTEGER, allowNull: false },
        last_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await qi.createTable(
      'user_write_marks',
      {
        user_id: {
          type: DataTypes.INTEGER,
          allowNull: false,
          primaryKey: true,
          references: { model: 'users', key: 'id' },
          onDelete: 'CASCADE',
        },
        at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    for (const t of ['user_write_marks', 'login_failures', 'rate_limit_hits', 'calibration_fits']) await qi.dropTable(t, { transaction });
    await qi.removeColumn('mail_outbox', 'claimed_at', { transaction });
    await qi.removeColumn('payments', 'auto_refund_reason', { transaction });
    await qi.removeColumn('payments', 'idempotency_key', { transaction });
    await qi.sequelize.query('DELETE FROM payments WHERE checkout_session_id IS NULL', { transaction });
    await qi.changeColumn('payments', 'checkout_session_id', { type: DataTypes.STRING(255), allowNull: false }, { transaction });
  });
}
