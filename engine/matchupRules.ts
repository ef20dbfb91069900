import type { MatchupRule } from './types';
import { asymmetryVsOil } from './rules/asymmetryVsOil';
import { bowlerSpeedRevs } from './rules/bowlerSpeedRevs';
import { coverVsOil } from './rules/coverVsOil';
import { differentialVsOil } from './rules/differentialVsOil';
import { flareVsRatio } from './rules/flareVsRatio';
import { layoutFlare } from './rules/layoutFlare';
import { patternBreakdown } from './rules/patternBreakdown';
import { plasticSpareBall } from './rules/plasticSpareBall';
import { rgVsLength } from './rules/rgVsLength';
import { surfaceVsOil } from './rules/surfaceVsOil';
import { usbcLegality } from './rules/usbcLegality';

/**
 * Every rule of thumb of the rules layer, in the order their reasons are listed before sorting.
 * To add a rule: write engine/rules/<name>.ts exporting one MatchupRule with its doc comment and
 * source, list it here, add a row to README.md's rule table and a test in tests/engine/rules.
 */
export const MATCHUP_RULES: readonly MatchupRule[] = [
  plasticSpareBall,
  coverVsOil,
  surfaceVsOil,
  rgVsLength,
  differentialVsOil,
  asymmetryVsOil,
  layoutFlare,
  flareVsRatio,
  bowlerSpeedRevs,
  patternBreakdown,
  usbcLegality,
];
