import { QueryTypes } from 'sequelize';
import { sequelize } from '../../../server/models/index';

// rate_limit_hits counts every attempt, refused ones included, by design (uploads, sign-in failures); login_failures likewise.
const SKIP = ['SequelizeMeta', 'umzug_migrations', 'fuzz_row_writes', 'rate_limit_hits', 'login_failures'];

async function publicTables(): Promise<string[]> {
  const rows = await sequelize.query<{ name: string }>(
    `SELECT table_name AS name FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE' ORDER BY 1`,
    { type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.name).filter((n) => !SKIP.includes(n));
}
const ident = (n: string) => `"${n.replace(/"/g, '""')}"`;

let query: string | null = null;

/**
 * One checksum per table of the public schema, in one round trip: the row count and the sum of a 64-bit
 * hash of every row's text (order-free, so no sort). Two snapshots differ when a stored row was added,
 * removed or changed (barring a 64-bit hash collision). The migrations' bookkeeping table is left out.
 */
export async function tableChecksums(): Promise<Record<string, string>> {
  if (!query) {
    const tables = await publicTables();
    query = `SELECT json_build_object(${tables.map((t) => `'${t}', (SELECT count(*)::text || ':' || coalesce(sum(hashtextextended(x::text, 0)), 0)::text FROM ${ident(t)} x)`).join(', ')}) AS sums`;
  }
  const [row] = await sequelize.query<{ sums: Record<string, string> }>(query, { type: QueryTypes.SELECT });
  return row.sums;
}

/** The tables whose checksum differs between two snapshots. */
export function changedTables(a: Record<string, string>, b: Record<string, string>): string[] {
  return [...new Set([...Object.keys(a), ...Object.keys(b)])].filter((k) => a[k] !== b[k]);
}

/**
 * A row-level trigger on every table that counts committed row writes (insert, update, delete) per table:
 * reading the counter after a request says whether it changed any stored row — a rolled-back write leaves
 * no count, a write undone by a later statement still does. Cheaper than a full checksum per request.
 * Returns the function that removes it again (the database is shared with the other API test files).
 */
export async function installWriteCounter(): Promise<() => Promise<void>> {
  const tables = await publicTables();
  await sequelize.query(`
    CREATE TABLE IF NOT EXISTS fuzz_row_writes (table_name text PRIMARY KEY, n bigint NOT NULL);
    CREATE OR REPLACE FUNCTION fuzz_count_row_write() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      INSERT INTO fuzz_row_writes VALUES (TG_TABLE_NAME, 1) ON CONFLICT (table_name) DO UPDATE SET n = fuzz_row_writes.n + 1;
      RETURN NULL;
    END $$;
    ${tables.map((t) => `CREATE OR REPLACE TRIGGER fuzz_count_row_write AFTER INSERT OR UPDATE OR DELETE ON ${ident(t)} FOR EACH ROW EXECUTE FUNCTION fuzz_count_row_write();`).join('\n')}
  `);
  return async () => {
    await sequelize.query(
      `${tables.map((t) => `DROP TRIGGER IF EXISTS fuzz_count_row_write ON ${ident(t)};`).join('\n')} DROP FUNCTION IF EXISTS fuzz_count_row_write(); DROP TABLE IF EXISTS fuzz_row_writes;`,
    );
  };
}

/** Committed row writes per table since the counter was installed. */
export async function rowWrites(): Promise<Record<string, number>> {
  const rows = await sequelize.query<{ table_name: string; n: string }>('SELECT table_name, n FROM fuzz_row_writes', {
    type: QueryTypes.SELECT,
  });
  return Object.fromEntries(rows.map((r) => [r.table_name, Number(r.n)]));
}

export function changedCounts(a: Record<string, number>, b: Record<string, number>): string[] {
  return [...new Set([...Object.keys(a), ...Object.keys(b)])].filter((k) => (a[k] ?? 0) !== (b[k] ?? 0));
}
