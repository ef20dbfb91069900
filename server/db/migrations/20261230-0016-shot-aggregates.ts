import type { QueryInterface } from 'sequelize';

/**
 * The counts behind a bowler's statistics, kept per game (`shot_aggregates`), so a statistics page sums counts in SQL
 * instead of replaying a season of shots:
 *  - one row per session, game, ball and surface, twice: `alone` false counted on the game's full sheet, `alone` true
 *    with only that ball's shots of the game (what the statistics of one ball count); the counts and tallies of
 *    engine's `gameCounts` (`tallies` holds `fb:<pins>` and `leave:<pins>` counts);
 *  - `shot_aggregate_changes`: the games whose shots changed since their rows were counted. Statement triggers on
 *    `shots` add the games an INSERT, UPDATE or DELETE touched (any writer: the API, a script, psql, a restore); the
 *    next statistics read of the bowler counts those games again and removes their marks
 *    (server/features/stats/aggregates.repository.ts). The table has no key, so a mark added twice (two writers, a
 *    restore that copies marks while the trigger adds them) is only counted once more.
 * Games logged before this migration are marked here, so every bowler's first statistics read counts them.
 */
const COUNT_COLUMNS = [
  'shots',
  'strikes',
  'strike_n',
  'spares',
  'spare_n',
  'single_made',
  'single_n',
  'multi_made',
  'multi_n',
  'split_made',
  'split_n',
  'pocket',
  'pocket_n',
  'carried',
];

const MARK_FUNCTION = (rows: string) => `
CREATE OR REPLACE FUNCTION lanewright_mark_shot_games_${rows}() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  INSERT INTO shot_aggregate_changes (user_id, session_id, game_number)
    SELECT DISTINCT s.user_id, c.session_id, c.game_number FROM ${rows}_rows c JOIN sessions s ON s.id = c.session_id;
  RETURN NULL;
END $$`;

const TRIGGERS = [
  { name: 'shots_mark_games_insert', sql: 'AFTER INSERT ON shots REFERENCING NEW TABLE AS new_rows', fn: 'new' },
  { name: 'shots_mark_games_update_new', sql: 'AFTER UPDATE ON shots REFERENCING NEW TABLE AS new_rows', fn: 'new' },
  { name: 'shots_mark_games_update_old', sql: 'AFTER UPDATE ON shots REFERENCING OLD TABLE AS old_rows', fn: 'old' },
  { name: 'shots_mark_games_delete', sql: 'AFTER DELETE ON shots REFERENCING OLD TABLE AS old_rows', fn: 'old' },
];

export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    const q = (sql: string) => qi.sequelize.query(sql, { transaction });
    await q(`CREATE TABLE shot_aggregates (
      session_id INTEGER NOT NULL REFERENCES sessions(id) ON DELETE CASCADE,
      game_number INTEGER NOT NULL,
      ball_id INTEGER NOT NULL,
      surface_key VARCHAR(40) NOT NULL,
      alone BOOLEAN NOT NULL,
      user_id INTEGER NOT NULL,
      ${COUNT_COLUMNS.map((c) => `${c} INTEGER NOT NULL`).join(',\n      ')},
      tallies JSONB NOT NULL,
      game_total INTEGER,
      game_balls SMALLINT NOT NULL,
      game_rows SMALLINT NOT NULL,
      lead BOOLEAN NOT NULL,
      PRIMARY KEY (session_id, game_number, ball_id, surface_key, alone)
    )`);
    await q('CREATE INDEX shot_aggregates_user ON shot_aggregates (user_id, alone)');
    await q(`CREATE TABLE shot_aggregate_changes (
      user_id INTEGER NOT NULL,
      session_id INTEGER NOT NULL,
      game_number INTEGER NOT NULL
    )`);
    await q('CREATE INDEX shot_aggregate_changes_user ON shot_aggregate_changes (user_id)');
    await q(MARK_FUNCTION('new'));
    await q(MARK_FUNCTION('old'));
    for (const t of TRIGGERS)
      await q(`CREATE TRIGGER ${t.name} ${t.sql} FOR EACH STATEMENT EXECUTE FUNCTION lanewright_mark_shot_games_${t.fn}()`);
    await q(`INSERT INTO shot_aggregate_changes (user_id, session_id, game_number)
      SELECT DISTINCT s.user_id, sh.session_id, sh.game_number FROM shots sh JOIN sessions s ON s.id = sh.session_id`);
  });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.transaction(async (transaction) => {
    const q = (sql: string) => qi.sequelize.query(sql, { transaction });
    for (const t of TRIGGERS) await q(`DROP TRIGGER IF EXISTS ${t.name} ON shots`);
    await q('DROP FUNCTION IF EXISTS lanewright_mark_shot_games_new()');
    await q('DROP FUNCTION IF EXISTS lanewright_mark_shot_games_old()');
    await q('DROP TABLE IF EXISTS shot_aggregate_changes');
    await q('DROP TABLE IF EXISTS shot_aggregates');
  });
}
