import { logger } from './logger';

/**
 * Work done after the answer was sent (so the answer takes the same time whatever the work finds), e.g. a
 * reset mail for an address that may or may not have an account. Failures are logged; shutdown waits.
 */
const pending = new Set<Promise<void>>();

export function runInBackground(what: string, work: () => Promise<void>): void {
  const p = new Promise<void>((resolve) => setImmediate(resolve))
    .then(work)
    .catch((err: unknown) => logger.error({ err, what }, 'background work failed'))
    .finally(() => pending.delete(p));
  pending.add(p);
}

/** Resolves when every background task started so far has finished. */
export async function drainBackground(): Promise<void> {
  while (pending.size) await Promise.allSettled([...pending]);
}
