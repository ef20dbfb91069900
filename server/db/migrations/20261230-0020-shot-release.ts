import { DataTypes, type QueryInterface } from 'sequelize';

/** A shot's own ball speed and rev rate, when the bowler measured them (a center's display, a count of revs). */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.addColumn('shots', 'speed_mph', { type: DataTypes.REAL, allowNull: true }, { transaction });
    await qi.addColumn('shots', 'rev_rpm', { type: DataTypes.INTEGER, allowNull: true }, { transaction });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.removeColumn('shots', 'rev_rpm', { transaction });
    await qi.removeColumn('shots', 'speed_mph', { transaction });
  });
}
