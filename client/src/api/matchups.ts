import type { MissRoom, ShotPrediction } from '@engine/index';
import type { MatchupCalibration, MatchupRanking, MatchupRequest, MatchupResult } from '@shared/matchups';
import { api } from './client';

export type { MatchupCalibration, MatchupRanking, MatchupResult, MissRoom, ShotPrediction };

export type MatchupParams = Omit<MatchupRequest, 'gamesBowled' | 'studentId'> & { gamesBowled?: number };

export const matchupsApi = {
  /** A plain pattern (`patternId`, optional `lane`) or a published condition (`conditionId`: its own lane surface). */
  run: (body: MatchupParams, signal?: AbortSignal) => api.post<MatchupResult>('/matchups', body, { signal, readOnly: true }),
};
