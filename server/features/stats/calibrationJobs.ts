import type { Transaction } from 'sequelize';
import type { LaneSurface } from '../../../engine/types';
import { sendJob } from '../../lib/jobs';
import { logger } from '../../lib/logger';
import { statsRepository } from './stats.repository';

/**
 * Requests for calibration fits (the `calibration` queue; the worker's side is runCalibrationFit in
 * calibration.service.ts). Kept apart from the stats service so the features whose changes call for a refit (shots,
 * balls, the release) can ask for one without importing it.
 */

/** Which fit a `calibration` job computes: on a published condition (its pattern as published, its lanes), or on a pattern on a lane surface. */
export type FitRequest = { bowlerId: number; conditionId: number } | { bowlerId: number; patternId: number; lane: LaneSurface };

/** Asks the worker for a fit (at most one queued per bowler and subject; the job reads the newest input when it runs). */
export async function requestCalibrationFit(req: FitRequest): Promise<void> {
  const subject = 'conditionId' in req ? `condition-${req.conditionId}` : `pattern-${req.patternId}-${req.lane.kind}-${req.lane.friction}`;
  const data =
    'conditionId' in req
      ? { bowlerId: req.bowlerId, conditionId: req.conditionId }
      : { bowlerId: req.bowlerId, patternId: req.patternId, laneKind: req.lane.kind, laneFriction: req.lane.friction };
  await sendJob('calibration', `${req.bowlerId}:${subject}:${Date.now()}`, data, { singletonKey: `${req.bowlerId}:${subject}` });
}

/**
 * Sends the requests once `transaction` has committed. Not inside it: a queued job of the same subject absorbs a
 * new request, and one fetched before the change committed would fit without it; a request sent after the commit
 * either finds a job that has not started (it will read the change) or queues a new one. A request lost to a crash
 * right after the commit is made again by the next reader, who finds the stored fit's input out of date.
 */
export function requestCalibrationFitsAfterCommit(
  transaction: Transaction | null | undefined,
  reqs: () => Promise<FitRequest[]> | FitRequest[],
): void {
  const send = () =>
    void Promise.resolve()
      .then(reqs)
      .then((list) => Promise.all(list.map(requestCalibrationFit)))
      .catch((err: unknown) => logger.warn({ err }, 'could not queue a calibration refit; the next reader will'));
  if (transaction) transaction.afterCommit(send);
  else send();
}

/** After a change to what a bowler's stored fits were made of (a ball's surface or specs, the release): a refit of each, once committed. */
export function refitBowlerAfterCommit(bowlerId: number, transaction?: Transaction | null): void {
  requestCalibrationFitsAfterCommit(transaction, async () => {
    const rows = await statsRepository.fitSubjectsOf(bowlerId);
    const seen = new Map<string, FitRequest>();
    for (const r of rows) {
      const req: FitRequest = r.conditionId
        ? { bowlerId, conditionId: r.conditionId }
        : { bowlerId, patternId: r.patternId, lane: { kind: r.laneKind, friction: r.laneFriction } };
      seen.set(JSON.stringify(req), req);
    }
    return [...seen.values()];
  });
}
