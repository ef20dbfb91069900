import { describe, expect, it } from 'vitest';
import * as engine from '../../engine/index';

// The public API (names and kinds): the entry points the server and client call, plus oilGrid and the class
// thresholds agreed by the team.

describe('engine/index public API', () => {
  it.each([
    'scoreGame',
    'isSplit',
    'checkLegality',
    'pinToPapAngleDeg',
    'analyzePattern',
    'oilAt',
    'ruleOf31',
    'rankArsenal',
    'oilGrid',
    'simulateShot',
    'ballReaction',
    'conditionDemand',
    'strengthFit',
    'matchupContext',
    'suggestChanges',
    'fitCalibration',
    'validateBallSpec',
    'validateBowlerProfile',
    'validatePattern',
  ])('exports the function %s', (name) => {
    expect(typeof (engine as Record<string, unknown>)[name]).toBe('function');
  });

  it('exports the class thresholds and lane constants', () => {
    expect(engine.LENGTH_CLASS_FT).toBeDefined();
    expect(engine.VOLUME_CLASS_ML).toBeDefined();
    expect(engine.RATIO_CLASS).toBeDefined();
    expect(engine.BOARD_WIDTH_IN).toBeGreaterThan(1);
    expect(engine.USBC_BALL_LIMITS).toBeDefined();
  });
});
