import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Stored calibration fits are per lane surface too (matchups and their calibration run on a condition's lanes), and
 * per pattern as fitted (a published condition keeps the sweeps it was published with), and name the condition
 * they were asked for. The stored fits are a
 * cache the worker refills on the next read, so the old rows are dropped rather than guessed onto a surface.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.sequelize.query('DELETE FROM calibration_fits', { transaction });
    await qi.sequelize.query('ALTER TABLE calibration_fits DROP CONSTRAINT calibration_fits_pkey', { transaction });
    await qi.addColumn('calibration_fits', 'lane_kind', { type: DataTypes.STRING(10), allowNull: false }, { transaction });
    await qi.addColumn('calibration_fits', 'lane_friction', { type: DataTypes.STRING(6), allowNull: false }, { transaction });
    await qi.addColumn('calibration_fits', 'pattern_hash', { type: DataTypes.STRING(64), allowNull: false }, { transaction });
    // The condition a fit was asked for, so a refit after a ball or release change asks for the same one (no key: a hint).
    await qi.addColumn('calibration_fits', 'condition_id', { type: DataTypes.INTEGER, allowNull: true }, { transaction });
    await qi.sequelize.query(
      'ALTER TABLE calibration_fits ADD PRIMARY KEY (bowler_id, pattern_id, lane_kind, lane_friction, pattern_hash)',
      { transaction },
    );
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.sequelize.query('DELETE FROM calibration_fits', { transaction });
    await qi.sequelize.query('ALTER TABLE calibration_fits DROP CONSTRAINT calibration_fits_pkey', { transaction });
    for (const c of ['condition_id', 'pattern_hash', 'lane_friction', 'lane_kind'])
      await qi.removeColumn('calibration_fits', c, { transaction });
    await qi.sequelize.query('ALTER TABLE calibration_fits ADD PRIMARY KEY (bowler_id, pattern_id)', { transaction });
  });
}
