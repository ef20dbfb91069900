import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * The lane surface of a published condition (wood or synthetic, and its friction; existing publications were
 * bowled on the default, synthetic with medium friction) and the approval year of a ball (the catalogue model's
 * release year, copied like its other specs: the USBC hardness minimum depends on it). Adding a column with a
 * default fires no row trigger, so the immutable conditions keep their rows as published.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.addColumn(
      'conditions',
      'lane_kind',
      { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'synthetic' },
      { transaction },
    );
    await qi.addColumn(
      'conditions',
      'lane_friction',
      { type: DataTypes.STRING(6), allowNull: false, defaultValue: 'medium' },
      { transaction },
    );
    await qi.sequelize.query(
      `ALTER TABLE conditions ADD CONSTRAINT conditions_lane_kind CHECK (lane_kind IN ('wood', 'synthetic')),
         ADD CONSTRAINT conditions_lane_friction CHECK (lane_friction IN ('low', 'medium', 'high'))`,
      { transaction },
    );
    await qi.addColumn('balls', 'approval_year', { type: DataTypes.INTEGER, allowNull: true }, { transaction });
    await qi.sequelize.query(
      `UPDATE balls SET approval_year = m.release_year FROM ball_models m WHERE balls.ball_model_id = m.id AND balls.approval_year IS NULL`,
      { transaction },
    );
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.removeColumn('balls', 'approval_year', { transaction });
    await qi.sequelize.query(
      'ALTER TABLE conditions DROP CONSTRAINT IF EXISTS conditions_lane_kind, DROP CONSTRAINT IF EXISTS conditions_lane_friction',
      { transaction },
    );
    await qi.removeColumn('conditions', 'lane_friction', { transaction });
    await qi.removeColumn('conditions', 'lane_kind', { transaction });
  });
}
