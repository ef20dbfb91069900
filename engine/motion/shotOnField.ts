import type { BallSpec, BowlerProfile } from '../types';
import type { BallInertia } from './ballInertia';
import type { FrictionField } from './frictionField';
import { integrateDelivery, type DeliveryResult } from './integrateDelivery';
import { previewDelivery, type PreviewResult } from './previewDelivery';
import { releaseState } from './releaseState';

/** A ball and a bowler on one friction field, ready to throw many deliveries (the solver and miss room). */
export interface PreparedShot {
  hand: 1 | -1;
  inertia: BallInertia;
  field: FrictionField;
  /** One delivery on the line (hand-side boards at the foul line and at the arrows). */
  run: (laydownBoard: number, targetBoard: number) => DeliveryResult;
  /**
   * A fast preview of the same delivery for the line search (previewDelivery), on an oil field; undefined for a
   * uniform or sampled friction. Its flare rate is the full model's on a usual line, found on first use, and its
   * entry board is shifted by the difference the two show on that line (at most 2 boards).
   */
  preview?: (laydownBoard: number, targetBoard: number) => PreviewResult;
}

/**
 * The deliveries of one ball and bowler on a friction field already built (inputs already checked): the full
 * model (integrateDelivery) and, on an oil field, its preview (previewDelivery) with the flare rate the full model
 * gives on a usual line (laid down on 20, over 12 at the arrows). Internal to the motion model: prepareShot checks
 * the inputs and builds the field; conditionOilMap throws its reference ball with it.
 * Units: boards in, DeliveryResult out. Example: `shotOnField(ball, bowler, 1, ballInertia(ball), field).run(20, 12)`.
 */
export function shotOnField(ball: BallSpec, bowler: BowlerProfile, hand: 1 | -1, inertia: BallInertia, field: FrictionField): PreparedShot {
  const run = (l: number, t: number) => integrateDelivery(releaseState(ball, bowler, l, t), inertia, field, { hand });
  let flareRate: number | null = null;
  let offset = 0;
  const preview =
    field.kind === 'oil'
      ? (l: number, t: number): PreviewResult => {
          if (flareRate === null) {
            // calibrate the preview on the usual line: the full model's flare rate, and the entry board the two
            // differ by there (nearly the same on every line, so the search lands on the full model's pocket line)
            const r = run(20, 12);
            flareRate = r.timeToPinsS > 0 ? r.flareIn / r.timeToPinsS : 0;
            const p = previewDelivery(releaseState(ball, bowler, 20, 12), inertia, field, hand, flareRate);
            const usable = r.reachedPins && !r.gutter && p.reachedPins && !p.gutter;
            offset = usable ? Math.max(-2, Math.min(2, r.entryBoard - p.entryBoard)) : 0;
          }
          const p = previewDelivery(releaseState(ball, bowler, l, t), inertia, field, hand, flareRate);
          p.entryBoard += offset;
          return p;
        }
      : undefined;
  return { hand, inertia, field, run, preview };
}
