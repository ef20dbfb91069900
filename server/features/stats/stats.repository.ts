import type { CreationAttributes, Transaction } from 'sequelize';
import { changedAfterCommit } from '../../lib/changeFeed';
import { BowlingSession, CalibrationFit } from '../../models/index';

/** What a stored fit is about: the bowler, the pattern id, the lane surface and the pattern's sweeps as fitted (their hash). */
export type FitSubject = Pick<CalibrationFit, 'bowlerId' | 'patternId' | 'laneKind' | 'laneFriction' | 'patternHash'>;

// A session saved, deleted or restored in this process drops its bowler's kept statistics when it commits.
for (const hook of ['afterSave', 'afterDestroy', 'afterRestore'] as const) {
  BowlingSession.addHook(hook, (session: BowlingSession, options: { transaction?: Transaction | null }) =>
    changedAfterCommit('shots', session.userId, options.transaction),
  );
}

/** The stored calibration fits (`calibration_fits`): read by the statistics and the matchups, written by the `calibration` job. */
export const statsRepository = {
  /** The stored fit of a subject, or null; `fromPrimary` for the job, which must see the fit it may just have stored. */
  findFit(subject: FitSubject, opts: { fromPrimary?: boolean } = {}): Promise<CalibrationFit | null> {
    return CalibrationFit.findOne({ where: subject, ...(opts.fromPrimary ? { useMaster: true } : {}) });
  },
  /** Stores a fit in place of the subject's previous one. */
  async saveFit(data: CreationAttributes<CalibrationFit>): Promise<void> {
    await CalibrationFit.upsert(data);
  },
  /** The subjects of a bowler's stored fits, read from the primary (a refit of each follows a change to their input). */
  fitSubjectsOf(bowlerId: number): Promise<Pick<CalibrationFit, 'patternId' | 'laneKind' | 'laneFriction' | 'conditionId'>[]> {
    return CalibrationFit.findAll({
      where: { bowlerId },
      attributes: ['patternId', 'laneKind', 'laneFriction', 'conditionId'],
      useMaster: true,
    });
  },
};
