import { assertNumber } from './assertNumber';
import { func, record } from '../internal/checks';
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
  /** Laydown − target, boards (positive = launched out toward the hand-side gutter; 3 boards ≈ 1°). */
  launchBoards: number;
  /** Why no line reaches the pocket ('' when one does), in words a bowler reads. */
  reason: string;
  /**
   * The side of the pocket the closest line ends on when no line reaches it: 'high' (hooks past the pocket on
   * every line tried: too much ball), 'light' (never gets back to it), or null when a line reaches it.
   */
  miss: 'high' | 'light' | null;
  /** Where the search settled (absent when one side of the line was given): a hint that starts the next search of this ball on a nearby condition there. */
  settled?: PocketLineHint;
}

/**
 * Where to start the search, as a search of the same ball on a nearby condition left it (PocketLine.settled): the
 * launch it settled on, the target its last walk to the valley floor started from, and what its scan found (a hold
 * area, a ball well short of the pocket). With both boards given the search skips the scan across the lane and the
 * launch steps already taken, and repeats only that last walk (a warm start: on the same condition it takes the same
 * steps to the same line); otherwise it starts cold.
 */
export interface PocketLineHint {
  launchBoards?: number;
  targetBoard?: number;
  valley?: boolean;
  light?: boolean;
}

/** The little of a delivery the line search reads (a full delivery or a preview). */
export interface LineTrial {
  entryBoard: number;
  reachedPins: boolean;
  gutter: boolean;
}

type Sample = { t: number; e: number; r: LineTrial };

const ok = (r: LineTrial): boolean => r.reachedPins && !r.gutter;

/**
 * Finds the line that puts a ball in the pocket (board 17.5 at the headpin; USBC pin-carry research, reported
 * second-hand).
 *
 * Definition: one free variable when the other is given — `laydownBoard` given: solve the target; `targetBoard`
 * given: solve the laydown. Neither given: the line a bowler settles on — for a launch D (laydown − target) the
 * entry board against a parallel shift of the line is a valley on a pattern with a hold area (a miss outward
 * finds friction and comes back, a miss inward is held by the oil); the solver looks for the launch whose valley
 * floor sits on the pocket, and plays the floor: the most forgiving line. A strong ball needs a wider launch from
 * deeper inside; a weak one a straighter line. Launches run from solverLaunchBoards' first to its last entry; if
 * even the widest launch hooks past the pocket the ball has too much for the condition ('high'); if even the
 * straightest cannot reach it the ball plays the outside of its valley. Steps: a parabola through three lines
 * finds the valley floor (successive parabolic interpolation), a secant step on the launch moves the floor onto
 * the pocket, and a last secant step on the laydown puts the entry exactly on 17.5. Lines whose ball drops in
 * the gutter count as missing by ten boards.
 *
 * Units: boards. Edge cases: if no line reaches 17.5 within the range, the closest line is returned with
 * `reached` false and `reason` saying why. Example: `solvePocketLine((l, t) => integrateDelivery(...), {})`.
 */
