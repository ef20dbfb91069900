import type { BallSpec, LegalityResult, LegalityViolation, LegalityGap } from './types';
import { DEFAULT_BALL_DIAMETER_IN } from './constants';
import { validateBallSpec } from './validateBallSpec';

const LIMITS_SOURCE = 'USBC equipment specifications';

/**
 * Current USBC limits for a bowling ball, as Lanewright applies them.
 * Source: the USBC equipment specifications (weight, diameter, RG and differential as summarised from the
 * specification; hardness from the USBC release of June 2020: 73 D for balls approved from 2021, 72 D before).
 * The RG, differential and hardness limits are those given for balls of 13 lb and more (`fullSpecFromLb`).
 * Units: lb, in, durometer D.
 */
export const USBC_BALL_LIMITS = {
  maxWeightLb: 16,
  minDiameterIn: 8.5,
  maxDiameterIn: 8.595,
  minRgIn: 2.46,
  maxRgIn: 2.8,
  maxDifferentialIn: 0.06,
  /** 73 D for balls approved from 2021 on (USBC, final rule of June 2020); earlier approvals: `minHardnessBefore2021D`. */
  minHardnessD: 73,
  /** 72 D for balls approved before 2021 (USBC equipment specifications until the 2020 change). */
  minHardnessBefore2021D: 72,
  fullSpecFromLb: 13,
} as const;

/**
 * Checks a ball against the current USBC limits.
 *
 * Definition: a ball is legal when it breaks none of the checked limits in USBC_BALL_LIMITS:
 * weight ≤ 16 lb; diameter 8.500–8.595 in (a missing diameter is the nominal 8.5 in); and, for
 * balls of 13 lb and more, RG 2.460–2.800 in, differential ≤ 0.060 in and hardness ≥ 73 D (≥ 72 D when
 * `approvalYear` is before 2021 — models approved then stay legal).
 * Limits are inclusive: a value exactly at a limit is legal.
 *
 * Source: USBC equipment specifications (summary) and the USBC hardness release of June 2020.
 *
 * Edge cases: no limit on intermediate differential was found, so it is never a violation and is
 * listed in `unchecked`; a missing hardness is listed in `unchecked`; for a ball under 13 lb the
 * RG, differential and hardness limits are listed in `unchecked` (the USBC gives them for 13 lb
 * and more only). Layout and surface are not equipment specifications and are not checked.
 *
 * @param ball the ball, in lb and inches.
 * @returns `legal`, the `violations` (field, limit in words, source) and the `unchecked` limits.
 * @throws TypeError/RangeError for a malformed ball (see validateBallSpec).
 *
 * @example
 * checkLegality({ weightLb: 16.5, rg: 2.5, differential: 0.05, intermediateDifferential: 0,
 *   coverType: 'reactive-solid', surfaceGrit: 2000, polished: false });
 * // => { legal: false, violations: [{ field: 'weightLb', limit: '≤ 16 lb', source: … }], unchecked: [...] }
 */
export function checkLegality(ball: BallSpec): LegalityResult {
  validateBallSpec(ball, 'checkLegality');
  const L = USBC_BALL_LIMITS;
  const violations: LegalityViolation[] = [];
  const unchecked: LegalityGap[] = [];
  const broken = (field: string, limit: string): void => {
    violations.push({ field, limit, source: LIMITS_SOURCE });
  };

  if (ball.weightLb > L.maxWeightLb) broken('weightLb', `≤ ${L.maxWeightLb} lb`);
  const d = ball.diameterIn ?? DEFAULT_BALL_DIAMETER_IN;
  if (d < L.minDiameterIn || d > L.maxDiameterIn) {
    broken('diameterIn', `${L.minDiameterIn.toFixed(3)}–${L.maxDiameterIn.toFixed(3)} in`);
  }

  if (ball.weightLb >= L.fullSpecFromLb) {
    if (ball.rg < L.minRgIn || ball.rg > L.maxRgIn) broken('rg', `${L.minRgIn.toFixed(3)}–${L.maxRgIn.toFixed(3)} in`);
    if (ball.differential > L.maxDifferentialIn) broken('differential', `≤ ${L.maxDifferentialIn.toFixed(3)} in`);
    if (ball.hardnessD === undefined) {
      unchecked.push({ field: 'hardnessD', reason: 'no hardness given' });
    } else {
      const before2021 = ball.approvalYear !== undefined && ball.approvalYear < 2021;
      const min = before2021 ? L.minHardnessBefore2021D : L.minHardnessD;
      if (ball.hardnessD < min) broken('hardnessD', `≥ ${min} D (${before2021 ? 'approved before 2021' : 'approved from 2021 on'})`);
    }
  } else {
    const reason = `the USBC limit is given for balls of ${L.fullSpecFromLb} lb and more`;
    unchecked.push({ field: 'rg', reason }, { field: 'differential', reason }, { field: 'hardnessD', reason });
  }
  unchecked.push({ field: 'intermediateDifferential', reason: 'no USBC limit on intermediate differential was found' });

  return { legal: violations.length === 0, violations, unchecked };
}
