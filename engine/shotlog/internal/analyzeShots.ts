import { list, show } from '../../internal/checks';
import { buildGame } from '../buildGame';
import type { DeliveryView, HitKind, ShotRecord } from '../types';
import { checkShape, frameStart, step } from './replay';

const HIT_KINDS: readonly HitKind[] = ['pocket', 'high', 'light', 'brooklyn', 'miss'];
const DATE = /^\d{4}-\d{2}-\d{2}$/;

/** One shot with its place on the sheet (internal to shotStats/statsBy/suggestMoves). */
export interface ShotEntry {
  shot: ShotRecord;
  /** Its view, or null when an earlier delivery of its frame is not among the shots (no context). */
  view: DeliveryView | null;
  /** For a second ball at a rack: the view of the rack's first ball; else null. */
  rackFirst: DeliveryView | null;
  /** sessionId + game number. */
  game: string;
}

export interface AnalyzedGame {
  key: string;
  /** Indexes into entries. */
  entries: number[];
  /** The total when the game's shots form one complete game, else null. */
  total: number | null;
}

export interface AnalyzedShots {
  entries: ShotEntry[];
  games: AnalyzedGame[];
}

/** Checks a ShotRecord's shape (TypeError/RangeError naming fn). */
export function checkShot(fn: string, name: string, raw: unknown): ShotRecord {
  const d = checkShape(fn, name, raw) as ShotRecord;
  const str = (k: 'sessionId' | 'ballId' | 'surfaceKey' | 'date'): void => {
    if (typeof d[k] !== 'string') throw new TypeError(`${fn}: ${name}.${k} must be a string, got ${show(d[k])}`);
  };
  str('sessionId');
  str('ballId');
  str('surfaceKey');
  str('date');
  if (!DATE.test(d.date)) throw new RangeError(`${fn}: ${name}.date must be YYYY-MM-DD, got ${show(d.date)}`);
  if (typeof d.gameNumber !== 'number') throw new TypeError(`${fn}: ${name}.gameNumber must be a number, got ${show(d.gameNumber)}`);
  if (!Number.isInteger(d.gameNumber) || d.gameNumber < 1)
    throw new RangeError(`${fn}: ${name}.gameNumber must be an integer ≥ 1, got ${d.gameNumber}`);
  if (!Number.isInteger(d.frame) || d.frame < 1 || d.frame > 10)
    throw new RangeError(`${fn}: ${name}.frame must be an integer from 1 to 10, got ${d.frame}`);
  const maxDelivery = d.frame === 10 ? 3 : 2;
  if (!Number.isInteger(d.delivery) || d.delivery < 1 || d.delivery > maxDelivery) {
    throw new RangeError(`${fn}: ${name}: frame ${d.frame} has no delivery ${d.delivery}`);
  }
  const seen = new Set<number>();
  for (const p of d.standing) {
    if (!Number.isInteger(p) || p < 1 || p > 10 || seen.has(p))
      throw new RangeError(`${fn}: ${name}.standing must list distinct pins 1 to 10, got ${JSON.stringify(d.standing)}`);
    seen.add(p);
  }
  for (const k of ['feetBoard', 'targetBoard', 'breakpointBoard'] as const) {
    const v = d[k];
    if (v === undefined || v === null) continue;
    if (typeof v !== 'number') throw new TypeError(`${fn}: ${name}.${k} must be a number or null, got ${show(v)}`);
    if (!Number.isFinite(v) || v < -5 || v > 45) throw new RangeError(`${fn}: ${name}.${k} must be a board from -5 to 45, got ${v}`);
  }
  if (d.hit !== undefined && d.hit !== null && !HIT_KINDS.includes(d.hit)) {
    throw new TypeError(`${fn}: ${name}.hit must be one of ${HIT_KINDS.join(', ')} or null, got ${show(d.hit)}`);
  }
  return d;
}

/**
 * Places every shot on its game's sheet. Each frame is replayed from its full rack with the shots of
 * that frame that are present (so shots filtered by ball keep their context where the frame's earlier
 * deliveries are there too); a game's total is taken only when its shots make one complete game.
 * Throws RangeError for a frame whose shots are impossible (a pin already down, a repeat).
 */
export function analyzeShots(fn: string, shots: unknown): AnalyzedShots {
  const records = list(fn, 'shots', shots).map((s, i) => checkShot(fn, `shots[${i}]`, s));
  const entries: ShotEntry[] = records.map((shot) => ({
    shot,
    view: null,
    rackFirst: null,
    game: `${shot.sessionId}\u0000${shot.gameNumber}`,
  }));
  const byGame = new Map<string, number[]>();
  entries.forEach((e, i) => {
    const list = byGame.get(e.game);
    if (list) list.push(i);
    else byGame.set(e.game, [i]);
  });
  const games: AnalyzedGame[] = [];
  for (const [key, idx] of byGame) {
    idx.sort((a, b) => records[a].frame - records[b].frame || records[a].delivery - records[b].delivery);
    const label = `session ${records[idx[0]].sessionId} game ${records[idx[0]].gameNumber}`;
    for (let k = 1; k < idx.length; k++) {
      const a = records[idx[k - 1]];
      const b = records[idx[k]];
      if (a.frame === b.frame && a.delivery === b.delivery)
        throw new RangeError(`${fn}: ${label}: frame ${b.frame}, delivery ${b.delivery} is logged twice`);
    }
    let k = 0;
    while (k < idx.length) {
      const frame = records[idx[k]].frame;
      let state = frameStart(frame);
      let first: DeliveryView | null = null;
      let context = true;
      for (; k < idx.length && records[idx[k]].frame === frame; k++) {
        const e = entries[idx[k]];
        const gap = !state.complete && state.frame === frame && e.shot.delivery > state.delivery;
        if (!context || gap) {
          // an earlier delivery of this frame is not among the shots: no pins-before for this one
          context = false;
          continue;
        }
        const r = step(state, e.shot);
        if (!r.ok) throw new RangeError(`${fn}: ${label}: frame ${frame}, delivery ${e.shot.delivery}: ${r.reason}`);
        e.view = r.view;
        if (r.view.rackBall === 1) first = r.view;
        else e.rackFirst = first;
        state = r.state;
      }
    }
    let total: number | null = null;
    if (idx.length >= 11 && idx.length <= 21) {
      try {
        const g = buildGame(idx.map((i) => records[i]));
        if (g.complete) total = g.total;
      } catch {
        total = null; // not one complete game (frames missing): no total
      }
    }
    games.push({ key, entries: idx, total });
  }
  return { entries, games };
}