export function solvePocketLine(
  run: (laydownBoard: number, targetBoard: number) => DeliveryResult,
  given: { laydownBoard?: number; targetBoard?: number },
  hint: PocketLineHint = {},
  preview?: (laydownBoard: number, targetBoard: number) => LineTrial,
): PocketLine {
  const fn = 'solvePocketLine';
  func(fn, 'run', run);
  if (preview !== undefined) func(fn, 'preview', preview);
  const g = record(fn, 'given', given);
  if (g.laydownBoard !== undefined) assertNumber(fn, 'given.laydownBoard', g.laydownBoard, -5, 45);
  if (g.targetBoard !== undefined) assertNumber(fn, 'given.targetBoard', g.targetBoard, -5, 45);
  const hn = record(fn, 'hint', hint);
  if (hn.launchBoards !== undefined) assertNumber(fn, 'hint.launchBoards', hn.launchBoards, -45, 45);
  if (hn.targetBoard !== undefined) assertNumber(fn, 'hint.targetBoard', hn.targetBoard, -5, 45);
  if (preview === undefined || given.laydownBoard !== undefined || given.targetBoard !== undefined) return searchLine(run, given, hint);
  // Find the line with the preview, then put the full model's entry on the pocket by moving the laydown (each board
  // of laydown moves the entry about 3 boards); every number reported is the full model's.
  const guide = searchLine(preview, {}, hint);
  const P = C.pocketBoard;
  let evaluations = 0;
  let best: { l: number; r: DeliveryResult; m: number } | null = null;
  const full = (l: number): DeliveryResult => {
    const r = run(l, guide.targetBoard);
    evaluations++;
    const m = Math.abs(r.entryBoard - P) + (ok(r) ? 0 : 100);
    if (best === null || m < best.m) best = { l, r, m };
    return r;
  };
  if (guide.reached)
    root(full, Math.max(1, guide.targetBoard + K.solverLaunchBoards[0]), 39, guide.laydownBoard, 1 - C.headpinFt / C.arrowsFt);
  else full(guide.laydownBoard);
  const b = best as unknown as { l: number; r: DeliveryResult; m: number };
  const reached = Math.abs(b.r.entryBoard - P) <= K.solverTolBoards && ok(b.r);
  return {
    laydownBoard: b.l,
    targetBoard: guide.targetBoard,
    result: b.r,
    reached,
    evaluations,
    launchBoards: b.l - guide.targetBoard,
    reason: reached ? '' : guide.reason || 'No line found that reaches the pocket.',
    miss: reached ? null : (guide.miss ?? (b.r.entryBoard > P ? 'high' : 'light')),
    ...(guide.settled ? { settled: guide.settled } : {}),
  };
}

