import { arsenalCoverage, layoutLab, MOTION_CALIBRATION } from '../../../engine/index';
import type { CatalogueCandidate, CoverageCondition } from '../../../engine/index';
import { ballLabel, ballToArsenalBall } from '../../../shared/balls';
import type { CoverageResult, LayoutLabRequest, LayoutLabResult } from '../../../shared/decisions';
import { AppError } from '../../lib/AppError';
import type { AuthUser } from '../../middleware/auth';
import { arsenalRepository } from '../arsenal/arsenal.repository';
import { centersService } from '../centers/centers.service';
import { readableBowlerId } from '../coaching/coaching.access';
import { bowlerOf, engineCondition } from '../stats/engineInput.service';
import { decisionsRepository } from './decisions.repository';

const laneRange = (lanes: number[]) => {
  const sorted = [...lanes].sort((a, b) => a - b);
  return sorted.length > 1 && sorted.at(-1)! - sorted[0] === sorted.length - 1
    ? `lanes ${sorted[0]}–${sorted.at(-1)}`
    : `lanes ${sorted.join(', ')}`;
};

export const decisionsService = {
  /**
   * Arsenal coverage for a bowler (or a linked coach's student): every lane group in force at the centers they
   * follow, fresh and after some games, against their active balls, with catalogue models for each gap.
   */
  async coverage(user: AuthUser, studentId: number | undefined): Promise<CoverageResult> {
    const bowlerId = await readableBowlerId(user, studentId);
    const [bowler, balls, follows, models] = await Promise.all([
      bowlerOf(bowlerId),
      decisionsRepository.activeBalls(bowlerId),
      centersService.follows({ id: bowlerId } as AuthUser),
      decisionsRepository.catalogue(),
    ]);
    const conditions: (CoverageCondition & { centerName: string; lanes: number[] })[] = follows.flatMap((f) =>
      f.inForce.map(({ condition, lanes }) => ({
        id: String(condition.id),
        label: `${f.center.name}, ${laneRange(lanes)}: ${condition.pattern.name}`,
        centerName: f.center.name,
        lanes,
        pattern: { name: condition.pattern.name, sweeps: condition.pattern.sweeps },
        lane: condition.lane,
      })),
    );
    const arsenal = balls.map((b) => ballToArsenalBall(b.get({ plain: true })));
    const weight = arsenal.length ? arsenal.map((b) => b.weightLb).sort((a, b) => a - b)[Math.floor(arsenal.length / 2)] : 15;
    const catalogue: CatalogueCandidate[] = models.map((m) => ({
      id: String(m.id),
      label: `${m.maker} ${m.name}`,
      spec: {
        weightLb: weight,
        rg: m.rg,
        differential: m.differential,
        intermediateDifferential: m.intermediateDifferential,
        coverType: m.coverType,
        surfaceGrit: m.factoryGrit,
        polished: m.factoryPolished,
        ...(m.hardnessD != null ? { hardnessD: m.hardnessD } : {}),
        ...(m.releaseYear != null ? { approvalYear: m.releaseYear } : {}),
        layout: { pinToPapIn: MOTION_CALIBRATION.defaultPinToPapIn },
      },
    }));
    return {
      balls: arsenal.map((b) => ({ id: b.id, label: b.label })),
      conditions: conditions.map(({ id, label, centerName, lanes }) => ({ id, label, centerName, lanes })),
      coverage: arsenalCoverage({ bowler, balls: arsenal, conditions, catalogue }),
    };
  },

  /** The layout lab for one of the user's balls on a pattern or a published condition. */
  async layoutLab(user: AuthUser, req: LayoutLabRequest): Promise<LayoutLabResult> {
    const ball = await arsenalRepository.findOwned(user.id, req.ballId);
    if (!ball) throw AppError.badRequest('Check the layout lab', { 'body.ballId': 'Not a ball in your arsenal' });
    const on = await engineCondition({ patternId: req.patternId, conditionId: req.conditionId, viewer: user });
    const bowler = await bowlerOf(user.id);
    const spec = ballToArsenalBall(ball.get({ plain: true }));
    const items = layoutLab({
      ball: spec,
      bowler,
      pattern: on.pattern,
      lane: on.lane,
      layouts: req.layouts.map((l, i) => ({
        id: String(i + 1),
        label: l.label,
        layout: {
          pinToPapIn: l.pinToPapIn,
          ...(l.drillingAngleDeg != null ? { drillingAngleDeg: l.drillingAngleDeg } : {}),
          ...(l.valAngleDeg != null ? { valAngleDeg: l.valAngleDeg } : {}),
        },
      })),
    });
    return { ball: { id: ball.id, label: ballLabel(ball) }, hand: bowler.hand, condition: { name: on.name }, items };
  },
};
