/**
 * Lanewright engine: the public entry. This file only re-exports; see README.md.
 */
export type * from './types';

export { scoreGame } from './scoreGame';
export { scorePartialGame } from './scorePartialGame';
export { isSplit } from './isSplit';
export { leaveName } from './leaveName';
export { checkLegality, USBC_BALL_LIMITS } from './checkLegality';
export { pinToPapAngleDeg } from './pinToPapAngleDeg';
export { pinToPapInForAngle } from './pinToPapInForAngle';
export { flareShare } from './flareShare';
export { analyzePattern, RATIO_BOARDS } from './analyzePattern';
export { oilAt } from './oilAt';
export { oilGrid, OIL_GRID_MAX_CELLS } from './oilGrid';
export { ruleOf31 } from './ruleOf31';
export { lengthClass, LENGTH_CLASS_FT } from './lengthClass';
export { volumeClass, VOLUME_CLASS_ML } from './volumeClass';
export { ratioClass, RATIO_CLASS } from './ratioClass';
export { validateBallSpec, COVER_TYPES } from './validateBallSpec';
export { validateBowlerProfile, BOWLER_BOUNDS } from './validateBowlerProfile';
export { validatePattern } from './validatePattern';
export { ballReaction, REACTION_SCALE, surfaceWords } from './ballReaction';
export type { BallReaction, ReactionFactor } from './ballReaction';
export { conditionDemand, DEMAND_SCALE } from './conditionDemand';
export type { ConditionDemand, DemandFactor } from './conditionDemand';
export { matchupContext } from './matchupContext';
export { strengthFit, FIT_SCALE } from './strengthFit';
export type { StrengthFit } from './strengthFit';
export { suggestChanges, SURFACE_STEPS, LAYOUT_STEPS, SURFACE_CAUTION } from './suggestChanges';
export { fitLayer, FIT_LAYER_WEIGHT } from './fitLayer';
export { combineLayers } from './combineLayers';
export type { WeightedLayer } from './combineLayers';
export { SCORING_LAYERS } from './scoringLayers';
export type { ScoringLayer } from './scoringLayers';
export { rankArsenal, compareRanked } from './rankArsenal';
export type { RankArsenalOptions, RankedPlace } from './rankArsenal';
export { rankTransition } from './rankTransition';
export { pairAdvice, PAIR_ADVICE } from './pairAdvice';
export type { PairAdvice } from './pairAdvice';
export {
  BOARD_COUNT,
  LANE_WIDTH_IN,
  BOARD_WIDTH_IN,
  HEADPIN_FT,
  ARROWS_FT,
  ARROW_BOARDS,
  POCKET_BOARD,
  IDEAL_ENTRY_ANGLE_DEG,
  DEFAULT_BALL_DIAMETER_IN,
  MICROLITERS_PER_ML,
} from './constants';

// ── Ball-motion model (engine/motion; its README lists every model assumption) ───────────────────
export { simulateShot } from './motion/simulateShot';
export type { ShotPrediction, SimulateShotInput } from './motion/shotPrediction';
export { missRoom } from './motion/missRoom';
export type { MissRoom } from './motion/missRoom';
export { MOTION_LAYER_POINTS, MOTION_LAYER_WEIGHT } from './motion/motionLayer';
export type { MotionVerdict, RankedBallWithPrediction } from './motion/motionLayer';
export { MOTION_CALIBRATION } from './motion/motionCalibration';
export { motionSteps, withMotionSteps } from './motion/motionSteps';
export type { MotionSteps } from './motion/motionSteps';
export type { CoverCalibration, LaneFriction } from './motion/motionCalibration';
export { DEFAULT_LANE_SURFACE } from './motion/laneSurfaceOf';
export { PHYSICAL_CONSTANTS } from './motion/physicalConstants';
export { ballInertia } from './motion/ballInertia';
export type { BallInertia } from './motion/ballInertia';
export { coverFriction, REFERENCE_FILM_UM } from './motion/coverFriction';
export type { CoverFriction } from './motion/coverFriction';
export { laneOilMap } from './motion/laneOilMap';
export type { LaneOilMap } from './motion/laneOilMap';
export { patternOilMap } from './motion/patternOilMap';
export { conditionOilMap } from './motion/conditionOilMap';
export { transitionOilMap } from './motion/transitionOilMap';
export type { TransitionResult } from './motion/transitionOilMap';
export { oilVolumeUl } from './motion/oilVolumeUl';
export { uniformFrictionField, sampledFrictionField, oilFrictionField } from './motion/frictionField';
export type { FrictionField } from './motion/frictionField';
export { releaseState, STATE } from './motion/releaseState';
export { integrateDelivery } from './motion/integrateDelivery';
export type { IntegrateOptions, DeliveryResult } from './motion/integrateDelivery';
export { contactAngularMomentum } from './motion/contactAngularMomentum';
export { kineticEnergy } from './motion/kineticEnergy';
export { solvePocketLine } from './motion/solvePocketLine';
export type { PocketLine, PocketLineHint } from './motion/solvePocketLine';
export { prepareShot } from './motion/prepareShot';
export type { PreparedShot } from './motion/prepareShot';
export { predictChange } from './motion/predictChange';
export type { ChangePrediction } from './motion/predictChange';
// ── end ball-motion model ──────────────────────────────────────────────────────────────────────