/** The search itself, over any delivery (full or preview): see solvePocketLine. */
function searchLine<T extends LineTrial>(
  run: (laydownBoard: number, targetBoard: number) => T,
  given: { laydownBoard?: number; targetBoard?: number },
  hint: PocketLineHint,
): Omit<PocketLine, 'result'> & { result: T } {
  const P = C.pocketBoard;
  let evaluations = 0;
  let best: { l: number; t: number; r: T; m: number } | null = null;
  // the final step's own best: the line the search chose, not some earlier line that happened to come close
  let chosen: { l: number; t: number; r: T; m: number } | null = null;
  let choosing = false;
  const eval2 = (l: number, t: number): T => {
    const r = run(l, t);
    evaluations++;
    const m = Math.abs(r.entryBoard - P) + (ok(r) ? 0 : 100);
    if (best === null || m < best.m) best = { l, t, r, m };
    if (choosing && (chosen === null || m < chosen.m)) chosen = { l, t, r, m };
    return r;
  };
  let settled: PocketLineHint | undefined;
  const finish = (miss: 'high' | 'light' | null, reason: string): Omit<PocketLine, 'result'> & { result: T } => {
    const c = chosen as { l: number; t: number; r: T; m: number } | null;
    const b = (c !== null && c.m <= K.solverTolBoards ? c : best) as unknown as { l: number; t: number; r: T; m: number };
    const reached = Math.abs(b.r.entryBoard - P) <= K.solverTolBoards && ok(b.r);
    return {
      laydownBoard: b.l,
      targetBoard: b.t,
      result: b.r,
      reached,
      evaluations,
      launchBoards: b.l - b.t,
      reason: reached ? '' : reason,
      miss: reached ? null : (miss ?? (b.r.entryBoard > P ? 'high' : 'light')),
      ...(settled ? { settled } : {}),
    };
  };
  const arrowsToPins = C.headpinFt / C.arrowsFt;
  const fixedL = given.laydownBoard,
    fixedT = given.targetBoard;
  if (fixedL !== undefined && fixedT === undefined) {
    root((x) => eval2(fixedL, x), 1, 39, Math.min(39, Math.max(1, fixedL - 6)), arrowsToPins);
    return finish(null, 'No target at the arrows from this laydown reaches the pocket.');
  }
  if (fixedT !== undefined && fixedL === undefined) {
    root((x) => eval2(x, fixedT), 1, 39, Math.min(39, Math.max(1, fixedT + 6)), 1 - arrowsToPins);
    return finish(null, 'No laydown board with this target reaches the pocket.');
  }

  const launches = K.solverLaunchBoards;
  const dMin = launches[0],
    dMax = launches[launches.length - 1];
  const clampD = (d: number) => Math.min(dMax, Math.max(dMin, d));
  // targets from minTargetBoard (a line closer to the gutter leaves no room) to the far side
  const tRange = (d: number): [number, number] => [Math.max(K.minTargetBoard, 1 - d), Math.min(39, 39 - d)];
  // A gutter ball counts as ten boards past the pocket (the lane's edge walls the search in).
  const effective = (r: LineTrial): number => (ok(r) ? r.entryBoard : Math.max(r.entryBoard, P) + 10);
  const sample = (d: number, t: number): Sample => {
    const r = eval2(t + d, t);
    return { t, e: effective(r), r };
  };

  /** Lines at launch d across targets lo…hi (a few boards apart), in order of target. */
  const scan = (d: number, from: number, to: number, step: number): Sample[] => {
    const [lo, hi] = tRange(d);
    const out: Sample[] = [];
    for (let t = Math.max(lo, from); t <= Math.min(hi, to) + 1e-9; t += step) out.push(sample(d, t));
    return out;
  };
  /**
   * The lowest entry of a scan, refined by one parabola through it and its neighbours; on a flat floor (neighbours
   * within floorFlatBoards of the lowest) the middle of the flat stretch — the most forgiving line, and one that
   * does not jump across the floor with a tenth of a board of difference.
   */
  const floorOf = (d: number, pts: Sample[]): Sample => {
    let i = 0;
    for (let j = 1; j < pts.length; j++) if (pts[j].e < pts[i].e) i = j;
    let a = i,
      b = i;
    while (a > 0 && ok(pts[a - 1].r) && pts[a - 1].e <= pts[i].e + K.floorFlatBoards) a--;
    while (b < pts.length - 1 && ok(pts[b + 1].r) && pts[b + 1].e <= pts[i].e + K.floorFlatBoards) b++;
    if (b - a >= 2) return pts[Math.round((a + b) / 2)];
    if (i === 0 || i === pts.length - 1) return pts[i];
    const [p0, p1, p2] = [pts[i - 1], pts[i], pts[i + 1]];
    const den = (p1.t - p0.t) * (p1.e - p2.e) - (p1.t - p2.t) * (p1.e - p0.e);
    if (Math.abs(den) < 1e-12) return p1;
    const tv = p1.t - ((p1.t - p0.t) ** 2 * (p1.e - p2.e) - (p1.t - p2.t) ** 2 * (p1.e - p0.e)) / (2 * den);
    if (!(tv > p0.t && tv < p2.t) || Math.abs(tv - p1.t) < 0.5) return p1;
    const v = sample(d, tv);
    return v.e < p1.e ? v : p1;
  };

  /** The floor near target t at launch d: three lines 3 boards apart (walking downhill) and one parabola. */
  const floorNear = (d: number, t: number): { fl: Sample; pts: Sample[] } => {
    const [lo, hi] = tRange(d);
    const cl = (x: number) => Math.min(hi, Math.max(lo, x));
    let a = sample(d, cl(t - 3)),
      b = sample(d, cl(t)),
      c = sample(d, cl(t + 3));
    for (let i = 0; i < 4 && !(b.e <= a.e && b.e <= c.e); i++) {
      if (a.e < b.e) {
        if (a.t <= lo) break;
        c = b;
        b = a;
        a = sample(d, cl(a.t - 3));
      } else {
        if (c.t >= hi) break;
        a = b;
        b = c;
        c = sample(d, cl(c.t + 3));
      }
    }
    const pts = [a, b, c].sort((p, q) => p.t - q.t);
    return { fl: floorOf(d, pts), pts };
  };

  // 1. The bowler's usual launch: look across the lane for the lowest entry (the floor of the valley); warm: walk
  //    to the floor from where the last search of this ball settled.
  const usualD = clampD(K.solverFirstLaunchBoards);
  const warm =
    hint.launchBoards !== undefined &&
    hint.targetBoard !== undefined &&
    Number.isFinite(hint.launchBoards) &&
    Number.isFinite(hint.targetBoard);
  let d = warm ? clampD(hint.launchBoards!) : usualD;
  let pts: Sample[];
  let fl: Sample;
  /** The target the last walk to the floor started from (undefined: the floor is the scan's). */
  let walkFrom: number | undefined;
  if (!warm) {
    pts = scan(d, 4, 29, 5);
    fl = floorOf(d, pts);
  } else {
    walkFrom = hint.targetBoard!;
    ({ fl, pts } = floorNear(d, walkFrom));
  }
  // A hold area: somewhere at least minTargetBoard from the gutter, two neighbouring lines on the lane whose entries
  // differ by at most holdSlope boards per board of shift (a miss outward finds friction and comes back, a miss
  // inward is held by the oil). On a flat pattern the entry follows a parallel miss board for board.
  const holdAt = (list: Sample[]): boolean => {
    const q = [...list].sort((x, y) => x.t - y.t);
    for (let i = 1; i < q.length; i++) {
      const x = q[i - 1],
        y = q[i];
      if (x.t >= K.minTargetBoard && ok(x.r) && ok(y.r) && Math.abs((y.e - x.e) / (y.t - x.t)) <= K.holdSlope) return true;
    }
    return false;
  };
  const valley = fl.t >= K.minTargetBoard && (warm && hint.valley !== undefined ? hint.valley : holdAt(pts));

  // 2. Open or close the launch until the floor sits on the pocket (each board of launch moves a straight line
  //    3 boards at the pins; a secant step once two floors are known). Without a hold area a ball that hooks past
  //    the pocket from every line opens up, and one whose floor ends well short of it straightens; otherwise the
  //    bowler keeps the usual launch.
  const light = warm && hint.light !== undefined ? hint.light : fl.e < P - K.straightenBelowBoards;
  if (valley || light || fl.e > P + K.solverTolBoards) {
    let prev: { d: number; e: number } | null = null;
    for (let i = 0; i < 5 && Math.abs(fl.e - P) > 0.3; i++) {
      if (!valley && !light && fl.e < P) break;
      let slope = -2.4;
      if (prev !== null && Math.abs(d - prev.d) > 1e-6) {
        const sl = (fl.e - prev.e) / (d - prev.d);
        if (sl < -0.5) slope = sl;
      }
      const next = clampD(d + (P - fl.e) / slope);
      if (Math.abs(next - d) < 1e-3) break; // pinned at an end of the launch range
      prev = { d, e: fl.e };
      d = next;
      walkFrom = fl.t;
      ({ fl, pts } = floorNear(d, walkFrom));
    }
  }
  // A later search of this ball starts from here when the launch moved (a floor the scan found is found by scanning).
  if (walkFrom !== undefined) settled = { launchBoards: d, targetBoard: walkFrom, valley, light };
  if (fl.e > P + 0.3 && d >= dMax - 1e-6) {
    return finish(
      'high',
      `Hooks past the pocket from every line, even launched ${Math.round(dMax / 3)}° out across the lane: too much ball for this condition and release.`,
    );
  }
  const [lo, hi] = tRange(d);
  const usual = Math.abs(d - usualD) < 1e-6;
  // the deepest line of the scan at the usual launch (a warm start did not scan: it throws that one line)
  const scanTop = (): number => {
    const from = Math.max(lo, 4);
    return from + 5 * Math.floor((Math.min(hi, 29) + 1e-9 - from) / 5);
  };
  const inner = warm && !valley && usual && fl.e <= P ? sample(d, scanTop()) : pts.reduce((m, q) => (q.t > m.t ? q : m));
  choosing = true;
  if (!valley && usual && fl.e <= P && inner.e < P && ok(inner.r)) {
    // 3d. A weak ball that falls short of the pocket from the deepest line at the usual launch: straighten the
    //     launch (the laydown moves toward the target) until it gets there.
    root(
      (x) => eval2(x, inner.t),
      Math.max(1, inner.t + dMin),
      Math.min(39, inner.t + dMax),
      inner.t + d - (P - inner.e) / 2.4,
      1 - arrowsToPins,
    );
  } else if (!valley && fl.e <= P) {
    // 3c. No hold area (at the usual launch, or the straightest one the ball needed): move the line inward from the
    //     floor until the ball reaches the pocket.
    root((x) => eval2(x + d, x), fl.t, hi, Math.min(hi, fl.t + (P - fl.e)), 1);
  } else if (valley && fl.e < P - 1.5 && d <= dMin + 1e-6) {
    // 3b. Even the straightest launch floors well below the pocket: play the wall outside the floor (the dry
    //     outside brings the ball back), no closer to the gutter than minTargetBoard.
    root((x) => eval2(x + d, x), Math.max(lo, K.minTargetBoard), fl.t, Math.max(lo, fl.t - 3), -1);
  } else {
    // 3a. Play the floor (the most forgiving line); the last boards come from the laydown (each board of
    //     laydown moves the entry about 3 boards).
    root((x) => eval2(x, fl.t), Math.max(1, fl.t + dMin), Math.min(39, fl.t + dMax), fl.t + d - (P - fl.e) / 2.4, 1 - arrowsToPins);
  }
  return finish(null, 'No line found that reaches the pocket.');
}

