import pg from 'pg';
import { changeFeedListening, startChangeFeed, syncChangeFeed } from '../../server/lib/changeFeed';
import { waitFor } from './wait';

/** The in-process caches answer only while the process hears the database's change feed: waits until it does. */
export async function feedUp(): Promise<void> {
  startChangeFeed();
  await waitFor(
    async () => changeFeedListening(),
    (up) => up,
  );
}

/**
 * Runs SQL on a connection of its own, as another API process, the job worker or psql would, then waits until this
 * process has heard every change committed so far (the feed's delivery: milliseconds, not a guessed sleep).
 */
export async function elsewhere(sql: string, params: unknown[] = []): Promise<void> {
  const c = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await c.connect();
  try {
    await c.query(sql, params);
  } finally {
    await c.end();
  }
  await syncChangeFeed();
}
