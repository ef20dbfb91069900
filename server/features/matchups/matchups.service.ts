import type { BowlerProfile, RankArsenalInput, RankedBall, Suggestion } from '../../../engine/types';
import { ballToArsenalBall } from '../../../shared/balls';
import { laneSurfaceText } from '../../../shared/centers';
import type { MatchupCalibration, MatchupRanking, MatchupRequest, MatchupResult } from '../../../shared/matchups';
import { createHash } from 'node:crypto';
import { LRUCache } from 'lru-cache';
import simplify from 'simplify-js';
import type { Calibration } from '../../../engine/shotlog/types';
import type { ShotPrediction } from '../../../engine/index';
import { AppError } from '../../lib/AppError';
import { rankInWorker } from '../../lib/enginePool';
import { logger } from '../../lib/logger';
import type { AuthUser } from '../../middleware/auth';
import { arsenalRepository, toBallDto } from '../arsenal/arsenal.repository';
import { readableBowlerId } from '../coaching/coaching.access';
import { calibrationFor } from '../stats/calibration.service';
import { bowlerOf, engineCondition } from '../stats/engineInput.service';

export type { MatchupRanking, MatchupResult };

/**
 * The engine is deterministic, so a ranking is cached by the exact input it was computed from (balls with
 * their current specs, surfaces, wear and labels, the bowler's release, the pattern's sweeps, the lane surface,
 * games bowled, the calibration). Any change to one of them is a different key; nothing has to be invalidated.
 */
/**
 * A predicted path at the resolution the lane view draws: the lane view (client MatchupLaneView, 300 × 660 px) gives
 * a board about 6 px and a foot about 10 px, so points a straight line through their neighbours passes within
 * PATH_TOLERANCE_BOARDS of are dropped (Ramer–Douglas–Peucker, simplify-js) and the rest rounded to a hundredth of
 * a board and a tenth of a foot and of a mph. The first and last points always stay. Every other figure of the
 * prediction (entry, breakpoint, roll) is the engine's, unrounded.
 */
export const PATH_TOLERANCE_BOARDS = 0.05;

export function pathForLaneView(path: ShotPrediction['path']): ShotPrediction['path'] {
  if (path.length <= 2) return path;
  const byPoint = new Map<{ x: number; y: number }, ShotPrediction['path'][number]>();
  const pts = path.map((p) => {
    const q = { x: p.board, y: p.ft };
    byPoint.set(q, p);
    return q;
  });
  const r = (x: number, k: number) => Math.round(x * k) / k;
  return simplify(pts, PATH_TOLERANCE_BOARDS, true).map((q) => {
    const p = byPoint.get(q)!;
    return { ft: r(p.ft, 10), board: r(p.board, 100), speedMph: r(p.speedMph, 10) };
  });
}

const rankingCache = new LRUCache<string, RankedBall[]>({
  max: 500,
  maxSize: 3_000,
  sizeCalculation: (ranked) => Math.max(1, ranked.length),
});

/** A ranking as kept and sent: each path at the lane view's resolution (pathForLaneView). */
function trimmed(ranked: RankedBall[]): RankedBall[] {
  return ranked.map((r) => {
    const prediction = (r as RankedBall & { prediction?: ShotPrediction | null }).prediction;
    return prediction ? ({ ...r, prediction: { ...prediction, path: pathForLaneView(prediction.path) } } as RankedBall) : r;
  });
}

/** At most 3 000 ranked balls are kept (200 rankings of 15), their paths trimmed: a few megabytes, whatever the load. */
async function rankCached(input: RankArsenalInput, signal?: AbortSignal): Promise<RankedBall[]> {
  const key = createHash('sha256').update(JSON.stringify(input)).digest('base64url');
  const hit = rankingCache.get(key);
  if (hit) return hit;
  const ranked = trimmed(await rankInWorker(input, signal));
  rankingCache.set(key, ranked);
  return ranked;
}

/** A 'ball' suggestion names the engine's string id of another ball: the client gets that ball's numeric id. */
function withNumericBallIds(suggestions: Suggestion[], ids: ReadonlyMap<string, number>): Suggestion[] {
  return suggestions.map((s) => {
    if (s.kind !== 'ball' || typeof s.change?.ballId !== 'string') return s;
    const ballId = ids.get(s.change.ballId);
    return ballId === undefined ? s : { ...s, change: { ...s.change, ballId } };
  });
}

