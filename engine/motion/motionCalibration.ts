import type { CoverType } from '../types';

/** Friction and oil-handling parameters of one cover family (all model assumptions, see below). */
export interface CoverCalibration {
  /** Multiplies the surface roughness Ra of the grit (microtexture of the shell): how well the cover bites through an oil film. */
  textureFactor: number;
  /** Multiplies the dry-lane coefficient `muDry`: how hard the cover grips once the film is gone (its back end). */
  muDryFactor: number;
  /** Multiplies the full-film floor `muFilm`: a cover that grips through a film whatever its texture (urethane). */
  filmFloorFactor: number;
  /** Time constant with which the cover absorbs the oil carried on its track, s. */
  absorptionTimeS: number;
}

/** Friction of the lane surface itself, as a center describes it. */
export type LaneFriction = 'low' | 'medium' | 'high';

/**
 * Every calibration constant of the ball-motion model, in one place. Each entry says whether it comes
 * from a source or is a **model assumption** and why it was chosen; engine/motion/README.md lists the same
 * entries with the effect each has on the predictions.
 *
 * Units are in each name. Edge cases: frozen object, never mutated by the engine.
 * Example: `MOTION_CALIBRATION.muDry` → 0.2.
 */
export const MOTION_CALIBRATION = Object.freeze({
  // ── Friction (C. Frohlich, "What makes bowling balls hook?", Am. J. Phys. 72 (2004), as quoted second-hand;
  //    mixed lubrication after the Stribeck curve, textbook tribology) ───────────────────────────────────
  /**
   * Sliding coefficient on a dry lane. Anchor: about 0.2 on the dry back end (Frohlich 2004, as widely quoted,
   * from memory); bounded above by the USBC 0.32 ball friction limit (USBC equipment specifications).
   */
  muDry: 0.2,
  /** Largest coefficient any cover may reach (USBC equipment specifications: ball coefficient of friction ≤ 0.32). */
  muMax: 0.32,
  /**
   * Sliding coefficient under a full oil film, when the cover's texture no longer reaches the lane
   * (hydrodynamic floor). Assumption: 0.012, below the ≈ 0.04 quoted for an oiled lane (Frohlich 2004, from
   * memory), which is what a mid-roughness cover sees on a typical film (see filmScalePerRoughness).
   */
  muFilm: 0.012,
  /**
   * Friction law (mixed lubrication): μ(h) = μ_film + (μ_dry − μ_film)·h_c/(h + h_c), h the film the cover meets
   * (lane film plus the oil carried on the track), h_c = filmScalePerRoughness × σ, σ = √(Ra_ball² + Ra_lane²).
   * The share of the load carried by the texture falls off as the film grows compared with the roughness —
   * the mixed regime of the Stribeck curve. A rougher cover (lower grit) keeps more texture in contact
   * through the same film, so it reads oil earlier; more oil lowers the friction of every cover.
   * Assumption: 0.8 puts μ ≈ 0.03 for a 2000-grit solid on the 2–3 µm film of a house shot's track and ≈ 0.1
   * on its lightly oiled outside boards, so a typical release reaches the pocket from the second-arrow area
   * with a breakpoint near the end of the pattern (common practice); 2000 → 4000 grit then moves the breakpoint
   * 3–4 ft later on the same line.
   */
  filmScalePerRoughness: 0.8,
  /** Lane surface roughness Ra by the lane's friction, µm (assumption: a finished lane is smoother than a sanded ball). */
  laneRaUm: Object.freeze({ low: 0.1, medium: 0.15, high: 0.22 }) as Readonly<Record<LaneFriction, number>>,
  /** μ_dry multiplier by the lane's friction (assumption: ±15 % between a slick and a grippy lane surface). */
  laneDryFactor: Object.freeze({ low: 0.85, medium: 1, high: 1.15 }) as Readonly<Record<LaneFriction, number>>,
  /** Ball Ra at the reference grit, µm (assumption: below the 65 µin = 1.65 µm single-ball limit quoted for USBC, from memory). */
  ballRaAtRefGritUm: 0.9,
  /** Reference grit for ballRaAtRefGritUm. */
  refGrit: 500,
  /** Ra ∝ (refGrit / grit)^gritExponent. Assumption: a finer abrasive leaves a smoother cover, sub-linearly (common practice direction). */
  gritExponent: 0.7,
  /** Ra multiplier for a polished surface. Assumption: polish fills the microtexture (common practice: polish adds length). */
  polishRaFactor: 0.45,
  /**
   * Loss of texture with use: Ra × (1 − dullingMax · g/(g + dullingHalfGames)) after g games since the last
   * resurface. Assumption: a cover loses up to 30 % of its bite as it absorbs oil and its track burnishes,
   * half of that in about 40 games (common practice: a full resurface every 60–100 games restores it).
   */
  dullingMax: 0.3,
  dullingHalfGames: 40,
  /**
   * Cover families. Assumption, in the order the trade teaches (common practice): plastic barely grips;
   * urethane grips through a film whatever its texture (a higher film floor: it reads early) but little on the
   * dry back end (smooth, low angle); a pearl
   * reactive skids through oil (less texture) and grips hard on the dry; a solid reads oil earliest;
   * a hybrid is in between. Absorption: reactive covers absorb carried oil in seconds, urethane and
   * plastic hardly (the USBC absorption specification is given in seconds, from memory).
   */
  covers: Object.freeze({
    plastic: Object.freeze({ textureFactor: 0.35, muDryFactor: 0.45, filmFloorFactor: 1, absorptionTimeS: 60 }),
    urethane: Object.freeze({ textureFactor: 0.85, muDryFactor: 0.62, filmFloorFactor: 2.0, absorptionTimeS: 15 }),
    'reactive-pearl': Object.freeze({ textureFactor: 0.62, muDryFactor: 1.1, filmFloorFactor: 1, absorptionTimeS: 3 }),
    'reactive-hybrid': Object.freeze({ textureFactor: 0.82, muDryFactor: 1.05, filmFloorFactor: 1, absorptionTimeS: 2.5 }),
    'reactive-solid': Object.freeze({ textureFactor: 1.0, muDryFactor: 1.0, filmFloorFactor: 1, absorptionTimeS: 2.2 }),
  }) as Readonly<Record<CoverType, CoverCalibration>>,

  // ── Integration (classical RK4, smoothed Coulomb friction) ─────────────────────────────────────
  /**
   * RK4 step, s. Explicit RK4 on the creep zone is stable for λh ≲ 2.8 with λ = μg(1+R²/k²)/ε; the integrator
   * shortens h automatically for stiffer fields (λh ≤ 2). Against a 0.5 ms, ε = 0.005 m/s reference (3 covers ×
   * 3 releases × 3 lines × 4 patterns): entry board within 0.08 board, entry angle within 0.04°.
   */
  stepS: 0.006,
  /** Longest RK4 step, s, taken while the ball slides fast (see slipStepFactor). */
  maxStepS: 0.016,
  /**
   * Step growth with slip: h = slipStepFactor · u / (μ_max g (1 + R²/k²)), between stepS and maxStepS — the local
   * stiffness of the friction direction is μg(1+R²/k²)/u while the slip u is well above ε.
   */
  slipStepFactor: 0.5,
  /** Regularisation speed ε of smoothed Coulomb friction, m/s (position bias ∝ ε). */
  slipEpsMs: 0.03,
  /** Slip speed, in multiples of ε, below which the ball counts as rolling; the crossing is extrapolated linearly to zero. */
  rollSlipTolEps: 5,
  /**
   * The skid ends (the hook phase begins) where the slip speed has fallen by this fraction of its release value,
   * or at the breakpoint if that comes first (our definition: the ball has spent this share of its sliding on
   * turning and is visibly curving).
   */
  skidSlipDrop: 0.2,
  /** Give up after this many seconds (a stalled ball). */
  maxTimeS: 8,
  /** Oil map resolution along the lane, ft (bilinear interpolation makes μ continuous). */
  oilMapFtStep: 0.5,
  /** Oil map extends this far, ft (past the headpin so the last stage never reads outside). */
  oilMapMaxFt: 62,

  // ── Oil carried on the ball's track ───────────────────────────────────────────────────────────────
  /** Share of the difference to equilibrium the track exchanges with the lane on each pass through contact (assumption). */
  exchangeFraction: 0.3,
  /** Equilibrium carried film as a fraction of the lane film (film splitting between two surfaces, ≈ ½; assumption from coating practice). */
  filmSplit: 0.5,
  /** Weight of the carried film in the film friction sees (h = h_lane + w·b). */
  carriedFilmWeight: 1.0,
  /**
   * Width of the oil ring the track leaves on the cover, in: as the spin axis migrates through the core
   * (flare) the ring moves by its width in fresh, dry cover (assumption: about the width of a visible oil track).
   */
  trackWidthIn: 1.0,

  // ── Lane transition between shots (depletion and carrydown) ───────────────────────────────────────
  /** Bowlers sharing one pair of lanes (assumption: two league teams of four). */
  bowlersPerPair: 8,
  /** First-ball (strike-line) deliveries per bowler per game (assumption: 10 frames, spares on other lines ignored). */
  strikeShotsPerBowlerPerGame: 10,
  /** Fraction of the oil under the track that one passing ball picks up (assumption: about half the oil in the middle of the track is gone after nine games of a league pair). */
  pickupFraction: 0.02,
  /** Extra pickup on a wood lane, which also soaks conditioner into the boards (assumption, common practice: wood breaks down faster). */
  woodPickupFactor: 1.3,
  /** Width of the oil track a ball leaves on the lane, boards (assumption: ≈ 1 in, the visible track). */
  laneTrackWidthBoards: 1,
  /** Standard deviation of the bowlers' lines around the reference line, boards (assumption: eight bowlers spread over about ten boards). */
  lineSpreadBoards: 5,
  /** Fraction of the picked-up oil laid back down beyond the pattern's end (carrydown, assumption: small on a fresh pair, so the drying track dominates and lines move deeper, common practice); the rest stays on the balls. */
  carrydownFraction: 0.005,
  /** Length beyond the pattern end over which carrydown is spread, ft (assumption). */
  carrydownLengthFt: 10,
  /** The invented mid-strength ball whose pocket line stands for the pair's track (assumption: the pair plays lines like the bowler's own). */
  transitionReferenceBall: Object.freeze({
    weightLb: 15,
    rg: 2.52,
    differential: 0.04,
    intermediateDifferential: 0,
    coverType: 'reactive-hybrid' as CoverType,
    surfaceGrit: 3000,
    polished: false,
    layout: Object.freeze({ pinToPapIn: 4.5 }),
  }),

  // ── Release and layout defaults ─────────────────────────────────────────────────────────────────
  /** Pin-to-PAP distance when the ball has no layout, in (common practice: 3.5–5 in layouts). */
  defaultPinToPapIn: 4,
  /** VAL angle when an asymmetric ball gives neither VAL nor drilling angle, degrees (common practice). */
  defaultValAngleDeg: 45,

  // ── Pocket solver and ranking ───────────────────────────────────────────────────────────────────
  /** The range of launches (laydown − target, boards over the 15 ft to the arrows; 3 boards ≈ 1°) the solver may use: straight up the boards to 6° out (1–3° is the usual launch, common practice). */
  solverLaunchBoards: Object.freeze([0, 18]) as readonly number[],
  /** The launch the solver starts from, boards (≈ 2.7°), when no hint is given. */
  solverFirstLaunchBoards: 8,
  /** The outermost target at the arrows the solver plays, boards from the gutter (a line closer to the edge leaves no room; assumption). */
  minTargetBoard: 4,
  /**
   * A ball whose most forgiving line at the usual launch still ends this many boards short of the pocket straightens
   * its launch first (common practice: a ball that will not come back is played straighter up the boards, not
   * thrown across the lane from deep inside).
   */
  straightenBelowBoards: 1.5,
  /** A floor is flat where neighbouring lines' entries lie within this many boards of the lowest (the solver then plays its middle). */
  floorFlatBoards: 0.5,
  /** A hold area: neighbouring parallel lines whose entries differ by at most this many boards per board of shift (a flat pattern: about 1). */
  holdSlope: 0.5,
  /** Solver tolerance on the entry board. */
  solverTolBoards: 0.05,
  /** Half-width of the strike window for miss room, boards (assumption: a ball within ±1 board of 17.5 still carries). */
  pocketHalfWidthBoards: 1,
  /** Largest miss searched on each side, boards at the arrows. */
  missRoomMaxBoards: 6,
  /** Entry angle that carries best, degrees (USBC pin-carry research, reported second-hand: about 6°). */
  idealEntryAngleDeg: 6,
});
