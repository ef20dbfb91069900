import type { BowlerProfile, MissRoom, RankedBall, ShotPrediction } from '@engine/index';
import type { Ball } from '@shared/balls';
import type { MatchupRequest } from '@shared/matchups';
import type { PatternSummary } from '@shared/patterns';
import { api } from './client';

export type { MissRoom, ShotPrediction };

/** One ranked ball of a matchup answer; `prediction` is there once the ball-motion model runs on the server. */
export interface MatchupRanking extends RankedBall {
  ballId: number;
  ball: Pick<
    Ball,
    | 'id'
    | 'name'
    | 'nickname'
    | 'maker'
    | 'coverType'
    | 'coreType'
    | 'rg'
    | 'differential'
    | 'intermediateDifferential'
    | 'surfaceGrit'
    | 'polished'
    | 'layout'
    | 'weightLb'
  >;
  prediction?: ShotPrediction | null;
  /** Boards of target error at the arrows that still reach the pocket (with the prediction). */
  missRoom?: MissRoom | null;
}

export interface MatchupResult {
  pattern: { id: number; name: string; summary: PatternSummary };
  bowler: BowlerProfile;
  gamesBowled: number;
  rankings: MatchupRanking[];
}

export type MatchupParams = Omit<MatchupRequest, 'gamesBowled' | 'studentId'> & { gamesBowled?: number };

export const matchupsApi = {
  run: (body: MatchupParams, signal?: AbortSignal) => api.post<MatchupResult>('/matchups', body, { signal }),
};
