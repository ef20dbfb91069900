import { computed, type Ref } from 'vue';
import {
  buildGame,
  moveFollowUp,
  shotStats,
  suggestMoves,
  surfaceWords,
  type GameView,
  type LoggedDelivery,
  type Move,
  type MoveFollowUp,
  type ShotRecord,
  type ShotStats,
} from '@engine/index';
import type { Ball } from '@shared/balls';
import type { HitKind, SessionDetail, Shot } from '@/api/sessions';
import type { QueuedShot } from '@/stores/shotQueue';

/** One shot of the log, stored or still queued on this device. */
export interface Entry {
  gameNumber: number;
  frame: number;
  delivery: number;
  standing: number[];
  foul: boolean;
  ballId: number;
  surfaceKey: string;
  feetBoard: number | null;
  targetBoard: number | null;
  breakpointBoard: number | null;
  hit: HitKind | null;
  pending: boolean;
}

/** One game of the session, scored here with the engine (with the queued shots). */
export interface LocalGame {
  number: number;
  view: GameView | null;
  error: string;
  pending: number;
}

export interface SessionLogInput {
  sessionId: number;
  detail: Ref<SessionDetail | null>;
  stored: Ref<Shot[]>;
  queued: Ref<QueuedShot[]>;
  balls: Ref<Ball[]>;
  hand: Ref<'right' | 'left'>;
  isOwner: Ref<boolean>;
}

/** A shot's place in the session: game, frame and delivery. */
export const slot = (s: { gameNumber: number; frame: number; delivery: number }) => `${s.gameNumber}:${s.frame}:${s.delivery}`;

/**
 * The session's shots as the Session screen works with them: stored and queued shots in order, the games scored with
 * the engine, the frame and ball up next, and the live stats and suggested moves.
 */
export function useSessionLog(input: SessionLogInput) {
  const { detail, stored, queued, balls, hand, isOwner } = input;

  /** Queued shots not yet on the server (a resent shot already stored is shown once). */
  const waiting = computed<QueuedShot[]>(() => {
    const have = new Set(stored.value.map(slot));
    return queued.value.filter((q) => !have.has(slot(q.body)));
  });

  function surfaceKeyOf(id: number): string {
    const b = balls.value.find((x) => x.id === id);
    if (!b) return 'unknown';
    return surfaceWords(b.surfaceGrit, b.polished);
  }

  const entries = computed<Entry[]>(() => {
    const order = (a: Entry, b: Entry) => a.gameNumber - b.gameNumber || a.frame - b.frame || a.delivery - b.delivery;
    const done: Entry[] = stored.value
      .map((s) => ({
        gameNumber: s.gameNumber,
        frame: s.frame,
        delivery: s.delivery,
        standing: s.standing,
        foul: s.foul,
        ballId: s.ballId,
        surfaceKey: s.surfaceKey,
        feetBoard: s.feetBoard,
        targetBoard: s.targetBoard,
        breakpointBoard: s.breakpointBoard,
        hit: s.hit,
        pending: false,
      }))
      .sort(order);
    const pending: Entry[] = waiting.value.map(({ body }) => ({
      gameNumber: body.gameNumber,
      frame: body.frame,
      delivery: body.delivery,
      standing: body.standing,
      foul: body.foul ?? false,
      ballId: body.ballId,
      surfaceKey: surfaceKeyOf(body.ballId),
      feetBoard: body.feetBoard ?? null,
      targetBoard: body.targetBoard ?? null,
      breakpointBoard: body.breakpointBoard ?? null,
      hit: body.hit ?? null,
      pending: true,
    }));
    return [...done, ...pending];
  });

  const toLogged = (e: Entry): LoggedDelivery => ({
    frame: e.frame,
    delivery: e.delivery,
    standing: e.standing,
    ...(e.foul ? { foul: true } : {}),
  });
  const deliveriesOf = (n: number) => entries.value.filter((e) => e.gameNumber === n).map(toLogged);

  const games = computed<LocalGame[]>(() => {
    const numbers = [...new Set(entries.value.map((e) => e.gameNumber))].sort((a, b) => a - b);
    return numbers.map((n) => {
      const pending = entries.value.filter((e) => e.gameNumber === n && e.pending).length;
      try {
        return { number: n, view: buildGame(deliveriesOf(n)), error: '', pending };
      } catch (err) {
        return { number: n, view: null, error: err instanceof Error ? err.message : 'This game cannot be scored.', pending };
      }
    });
  });

  const lastGame = computed(() => games.value[games.value.length - 1] ?? null);
  const currentNumber = computed(() => {
    const g = lastGame.value;
    if (!g) return 1;
    return g.view?.complete ? g.number + 1 : g.number;
  });
  const currentView = computed<GameView | null>(() => {
    const g = lastGame.value;
    if (g && g.number === currentNumber.value) return g.view;
    return buildGame([]);
  });
  const next = computed(() => currentView.value?.next ?? null);
  const pinsBefore = computed(() => next.value?.pinsBefore ?? []);
  const fullRack = computed(() => pinsBefore.value.length === 10);
  /** Sheets newest game first, the one in progress on top. */
  const sheets = computed(() => {
    const list = games.value.slice();
    if (!list.some((g) => g.number === currentNumber.value) && isOwner.value)
      list.push({ number: currentNumber.value, view: buildGame([]), error: '', pending: 0 });
    return list.reverse();
  });

  const lastShot = computed(() => entries.value[entries.value.length - 1] ?? null);
  const lastStored = computed(() => {
    const list = [...stored.value].sort((a, b) => a.gameNumber - b.gameNumber || a.frame - b.frame || a.delivery - b.delivery);
    return list[list.length - 1] ?? null;
  });

  /* ---- stats and moves (live, with the queued shots) ------------------------------------------------- */
  const records = computed<ShotRecord[]>(() =>
    entries.value.map((e) => ({
      sessionId: String(input.sessionId),
      gameNumber: e.gameNumber,
      date: detail.value?.date ?? '',
      ballId: String(e.ballId),
      surfaceKey: e.surfaceKey,
      frame: e.frame,
      delivery: e.delivery,
      standing: e.standing,
      foul: e.foul,
      feetBoard: e.feetBoard,
      targetBoard: e.targetBoard,
      breakpointBoard: e.breakpointBoard,
      hit: e.hit,
    })),
  );
  const stats = computed<ShotStats | null>(() => {
    if (!isOwner.value) return detail.value?.stats ?? null;
    try {
      return shotStats(records.value);
    } catch {
      return detail.value?.stats ?? null;
    }
  });
  const moves = computed<Move[]>(() => {
    if (!isOwner.value) return detail.value?.moves ?? [];
    try {
      return suggestMoves({ shots: records.value, hand: hand.value });
    } catch {
      return detail.value?.moves ?? [];
    }
  });

  const followUps = computed<MoveFollowUp[]>(() => {
    if (!isOwner.value) return detail.value?.followUps ?? [];
    try {
      return moveFollowUp({ shots: records.value, hand: hand.value });
    } catch {
      return detail.value?.followUps ?? [];
    }
  });

  return {
    entries,
    deliveriesOf,
    games,
    currentNumber,
    next,
    pinsBefore,
    fullRack,
    sheets,
    lastShot,
    lastStored,
    stats,
    moves,
    followUps,
  };
}

export type SessionLog = ReturnType<typeof useSessionLog>;
