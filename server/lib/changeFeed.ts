import { LRUCache } from 'lru-cache';
import pg from 'pg';
import { config } from '../config/index';
import { logger } from './logger';

/**
 * Short-lived in-process caches that stay right across API processes.
 *
 * PostgreSQL is the one place every process sees: triggers (migration 20261222-0010) notify the channel
 * `lanewright_changes` with `<kind>:<id>` whenever a cached row changes, from whichever process, worker or script
 * wrote it, and the notification is delivered when that transaction commits. Each API process keeps one connection
 * that LISTENs there and drops the cached entries of that id. The rules that keep a cache honest:
 *  - a cache answers only while that connection is up: when it drops, every cache is emptied and bypassed until
 *    the connection is back (a missed notification can never leave a stale entry behind);
 *  - an entry lives at most its TTL, whatever happens;
 *  - a read that started before a change of its id is not stored (each id's generation is compared before and
 *    after the read), so a slow read never puts back what a change just removed;
 *  - the writing process also drops its own entries at once (`invalidate`), without waiting for the notification.
 * Caching of this kind (a local cache invalidated by LISTEN/NOTIFY) is common practice with PostgreSQL.
 */
const CHANNEL = 'lanewright_changes';
const RECONNECT_MS = 1000;

type Kind = 'user' | 'balls' | 'shots';

const caches = new Map<Kind, ScopedCache<unknown>[]>();
let client: pg.Client | null = null;
let listening = false;
let stopped = false;
let reconnectTimer: NodeJS.Timeout | null = null;

/** Generations: an id's generation moves on every change of it; an id that fell out of this table counts as `floor`. */
let counter = 0;
let floor = 0;
const generations = new LRUCache<string, number>({
  max: 100_000,
  dispose: (g) => {
    if (g > floor) floor = g;
  },
});

function bump(kind: Kind, id: string): void {
  counter += 1;
  generations.set(`${kind}:${id}`, counter);
  for (const c of caches.get(kind) ?? []) c.drop(id);
}

function dropAll(): void {
  counter += 1;
  floor = counter;
  generations.clear();
  for (const list of caches.values()) for (const c of list) c.clear();
}

function onNotification(msg: pg.Notification): void {
  const payload = msg.payload ?? '';
  const at = payload.indexOf(':');
  if (at < 0) return;
  const kind = payload.slice(0, at) as Kind;
  if (caches.has(kind)) bump(kind, payload.slice(at + 1));
}

function scheduleReconnect(): void {
  if (stopped || reconnectTimer) return;
  reconnectTimer = setTimeout(() => {
    reconnectTimer = null;
    void connect();
  }, RECONNECT_MS);
  reconnectTimer.unref();
}

function lost(err?: unknown): void {
  if (err) logger.warn({ err }, 'change feed lost; in-process caches bypassed until it is back');
  listening = false;
  dropAll();
  const c = client;
  client = null;
  c?.end().catch(() => undefined);
  scheduleReconnect();
}

async function connect(): Promise<void> {
  if (stopped || client) return;
  const c = new pg.Client({ connectionString: config.databaseUrl, application_name: 'lanewright-change-feed' });
  client = c;
  c.on('error', (err) => {
    if (client === c) lost(err);
  });
  c.on('end', () => {
    if (client === c) lost();
  });
  c.on('notification', onNotification);
  try {
    await c.connect();
    // The feed never keeps a process alive on its own (a script that imports the server exits when its work is done).
    (c as unknown as { connection?: { stream?: { unref?: () => void } } }).connection?.stream?.unref?.();
    await c.query(`LISTEN ${CHANNEL}`);
    if (client !== c) return;
    // Anything cached before this point may have missed a notification.
    dropAll();
    listening = true;
  } catch (err) {
    if (client === c) lost(err);
  }
}

/** Starts listening (the first read of a cache does this itself); caches answer once the connection is up. */
export function startChangeFeed(): void {
  stopped = false;
  void connect();
}

