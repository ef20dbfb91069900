import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * A center's own time zone (an IANA name such as "America/Denver"): its "today", its lane schedules and the
 * pro shop's takings are reckoned in it. Existing centers start on UTC until their proprietor sets it.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.addColumn('centers', 'time_zone', { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.removeColumn('centers', 'time_zone');
}