// ── Shot log, stats, moves and calibration (engine/shotlog) ───────────────────────────────────
export type * from './shotlog/types';
export { buildGame } from './shotlog/buildGame';
export { checkDelivery } from './shotlog/checkDelivery';
export { wilsonInterval, WILSON_Z_95 } from './shotlog/wilsonInterval';
export { shotStats } from './shotlog/shotStats';
export { statsBy, STATS_KEYS } from './shotlog/statsBy';
export type { StatsKey } from './shotlog/statsBy';
export { suggestMoves, recentShotsSuffice, movesOfRecentShots, MOVE_THRESHOLDS } from './shotlog/suggestMoves';
export { countsOfShots, emptyShotCounts, gameCounts, shotStatsOfCounts } from './shotlog/shotCounts';
export type { GameCountsRow } from './shotlog/shotCounts';
export { moveFollowUp, FOLLOW_UP } from './shotlog/moveFollowUp';
export { upkeepDue, UPKEEP_DEFAULTS } from './upkeep/upkeepDue';
export type { UpkeepItem } from './upkeep/upkeepDue';
export { leagueAverage } from './league/leagueAverage';
export { handicapFor } from './league/handicapFor';
export type { HandicapRule } from './league/handicapFor';
export { leagueSeason } from './league/leagueSeason';
export type { LeagueNight, LeagueNightResult, LeagueSeason } from './league/leagueSeason';
export { differenceInterval } from './shotlog/differenceInterval';
export { spareAdjustment, THREE_SIX_NINE } from './shotlog/spareAdjustment';
export { isCalibrationShot, LAYDOWN_OFFSET_BOARDS, laydownBoardOf } from './shotlog/observation';
export type { LoggedLine } from './shotlog/observation';
export { fitCalibration, CALIBRATION } from './shotlog/fitCalibration';
// ── end shot log ───────────────────────────────────────────────────────────────────────────────

// ── Decisions: equipment trials, the layout lab and arsenal coverage (engine/decisions) ─────────
export { probabilityBetter, twoProportionTest, shotsPerArm } from './decisions/proportions';
export type { Count } from './decisions/proportions';
export { compareTrial, TRIAL_RULES } from './decisions/compareTrial';
export type { TrialArmInput, TrialArmResult, TrialVerdict, TrialComparison, MeanWithInterval } from './decisions/compareTrial';
export { layoutLab, LAYOUT_MAP_RADIUS_IN } from './decisions/layoutLab';
export type { LayoutLabEntry, MapPoint } from './decisions/layoutLab';
export { arsenalCoverage, COVERAGE_RULES } from './decisions/arsenalCoverage';
export type {
  ArsenalCoverage,
  CoverageCell,
  CoverageGap,
  CoverageDuplicate,
  CoverageCondition,
  CatalogueCandidate,
} from './decisions/arsenalCoverage';
