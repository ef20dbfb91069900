import { inRange, integerInRange, list, record, show } from '../internal/checks';
import { validateBallSpec } from '../validateBallSpec';
import { BOWLER_BOUNDS, validateBowlerProfile } from '../validateBowlerProfile';
import { validatePattern } from '../validatePattern';
import { conditionOilMap } from '../motion/conditionOilMap';
import type { LaneOilMap } from '../motion/laneOilMap';
import { prepareShot, type PreparedShot } from '../motion/prepareShot';
import type { BowlerProfile, LaneSurface, OilPattern } from '../types';
import { solvePocketLine } from '../motion/solvePocketLine';
import { laneSurfaceOf } from '../motion/laneSurfaceOf';
import { surfaceWords } from '../ballReaction';
import { brentMinimize } from './internal/brentMinimize';
import type { BallCalibration, Calibration, CalibrationObservation, HitKind } from './types';

/**
 * The numbers of fitCalibration (Lanewright's choices, documented there).
 * `hitEntryBoards`: the band of the model's entry board (hand-side board at the headpin, 60 ft) that
 * each recorded hit stands for — the pocket is board 17.5 (USBC pin-carry research, reported second-hand) ± 1 board (the miss-room window
 * of the motion model, engine/motion/README.md #21); the headpin's centre is board 20; past
 * 21.25 (halfway to the far pocket at 22.5) the ball crossed over ('brooklyn').
 */
export const CALIBRATION = Object.freeze({
  /** Usable observations a ball needs before rankArsenal applies its scale. */
  minShots: 12,
  /** The search range of frictionScale. */
  minScale: 0.5,
  maxScale: 2,
  /** Coarse scan points (log-spaced over the range) before Brent's search. */
  scanPoints: 5,
  /** Search and interval tolerance on frictionScale. */
  tolerance: 0.003,
  /** Step of the finite-difference curvature of the loss at the fit. */
  curvatureStep: 0.01,
  /** Floor of the residual standard deviation, boards: the resolution a bowler reads a board at. */
  sigmaFloorBoards: 0.5,
  /** z for the 95 % interval. */
  z: 1.96,
  hitEntryBoards: Object.freeze({
    light: [-Infinity, 16.5],
    pocket: [16.5, 18.5],
    high: [18.5, 21.25],
    brooklyn: [21.25, Infinity],
  } as Record<Exclude<HitKind, 'miss'>, readonly [number, number]>),
});

interface Usable {
  obs: CalibrationObservation;
  spec: string;
  games: number;
  /** The bowler as this shot was thrown: the profile, with the shot's own speed and revs where logged. */
  release: BowlerProfile;
  lane: LaneSurface;
}

