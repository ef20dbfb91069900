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
    // role and roles stay in step whoever writes the row (the API, a script, another process): a new set decides the
    // highest role; a lone role written the old way becomes the whole set.
    await qi.sequelize.query(
      `CREATE FUNCTION users_roles_in_step() RETURNS trigger LANGUAGE plpgsql AS $$
       BEGIN
         IF TG_OP = 'INSERT' THEN
           IF NEW.roles IS NULL OR (NEW.roles = ARRAY['bowler']::varchar(16)[] AND NEW.role <> 'bowler') THEN
             NEW.roles := ARRAY[NEW.role]::varchar(16)[];
           END IF;
         ELSIF NEW.roles IS DISTINCT FROM OLD.roles THEN
           NULL;
         ELSIF NEW.role IS DISTINCT FROM OLD.role THEN
           NEW.roles := ARRAY[NEW.role]::varchar(16)[];
         END IF;
         NEW.role := CASE
           WHEN 'admin' = ANY(NEW.roles) THEN 'admin'
           WHEN 'proprietor' = ANY(NEW.roles) THEN 'proprietor'
           WHEN 'coach' = ANY(NEW.roles) THEN 'coach'
           ELSE 'bowler' END;
         RETURN NEW;
       END $$`,
      { transaction },
    );
    await qi.sequelize.query(
      'CREATE TRIGGER users_roles_in_step BEFORE INSERT OR UPDATE ON users FOR EACH ROW EXECUTE FUNCTION users_roles_in_step()',
      { transaction },
    );
    await qi.sequelize.query(
      "ALTER TABLE users ADD CONSTRAINT users_roles_known CHECK (cardinality(roles) > 0 AND roles <@ ARRAY['bowler','coach','proprietor','admin']::varchar(16)[])",
      { transaction },
    );
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
    await qi.sequelize.query('DROP TRIGGER IF EXISTS users_roles_in_step ON users; DROP FUNCTION IF EXISTS users_roles_in_step()', {
      transaction,
    });
    await qi.removeColumn('users', 'roles', { transaction });
  });
}
