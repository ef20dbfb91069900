import { assertOilMap } from './assertState';
import type { LaneOilMap } from './laneOilMap';
import { assertNumber } from './assertNumber';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';

/** A lane after some games, and where the oil went (µL). */
export interface TransitionResult {
  map: LaneOilMap;
  /** Deliveries on this lane that the transition stands for. */
  shots: number;
  /** Oil picked up from under the track, µL. */
  removedUl: number;
  /** Of that, laid back down beyond the pattern (carrydown), µL. */
  carriedDownUl: number;
  /** The rest, left on the balls (wiped or absorbed), µL. */
  keptOnBallsUl: number;
}

/**
 * How the oil map evolves over `gamesBowled` games on a pair (engine/motion/README.md, all amounts documented
 * **assumptions** in MOTION_CALIBRATION): the pair's bowlers (bowlersPerPair × strikeShotsPerBowlerPerGame
 * first balls per game, half on each lane) play lines spread normally (σ = lineSpreadBoards) around
 * `track`; each pass removes pickupFraction of the oil under a track trackWidthBoards wide, so after N
 * passes a cell keeps h·exp(−κ·p·N) with p the share of passes covering it (depletion). A share
 * carrydownFraction of the removed oil is laid back along the track from the pattern's end over
 * carrydownLengthFt (carrydown); the rest stays on the balls. Oil is conserved:
 * before = after + keptOnBalls.
 *
 * Units: `track` in pattern boards (from the right-hand gutter) by ft; µm maps, µL totals.
 * Edge cases: gamesBowled 0 returns a copy; gamesBowled must be in [0, 50]; a track needs ≥ 2 points
 * with increasing ft (beyond its ends the nearest point is used).
 * Example: `transitionOilMap(patternOilMap(p), [{ ft: 0, board: 15 }, { ft: 60, board: 17.5 }], 3)`.
 */
export function transitionOilMap(
  map: LaneOilMap,
  track: readonly { ft: number; board: number }[],
  gamesBowled: number,
  options: { wood?: boolean } = {},
): TransitionResult {
  const fn = 'transitionOilMap';
  assertNumber(fn, 'gamesBowled', gamesBowled, 0, 50);
  assertOilMap(fn, map);
  if (!Array.isArray(track) || track.length < 2) throw new TypeError(`${fn}: track needs at least 2 points, got ${String(track?.length)}`);
  for (let i = 0; i < track.length; i++) {
    const p: unknown = track[i];
    if (p === null || typeof p !== 'object') throw new TypeError(`${fn}: track point ${i} must be an object, got ${String(p)}`);
    const { ft, board } = track[i];
    const minFt = i === 0 ? -1000 : track[i - 1].ft;
    // the message is built only on a failure (a track has one point a foot)
    if (!(typeof ft === 'number' && ft >= minFt && ft <= 1000)) assertNumber(fn, `track[${i}].ft`, ft, minFt, 1000);
    if (!(typeof board === 'number' && board >= -100 && board <= 140)) assertNumber(fn, `track[${i}].board`, board, -100, 140);
  }
  if (options === null || typeof options !== 'object') throw new TypeError(`${fn}: options must be an object, got ${String(options)}`);
  const filmUm = Float64Array.from(map.filmUm);
  const out: LaneOilMap = { ...map, filmUm };
  const shots = (gamesBowled * K.bowlersPerPair * K.strikeShotsPerBowlerPerGame) / 2;
  if (shots === 0) return { map: out, shots: 0, removedUl: 0, carriedDownUl: 0, keptOnBallsUl: 0 };
  const boardAt = (ft: number): number => {
    if (ft <= track[0].ft) return track[0].board;
    for (let i = 1; i < track.length; i++) {
      if (ft <= track[i].ft) {
        const a = track[i - 1],
          b = track[i];
        return a.board + ((b.board - a.board) * (ft - a.ft)) / (b.ft - a.ft);
      }
    }
    return track[track.length - 1].board;
  };
  const sigma = K.lineSpreadBoards,
    norm = K.laneTrackWidthBoards / (sigma * Math.sqrt(2 * Math.PI));
  const pickup = K.pickupFraction * (options.wood ? K.woodPickupFactor : 1);
  const share = (j: number, b: number): number => norm * Math.exp(-((j - b) ** 2) / (2 * sigma * sigma));
  let removed = 0;
  for (let r = 0; r < map.rows; r++) {
    const b = boardAt(r * map.ftStep);
    for (let j = 1; j <= 39; j++) {
      const i = r * map.cols + j;
      const keep = Math.exp(-pickup * share(j, b) * shots);
      removed += filmUm[i] * (1 - keep);
      filmUm[i] *= keep;
    }
  }
  const drop = removed * K.carrydownFraction;
  // carrydown weights: along the track from the pattern end, falling linearly to 0 over carrydownLengthFt
  let wSum = 0;
  const r0 = Math.ceil(map.patternEndFt / map.ftStep - 1e-9),
    r1 = Math.min(map.rows - 1, Math.floor((map.patternEndFt + K.carrydownLengthFt) / map.ftStep));
  for (let r = r0; r <= r1; r++) {
    const along = 1 - (r * map.ftStep - map.patternEndFt) / K.carrydownLengthFt;
    if (along <= 0) continue;
    const b = boardAt(r * map.ftStep);
    for (let j = 1; j <= 39; j++) wSum += along * share(j, b);
  }
  let dropped = 0;
  if (wSum > 0) {
    for (let r = r0; r <= r1; r++) {
      const along = 1 - (r * map.ftStep - map.patternEndFt) / K.carrydownLengthFt;
      if (along <= 0) continue;
      const b = boardAt(r * map.ftStep);
      for (let j = 1; j <= 39; j++) {
        const add = (drop * along * share(j, b)) / wSum;
        filmUm[r * map.cols + j] += add;
        dropped += add;
      }
    }
  }
  for (let r = 0; r < map.rows; r++) {
    filmUm[r * map.cols] = filmUm[r * map.cols + 1];
    filmUm[r * map.cols + 40] = filmUm[r * map.cols + 39];
  }
  const toUl = map.ftStep / C.filmUmPerMicroliterBoardFt;
  return { map: out, shots, removedUl: removed * toUl, carriedDownUl: dropped * toUl, keptOnBallsUl: (removed - dropped) * toUl };
}
