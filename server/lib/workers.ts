import { runAutoRefund } from '../features/shop/payments.service';
import { z } from 'zod';
import { DEFAULT_LANE_SURFACE, LANE_FRICTIONS, LANE_KINDS } from '../../shared/centers';
import type { FitRequest } from '../features/stats/calibrationJobs';
import { runCalibrationFit } from '../features/stats/calibration.service';
import { superviseJobs, workQueue } from './jobs';
import { startMailSender } from './outbox';

/**
 * Works every queue in this process: the API process when JOBS_IN_PROCESS (the default; one process does it
 * all), or the separate worker tier (`npm run worker`). Any number of processes may do this at once.
 */
export async function startWorkers(): Promise<void> {
  superviseJobs();
  await startMailSender();
  await workQueue('refund', 2, async (data) => runAutoRefund(Number(data.paymentId), String(data.why ?? 'automatic refund')));
  await workQueue('calibration', 1, async (data) => runCalibrationFit(fitRequestOf(data)));
}

const id = z.coerce.number().int().positive();
/** A `calibration` job's data: a published condition, or a pattern on a lane surface (the default surface for jobs that name none). */
const FitJobSchema = z.union([
  z.object({ bowlerId: id, conditionId: id }),
  z.object({
    bowlerId: id,
    patternId: id,
    laneKind: z.enum(LANE_KINDS).default(DEFAULT_LANE_SURFACE.kind),
    laneFriction: z.enum(LANE_FRICTIONS).default(DEFAULT_LANE_SURFACE.friction),
  }),
]);

function fitRequestOf(data: Record<string, unknown>): FitRequest {
  const d = FitJobSchema.parse(data);
  return 'conditionId' in d ? d : { bowlerId: d.bowlerId, patternId: d.patternId, lane: { kind: d.laneKind, friction: d.laneFriction } };
}
