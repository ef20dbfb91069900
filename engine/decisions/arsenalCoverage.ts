import { checkLegality } from '../checkLegality';
import { matchupContext } from '../matchupContext';
import { ballReaction, surfaceWords } from '../ballReaction';
import { strengthFit, FIT_SCALE } from '../strengthFit';
import { SURFACE_STEPS } from '../suggestChanges';
import type { ArsenalBall, BallSpec, BowlerProfile, LaneSurface, OilPattern } from '../types';
import { validateBallSpec } from '../validateBallSpec';

/**
 * Coverage's rules (Lanewright's choices, shown on the screen):
 * - a ball covers a condition when it suits it (strengthFit: |gap| within FIT_SCALE.tolerance, about half a surface step);
 * - each condition is looked at fresh and after `transitionGames` games (the oil breaks down: conditionDemand's transition);
 * - two strike balls with the same cover family whose reactions differ by at most `duplicatePoints` (under half a
 *   surface step on the matchup scale) do the same job;
 * - up to `suggestions` catalogue models are offered for each gap, the closest fit first, each with the finish (of the
 *   pro shop's usual steps, SURFACE_STEPS) that brings it closest to the condition.
 */
export const COVERAGE_RULES = Object.freeze({ transitionGames: [0, 9] as readonly number[], duplicatePoints: 2, suggestions: 3 });

export interface CoverageCondition {
  id: string;
  label: string;
  pattern: OilPattern;
  lane?: LaneSurface;
}

export interface CatalogueCandidate {
  id: string;
  label: string;
  spec: BallSpec;
}

export interface CoverageCell {
  conditionId: string;
  label: string;
  gamesBowled: number;
  demand: number;
  /** The balls that suit it (ids), best fit first. */
  covering: string[];
  /** Every strike ball's gap (strength − demand; + too strong, − too weak). */
  gaps: { ballId: string; gap: number }[];
}

export interface CoverageGap {
  conditionId: string;
  label: string;
  gamesBowled: number;
  demand: number;
  /** 'more': every ball is too weak; 'less': every ball is too strong; 'between': some too strong, some too weak. */
  need: 'more' | 'less' | 'between';
  /** The nearest ball and its gap. */
  nearest: { ballId: string; gap: number } | null;
  /** What kind of ball would fill it, in words (cover, core, surface), from the catalogue models that suit it. */
  kind: string;
  suggestions: { id: string; label: string; gap: number; surfaceGrit: number; polished: boolean }[];
}

export interface CoverageDuplicate {
  a: string;
  b: string;
  /** Difference of their reactions on the matchup scale. */
  difference: number;
  text: string;
}

export interface ArsenalCoverage {
  cells: CoverageCell[];
  gaps: CoverageGap[];
  duplicates: CoverageDuplicate[];
}

const coverWords: Record<string, string> = {
  'reactive-solid': 'solid reactive',
  'reactive-hybrid': 'hybrid reactive',
  'reactive-pearl': 'pearl reactive',
  urethane: 'urethane',
  plastic: 'plastic',
};

function kindOf(spec: BallSpec): string {
  const core = spec.intermediateDifferential > 0.008 ? 'asymmetric' : 'symmetric';
  return `a ${coverWords[spec.coverType]} cover, ${core} core (RG ${spec.rg.toFixed(2)} in, differential ${spec.differential.toFixed(3)} in), ${surfaceWords(spec.surfaceGrit, spec.polished)}`;
}

/** A catalogue model with the finish of SURFACE_STEPS (or its factory finish) that brings it closest to the condition. */
function bestFinish(
  c: CatalogueCandidate,
  ctx: ReturnType<typeof matchupContext>,
): { c: CatalogueCandidate; fit: ReturnType<typeof strengthFit> } {
  const options = [c.spec, ...SURFACE_STEPS.map((s) => ({ ...c.spec, ...s }))];
  let best = { c, fit: strengthFit(c.spec, ctx) };
  for (const spec of options) {
    const fit = strengthFit(spec, ctx);
    if (Math.abs(fit.gap) < Math.abs(best.fit.gap)) best = { c: { ...c, spec }, fit };
  }
  return best;
}

/**
 * Arsenal coverage: across the conditions a bowler meets (each fresh and after some games), which no ball suits,
 * which two balls do the same job, and what kind of ball would fill each gap, with catalogue models that suit it.
 *
 * Definition: the one strength-versus-demand model of the ranking (strengthFit on matchupContext) for each legal
 * strike ball (plastic is a spare ball; an illegal ball is left out) on each condition state; rules in
 * COVERAGE_RULES. A catalogue model is offered with the finish that suits it to the gap (a resurface at the pro
 * shop, between sessions).
 */
