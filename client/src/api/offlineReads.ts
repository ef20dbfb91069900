import { ref } from 'vue';

/**
 * The last answers a bowler saw of the reads that matter at the lane (who they are, their profile and arsenal, the
 * centers they follow with today's condition, their list of sessions), kept in localStorage so a reload with no
 * connection can still show them. An open session has its own copy, kept up to date shot by shot and cleared the same
 * way (composables/useSessionDetail.ts). The service worker never caches the API; these copies are the only
 * offline copies of API answers, and they are:
 * - per user: every key carries a hash of the bearer token that read the answer, and only a request with the same
 *   token is answered from it, so one user's copy is never shown to another on a shared device;
 * - used only when the server cannot be reached (a network failure), never instead of a server answer;
 * - removed when the session ends (sign-out, an expired token, another user signing in: stores/userData.ts).
 */

export const OFFLINE_READS_PREFIX = 'lanewright.offline.';

/** The API paths (below /api, with their query) whose last answer is kept for offline reading. */
const OFFLINE_READS: readonly RegExp[] = [
  /^\/auth\/me$/,
  /^\/profile$/,
  /^\/arsenal(\?.*)?$/,
  /^\/follows$/,
  /^\/centers\/\d+\/conditions\/current$/,
  /^\/sessions(\?.*)?$/,
];

interface StoredRead {
  savedAt: string;
  data: unknown;
}

/** When the screen last showed an offline copy (its saving time), or null once the server answered again. */
export const offlineCopyShown = ref<string | null>(null);

export function isOfflineRead(apiPath: string): boolean {
  return OFFLINE_READS.some((r) => r.test(apiPath));
}

const hashes = new Map<string, Promise<string | null>>();

/** A short SHA-256 of the token (never the token itself in a key); null where the page has no Web Crypto. */
function tokenHash(token: string): Promise<string | null> {
  let h = hashes.get(token);
  if (!h) {
    const subtle = globalThis.crypto?.subtle;
    h = subtle
      ? subtle
          .digest('SHA-256', new TextEncoder().encode(token))
          .then((buf) => [...new Uint8Array(buf).slice(0, 12)].map((b) => b.toString(16).padStart(2, '0')).join(''))
          .catch(() => null)
      : Promise.resolve(null);
    hashes.set(token, h);
  }
  return h;
}

async function keyFor(token: string, apiPath: string): Promise<string | null> {
  const hash = await tokenHash(token);
  return hash ? `${OFFLINE_READS_PREFIX}${hash}.${apiPath}` : null;
}

/**
 * Keeps a successful answer of an offline read (storage full or unavailable: nothing is kept). `stillCurrent` is asked
 * once the key is ready: an answer arriving after its session ended is dropped.
 */
export async function rememberRead(token: string, apiPath: string, data: unknown, stillCurrent: () => boolean): Promise<void> {
  offlineCopyShown.value = null;
  if (!isOfflineRead(apiPath)) return;
  const key = await keyFor(token, apiPath);
  if (!key || !stillCurrent()) return;
  try {
    window.localStorage.setItem(key, JSON.stringify({ savedAt: new Date().toISOString(), data } satisfies StoredRead));
  } catch {
    // storage full or unavailable: this answer is not available offline
  }
}

/** The last answer this token got for the path, or undefined. */
export async function recallRead(token: string, apiPath: string): Promise<unknown> {
  if (!isOfflineRead(apiPath)) return undefined;
  const key = await keyFor(token, apiPath);
  if (!key) return undefined;
  try {
    const raw = window.localStorage.getItem(key);
    if (!raw) return undefined;
    const stored = JSON.parse(raw) as StoredRead;
    if (!stored || typeof stored.savedAt !== 'string' || !('data' in stored)) return undefined;
    offlineCopyShown.value = stored.savedAt;
    return stored.data;
  } catch {
    return undefined;
  }
}

/** Removes every offline copy on this device, whoever's (the session ended). */
export function forgetOfflineReads(): void {
  offlineCopyShown.value = null;
  try {
    const keys: string[] = [];
    for (let i = 0; i < window.localStorage.length; i++) {
      const key = window.localStorage.key(i);
      if (key?.startsWith(OFFLINE_READS_PREFIX)) keys.push(key);
    }
    for (const key of keys) window.localStorage.removeItem(key);
  } catch {
    // storage unavailable: nothing kept there
  }
}
