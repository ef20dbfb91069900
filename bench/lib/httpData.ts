/**
 * The data the loads of bench/http.ts read, beyond the demo seed: dana's arsenal brought to 15 balls, lee's to 1 000
 * and lee's logged shots to about 10 000 (copies written straight to the database).
 */
import pg from 'pg';

/** Brings dana's arsenal to 15 balls from the catalogue (through the API, as dana). */
export async function arsenalOfFifteen(base: string, auth: Record<string, string>): Promise<void> {
  const arsenal = (await (await fetch(`${base}/api/arsenal`, { headers: auth })).json()) as { total: number };
  const cat = (await (await fetch(`${base}/api/catalogue?pageSize=40`, { headers: auth })).json()) as {
    items: { id: number; coverType: string }[];
  };
  const extra = cat.items.filter((m) => m.coverType !== 'plastic').slice(0, Math.max(0, 15 - arsenal.total));
  for (const m of extra)
    await fetch(`${base}/api/arsenal`, {
      method: 'POST',
      headers: auth,
      body: JSON.stringify({ ballModelId: m.id, weightLb: 15, layout: { pinToPapIn: 4.5, drillingAngleDeg: 45 } }),
    });
}

/** Gives lee 1 000 balls (copies of his own). */
export async function aThousandBalls(adminUrl: string): Promise<void> {
  const db = new pg.Client({ connectionString: adminUrl });
  await db.connect();
  await db.query(`INSERT INTO balls (owner_id, ball_model_id, name, maker, nickname, weight_lb, rg, differential, intermediate_differential, cover_type, core_type,
      hardness_d, approval_year, surface_grit, polished, layout, games_since_resurface, status, version, created_at, updated_at)
    SELECT b.owner_id, b.ball_model_id, b.name, b.maker, 'copy ' || g, b.weight_lb, b.rg, b.differential, b.intermediate_differential, b.cover_type, b.core_type,
      b.hardness_d, b.approval_year, b.surface_grit, b.polished, b.layout, g % 120, b.status, 0, now() - g * interval '1 minute', now()
    FROM (SELECT * FROM balls WHERE owner_id = (SELECT id FROM users WHERE email = 'lee@copperline.example') AND deleted_at IS NULL ORDER BY id LIMIT 1) b,
      generate_series(1, 1000 - (SELECT count(*)::int FROM balls WHERE owner_id = (SELECT id FROM users WHERE email = 'lee@copperline.example') AND deleted_at IS NULL)) g`);
  await db.end();
}

/** Gives lee about 10 000 logged shots (copies of a demo session's games); answers how many he has. */
export async function tenThousandShots(adminUrl: string): Promise<number> {
  const db2 = new pg.Client({ connectionString: adminUrl });
  await db2.connect();
  const template = (
    await db2.query<{ id: number; pattern_id: number | null; n: number }>(
      'SELECT s.id, s.pattern_id, count(*)::int AS n FROM sessions s JOIN shots sh ON sh.session_id = s.id WHERE s.deleted_at IS NULL GROUP BY s.id ORDER BY n DESC LIMIT 1',
    )
  ).rows[0];
  const copies = Math.ceil(10000 / template.n);
  await db2.query(
    `WITH lee AS (SELECT u.id AS uid, (SELECT min(b.id) FROM balls b WHERE b.owner_id = u.id) AS ball FROM users u WHERE u.email = 'lee@copperline.example'),
     made AS (INSERT INTO sessions (user_id, date, kind, pattern_id, notes, version, created_at, updated_at)
       SELECT lee.uid, date '2025-01-01' + g, 'practice', $2, '', 0, now(), now() FROM lee, generate_series(1, $3) g RETURNING id)
     INSERT INTO shots (session_id, game_number, frame, delivery, ball_id, surface_grit, surface_polished, surface_key, feet_board, target_board, breakpoint_board,
       standing, foul, hit, note, idempotency_key, request_hash, response, created_at, updated_at)
     SELECT made.id, t.game_number, t.frame, t.delivery, lee.ball, t.surface_grit, t.surface_polished, t.surface_key, t.feet_board, t.target_board, t.breakpoint_board,
       t.standing, t.foul, t.hit, '', 'bench-' || made.id || '-' || t.id, '', '{}'::jsonb, now(), now()
     FROM made, lee, shots t WHERE t.session_id = $1`,
    [template.id, template.pattern_id, copies],
  );
  const statShots = Number(
    (
      await db2.query(
        `SELECT count(*)::int AS n FROM shots sh JOIN sessions s ON s.id = sh.session_id JOIN users u ON u.id = s.user_id WHERE u.email = 'lee@copperline.example' AND s.deleted_at IS NULL`,
      )
    ).rows[0].n,
  );
  await db2.end();
  return statShots;
}
