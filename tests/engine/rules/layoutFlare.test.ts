import { describe, expect, it } from 'vitest';
import { layoutFlare, pinToPapInForAngle } from '../../../engine/index';
import { longHeavy, polishedPearl, shortLight } from '../fixtures';
import { effect, run } from './helpers';

// Source: TRADE.md 6.3 (derived): migration ∝ sin 2θ, largest at 45° (3 3/8 in); farther pins
// give less flare.

const withPin = (pinToPapIn: number) => ({ ...polishedPearl, layout: { pinToPapIn } });
const at45 = pinToPapInForAngle(45);
const at75 = pinToPapInForAngle(75);

describe('rules/layoutFlare', () => {
  it('points, heavy oil: a 45° pin (3.34 in) > a 75° pin (5.56 in)', () => {
    expect(effect(layoutFlare, withPin(at45), longHeavy)).toBeGreaterThan(effect(layoutFlare, withPin(at75), longHeavy));
  });
  it('points, light oil: a 75° pin (less flare, sin 150° = 0.5) > a 45° pin', () => {
    expect(effect(layoutFlare, withPin(at75), shortLight)).toBeGreaterThan(effect(layoutFlare, withPin(at45), shortLight));
  });
  it('does not apply to a ball without a layout', () => {
    const { layout: _omit, ...noLayout } = polishedPearl;
    expect(run(layoutFlare, noLayout, longHeavy)).toBeNull();
  });
  it('text gives the angle and the share of flare: 45° and 100%', () => {
    expect(run(layoutFlare, withPin(at45), longHeavy)?.text).toMatch(/\(45°\) gives 100% of the core's flare/);
  });
});
