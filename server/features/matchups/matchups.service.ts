import type { BowlerProfile, RankedBall } from '../../../engine/types';
import { ballToSpec, type Ball as BallDto } from '../../../shared/balls';
import type { MatchupRequest } from '../../../shared/matchups';
import type { MatchupCalibration } from '../../../shared/sessions';
import type { PatternSummary } from '../../../shared/patterns';
import { createHash } from 'node:crypto';
import { LRUCache } from 'lru-cache';
import type { RankArsenalInput } from '../../../engine/types';
import type { Calibration } from '../../../engine/shotlog/types';
import { AppError } from '../../lib/AppError';
import { rankInWorker } from '../../lib/enginePool';
import { logger } from '../../lib/logger';
import type { AuthUser } from '../../middleware/auth';
import { arsenalRepository, toBallDto } from '../arsenal/arsenal.repository';
import { patternsService } from '../patterns/patterns.service';
import { readableBowlerId } from '../coaching/coaching.access';
import { bowlerOf, calibrationFor } from '../stats/stats.service';

export interface MatchupRanking extends RankedBall {
  ballId: number;
  ball: Pick<BallDto, 'id' | 'name' | 'nickname' | 'maker' | 'coverType' | 'coreType' | 'rg' | 'differential' | 'intermediateDifferential' | 'surfaceGrit' | 'polished' | 'layout' | 'weightLb'>;
}

export interface MatchupResult {
  pattern: { id: number; name: string; summary: PatternSummary };
  bowler: BowlerProfile;
  gamesBowled: number;
  /** Whether the bowler's calibration (from their logged shots on this pattern) was applied. */
  calibration: MatchupCalibration;
  rankings: MatchupRanking[];
}

/**
 * The engine is deterministic, so a ranking is cached by the exact input it was computed from (balls with
 * their current specs and surfaces, the bowler's release, the pattern's sweeps, games bowled). Any change to
 * one of them is a different key; nothing has to be invalidated.
 */
const rankingCache = new LRUCache<string, RankedBall[]>({ max: 500 });

async function rankCached(input: RankArsenalInput, signal?: AbortSignal): Promise<RankedBall[]> {
  const key = createHash('sha256').update(JSON.stringify(input)).digest('base64url');
  const hit = rankingCache.get(key);
  if (hit) return hit;
  const ranked = await rankInWorker(input, signal);
  rankingCache.set(key, ranked);
  return ranked;
}

export const matchupsService = {
  /** Ranks the bowler's active balls (or the chosen ones) for a pattern with the engine, in a worker thread. */
  async run(user: AuthUser, req: MatchupRequest, signal?: AbortSignal): Promise<MatchupResult> {
    // A linked coach ranks a student's arsenal; anyone else asking for another bowler gets 404.
    const bowlerId = await readableBowlerId(user, req.studentId);
    const { id, name, pattern, summary } = await patternsService.engineInput(req.patternId);
    const bowler: BowlerProfile = await bowlerOf(bowlerId);
    const rows = await arsenalRepository.findOwnedMany(bowlerId, req.ballIds);
    if (req.ballIds && rows.length !== new Set(req.ballIds).size) throw AppError.notFound('Ball');
    const balls = rows.filter((b) => req.ballIds || b.status === 'active').map(toBallDto);
    const byId = new Map(balls.map((b) => [String(b.id), b]));
    // The bowler's logged shots on this pattern calibrate the model once there are enough of them.
    let fitted: Calibration | null = null;
    try {
      fitted = await calibrationFor(bowlerId, id, { pattern, bowler });
    } catch (err) {
      // A calibration that cannot be fitted never blocks the ranking; it is simply not applied.
      logger.warn({ err, bowlerId, patternId: id }, 'calibration failed; ranking without it');
    }
    const calibration: MatchupCalibration = fitted
      ? { applied: fitted.enough, shots: fitted.shots, note: fitted.note }
      : { applied: false, shots: 0, note: 'The calibration could not be computed; the ranking uses the uncalibrated model.' };
    let ranked: RankedBall[] = [];
    try {
      if (balls.length)
        ranked = await rankCached(
          { balls: balls.map((b) => ({ id: String(b.id), ...ballToSpec(b) })), bowler, pattern, gamesBowled: req.gamesBowled, ...(fitted?.enough ? { calibration: fitted } : {}) },
          signal,
        );
    } catch (err) {
      // The engine refuses input outside its documented ranges with RangeError/TypeError naming the value.
      if (err instanceof Error && (err.name === 'RangeError' || err.name === 'TypeError') && /^[a-zA-Z]+: /.test(err.message)) throw new AppError(422, 'engine_rejected', err.message);
      throw err;
    }
    return {
      pattern: { id, name, summary },
      bowler,
      gamesBowled: req.gamesBowled,
      calibration,
      rankings: ranked.map((r) => {
        const b = byId.get(r.id)!;
        return {
          ...r,
          ballId: b.id,
          ball: {
            id: b.id, name: b.name, nickname: b.nickname, maker: b.maker, coverType: b.coverType, coreType: b.coreType, rg: b.rg, differential: b.differential,
            intermediateDifferential: b.intermediateDifferential, surfaceGrit: b.surfaceGrit, polished: b.polished, layout: b.layout, weightLb: b.weightLb,
          },
        };
      }),
    };
  },
};
