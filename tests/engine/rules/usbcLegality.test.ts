import { describe, expect, it } from 'vitest';
import { ILLEGAL_BALL_PENALTY, usbcLegality } from '../../../engine/index';
import { houseShot, urethaneBall } from '../fixtures';
import { run } from './helpers';

// Source: USBC limits (TRADE.md 1.1) through checkLegality: weight ≤ 16 lb.

describe('rules/usbcLegality', () => {
  it('points: a 16.5 lb ball loses 10 points and the text names the broken limit', () => {
    const r = run(usbcLegality, { ...urethaneBall, weightLb: 16.5 }, houseShot);
    expect(r?.effect).toBe(-ILLEGAL_BALL_PENALTY);
    expect(r?.text).toMatch(/weightLb ≤ 16 lb/);
  });
  it('does not apply to a legal ball', () => {
    expect(run(usbcLegality, urethaneBall, houseShot)).toBeNull();
  });
});
