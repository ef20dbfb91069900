import type { DeliveryResult } from './integrateDelivery';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';

/** The line the pocket solver chose and the delivery on it. */
export interface PocketLine {
  laydownBoard: number;
  targetBoard: number;
  result: DeliveryResult;
  /** Entry within solverTolBoards of board 17.5, at the pins, and not in the gutter. */
  reached: boolean;
  evaluations: number;
}

/**
 * Finds the line that puts a ball in the pocket (board 17.5 at the headpin, TRADE.md §2.2).
 *
 * Definition: one free variable, the other held — `laydownBoard` given: solve the target; `targetBoard`
 * given: solve the laydown; neither: laydown = target + D and solve the target, starting at D = 5 boards
 * (≈ 1.7° outward over 15 ft, PHYSICS.md §6 typical 1–3°, C) and widening it 2 boards at a time (to 17)
 * for a ball that hooks past the pocket on every target, or narrowing it (to −3, an inward launch) for
 * one that never gets there — so the straightest line that reaches the pocket is used (the most angle). Each solve
 * scans the free variable at 5 points across boards 1–39 and refines the best sign change with the
 * Illinois (modified regula falsi) method (standard root finding, from memory). The lane beyond a gutter
 * is treated as continuing so the function stays continuous; a line whose ball drops in the gutter does
 * not count as reaching the pocket.
 *
 * Units: boards. Edge cases: if no line reaches 17.5 within the range, the closest line is returned with
 * `reached` false. Example: `solvePocketLine((l, t) => integrateDelivery(...), {})`.
 */
export function solvePocketLine(
  run: (laydownBoard: number, targetBoard: number) => DeliveryResult,
  given: { laydownBoard?: number; targetBoard?: number },
): PocketLine {
  const fixedL = given.laydownBoard, fixedT = given.targetBoard;
  if (fixedL !== undefined && fixedT === undefined) return solveOne(run, (x) => [fixedL, x], 1, 39);
  if (fixedT !== undefined && fixedL === undefined) return solveOne(run, (x) => [x, fixedT], 1, 39);
  // neither given: start at the typical launch; widen it for a ball that hooks past the pocket on every
  // target, narrow it (down to an inward launch) for one that never gets there
  const launches = K.solverLaunchBoards;
  let i = launches.indexOf(K.solverFirstLaunchBoards);
  let best: (PocketLine & { miss: number }) | null = null;
  let evaluations = 0;
  let dir = 0;
  while (i >= 0 && i < launches.length) {
    const D = launches[i];
    const line = solveOne(run, (x) => [x + D, x], Math.max(1, 1 - D), Math.min(39, 39 - D));
    evaluations += line.evaluations;
    if (best === null || (line.reached && !best.reached) || (line.reached === best.reached && line.miss < best.miss)) best = line;
    if (line.reached) break;
    const d = line.side > 0 ? 1 : -1; // hooks past the pocket everywhere: widen
    if (dir !== 0 && d !== dir) break;
    dir = d;
    i += d;
  }
  const b = best as PocketLine;
  return { laydownBoard: b.laydownBoard, targetBoard: b.targetBoard, result: b.result, reached: b.reached, evaluations };
}

type Sample = { x: number; g: number; r: DeliveryResult };

/** Scan the free variable at 5 points, then Illinois on the best bracket. */
function solveOne(
  run: (laydownBoard: number, targetBoard: number) => DeliveryResult,
  lineOf: (x: number) => [number, number],
  lo: number,
  hi: number,
): PocketLine & { miss: number; side: number } {
  const pocket = C.pocketBoard, tol = K.solverTolBoards;
  const isOk = (r: DeliveryResult): boolean => r.reachedPins && !r.gutter;
  const score = (v: Sample): number => Math.abs(v.g) + (isOk(v.r) ? 0 : 100);
  let evaluations = 0;
  let best: Sample | null = null;
  const evalAt = (x: number): Sample => {
    const [l, t] = lineOf(x);
    const r = run(l, t);
    evaluations++;
    const e = { x, g: r.entryBoard - pocket, r };
    if (best === null || score(e) < score(best)) best = e;
    return e;
  };
  const n = 5;
  const scan: Sample[] = [];
  for (let k = 0; k < n; k++) scan.push(evalAt(lo + ((hi - lo) * k) / (n - 1)));
  // prefer a bracket where the entry rises with the free variable and the ball stays on the lane
  let bracket: [Sample, Sample] | null = null;
  for (let k = 1; k < n; k++) {
    const p = scan[k - 1], q = scan[k];
    if (p.g * q.g > 0) continue;
    const good = isOk(p.r) || isOk(q.r);
    if (bracket === null || (good && !(isOk(bracket[0].r) || isOk(bracket[1].r)))) bracket = [p, q];
    if (good) break;
  }
  let side = 0;
  if (bracket !== null) {
    let [p, q] = bracket;
    let gp = p.g, gq = q.g;
    for (let it = 0; it < 16 && Math.abs((best as unknown as Sample).g) > tol && Math.abs(q.x - p.x) > 1e-4; it++) {
      const x = gq !== gp ? q.x - (gq * (q.x - p.x)) / (gq - gp) : (p.x + q.x) / 2;
      const c = evalAt(x);
      if (c.g * gq < 0) { p = q; gp = gq; } else { gp /= 2; }
      q = c; gq = c.g;
    }
  } else {
    side = scan.every((e) => e.g > 0) ? 1 : -1;
  }
  const b = best as unknown as Sample;
  const [laydownBoard, targetBoard] = lineOf(b.x);
  return { laydownBoard, targetBoard, result: b.r, reached: Math.abs(b.g) <= tol && isOk(b.r), evaluations, miss: score(b), side };
}
