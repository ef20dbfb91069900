import { beforeEach, describe, expect, it } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import {
  OFFLINE_READS_PREFIX,
  forgetOfflineReads,
  isOfflineRead,
  offlineCopyShown,
  recallRead,
  rememberRead,
} from '../../client/src/api/offlineReads';
import { clearUserData } from '../../client/src/stores/userData';
import { useShotQueueStore } from '../../client/src/stores/shotQueue';
import { useNoteQueueStore } from '../../client/src/stores/noteQueue';

/**
 * The offline copies of API answers (happy-dom; Web Crypto hashes the token): kept per token, answered only to the
 * same token, only for the reads a bowler needs at the lane, and gone when the session ends.
 */
const copies = () => Object.keys(window.localStorage).filter((k) => k.startsWith(OFFLINE_READS_PREFIX));
const current = () => true;

beforeEach(() => {
  window.localStorage.clear();
  offlineCopyShown.value = null;
  setActivePinia(createPinia());
});

describe('offline reads', () => {
  it('keeps the reads of the lane and nothing else', () => {
    for (const p of [
      '/auth/me',
      '/profile',
      '/arsenal?pageSize=100',
      '/follows',
      '/centers/3/conditions/current',
      '/sessions?page=1&pageSize=20',
    ])
      expect(isOfflineRead(p), p).toBe(true);
    for (const p of ['/admin/users', '/orders', '/sessions/4', '/arsenal/5/photo', '/stats', '/dev/mail'])
      expect(isOfflineRead(p), p).toBe(false);
  });

  it('answers a copy only to the token that read it, under a key that holds a hash and never the token', async () => {
    const ballList = { items: [{ id: 7, name: 'Test ball' }], total: 1, page: 1, pageSize: 100 };
    await rememberRead('token-of-dana', '/arsenal?pageSize=100', ballList, current);
    expect(copies()).toHaveLength(1);
    expect(copies()[0]).not.toContain('token-of-dana');
    expect(await recallRead('token-of-dana', '/arsenal?pageSize=100')).toEqual(ballList);
    expect(offlineCopyShown.value).not.toBeNull();
    expect(await recallRead('token-of-lee', '/arsenal?pageSize=100')).toBeUndefined();
    expect(await recallRead('token-of-dana', '/arsenal?pageSize=20')).toBeUndefined();
  });

  it('stores nothing outside the list or after the session ended', async () => {
    await rememberRead('t', '/orders', { items: [] }, current);
    await rememberRead('t', '/profile', { profile: {} }, () => false);
    expect(copies()).toEqual([]);
  });

  it('is emptied with the queues when the user data is cleared (sign-out)', async () => {
    await rememberRead('t1', '/profile', { profile: { hand: 'left' } }, current);
    await rememberRead('t2', '/follows', { items: [] }, current);
    useNoteQueueStore().put(4, 'dry on the left');
    useShotQueueStore().queueUndo(4, 99);
    expect(copies()).toHaveLength(2);
    clearUserData();
    expect(copies()).toEqual([]);
    expect(Object.keys(window.localStorage).filter((k) => k.startsWith('lanewright.'))).toEqual([]);
    await rememberRead('t1', '/profile', { profile: {} }, current);
    forgetOfflineReads();
    expect(copies()).toEqual([]);
  });
});
