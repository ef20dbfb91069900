import { DataTypes, type QueryInterface } from 'sequelize';

const ts = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

/**
 * The pro shop: each center's price list, orders (price, service and ball copied when ordered), their
 * status history, card payments (one row per checkout session) and the payment service's webhook events
 * already processed (unique event id, so a repeated delivery is processed once). Money in integer cents
 * with its currency.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.createTable(
      'shop_services',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        center_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'centers', key: 'id' }, onDelete: 'CASCADE' },
        kind: { type: DataTypes.STRING(20), allowNull: false },
        name: { type: DataTypes.STRING(80), allowNull: false },
        grit: { type: DataTypes.INTEGER, allowNull: true },
        description: { type: DataTypes.STRING(500), allowNull: true },
        price_cents: { type: DataTypes.INTEGER, allowNull: false },
        currency: { type: DataTypes.STRING(3), allowNull: false, defaultValue: 'usd' },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('shop_services', ['center_id', 'active'], { transaction });
    await qi.sequelize.query(
      `ALTER TABLE shop_services ADD CONSTRAINT shop_services_price_positive CHECK (price_cents > 0),
         ADD CONSTRAINT shop_services_resurface_grit CHECK (kind <> 'resurface' OR grit IS NOT NULL)`,
      { transaction },
    );

    await qi.createTable(
      'orders',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
        center_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'centers', key: 'id' }, onDelete: 'CASCADE' },
        service_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'shop_services', key: 'id' }, onDelete: 'SET NULL' },
        ball_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'balls', key: 'id' }, onDelete: 'SET NULL' },
        service_kind: { type: DataTypes.STRING(20), allowNull: false },
        service_name: { type: DataTypes.STRING(80), allowNull: false },
        grit: { type: DataTypes.INTEGER, allowNull: true },
        ball_name: { type: DataTypes.STRING(150), allowNull: false },
        amount_cents: { type: DataTypes.INTEGER, allowNull: false },
        currency: { type: DataTypes.STRING(3), allowNull: false },
        status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'ordered' },
        payment_status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'unpaid' },
        last_payment_error: { type: DataTypes.STRING(500), allowNull: true },
        notes: { type: DataTypes.STRING(1000), allowNull: true },
        paid_at: { type: DataTypes.DATE, allowNull: true },
        ready_at: { type: DataTypes.DATE, allowNull: true },
        collected_at: { type: DataTypes.DATE, allowNull: true },
        refunded_at: { type: DataTypes.DATE, allowNull: true },
        cancelled_at: { type: DataTypes.DATE, allowNull: true },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('orders', ['user_id', 'created_at'], { transaction });
    await qi.addIndex('orders', ['center_id', 'created_at'], { transaction });
    await qi.addIndex('orders', ['center_id', 'paid_at'], { transaction });
    await qi.sequelize.query(
      `ALTER TABLE orders ADD CONSTRAINT orders_amount_positive CHECK (amount_cents > 0),
         ADD CONSTRAINT orders_status_known CHECK (status IN ('ordered','paid','in_progress','ready','collected','cancelled','refunded')),
         ADD CONSTRAINT orders_payment_status_known CHECK (payment_status IN ('unpaid','processing','paid','failed','refunded'))`,
      { transaction },
    );

    await qi.createTable(
      'order_events',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        order_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'orders', key: 'id' }, onDelete: 'CASCADE' },
        status: { type: DataTypes.STRING(12), allowNull: false },
        at: { type: DataTypes.DATE, allowNull: false },
        by_user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
        by_name: { type: DataTypes.STRING(80), allowNull: true },
        note: { type: DataTypes.STRING(300), allowNull: true },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('order_events', ['order_id', 'at'], { transaction });

    await qi.createTable(
      'payments',
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        order_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: 'orders', key: 'id' }, onDelete: 'CASCADE' },
        checkout_session_id: { type: DataTypes.STRING(255), allowNull: false, unique: true },
        payment_intent_id: { type: DataTypes.STRING(255), allowNull: true },
        amount_cents: { type: DataTypes.INTEGER, allowNull: false },
        currency: { type: DataTypes.STRING(3), allowNull: false },
        /** open → paid | expired; paid → refunded. */
        status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'open' },
        refund_id: { type: DataTypes.STRING(255), allowNull: true },
        refunded_cents: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        paid_at: { type: DataTypes.DATE, allowNull: true },
        refunded_at: { type: DataTypes.DATE, allowNull: true },
        ...ts,
      },
      { transaction },
    );
    await qi.addIndex('payments', ['order_id'], { transaction });
    await qi.addIndex('payments', ['payment_intent_id'], { transaction });
    await qi.addIndex('payments', ['refunded_at'], { transaction });

    await qi.createTable(
      'payment_events',
      {
        event_id: { type: DataTypes.STRING(255), primaryKey: true },
        type: { type: DataTypes.STRING(100), allowNull: false },
        order_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: 'orders', key: 'id' }, onDelete: 'SET NULL' },
        outcome: { type: DataTypes.STRING(200), allowNull: true },
        received_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('payment_events');
  await qi.dropTable('payments');
  await qi.dropTable('order_events');
  await qi.dropTable('orders');
  await qi.dropTable('shop_services');
}
