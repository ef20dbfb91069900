import { beforeEach, describe, expect, it } from 'vitest';
import { createPinia, setActivePinia, type Pinia } from 'pinia';
import { nextTick } from 'vue';
import type { User } from '../../shared/auth';
import type { Profile } from '../../shared/profile';
import { queryClient } from '../../client/src/api/queries';
import { useAuthStore } from '../../client/src/stores/auth';
import { useProfileStore } from '../../client/src/stores/profile';
import { queueStorageKey, useShotQueueStore, type QueuedShot } from '../../client/src/stores/shotQueue';
import { clearUserData, DEVICE_OWNER_KEY, guardUserData, SESSION_CACHE_PREFIX, unsentShots } from '../../client/src/stores/userData';
import { useUnits } from '../../client/src/composables/useUnits';

/**
 * The client's stores in a page whose API answers nothing (tests/client run in happy-dom at a closed address): the
 * profile's units, the shot queue's storage and offline behaviour, and what signing out leaves on the device.
 */
let pinia: Pinia;
beforeEach(() => {
  window.localStorage.clear();
  queryClient.clear();
  pinia = createPinia();
  setActivePinia(pinia);
});

const profile = (units: Profile['units']): Profile => ({
  hand: 'right',
  speedMph: 17,
  revRpm: 350,
  axisRotationDeg: 45,
  axisTiltDeg: 12,
  papRightIn: null,
  papUpIn: null,
  units,
});

function shot(frame: number): QueuedShot {
  return {
    key: `key-${frame}`,
    queuedAt: new Date(Date.UTC(2026, 0, 1, 19, frame)).toISOString(),
    body: {
      gameNumber: 1,
      frame,
      delivery: 1,
      ballId: 7,
      feetBoard: 20,
      targetBoard: 10,
      breakpointBoard: null,
      standing: [],
      foul: false,
      hit: null,
    },
  };
}

const user = (id: number): User =>
  ({ id, email: `bowler${id}@example.test`, displayName: `Bowler ${id}`, role: 'bowler', emailVerified: true }) as User;

describe('profile store and useUnits', () => {
  it('applies the units of the profile set once to every formatter made from it', async () => {
    const store = useProfileStore();
    const u = useUnits();
    expect(u.value.speed(17)).toBe('17.0 mph');
    store.set(profile('metric'));
    await nextTick();
    expect(u.value.units).toBe('metric');
    expect(u.value.speed(17)).toMatch(/km\/h$/);
    expect(useUnits().value.weight(15)).toMatch(/kg$/);
    store.$reset();
    expect(u.value.units).toBe('imperial');
  });

  it('keeps the imperial default and records the error when the profile cannot be loaded', async () => {
    const store = useProfileStore();
    await store.ensureLoaded();
    expect(store.profile).toBeNull();
    expect(store.error).not.toBe('');
    expect(store.units).toBe('imperial');
  });
});

describe('shot-queue store', () => {
  it('persists each session’s queue in localStorage and lists the sessions with shots waiting', () => {
    const q = useShotQueueStore();
    expect(q.write(12, [shot(1), shot(2)])).toBe(true);
    expect(q.write(5, [shot(1)])).toBe(true);
    expect(JSON.parse(window.localStorage.getItem(queueStorageKey(12))!)).toHaveLength(2);
    expect(q.queuedSessions()).toEqual([
      { sessionId: 5, count: 1 },
      { sessionId: 12, count: 2 },
    ]);
    q.write(5, []);
    expect(window.localStorage.getItem(queueStorageKey(5))).toBeNull();
    expect(q.queuedSessions()).toEqual([{ sessionId: 12, count: 2 }]);
  });

  it('ignores what is not a queued shot in storage (another version, a broken write)', () => {
    window.localStorage.setItem(queueStorageKey(3), JSON.stringify([shot(1), { key: 4 }, 'x', null]));
    window.localStorage.setItem(queueStorageKey(4), '{not json');
    const q = useShotQueueStore();
    expect(q.read(3).map((s) => s.key)).toEqual(['key-1']);
    expect(q.read(4)).toEqual([]);
  });

  it('keeps every shot queued, in order, when the server cannot be reached, and runs one send per session at a time', async () => {
    const q = useShotQueueStore();
    q.write(9, [shot(1), shot(2)]);
    const both = Promise.all([q.send(9), q.send(9)]);
    expect(q.isSending(9)).toBe(true);
    const [outcome, joined] = await both;
    expect(joined).toBe(outcome); // the second call joined the run under way
    expect(outcome.kind).toBe('waiting');
    expect(q.isSending(9)).toBe(false);
    expect(q.read(9).map((s) => s.key)).toEqual(['key-1', 'key-2']);
  });

  it('clearAll forgets every queue of the device, in storage and in memory', () => {
    const q = useShotQueueStore();
    q.write(1, [shot(1)]);
    q.write(2, [shot(2)]);
    window.localStorage.setItem('lanewright.token', 'kept-by-the-auth-store');
    q.clearAll();
    expect(q.queuedSessions()).toEqual([]);
    expect(q.queues).toEqual({});
    expect(window.localStorage.getItem(queueStorageKey(1))).toBeNull();
    expect(window.localStorage.getItem('lanewright.token')).toBe('kept-by-the-auth-store');
  });
});

describe('signing out on a shared device', () => {
  it('clearUserData empties the query cache, the profile, the queues and the session copies', () => {
    const q = useShotQueueStore();
    q.write(4, [shot(1), shot(2), shot(3)]);
    expect(unsentShots()).toBe(3);
    window.localStorage.setItem(`${SESSION_CACHE_PREFIX}4`, '{"id":4}');
    window.localStorage.setItem(DEVICE_OWNER_KEY, '1');
    queryClient.setQueryData(['arsenal', 1], [{ id: 1 }]);
    useProfileStore().set(profile('metric'));

    clearUserData();

    expect(unsentShots()).toBe(0);
    expect(queryClient.getQueryData(['arsenal', 1])).toBeUndefined();
    expect(useProfileStore().profile).toBeNull();
    const left = Array.from({ length: window.localStorage.length }, (_, i) => window.localStorage.key(i));
    expect(left.filter((k) => k?.startsWith('lanewright.'))).toEqual([]);
  });

  it('guardUserData drops the cache when the session ends, and the last user’s queue only when someone else signs in', async () => {
    const auth = useAuthStore();
    guardUserData(pinia);
    auth.setSession('token-1', user(1));
    await nextTick();
    expect(window.localStorage.getItem(DEVICE_OWNER_KEY)).toBe('1');
    useShotQueueStore().write(8, [shot(1)]);
    queryClient.setQueryData(['patterns', 1], []);

    auth.clearSession(); // an expired token: the cache goes, the queued shot stays for its owner
    await nextTick();
    expect(queryClient.getQueryData(['patterns', 1])).toBeUndefined();
    expect(unsentShots()).toBe(1);

    auth.setSession('token-1', user(1)); // the same bowler again: the shot is still there to send
    await nextTick();
    expect(unsentShots()).toBe(1);

    auth.clearSession();
    await nextTick();
    auth.setSession('token-2', user(2)); // someone else on this browser: the first bowler's shot is gone
    await nextTick();
    expect(unsentShots()).toBe(0);
    expect(window.localStorage.getItem(queueStorageKey(8))).toBeNull();
    expect(window.localStorage.getItem(DEVICE_OWNER_KEY)).toBe('2');
  });
});