/** Stops listening and empties every cache (shutdown). */
export async function stopChangeFeed(): Promise<void> {
  stopped = true;
  listening = false;
  if (reconnectTimer) clearTimeout(reconnectTimer);
  reconnectTimer = null;
  dropAll();
  const c = client;
  client = null;
  await c?.end().catch(() => undefined);
}

/**
 * Drops this process's cached entries of `kind:id` when the transaction commits (at once without one): the writer's
 * own process sees its change on the next request; the others hear the notification the triggers send.
 */
export function changedAfterCommit(kind: Kind, id: number | string, transaction?: { afterCommit: (fn: () => void) => void } | null): void {
  bump(kind, String(id));
  transaction?.afterCommit(() => bump(kind, String(id)));
}

/** A read's ticket: store its answer only if its id did not change while it ran. */
export interface CacheTicket {
  id: string;
  generation: number;
}

/** Entries per id (a user's pages of a list, or the user row itself), dropped together on a change of that id. */
export class ScopedCache<V> {
  private readonly entries: LRUCache<string, Map<string, V>>;

  private readonly kinds: Kind[];

  /** `kind`: what a change of drops an id's entries (several kinds: a change of any; the first is the one `invalidate` bumps). */
  constructor(kind: Kind | Kind[], opts: { ttlMs: number; maxIds: number; maxPerId?: number }) {
    this.kinds = Array.isArray(kind) ? kind : [kind];
    this.entries = new LRUCache<string, Map<string, V>>({ max: opts.maxIds, ttl: Math.max(1, opts.ttlMs), ttlAutopurge: false });
    this.maxPerId = opts.maxPerId ?? 32;
    this.enabled = opts.ttlMs > 0;
    for (const k of this.kinds) {
      const list = caches.get(k) ?? [];
      list.push(this as ScopedCache<unknown>);
      caches.set(k, list);
    }
  }

  private readonly maxPerId: number;
  private readonly enabled: boolean;

  /** Whether the cache may answer now (enabled, and the change feed is up). */
  get live(): boolean {
    return this.enabled && listening;
  }

  get(id: number | string, key = ''): V | undefined {
    if (!this.live) {
      // The first read starts the feed (scripts that only import the server never connect).
      if (this.enabled && !client && !stopped) startChangeFeed();
      return undefined;
    }
    return this.entries.get(String(id))?.get(key);
  }

  /** Taken before the read whose answer will be stored. */
  ticket(id: number | string): CacheTicket {
    return { id: String(id), generation: counter };
  }

  /** Whether the ticket's id changed (or the feed dropped) since the ticket was taken. */
  changedSince(ticket: CacheTicket): boolean {
    return this.kinds.some((k) => (generations.get(`${k}:${ticket.id}`) ?? floor) > ticket.generation);
  }

  set(ticket: CacheTicket, key: string, value: V): void {
    if (!this.live) return;
    if (this.changedSince(ticket)) return; // changed while it was read
    let m = this.entries.get(ticket.id);
    if (!m) {
      m = new Map();
      this.entries.set(ticket.id, m);
    }
    if (m.size >= this.maxPerId) m.clear();
    m.set(key, value);
  }

  /** Drops this id's entries here at once (the writer's own process; the others hear the notification). */
  invalidate(id: number | string): void {
    bump(this.kinds[0], String(id));
  }

  /** @internal used by the feed */
  drop(id: string): void {
    this.entries.delete(id);
  }

  /** @internal used by the feed */
  clear(): void {
    this.entries.clear();
  }
}

/**
 * Resolves once every change committed before the call has been heard (PostgreSQL hands a listening connection its
 * pending notifications before answering its next query). Another process hears a change within that delivery
 * time — milliseconds — after it commits; tests use this to wait for exactly that, not for a guessed time.
 */
export async function syncChangeFeed(): Promise<void> {
  if (client && listening) await client.query('SELECT 1');
}

/** Whether the change feed is up (health and tests). */
export function changeFeedListening(): boolean {
  return listening;
}
