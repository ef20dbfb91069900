import { analyzeShots } from './internal/analyzeShots';
import { computeStats } from './internal/computeStats';
import type { ShotRecord, ShotStats } from './types';

/**
 * The statistics of a set of logged shots: strike and spare rates with honest intervals, first-ball
 * average, pocket and carry, and which leaves keep coming back.
 *
 * Definitions (Lanewright's, following common scoresheet usage; every rate is a Rate: hits, n, pct in
 * percent and its Wilson 95 % interval, wilsonInterval — Wilson 1927):
 * - a shot's place on the sheet comes from the frame rules of buildGame (USBC and World Bowling playing rules: frames and fouls): the
 *   **first ball at a full rack** (delivery 1, and in the tenth frame each ball after a strike or
 *   spare) and the **second ball at a rack** (the ball after a count, or after a first-ball foul,
 *   whose rack is re-spotted);
 * - **strike %** = strikes ÷ first balls at a full rack (a fouled first ball is a chance missed);
 * - **spare %** = spares ('/') ÷ second balls at a rack; **single-pin** when one pin stood before the
 *   second ball, **multi-pin** otherwise (a re-spotted full rack after a foul is multi-pin);
 * - **split conversion** = spares ÷ second balls whose rack's first ball left a split (isSplit, the USBC playing rules on splits);
 * - **pocket %** = first balls recorded 'pocket' ÷ first balls with a recorded hit (any HitKind);
 * - **carry** = strikes among first balls recorded 'pocket';
 * - **first-ball average** = mean (and sample standard deviation) of the pins credited by first balls
 *   at a full rack (a foul counts 0);
 * - **leaves** = the pins standing after first balls at a full rack that were neither strikes nor
 *   fouls, by leaveName (common usage for naming leaves), most frequent first (ties by name), `share` = count ÷
 *   all those leaves;
 * - **average** = mean score of the games whose shots make one complete game (scoreGame), over
 *   `completeGames` games; `games` counts every game (sessionId + gameNumber) with a shot.
 * Shots may be a filtered set (one ball, a date range): each frame is replayed from its full rack with
 * the shots of it that are present, and a shot whose earlier deliveries in its frame are missing is
 * counted in `shots` only.
 *
 * @param shots ShotRecords (LoggedDelivery + sessionId, gameNumber, date, ballId, surfaceKey, boards, hit).
 * @returns ShotStats; with no shots every rate has n 0 and null pct.
 * @throws TypeError for a malformed record; RangeError for an impossible frame (a pin already down,
 *   a delivery logged twice, a delivery that cannot exist), naming the session and game.
 * @example
 * shotStats(shots).strike; // => { hits: 4, n: 11, pct: 36.4, low: 15.2, high: 64.6 }
 */
export function shotStats(shots: ShotRecord[]): ShotStats {
  const a = analyzeShots('shotStats', shots);
  return computeStats(a, new Set(a.entries.map((_, i) => i)));
}