/**
 * A secant/Illinois root of entry(x) = 17.5 on [lo, hi] from x0, starting with the straight-line slope
 * `slope` (boards at the pins per board of x). `monotone` skips the sign-change search's fallbacks.
 */
function root(evalAt: (x: number) => LineTrial, lo: number, hi: number, x0: number, slope: number, monotone = false): void {
  const P = C.pocketBoard,
    tol = K.solverTolBoards;
  const cl = (x: number) => Math.min(hi, Math.max(lo, x));
  const maxStep = 8 / Math.abs(slope);
  const stepTo = (from: number, dx: number) => cl(from + Math.max(-maxStep, Math.min(maxStep, dx)));
  let a = { x: cl(x0), g: evalAt(cl(x0)).entryBoard - P };
  if (Math.abs(a.g) <= tol) return;
  let b = { x: stepTo(a.x, -a.g / slope), g: 0 };
  if (b.x === a.x) return;
  b.g = evalAt(b.x).entryBoard - P;
  for (let it = 0; it < 8 && Math.abs(b.g) > tol; it++) {
    if (a.g * b.g < 0) {
      // bracketed: Illinois (modified regula falsi)
      let p = a,
        q = b,
        gp = a.g;
      for (let k = 0; k < 12 && Math.abs(q.g) > tol && Math.abs(q.x - p.x) > 1e-4; k++) {
        const x = q.x - (q.g * (q.x - p.x)) / (q.g - gp);
        const c = { x, g: evalAt(x).entryBoard - P };
        if (c.g * q.g < 0) {
          p = q;
          gp = q.g;
        } else gp /= 2;
        q = c;
      }
      return;
    }
    const s = (b.g - a.g) / (b.x - a.x);
    const useful = s * slope > 0 && Math.abs(s) >= 0.2 * Math.abs(slope);
    if (!useful && monotone) return;
    const x2 = stepTo(b.x, -b.g / (useful ? s : slope));
    if (Math.abs(x2 - b.x) < 1e-9) return;
    if (Math.abs(b.g) < Math.abs(a.g)) a = b;
    b = { x: x2, g: evalAt(x2).entryBoard - P };
  }
}
