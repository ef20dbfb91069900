import { runAutoRefund } from '../features/shop/payments.service';
import { runCalibrationFit } from '../features/stats/stats.service';
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
  await workQueue('calibration', 1, async (data) => runCalibrationFit(Number(data.bowlerId), Number(data.patternId)));
}