export function arsenalCoverage(input: {
  bowler: BowlerProfile;
  balls: ArsenalBall[];
  conditions: CoverageCondition[];
  catalogue?: CatalogueCandidate[];
}): ArsenalCoverage {
  const fn = 'arsenalCoverage';
  if (!Array.isArray(input?.balls)) throw new TypeError(`${fn}: balls must be an array`);
  if (!Array.isArray(input.conditions)) throw new TypeError(`${fn}: conditions must be an array`);
  input.balls.forEach((b) => validateBallSpec(b, fn));
  const strike = input.balls.filter((b) => b.coverType !== 'plastic' && checkLegality(b).legal);
  const catalogue = (input.catalogue ?? []).filter((c) => c.spec.coverType !== 'plastic' && checkLegality(c.spec).legal);
  const label = (id: string) => input.balls.find((b) => b.id === id)?.label ?? id;

  const cells: CoverageCell[] = [];
  const gaps: CoverageGap[] = [];
  for (const cond of input.conditions) {
    for (const games of COVERAGE_RULES.transitionGames) {
      const ctx = matchupContext(input.bowler, cond.pattern, games, fn, cond.lane);
      const fits = strike
        .map((b) => ({ ballId: b.id, fit: strengthFit(b, ctx) }))
        .sort((x, y) => Math.abs(x.fit.gap) - Math.abs(y.fit.gap));
      const covering = fits.filter((f) => f.fit.verdict === 'suits').map((f) => f.ballId);
      cells.push({
        conditionId: cond.id,
        label: cond.label,
        gamesBowled: games,
        demand: ctx.demand.total,
        covering,
        gaps: fits.map((f) => ({ ballId: f.ballId, gap: f.fit.gap })),
      });
      if (covering.length > 0) continue;
      const strong = fits.some((f) => f.fit.gap > 0),
        weak = fits.some((f) => f.fit.gap < 0);
      const need: CoverageGap['need'] = strong && weak ? 'between' : strong ? 'less' : 'more';
      const candidates = catalogue
        .map((c) => bestFinish(c, ctx))
        .filter((x) => Math.abs(x.fit.gap) <= FIT_SCALE.tolerance)
        .sort((x, y) => Math.abs(x.fit.gap) - Math.abs(y.fit.gap))
        .slice(0, COVERAGE_RULES.suggestions);
      const nearest = fits[0] ? { ballId: fits[0].ballId, gap: fits[0].fit.gap } : null;
      const direction =
        need === 'more'
          ? 'more ball than any in the bag'
          : need === 'less'
            ? 'less ball than any in the bag'
            : 'a ball between two in the bag';
      gaps.push({
        conditionId: cond.id,
        label: cond.label,
        gamesBowled: games,
        demand: ctx.demand.total,
        need,
        nearest,
        kind:
          candidates.length > 0
            ? `${direction}: ${kindOf(candidates[0].c.spec)}`
            : `${direction}; no catalogue model suits it at any usual finish`,
        suggestions: candidates.map((x) => ({
          id: x.c.id,
          label: x.c.label,
          gap: x.fit.gap,
          surfaceGrit: x.c.spec.surfaceGrit,
          polished: x.c.spec.polished,
        })),
      });
    }
  }

  // the ball's reaction does not depend on the condition (ballReaction), so one comparison serves every condition
  const duplicates: CoverageDuplicate[] = [];
  const strength = new Map(strike.map((b) => [b.id, ballReaction(b).total]));
  for (let i = 0; i < strike.length; i++) {
    for (let j = i + 1; j < strike.length; j++) {
      const a = strike[i],
        b = strike[j];
      const difference = Math.round(Math.abs((strength.get(a.id) ?? 0) - (strength.get(b.id) ?? 0)) * 10) / 10;
      if (a.coverType === b.coverType && difference <= COVERAGE_RULES.duplicatePoints) {
        duplicates.push({
          a: a.id,
          b: b.id,
          difference,
          text: `${label(a.id)} and ${label(b.id)} do the same job: the same cover family and reactions ${difference.toFixed(1)} points apart.`,
        });
      }
    }
  }
  return { cells, gaps, duplicates };
}