/**
 * Fits, for each ball, the friction multiplier (frictionScale of simulateShot) under which the
 * ball-motion model best explains the bowler's logged shots — the breakpoint boards seen and, where
 * recorded, where the ball met the pins — with a 95 % interval, and says whether there are enough shots
 * to use it.
 *
 * Definition: each observation is the logged line (laydown board at the foul line, target board at the
 * arrows) with the ball as it was (its surface at the time) after `gamesBowled` games on the pattern. Its
 * residual under a scale s is, in boards: for a logged breakpoint, predicted − logged breakpoint board
 * (the model's breakpoint: the farthest board toward the hand-side gutter); for a recorded hit (not
 * 'miss'), the distance from the predicted entry board to the band CALIBRATION.hitEntryBoards gives for
 * it (0 inside — a hit is a coarse, interval-censored reading of the entry board, so it only pulls when
 * the model is clearly off). An observation with both contributes both. The loss L(s) = Σ residual² is
 * minimised over s in [0.5, 2] by a log-spaced scan of 5 points, then Brent's method (tolerance 0.003)
 * in the bracket around the best point. Interval: the scales with L(s) − L(ŝ) ≤ z²σ̂² (z = 1.96), σ̂² =
 * max(L(ŝ)/(m − 1), 0.5²) over the m residuals — the profile (likelihood-ratio) interval for Gaussian
 * errors. Where L is near-quadratic its edges are ŝ ± z·σ̂·√(2/L''(ŝ)) (the curvature interval, L'' by
 * central differences of 0.01; accepted when L there has risen by 0.7–1.4 × z²σ̂²), otherwise they are
 * found by bisection on L to 0.003; clipped to the search range.
 * `enough`: n ≥ minShots (12) usable observations for the ball; Calibration.enough when any ball has
 * enough. The model is deterministic, so the same input always gives the same fit.
 * Source: least squares and the profile-likelihood interval are textbook statistics (e.g. Bates &
 * Watts, Nonlinear Regression Analysis and Its Applications, 1988 — from memory); Brent's method:
 * R. P. Brent, Algorithms for Minimization without Derivatives (1973); the model: engine/motion
 * (engine/motion/README.md).
 *
 * Cost (bench/calibration.bench.ts, this 2-core VM at load average ≈ 11): 40 observations with
 * breakpoints ≈ 250 ms median; the same 40 as pocket results only ≈ 1.5 s (a flat-bottomed loss: the
 * interval is found by bisection, about 35 model deliveries per observation).
 *
 * @param input `bowler`, `pattern`, `observations` (each may name the `lane` surface it was thrown on); optional
 *   `minShots` (integer ≥ 1, default 12) and `lane` (the surface of observations that name none, and of the
 *   reachability check: today's lanes; default synthetic, medium friction).
 * @returns Calibration: `shots` (usable observations), `enough`, `minShots`, `perBall` (ballId,
 *   frictionScale, low, high, n, enough, RMS residual before/after), `rmsBoardsBefore`/`After` (over all
 *   residuals, at scale 1 and at the fitted scales) and a plain-English `note`. Observations with no
 *   breakpoint and no usable hit are not counted.
 * @throws TypeError/RangeError for malformed input, naming 'fitCalibration'.
 * @example
 * fitCalibration({ bowler, pattern, observations }).perBall[0];
 * // => { ballId: 'b1', frictionScale: 0.86, low: 0.83, high: 0.89, n: 14, enough: true, … }
 */
