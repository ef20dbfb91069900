import { DataTypes, type QueryInterface } from 'sequelize';

/**
 * Users may hold more than one role (`roles`, e.g. a coach who also bowls); `role` stays as the highest of them
 * (admin, proprietor, coach, bowler) so existing readers keep working. Patterns gain a visibility: `draft` (the owner
 * only), `shared` (the owner and the staff of `center_id`) or `published` (everyone). Existing patterns were visible
 * to every user, so they start published; new patterns made through the API start as drafts.
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.addColumn(
      'users',
      'roles',
      { type: DataTypes.ARRAY(DataTypes.STRING(16)), allowNull: false, defaultValue: ['bowler'] },
      { transaction },
    );
    await qi.sequelize.query('UPDATE users SET roles = ARRAY[role]::varchar(16)[]', { transaction });
    await qi.addColumn(
      'patterns',
      'visibility',
      { type: DataTypes.STRING(16), allowNull: false, defaultValue: 'published' },
      { transaction },
    );
    await qi.addColumn(
      'patterns',
      'center_id',
      { type: DataTypes.INTEGER, allowNull: true, references: { model: 'centers', key: 'id' }, onDelete: 'SET NULL' },
      { transaction },
    );
    await qi.sequelize.query(
      "ALTER TABLE patterns ADD CONSTRAINT patterns_visibility_check CHECK (visibility IN ('draft', 'shared', 'published'))",
      { transaction },
    );
    await qi.addIndex('patterns', ['owner_id', 'visibility'], { transaction });
    await qi.addIndex('audit_events', ['action', 'created_at'], { transaction });
    await qi.addIndex('audit_events', ['actor_id', 'created_at'], { transaction });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.removeIndex('audit_events', ['actor_id', 'created_at'], { transaction });
    await qi.removeIndex('audit_events', ['action', 'created_at'], { transaction });
    await qi.removeIndex('patterns', ['owner_id', 'visibility'], { transaction });
    await qi.removeColumn('patterns', 'center_id', { transaction });
    await qi.removeColumn('patterns', 'visibility', { transaction });
    await qi.removeColumn('users', 'roles', { transaction });
  });
}