export const matchupsService = {
  /**
   * Ranks the bowler's active balls (or the chosen ones) with the engine, in a worker thread, for a plain pattern on
   * a lane surface or for a published condition (its pattern as published and its lane surface; any signed-in user
   * may rank on a published condition, as anyone may read it). The answer carries the engine's input as used
   * (pattern sweeps, lane, bowler, games, calibration) so the browser's what-if reproduces the same numbers.
   */
  async run(user: AuthUser, req: MatchupRequest, signal?: AbortSignal): Promise<MatchupResult> {
    // A linked coach ranks a student's arsenal; anyone else asking for another bowler gets 404.
    const bowlerId = await readableBowlerId(user, req.studentId);
    // The condition, the release and the balls are independent reads: asked for together.
    const [on, bowler, rows] = await Promise.all([
      engineCondition({ patternId: req.patternId, conditionId: req.conditionId, lane: req.lane, viewer: user }),
      bowlerOf(bowlerId) as Promise<BowlerProfile>,
      arsenalRepository.findOwnedMany(bowlerId, req.ballIds),
    ]);
    const { pattern, lane } = on;
    if (req.ballIds && rows.length !== new Set(req.ballIds).size) throw AppError.notFound('Ball');
    const balls = rows.filter((b) => req.ballIds || b.status === 'active').map(toBallDto);
    const byId = new Map(balls.map((b) => [String(b.id), b]));
    const numericIds = new Map(balls.map((b) => [String(b.id), b.id]));
    // The bowler's logged shots on this pattern calibrate the model, on these lanes, once there are enough of them.
    let fitted: Calibration | null = null;
    try {
      fitted = await calibrationFor(bowlerId, on.patternId ?? 0, {
        pattern,
        bowler,
        lane,
        ...(on.condition ? { conditionId: on.condition.id } : {}),
        ...(on.patternId === null ? { rows: [] } : {}),
      });
    } catch (err) {
      // A calibration that cannot be fitted never blocks the ranking; it is simply not applied.
      logger.warn({ err, bowlerId, patternId: on.patternId }, 'calibration failed; ranking without it');
    }
    const calibration: MatchupCalibration = fitted
      ? { applied: fitted.enough, shots: fitted.shots, note: fitted.note, fit: fitted }
      : { applied: false, shots: 0, note: 'The calibration could not be computed; the ranking uses the uncalibrated model.', fit: null };
    let ranked: RankedBall[] = [];
    try {
      if (balls.length)
        ranked = await rankCached(
          {
            balls: balls.map(ballToArsenalBall),
            bowler,
            pattern,
            gamesBowled: req.gamesBowled,
            lane,
            ...(fitted?.enough ? { calibration: fitted } : {}),
          },
          signal,
        );
    } catch (err) {
      // The engine refuses input outside its documented ranges with RangeError/TypeError naming the value.
      if (err instanceof Error && (err.name === 'RangeError' || err.name === 'TypeError') && /^[a-zA-Z]+: /.test(err.message))
        throw new AppError(422, 'engine_rejected', err.message);
      throw err;
    }
    return {
      pattern: { id: on.patternId, name: on.name, summary: on.summary, sweeps: pattern.sweeps },
      condition: on.condition,
      lane,
      laneText: laneSurfaceText(lane),
      bowler,
      gamesBowled: req.gamesBowled,
      calibration,
      rankings: ranked.map((r): MatchupRanking => {
        const b = byId.get(r.id)!;
        return {
          ...r,
          suggestions: withNumericBallIds(r.suggestions, numericIds),
          ballId: b.id,
          ball: {
            id: b.id,
            name: b.name,
            nickname: b.nickname,
            maker: b.maker,
            coverType: b.coverType,
            coreType: b.coreType,
            rg: b.rg,
            differential: b.differential,
            intermediateDifferential: b.intermediateDifferential,
            surfaceGrit: b.surfaceGrit,
            polished: b.polished,
            layout: b.layout,
            weightLb: b.weightLb,
            gamesSinceResurface: b.gamesSinceResurface,
          },
        };
      }),
    };
  },
};
