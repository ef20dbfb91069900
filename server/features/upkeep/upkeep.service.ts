import { upkeepDue } from '../../../engine/index';
import { ballLabel } from '../../../shared/balls';
import type { BallUpkeep, UpkeepPatch } from '../../../shared/upkeep';
import { AppError } from '../../lib/AppError';
import type { AuthUser } from '../../middleware/auth';
import { upkeepRepository, type UpkeepRow } from './upkeep.repository';

function toDto(r: UpkeepRow): BallUpkeep {
  const due = upkeepDue({
    gamesSinceResurface: Number(r.since_resurface),
    gamesSinceExtraction: Number(r.since_extraction),
    intervals: { resurfaceGames: r.upkeep_resurface_games, extractionGames: r.upkeep_extraction_games },
  });
  return {
    ballId: r.id,
    name: ballLabel(r),
    surfaceGrit: r.surface_grit,
    polished: r.polished,
    ...due,
    ownIntervals: r.upkeep_resurface_games !== null || r.upkeep_extraction_games !== null,
  };
}

const order = { due: 0, soon: 1, ok: 2 } as const;
const urgency = (u: BallUpkeep) => Math.min(order[u.resurface.state], order[u.extraction.state]);

export const upkeepService = {
  /** Every ball in the bag (not retired) with its upkeep, the most urgent first. */
  async list(user: AuthUser): Promise<BallUpkeep[]> {
    return (await upkeepRepository.rowsOf(user.id)).map(toDto).sort((a, b) => urgency(a) - urgency(b));
  },

  /** Sets a ball's own intervals, or records an oil extraction done; the bowler's own ball only (404 otherwise). */
  async update(user: AuthUser, ballId: number, patch: UpkeepPatch): Promise<BallUpkeep> {
    const ball = await upkeepRepository.findOwned(user.id, ballId);
    if (!ball) throw AppError.notFound('Ball');
    ball.set({
      ...(patch.resurfaceGames !== undefined ? { upkeepResurfaceGames: patch.resurfaceGames } : {}),
      ...(patch.extractionGames !== undefined ? { upkeepExtractionGames: patch.extractionGames } : {}),
      ...(patch.extractionDone ? { gamesSinceExtraction: 0, extractionCountedAt: new Date() } : {}),
    });
    await ball.save();
    const [row] = await upkeepRepository.rowsOf(user.id, ballId);
    if (!row)
      throw AppError.badRequest('A retired ball has no upkeep reminders', { 'params.id': 'Bring the ball back into the bag first' });
    return toDto(row);
  },
};
