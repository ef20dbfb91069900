/**
 * Polls `fn` until `ok(value)` holds and returns that value; fails after `timeoutMs` with the last value seen.
 * For state that settles in the background (a webhook, the mail sender): wait for the state, never a fixed time.
 * The default leaves room for a loaded machine; a healthy run takes milliseconds.
 */
export async function waitFor<T>(fn: () => Promise<T>, ok: (v: T) => boolean, timeoutMs = 20000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  let last = await fn();
  while (!ok(last)) {
    if (Date.now() > deadline) throw new Error(`condition not met within ${timeoutMs} ms: ${JSON.stringify(last)}`);
    await new Promise((r) => setTimeout(r, 50));
    last = await fn();
  }
  return last;
}
