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
 * for a ball that hooks past the pocket on every target tried, or narrowing it (to −3, an inward launch)
 * for one that never gets there — so the straightest line found that reaches the pocket is used (the
 * most angle). Each solve starts with a Newton step that uses the straight-line geometry (4 boards at the
 * pins per board at the arrows), continues with secant steps and finishes with the Illinois method
 * (modified regula falsi; standard root finding, from memory) once a sign change brackets the root. The
 * lane beyond a gutter is treated as continuing so the function stays continuous; a line whose ball
 * drops in the gutter does not count as reaching the pocket.
 *
 * Units: boards. Edge cases: if no line reaches 17.5 within the range, the closest line is returned with
 * `reached` false. Example: `solvePocketLine((l, t) => integrateDelivery(...), {})`.
 */
export function solvePocketLine(
  run: (laydownBoard: number, targetBoard: number) => DeliveryResult,
  given: { laydownBoard?: number; targetBoard?: number },
): PocketLine {
  const fixedL = given.laydownBoard, fixedT = given.targetBoard;
  const arrowsToPins = C.headpinFt / C.arrowsFt; // a straight line moves 4 boards at the pins per board at the arrows
  if (fixedL !== undefined && fixedT === undefined) {
    return solveOne(run, (x) => [fixedL, x], 1, 39, Math.min(39, Math.max(1, fixedL - 5)), arrowsToPins);
  }
  if (fixedT !== undefined && fixedL === undefined) {
    return solveOne(run, (x) => [x, fixedT], 1, 39, Math.min(39, Math.max(1, fixedT + 5)), 1 - arrowsToPins);
  }
  // neither given: start at the typical launch; widen it for a ball that hooks past the pocket on every
  // target, narrow it (down to an inward launch) for one that never gets there
  const launches = K.solverLaunchBoards;
  let i = launches.indexOf(K.solverFirstLaunchBoards);
  let best: (PocketLine & { miss: number }) | null = null;
  let evaluations = 0;
  let dir = 0;
  let x0 = 20;
  while (i >= 0 && i < launches.length) {
    const D = launches[i];
    const lo = Math.max(1, 1 - D), hi = Math.min(39, 39 - D);
    const line = solveOne(run, (x) => [x + D, x], lo, hi, Math.min(hi, Math.max(lo, x0)), 1);
    evaluations += line.evaluations;
    if (best === null || (line.reached && !best.reached) || (line.reached === best.reached && line.miss < best.miss)) best = line;
    if (line.reached) break;
    const d = line.side > 0 ? 1 : -1; // hooks past the pocket everywhere: widen
    if (dir !== 0 && d !== dir) break;
    dir = d;
    // a straight line moves 3 boards at the pins per board of launch: jump by about |miss| / 3 boards of D
    // (2 boards per step of the list), at least one step
    i += d * Math.max(1, Math.round(Math.abs(line.result.entryBoard - C.pocketBoard) / 6));
    // next guess from the hook just seen: entry ≈ x − 3D + H (straight line plus hook H)
    const hook = line.result.entryBoard - (line.targetBoard - (arrowsToPins - 1) * D);
    if (i >= 0 && i < launches.length) x0 = C.pocketBoard + (arrowsToPins - 1) * launches[i] - hook;
  }
  const b = best as PocketLine;
  return { laydownBoard: b.laydownBoard, targetBoard: b.targetBoard, result: b.result, reached: b.reached, evaluations };
}

type Sample = { x: number; g: number; r: DeliveryResult };

/**
 * One free variable x on [lo, hi]: a Newton step with the straight-line slope `slope` (boards at the pins
 * per board of x), then secant steps (falling back to that slope when the secant slope has the wrong sign),
 * then Illinois once a sign change brackets the root. `side` > 0 when the ball ends past the pocket on
 * every line tried (it hooks too much), < 0 when it never gets there.
 */
function solveOne(
  run: (laydownBoard: number, targetBoard: number) => DeliveryResult,
  lineOf: (x: number) => [number, number],
  lo: number,
  hi: number,
  x0: number,
  slope: number,
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
  const clampX = (x: number): number => Math.min(hi, Math.max(lo, x));
  const done = (): boolean => best !== null && Math.abs((best as Sample).g) <= tol && isOk((best as Sample).r);
  let a = evalAt(clampX(x0));
  let bracket: [Sample, Sample] | null = null;
  if (!done()) {
    const maxStep = 8 / Math.abs(slope); // boards of x per step (8 boards at the pins)
    const step = (from: number, dx: number): number => clampX(from + Math.max(-maxStep, Math.min(maxStep, dx)));
    let b = evalAt(step(a.x, -a.g / slope));
    let turned = 0;
    for (let it = 0; it < 6 && !done(); it++) {
      if (a.g * b.g <= 0 && a.x !== b.x) { bracket = [a, b]; break; }
      const s = b.x !== a.x ? (b.g - a.g) / (b.x - a.x) : slope;
      let x2: number;
      if (s * slope > 0 && Math.abs(s) >= 0.2 * Math.abs(slope)) x2 = step(b.x, -b.g / s);
      else if (b.g < 0) {
        // the entry turned (the lane's hold area makes the entry curve U-shaped) below the pocket: step
        // from the inner of the two lines up the rising branch with the straight-line slope
        x2 = step(slope > 0 ? Math.max(a.x, b.x) : Math.min(a.x, b.x), -b.g / slope);
      } else {
        // turned above the pocket: look between the two lines for the bottom of the U, twice at most;
        // still past the pocket there means no root on this launch
        if (++turned > 2 || (Math.abs((best as unknown as Sample).g) > 2 && it >= 1)) break;
        x2 = (a.x + b.x) / 2;
      }
      if (Math.abs(x2 - b.x) < 1e-9) break; // pinned at the end of the range
      if (Math.abs(b.g) < Math.abs(a.g)) { a = b; }
      b = evalAt(x2);
    }
  }
  let side = 0;
  if (bracket !== null && !done()) {
    let [p, q] = bracket;
    let gp = p.g, gq = q.g;
    for (let it = 0; it < 16 && !done() && Math.abs(q.x - p.x) > 1e-4; it++) {
      const x = gq !== gp ? q.x - (gq * (q.x - p.x)) / (gq - gp) : (p.x + q.x) / 2;
      const c = evalAt(x);
      if (c.g * gq < 0) { p = q; gp = gq; } else { gp /= 2; }
      q = c; gq = c.g;
    }
  }
  const b = best as unknown as Sample;
  if (!done()) side = b.g > 0 ? 1 : -1;
  const [laydownBoard, targetBoard] = lineOf(b.x);
  return { laydownBoard, targetBoard, result: b.r, reached: Math.abs(b.g) <= tol && isOk(b.r), evaluations, miss: score(b), side };
}
