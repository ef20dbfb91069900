import type { QueryInterface } from 'sequelize';

/**
 * Two things the hot reads need:
 *  - A change feed for the short-lived in-process caches (server/lib/changeFeed.ts): after a row of users,
 *    user_write_marks or balls changes, PostgreSQL notifies every listening API process on the channel
 *    `lanewright_changes` with `<kind>:<id>` (`user:<user id>`, `balls:<owner id>`, `shots:<bowler id>` for a
 *    bowler's shots and sessions), delivered when the
 *    writing transaction commits — whoever wrote it (any API process, the job worker, a script, psql).
 *  - An index for every sort the lists offer, led by the owner where the list is one owner's
 *    (balls of the arsenal, soft-deleted rows left out) and ending in the id tie-break.
 */
const NOTIFY_FUNCTION = `
CREATE OR REPLACE FUNCTION lanewright_notify_change() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  new_scope text;
  old_scope text;
BEGIN
  IF TG_OP <> 'DELETE' THEN new_scope := to_jsonb(NEW) ->> TG_ARGV[1]; END IF;
  IF TG_OP <> 'INSERT' THEN old_scope := to_jsonb(OLD) ->> TG_ARGV[1]; END IF;
  IF new_scope IS NOT NULL THEN PERFORM pg_notify('lanewright_changes', TG_ARGV[0] || ':' || new_scope); END IF;
  IF old_scope IS NOT NULL AND old_scope IS DISTINCT FROM new_scope THEN PERFORM pg_notify('lanewright_changes', TG_ARGV[0] || ':' || old_scope); END IF;
  RETURN NULL;
END $$`;

/** A shot names its session, not its bowler: the function looks the bowler up. */
const NOTIFY_SHOT_FUNCTION = `
CREATE OR REPLACE FUNCTION lanewright_notify_shot_change() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  uid text;
BEGIN
  FOR uid IN SELECT DISTINCT s.user_id::text FROM sessions s
    WHERE s.id IN (CASE WHEN TG_OP <> 'DELETE' THEN NEW.session_id END, CASE WHEN TG_OP <> 'INSERT' THEN OLD.session_id END)
  LOOP
    PERFORM pg_notify('lanewright_changes', 'shots:' || uid);
  END LOOP;
  RETURN NULL;
END $$`;

const TRIGGERS: { table: string; kind: string; column: string; on: string }[] = [
  { table: 'users', kind: 'user', column: 'id', on: 'UPDATE OR DELETE' },
  { table: 'user_write_marks', kind: 'user', column: 'user_id', on: 'INSERT OR UPDATE OR DELETE' },
  { table: 'balls', kind: 'balls', column: 'owner_id', on: 'INSERT OR UPDATE OR DELETE' },
  { table: 'sessions', kind: 'shots', column: 'user_id', on: 'INSERT OR UPDATE OR DELETE' },
];

const INDEXES: { name: string; sql: string }[] = [
  ...['name', 'cover_type', 'rg', 'differential', 'surface_grit', 'games_since_resurface', 'created_at'].map((c) => ({
    name: `balls_owner_${c}_live`,
    sql: `ON balls (owner_id, ${c}, id) WHERE deleted_at IS NULL`,
  })),
  ...['display_name', 'role', 'created_at'].map((c) => ({ name: `users_${c}_id`, sql: `ON users (${c}, id)` })),
  ...['rg', 'differential', 'release_year', 'cover_type', 'name'].map((c) => ({
    name: `ball_models_${c}_id`,
    sql: `ON ball_models (${c}, id)`,
  })),
  { name: 'patterns_created_at_id', sql: 'ON patterns (created_at, id)' },
  { name: 'patterns_length_ft_id', sql: "ON patterns (((summary->>'lengthFt')::float), id)" },
  { name: 'patterns_volume_ml_id', sql: "ON patterns (((summary->>'volumeMl')::float), id)" },
];

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    await qi.sequelize.query(NOTIFY_FUNCTION, { transaction });
    for (const t of TRIGGERS) {
      await qi.sequelize.query(
        `CREATE TRIGGER ${t.table}_notify_change AFTER ${t.on} ON ${t.table} FOR EACH ROW EXECUTE FUNCTION lanewright_notify_change('${t.kind}', '${t.column}')`,
        { transaction },
      );
    }
    await qi.sequelize.query(NOTIFY_SHOT_FUNCTION, { transaction });
    await qi.sequelize.query(
      'CREATE TRIGGER shots_notify_change AFTER INSERT OR UPDATE OR DELETE ON shots FOR EACH ROW EXECUTE FUNCTION lanewright_notify_shot_change()',
      { transaction },
    );
    for (const i of INDEXES) await qi.sequelize.query(`CREATE INDEX IF NOT EXISTS ${i.name} ${i.sql}`, { transaction });
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    for (const i of INDEXES) await qi.sequelize.query(`DROP INDEX IF EXISTS ${i.name}`, { transaction });
    await qi.sequelize.query('DROP TRIGGER IF EXISTS shots_notify_change ON shots', { transaction });
    await qi.sequelize.query('DROP FUNCTION IF EXISTS lanewright_notify_shot_change()', { transaction });
    for (const t of TRIGGERS) await qi.sequelize.query(`DROP TRIGGER IF EXISTS ${t.table}_notify_change ON ${t.table}`, { transaction });
    await qi.sequelize.query('DROP FUNCTION IF EXISTS lanewright_notify_change()', { transaction });
  });
}
