import type { CoverType } from '../types';

/** Friction and oil-handling parameters of one cover family (all model assumptions, see below). */
export interface CoverCalibration {
  /** Multiplies the oiled-lane coefficient `muOil`. */
  muOilFactor: number;
  /** Multiplies the dry-lane coefficient `muDry`. */
  muDryFactor: number;
  /** Multiplies the surface roughness Ra of the grit (microtexture of the shell), dimensionless. */
  textureFactor: number;
  /** Time constant with which the cover absorbs oil carried on its track, s. */
  absorptionTimeS: number;
}

/**
 * Every calibration constant of the ball-motion model, in one place so that later calibration from
 * logged shots can adjust them. Each entry says whether it comes from a source (PHYSICS.md / TRADE.md
 * section named) or is a **model assumption** and why it was chosen; the README's assumption table
 * lists the same entries.
 *
 * Units are in each name. Edge cases: frozen object, never mutated by the engine.
 * Example: `MOTION_CALIBRATION.muDry` → 0.2.
 */
export const MOTION_CALIBRATION = Object.freeze({
  // ── Friction (PHYSICS.md §2.1, §5.1, §5.2) ───────────────────────────────────────────────
  /**
   * Sliding coefficient on a fully oiled lane. Anchor: ≈ 0.04, plausible range 0.01–0.06 (PHYSICS.md §2.1 /
   * TRADE.md §6.1, attributed to Frohlich 2004, unverified, M); the viscous estimate of PHYSICS.md §5.1
   * gives ≈ 0.02 (D). Calibrated to 0.025, inside that range: at 0.04 the pocket lines the solver finds for
   * typical strokers on flat 40–44 ft patterns sit on boards 3–5 at the arrows, far outside where the
   * trade plays them (second arrow, TRADE.md §7.1), because the ball already hooks in the oil.
   */
  muOil: 0.025,
  /** Sliding coefficient on a dry lane. Source: as muOil (M); bounded above by the USBC 0.32 limit (S, PHYSICS.md §2.5). */
  muDry: 0.2,
  /** Largest coefficient any cover may reach (USBC ball CoF limit, PHYSICS.md §2.5, S). */
  muMax: 0.32,
  /** Stribeck / mixed-lubrication scale Λ₀ of the roughness-aware law, PHYSICS.md §5.1 (assumption: the usual ≈ 1). */
  lambda0: 1.0,
  /** Lane surface roughness Ra, µm. Assumption (no source): a finished synthetic lane is smoother than a sanded ball. */
  laneRaUm: 0.15,
  /** Ball Ra at the reference grit, µm. Assumption: below the 65 µin (1.65 µm) single-ball limit (TRADE.md §1.1, M). */
  ballRaAtRefGritUm: 0.9,
  /** Reference grit for ballRaAtRefGritUm. */
  refGrit: 500,
  /** Ra ∝ (refGrit / grit)^gritExponent. Assumption: finer abrasive → smoother, sub-linearly (common practice direction, TRADE.md §7.2). */
  gritExponent: 0.7,
  /** Ra multiplier for a polished surface. Assumption: polish fills the microtexture (TRADE.md §7.2 direction). */
  polishRaFactor: 0.45,
  /** Cover families. Assumption: ordering plastic < urethane < pearl < hybrid < solid from TRADE.md §7.2 / PHYSICS.md §5.2; urethane grips early in oil but is weak on the dry backend; pearl is smoother and absorbs less than solid. */
  covers: Object.freeze({
    plastic: Object.freeze({ muOilFactor: 0.6, muDryFactor: 0.55, textureFactor: 0.5, absorptionTimeS: 60 }),
    urethane: Object.freeze({ muOilFactor: 1.15, muDryFactor: 0.75, textureFactor: 1.0, absorptionTimeS: 12 }),
    'reactive-pearl': Object.freeze({ muOilFactor: 0.85, muDryFactor: 1.0, textureFactor: 0.8, absorptionTimeS: 4 }),
    'reactive-hybrid': Object.freeze({ muOilFactor: 1.0, muDryFactor: 1.05, textureFactor: 0.9, absorptionTimeS: 3 }),
    'reactive-solid': Object.freeze({ muOilFactor: 1.1, muDryFactor: 1.1, textureFactor: 1.0, absorptionTimeS: 2.5 }),
  }) as Readonly<Record<CoverType, CoverCalibration>>,

  // ── Integration (PHYSICS.md §1.8, §4.1 Option A) ────────────────────────────────────────
  /** RK4 step, s. Explicit RK4 on the creep zone is stable for λh ≲ 2.8 with λ = μg(1+R²/k²)/ε (PHYSICS.md §1.8); at ε = 0.02 m/s and μ ≤ 0.23 (every cover here) λh ≤ 1.8 at 4 ms; the integrator shortens h automatically for stiffer fields (λh ≤ 2). Measured error against the closed forms: README. */
  stepS: 0.004,
  /** Regularisation speed ε of smoothed Coulomb friction, m/s (PHYSICS.md §1.8: position bias ∝ ε, ≈ 1e-5 m at 0.01). */
  slipEpsMs: 0.02,
  /** Slip speed, in multiples of ε, below which the ball counts as rolling; the crossing is extrapolated linearly to zero (PHYSICS.md §1.8). */
  rollSlipTolEps: 5,
  /** Skid ends (the hook phase begins) where the slip speed has fallen to this fraction of its release value (our definition). */
  skidSlipFraction: 0.5,
  /** Give up after this many seconds (a stalled ball). */
  maxTimeS: 8,
  /** Oil map resolution along the lane, ft (bilinear interpolation makes μ continuous, PHYSICS.md §4.1). */
  oilMapFtStep: 0.5,
  /** Oil map extends this far, ft (past the headpin so the last stage never reads outside). */
  oilMapMaxFt: 62,

  // ── Oil carried on the ball (PHYSICS.md §5.3) ───────────────────────────────────────────
  /** Ball surface cells: a cube map with this many cells per face edge (6·n² cells, ≈ 0.56 in each at n = 12). Assumption: about the width of a visible oil track ring. */
  ballCellsPerFaceEdge: 12,
  /** Fraction of the difference to equilibrium exchanged when one cell width of cover rolls through contact (the exchange is continuous in the cover length, bilinear over cells). Assumption. */
  exchangeFraction: 0.5,
  /** Equilibrium carried film as a fraction of the lane film (film splitting between two surfaces, ≈ ½; assumption from coating practice). */
  filmSplit: 0.5,
  /** Weight of the carried film in the film friction sees (h_eff = h + w·b, PHYSICS.md §5.3 uses w = 1). */
  carriedFilmWeight: 1.0,

  // ── Lane transition between shots (PHYSICS.md §5.4) ─────────────────────────────────────
  /** Bowlers sharing one pair of lanes (assumption: two league teams of four). */
  bowlersPerPair: 8,
  /** First-ball (strike-line) deliveries per bowler per game (assumption: 10 frames, spares on other lines ignored). */
  strikeShotsPerBowlerPerGame: 10,
  /** Fraction of the oil under the track that one passing ball picks up (κ_pick, assumption). */
  pickupFraction: 0.02,
  /** Width of the oil track a ball leaves on the lane, boards (assumption: ≈ 1 in, the visible track). */
  trackWidthBoards: 1,
  /** Standard deviation of the bowlers' lines around the reference line, boards (assumption). */
  lineSpreadBoards: 3,
  /** Fraction of the picked-up oil laid back down beyond the pattern's end (κ_drop, assumption); the rest stays on the balls and is wiped or absorbed. */
  carrydownFraction: 0.03,
  /** Length beyond the pattern end over which carrydown is spread, ft (assumption). */
  carrydownLengthFt: 12,
  /** The invented mid-strength ball whose pocket line stands for the pair's track (assumption: the pair plays lines like the bowler's own). */
  transitionReferenceBall: Object.freeze({
    weightLb: 15, rg: 2.52, differential: 0.04, intermediateDifferential: 0, coverType: 'reactive-hybrid' as CoverType,
    surfaceGrit: 2000, polished: false, layout: Object.freeze({ pinToPapIn: 4 }),
  }),

  // ── Release and layout defaults ─────────────────────────────────────────────────────────
  /** Pin-to-PAP distance when the ball has no layout, in (common practice: 3.5–5 in layouts). */
  defaultPinToPapIn: 4,
  /** VAL angle when an asymmetric ball gives neither VAL nor drilling angle, degrees (common practice). */
  defaultValAngleDeg: 45,

  // ── Pocket solver and ranking ───────────────────────────────────────────────────────────
  /** Laydown − target (boards) the solver tries in turn when neither is given: 5 boards over 15 ft ≈ 1.7° outward (PHYSICS.md §6: 1–3° typical, C), wider for strong balls. */
  solverLaunchBoards: Object.freeze([-3, -1, 1, 3, 5, 7, 9, 11, 13, 15, 17]) as readonly number[],
  /** The launch the solver tries first, boards (must be one of solverLaunchBoards). */
  solverFirstLaunchBoards: 5,
  /** Solver tolerance on the entry board. */
  solverTolBoards: 0.05,
  /** Half-width of the pocket window for miss room, boards (assumption: ±1 board still carries). */
  pocketHalfWidthBoards: 1,
  /** Entry angle that carries best, degrees (TRADE.md §2.2, S). */
  idealEntryAngleDeg: 6,
});
