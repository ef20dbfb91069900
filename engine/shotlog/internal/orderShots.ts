import type { AnalyzedShots, ShotEntry } from './analyzeShots';

/**
 * The shots in the order they were thrown: date, then the order the sessions first appear, game, frame,
 * delivery (and the input order last). One home for the order suggestMoves and moveFollowUp read.
 */
export function orderShots(a: AnalyzedShots): { e: ShotEntry; i: number }[] {
  const sessionOrder = new Map<string, number>();
  a.entries.forEach((e) => {
    if (!sessionOrder.has(e.shot.sessionId)) sessionOrder.set(e.shot.sessionId, sessionOrder.size);
  });
  return a.entries
    .map((e, i) => ({ e, i }))
    .sort((x, y) => {
      const s = x.e.shot;
      const t = y.e.shot;
      return (
        (s.date < t.date ? -1 : s.date > t.date ? 1 : 0) ||
        (sessionOrder.get(s.sessionId) as number) - (sessionOrder.get(t.sessionId) as number) ||
        s.gameNumber - t.gameNumber ||
        s.frame - t.frame ||
        s.delivery - t.delivery ||
        x.i - y.i
      );
    });
}

/** A first ball at a full rack (delivery 1 when the frame's context is missing). */
export const isFirstBall = (e: ShotEntry): boolean => (e.view ? e.view.rackBall === 1 : e.shot.delivery === 1);
