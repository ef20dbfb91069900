import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { createApp, defineComponent, h, type App } from 'vue';
import { createPinia, setActivePinia } from 'pinia';
import { useShotQueue, queueStorageKey } from '../../client/src/composables/useShotQueue';
import type { ShotInput } from '../../client/src/api/sessions';

/**
 * The Session screen's view of its queue (useShotQueue in a mounted component) in a page whose API answers nothing:
 * a tapped shot is kept on the device with its own idempotency key, reported as waiting, and can be taken back.
 */
let app: App | null = null;
beforeEach(() => window.localStorage.clear());
afterEach(() => {
  app?.unmount();
  app = null;
});

function mountQueue(sessionId: number) {
  const pinia = createPinia();
  setActivePinia(pinia);
  let queue!: ReturnType<typeof useShotQueue>;
  const stored: unknown[] = [];
  app = createApp(
    defineComponent({
      setup() {
        queue = useShotQueue({ sessionId, onStored: (r) => stored.push(r) });
        return () => h('div');
      },
    }),
  );
  app.use(pinia);
  app.mount(document.createElement('div'));
  return { queue, stored };
}

const body = (frame: number): ShotInput => ({
  gameNumber: 1,
  frame,
  delivery: 1,
  ballId: 3,
  feetBoard: null,
  targetBoard: null,
  breakpointBoard: null,
  standing: [],
  foul: false,
  hit: null,
});

async function settled(queue: ReturnType<typeof useShotQueue>): Promise<void> {
  await queue.flush();
}

describe('useShotQueue without a connection', () => {
  it('keeps each tapped shot on the device under its own key, in order, and says it is waiting', async () => {
    const { queue, stored } = mountQueue(21);
    const a = queue.enqueue(body(1));
    const b = queue.enqueue(body(2));
    await settled(queue);
    expect(a.key).not.toBe(b.key);
    expect(a.key).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
    expect(queue.count.value).toBe(2);
    expect(queue.state.value).toBe('waiting');
    expect(queue.lastError.value).not.toBe('');
    expect(stored).toEqual([]);
    const kept = JSON.parse(window.localStorage.getItem(queueStorageKey(21))!) as { key: string; body: ShotInput }[];
    expect(kept.map((s) => s.key)).toEqual([a.key, b.key]);
    expect(kept.map((s) => s.body.frame)).toEqual([1, 2]);
  });

  it('takes back the last queued shot (undo before it was sent)', async () => {
    const { queue } = mountQueue(22);
    queue.enqueue(body(1));
    const last = queue.enqueue(body(2));
    await settled(queue);
    expect(queue.removeLast()?.key).toBe(last.key);
    expect(queue.count.value).toBe(1);
    expect(JSON.parse(window.localStorage.getItem(queueStorageKey(22))!)).toHaveLength(1);
  });

  it('picks up shots left on the device by an earlier visit', async () => {
    window.localStorage.setItem(
      queueStorageKey(23),
      JSON.stringify([{ key: 'left-before', body: body(1), queuedAt: '2026-01-01T19:00:00.000Z' }]),
    );
    const { queue } = mountQueue(23);
    expect(queue.items.value.map((s) => s.key)).toEqual(['left-before']);
    await settled(queue);
    expect(queue.state.value).toBe('waiting');
  });
});