export function fitCalibration(input: {
  bowler: BowlerProfile;
  pattern: OilPattern;
  observations: CalibrationObservation[];
  minShots?: number;
  lane?: LaneSurface;
}): Calibration {
  const fn = 'fitCalibration';
  const inp = record(fn, 'input', input);
  validateBowlerProfile(inp.bowler, fn);
  validatePattern(inp.pattern, fn);
  const bowler = inp.bowler;
  const pattern = inp.pattern;
  const minShots = inp.minShots === undefined ? CALIBRATION.minShots : integerInRange(fn, 'minShots', inp.minShots, 1, 10000);
  const raw = list(fn, 'observations', inp.observations);
  const lane = laneSurfaceOf(fn, inp.lane);
  const K = CALIBRATION;

  const byBall = new Map<string, Usable[]>();
  raw.forEach((o, i) => {
    const name = `observations[${i}]`;
    const r = record(fn, name, o);
    const ball = record(fn, `${name}.ball`, r.ball);
    validateBallSpec(ball, fn);
    if (typeof ball.id !== 'string' || ball.id === '')
      throw new TypeError(`${fn}: ${name}.ball needs a non-empty string id, got ${show(ball.id)}`);
    inRange(fn, `${name}.laydownBoard`, r.laydownBoard, -5, 45);
    inRange(fn, `${name}.targetBoard`, r.targetBoard, -5, 45);
    if (r.breakpointBoard !== undefined && r.breakpointBoard !== null) inRange(fn, `${name}.breakpointBoard`, r.breakpointBoard, -5, 45);
    if (r.hit !== undefined && r.hit !== null && !['pocket', 'high', 'light', 'brooklyn', 'miss'].includes(r.hit as string)) {
      throw new TypeError(`${fn}: ${name}.hit must be one of pocket, high, light, brooklyn, miss or null, got ${show(r.hit)}`);
    }
    const games = r.gamesBowled === undefined ? 0 : inRange(fn, `${name}.gamesBowled`, r.gamesBowled, 0, 50);
    // a shot's own measured release, where logged, in the bowler profile's ranges (validateBowlerProfile)
    const speed =
      r.speedMph === undefined || r.speedMph === null
        ? bowler.speedMph
        : inRange(fn, `${name}.speedMph`, r.speedMph, 1, BOWLER_BOUNDS.maxSpeedMph, ' mph');
    const revs =
      r.revRpm === undefined || r.revRpm === null
        ? bowler.revRpm
        : inRange(fn, `${name}.revRpm`, r.revRpm, 0, BOWLER_BOUNDS.maxRevRpm, ' rpm');
    const release: BowlerProfile =
      speed === bowler.speedMph && revs === bowler.revRpm ? bowler : { ...bowler, speedMph: speed, revRpm: revs };
    const obsLane = r.lane === undefined || r.lane === null ? lane : laneSurfaceOf(`${fn}: ${name}`, r.lane as LaneSurface);
    const obs = o as CalibrationObservation;
    const usable = typeof obs.breakpointBoard === 'number' || (obs.hit !== undefined && obs.hit !== null && obs.hit !== 'miss');
    if (!usable) return;
    const { id, ...spec } = obs.ball;
    const list2 = byBall.get(id) ?? [];
    list2.push({ obs, spec: JSON.stringify(spec), games, lane: obsLane, release });
    byBall.set(id, list2);
  });

  const maps = new Map<string, LaneOilMap>();
  const mapFor = (games: number, on: LaneSurface): LaneOilMap => {
    const key = `${games}\u0000${on.kind}\u0000${on.friction}`;
    let m = maps.get(key);
    if (!m) {
      m = conditionOilMap(pattern, bowler, games, on);
      maps.set(key, m);
    }
    return m;
  };

  const perBall: BallCalibration[] = [];
  let sumBefore = 0,
    sumAfter = 0,
    residualsTotal = 0;
  for (const [ballId, items] of [...byBall.entries()].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))) {
    const residuals = (s: number): number[] => {
      const prepared = new Map<string, PreparedShot>();
      const out: number[] = [];
      for (const u of items) {
        const key = `${u.spec}\u0000${u.games}\u0000${u.lane.kind}\u0000${u.lane.friction}\u0000${u.release.speedMph}\u0000${u.release.revRpm}`;
        let shot = prepared.get(key);
        if (!shot) {
          // the lane's oil map stays the bowler's usual one (it stands for the pair's wear); the shot is thrown with its own release
          shot = prepareShot({ ball: u.obs.ball, bowler: u.release, pattern, frictionScale: s, lane: u.lane }, mapFor(u.games, u.lane));
          prepared.set(key, shot);
        }
        const r = shot.run(u.obs.laydownBoard, u.obs.targetBoard);
        if (typeof u.obs.breakpointBoard === 'number') out.push(r.breakpointBoard - u.obs.breakpointBoard);
        const hit = u.obs.hit;
        if (hit !== undefined && hit !== null && hit !== 'miss') {
          const [lo, hi] = K.hitEntryBoards[hit];
          out.push(r.entryBoard < lo ? r.entryBoard - lo : r.entryBoard > hi ? r.entryBoard - hi : 0);
        }
      }
      return out;
    };
    const cache = new Map<number, number>();
    const loss = (s: number): number => {
      let v = cache.get(s);
      if (v === undefined) {
        v = residuals(s).reduce((a, r) => a + r * r, 0);
        cache.set(s, v);
      }
      return v;
    };

    // coarse log-spaced scan, then Brent's method in the bracket around the best point
    const lnLo = Math.log(K.minScale),
      lnHi = Math.log(K.maxScale);
    const grid = Array.from({ length: K.scanPoints }, (_, k) => Math.exp(lnLo + ((lnHi - lnLo) * k) / (K.scanPoints - 1)));
    let best = 0;
    grid.forEach((s, k) => {
      if (loss(s) < loss(grid[best])) best = k;
    });
    let sHat = brentMinimize(loss, grid[Math.max(0, best - 1)], grid[Math.min(grid.length - 1, best + 1)], grid[best], K.tolerance);
    if (loss(grid[best]) < loss(sHat)) sHat = grid[best];
    // A ball the bowler has put in the pocket keeps a line to the pocket: if the best fit leaves none (with the
    // ball as last thrown, on the fresh pattern), move the scale toward 1 (geometric bisection) until one appears.
    let keptReachable = false;
    if (items.some((u) => u.obs.hit === 'pocket') && sHat !== 1) {
      const last = items[items.length - 1].obs.ball;
      const reaches = (sc: number) => {
        const sh = prepareShot({ ball: last, bowler, pattern, frictionScale: sc, lane }, mapFor(0, lane));
        return solvePocketLine(sh.run, {}, {}, sh.preview).reached;
      };
      if (!reaches(sHat)) {
        keptReachable = true;
        let bad = sHat,
          good = 1;
        if (reaches(1)) {
          for (let k = 0; k < 6; k++) {
            const mid = Math.sqrt(bad * good);
            if (reaches(mid)) good = mid;
            else bad = mid;
          }
        }
        sHat = good;
      }
    }
    const lMin = loss(sHat);
    const m = residuals(sHat).length;
    const sigma2 = Math.max(m > 1 ? lMin / (m - 1) : 0, K.sigmaFloorBoards * K.sigmaFloorBoards);
    const rise = K.z * K.z * sigma2;
    const limit = lMin + rise;
    // the interval: from the curvature of L where L is near-quadratic there, else by bisection on L itself
    const edge = (toward: number, guess: number | null): number => {
      if (guess !== null) {
        const g = Math.min(K.maxScale, Math.max(K.minScale, guess));
        const dl = loss(g) - lMin;
        if (dl >= 0.7 * rise && dl <= 1.4 * rise) return g;
      }
      if (loss(toward) <= limit) return toward; // still inside at the range bound
      let inside = sHat,
        outside = toward;
      while (Math.abs(outside - inside) > K.tolerance) {
        const mid = (inside + outside) / 2;
        if (loss(mid) <= limit) inside = mid;
        else outside = mid;
      }
      return (inside + outside) / 2;
    };
    const h = K.curvatureStep;
    const curvature = (loss(sHat + h) - 2 * lMin + loss(sHat - h)) / (h * h);
    const half = curvature > 0 ? Math.sqrt((2 * rise) / curvature) : null;
    const low = edge(K.minScale, half === null ? null : sHat - half);
    const high = edge(K.maxScale, half === null ? null : sHat + half);
    const before = loss(1);
    sumBefore += before;
    sumAfter += lMin;
    residualsTotal += m;
    const r4 = (x: number) => Math.round(x * 10000) / 10000;
    perBall.push({
      ballId,
      frictionScale: r4(sHat),
      low: r4(Math.min(low, sHat)),
      high: r4(Math.max(high, sHat)),
      n: items.length,
      enough: items.length >= minShots,
      rmsBoardsBefore: r4(Math.sqrt(before / m)),
      rmsBoardsAfter: r4(Math.sqrt(lMin / m)),
      surfaces: [...new Set(items.map((u) => surfaceWords(u.obs.ball.surfaceGrit, u.obs.ball.polished)))],
      keptReachable,
    });
  }

  const shots = perBall.reduce((a, p) => a + p.n, 0);
  const ready = perBall.filter((p) => p.enough);
  const r1 = (x: number) => (Math.round(x * 10) / 10).toFixed(1);
  const rmsBefore = residualsTotal > 0 ? Math.sqrt(sumBefore / residualsTotal) : null;
  const rmsAfter = residualsTotal > 0 ? Math.sqrt(sumAfter / residualsTotal) : null;
  let note: string;
  if (shots === 0) {
    note = `No usable shots yet: a calibration needs first balls with feet and target boards and a breakpoint board or where the ball hit the pins (${minShots} per ball).`;
  } else {
    const atBound = perBall.filter(
      (p) => p.frictionScale <= K.minScale + K.tolerance || p.frictionScale >= K.maxScale - K.tolerance,
    ).length;
    note =
      `Friction multiplier fitted per ball from ${shots} logged shot${shots === 1 ? '' : 's'}; ` +
      (ready.length > 0
        ? `calibrated: ${ready.length} of ${perBall.length} ball${perBall.length === 1 ? '' : 's'} (those with at least ${minShots} shots)`
        : `no ball has the ${minShots} shots needed yet, so matchups use the uncalibrated model`) +
      `; model error ${r1(rmsBefore as number)} → ${r1(rmsAfter as number)} boards RMS.` +
      (atBound > 0
        ? ` For ${atBound} ball${atBound === 1 ? '' : 's'} the fit is at the edge of the searched range (${K.minScale}–${K.maxScale}): the model may not describe those shots well.`
        : '') +
      (perBall.some((p) => p.keptReachable)
        ? ' For a ball you have put in the pocket, the fit was held back so that a line to the pocket remains.'
        : '');
  }
  return {
    shots,
    enough: ready.length > 0,
    minShots,
    perBall,
    rmsBoardsBefore: rmsBefore === null ? null : Math.round(rmsBefore * 10000) / 10000,
    rmsBoardsAfter: rmsAfter === null ? null : Math.round(rmsAfter * 10000) / 10000,
    note,
  };
}
