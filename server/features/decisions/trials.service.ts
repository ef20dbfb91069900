import { median } from 'simple-statistics';
import { compareTrial, laydownBoardOf, simulateShot } from '../../../engine/index';
import type { BowlerProfile, OilPattern } from '../../../engine/types';
import { ballLabel, ballToSpec } from '../../../shared/balls';
import type { Trial as TrialDto, TrialCreate, TrialListQuery, TrialResult } from '../../../shared/decisions';
import { AppError } from '../../lib/AppError';
import type { AuthUser } from '../../middleware/auth';
import type { Ball, Trial } from '../../models/index';
import { arsenalRepository } from '../arsenal/arsenal.repository';
import { isLinkedCoach, readableBowlerId } from '../coaching/coaching.access';
import { patternsService } from '../patterns/patterns.service';
import { sessionsRepository, toShotRecord, type ShotRow } from '../sessions/sessions.repository';
import { bowlerOf } from '../stats/engineInput.service';
import { decisionsRepository } from './decisions.repository';

const todayUtc = () => new Date().toISOString().slice(0, 10);

function toDto(t: Trial, balls: Map<number, Ball>, patternName: string | null): TrialDto {
  return {
    id: t.id,
    userId: t.userId,
    name: t.name,
    arms: t.arms.map((a) => {
      const b = balls.get(a.ballId);
      const name = b ? ballLabel(b) : `Ball ${a.ballId}`;
      return { ballId: a.ballId, surfaceKey: a.surfaceKey, label: a.surfaceKey ? `${name}, ${a.surfaceKey}` : name };
    }),
    patternId: t.patternId,
    patternName,
    startDate: t.startDate,
    createdBy: t.createdBy,
    createdAt: t.createdAt.toISOString(),
  };
}

async function ballsOf(userId: number, ids: number[]): Promise<Map<number, Ball>> {
  if (ids.length === 0) return new Map();
  const rows = await arsenalRepository.findOwnedManyEvenRemoved(userId, ids);
  return new Map(rows.map((b) => [b.id, b]));
}

function patternNames(ids: (number | null)[]): Promise<Map<number, string>> {
  return decisionsRepository.patternNames([...new Set(ids.filter((x): x is number => x !== null))]);
}

/** The trial if the user may read it (its bowler or their linked coach); 404 otherwise. */
async function readable(user: AuthUser, id: number): Promise<Trial> {
  const t = await decisionsRepository.findTrial(id);
  if (!t || (t.userId !== user.id && !(await isLinkedCoach(user, t.userId)))) throw AppError.notFound('Trial');
  return t;
}

/**
 * The ball-motion model's breakpoint for an arm on the trial's pattern: from the arm's usual logged line (median
 * feet board less the laydown offset, median target), or the pocket solver's line when no line was logged.
 */
function predictedBreakpoint(ball: Ball, rows: ShotRow[], bowler: BowlerProfile, pattern: OilPattern): number {
  const lined = rows.filter((r) => r.delivery === 1 && r.feet_board != null && r.target_board != null);
  const spec = ballToSpec(ball.get({ plain: true }));
  const line = lined.length
    ? {
        laydownBoard: laydownBoardOf(median(lined.map((r) => r.feet_board as number))),
        targetBoard: median(lined.map((r) => r.target_board as number)),
      }
    : {};
  return Math.round(simulateShot({ ball: spec, bowler, pattern, ...line }).breakpoint.board * 10) / 10;
}

export const trialsService = {
  async list(user: AuthUser, q: TrialListQuery): Promise<TrialDto[]> {
    const bowlerId = await readableBowlerId(user, q.studentId);
    const trials = await decisionsRepository.trialsOf(bowlerId, 100);
    const balls = await ballsOf(bowlerId, [...new Set(trials.flatMap((t) => t.arms.map((a) => a.ballId)))]);
    const names = await patternNames(trials.map((t) => t.patternId));
    return trials.map((t) => toDto(t, balls, t.patternId ? (names.get(t.patternId) ?? null) : null));
  },

  async create(user: AuthUser, input: TrialCreate): Promise<TrialDto> {
    const bowlerId = await readableBowlerId(user, input.studentId);
    const balls = await ballsOf(
      bowlerId,
      input.arms.map((a) => a.ballId),
    );
    const fields: Record<string, string> = {};
    input.arms.forEach((a, i) => {
      if (!balls.has(a.ballId) || balls.get(a.ballId)!.deletedAt) fields[`body.arms.${i}.ballId`] = 'Not a ball in this arsenal';
    });
    let patternName: string | null = null;
    if (input.patternId != null) {
      patternName = (await decisionsRepository.patternNames([input.patternId])).get(input.patternId) ?? null;
      if (patternName === null) fields['body.patternId'] = 'No such pattern';
    }
    if (Object.keys(fields).length) throw AppError.badRequest('Check the trial', fields);
    const t = await decisionsRepository.createTrial({
      userId: bowlerId,
      createdBy: user.id,
      name: input.name,
      patternId: input.patternId ?? null,
      startDate: input.startDate ?? todayUtc(),
      arms: input.arms.map((a) => ({ ballId: a.ballId, surfaceKey: a.surfaceKey ?? null })),
    });
    return toDto(t, balls, patternName);
  },

  /** The trial and its comparison: the bowler's shots since the start (on the trial's pattern), each arm's own. */
  async get(user: AuthUser, id: number): Promise<TrialResult> {
    const t = await readable(user, id);
    const balls = await ballsOf(
      t.userId,
      t.arms.map((a) => a.ballId),
    );
    const names = await patternNames([t.patternId]);
    const dto = toDto(t, balls, t.patternId ? (names.get(t.patternId) ?? null) : null);
    const rows = await sessionsRepository.shotsForStats(t.userId, {
      from: t.startDate,
      ...(t.patternId ? { patternId: t.patternId } : {}),
    });
    const bowler = await bowlerOf(t.userId);
    const pattern = t.patternId && names.has(t.patternId) ? (await patternsService.engineInput(t.patternId)).pattern : null;
    const arms = t.arms.map((a, i) => {
      const own = rows.filter((r) => r.ball_id === a.ballId && (a.surfaceKey === null || r.surface_key === a.surfaceKey));
      const ball = balls.get(a.ballId);
      return {
        id: String(i + 1),
        label: dto.arms[i].label,
        shots: own.map((r) => toShotRecord(r, r.date!)),
        predictedBreakpointBoard: pattern && ball && ball.coverType !== 'plastic' ? predictedBreakpoint(ball, own, bowler, pattern) : null,
      };
    });
    return { trial: dto, comparison: compareTrial({ arms, hand: bowler.hand }) };
  },

  /** Deletes a trial (its bowler, or the coach who opened it); the shots stay in their sessions. */
  async remove(user: AuthUser, id: number): Promise<void> {
    const t = await readable(user, id);
    if (t.userId !== user.id && t.createdBy !== user.id)
      throw AppError.forbidden('Only the bowler or the coach who opened the trial may delete it');
    await t.destroy();
  },
};
