import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * The pro-shop counter: a walk-in order belongs to no account (no user, no ball of an arsenal: the customer's
 * name and contact and the ball in words), and a shop move records the status it left so it can be undone.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.sequelize.query('ALTER TABLE orders ALTER COLUMN user_id DROP NOT NULL', { transaction });
    await qi.addColumn('orders', 'customer_name', { type: DataTypes.STRING(80), allowNull: true }, { transaction });
    await qi.addColumn('orders', 'customer_contact', { type: DataTypes.STRING(120), allowNull: true }, { transaction });
    await qi.sequelize.query(
      `ALTER TABLE orders ADD CONSTRAINT orders_customer_known CHECK (user_id IS NOT NULL OR customer_name IS NOT NULL)`,
      { transaction },
    );
    await qi.addColumn('order_events', 'from_status', { type: DataTypes.STRING(12), allowNull: true }, { transaction });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.removeColumn('order_events', 'from_status', { transaction });
    await qi.sequelize.query('DELETE FROM orders WHERE user_id IS NULL', { transaction });
    await qi.sequelize.query('ALTER TABLE orders DROP CONSTRAINT IF EXISTS orders_customer_known', { transaction });
    await qi.removeColumn('orders', 'customer_contact', { transaction });
    await qi.removeColumn('orders', 'customer_name', { transaction });
    await qi.sequelize.query('ALTER TABLE orders ALTER COLUMN user_id SET NOT NULL', { transaction });
  });
}
