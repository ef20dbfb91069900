import { describe, expect, it } from 'vitest';
import { CM_PER_IN, KG_PER_LB, KMH_PER_MPH, M_PER_FT, unitFormatter } from '../../client/src/utils/units';
import { breakpointChange } from '../../client/src/utils/whatIf';
import { layoutText } from '../../client/src/utils/balls';

/**
 * The display units every screen uses (useUnits → unitFormatter). Reference: the international definitions of the
 * units (NIST Handbook 44, appendix C): 1 mile = 1.609344 km, 1 lb = 0.45359237 kg, 1 in = 2.54 cm, 1 ft = 0.3048 m.
 */
describe('unit conversion factors', () => {
  it('are the exact international definitions', () => {
    expect(KMH_PER_MPH).toBe(1.609344);
    expect(KG_PER_LB).toBe(0.45359237);
    expect(CM_PER_IN).toBe(2.54);
    expect(M_PER_FT).toBe(0.3048);
    // consistency of the definitions themselves: 1 ft = 12 in, 1 mile = 5280 ft
    expect(M_PER_FT * 100).toBeCloseTo(12 * CM_PER_IN, 12);
    expect(KMH_PER_MPH * 1000).toBeCloseTo(5280 * M_PER_FT, 9);
  });
});

describe('unitFormatter', () => {
  const imperial = unitFormatter('imperial');
  const metric = unitFormatter('metric');

  it('shows the stored trade units unchanged for an imperial bowler', () => {
    expect(imperial.speed(17)).toBe('17.0 mph');
    expect(imperial.weight(15)).toBe('15 lb');
    expect(imperial.length(2.5)).toBe('2.500 in');
    expect(imperial.distance(41.25)).toBe('41.3 ft');
    expect(imperial.pinToPap(4.5)).toBe('4 1/2 in');
    expect(imperial.labels).toEqual({ speed: 'mph', weight: 'lb', length: 'in', distance: 'ft' });
  });

  it('converts to km/h, kg, cm and m for a metric bowler, rounded as shown', () => {
    for (const mph of [12, 16.5, 17, 21.3]) expect(metric.speed(mph)).toBe(`${(mph * KMH_PER_MPH).toFixed(1)} km/h`);
    for (const lb of [10, 14, 15, 16]) expect(metric.weight(lb)).toBe(`${(lb * KG_PER_LB).toFixed(1)} kg`);
    for (const inches of [2.46, 2.5, 2.57]) expect(metric.length(inches)).toBe(`${(inches * CM_PER_IN).toFixed(2)} cm`);
    for (const ft of [15, 41, 60]) expect(metric.distance(ft)).toBe(`${(ft * M_PER_FT).toFixed(1)} m`);
    expect(metric.pinToPap(4.5)).toBe(`${(4.5 * CM_PER_IN).toFixed(1)} cm`);
    expect(metric.labels).toEqual({ speed: 'km/h', weight: 'kg', length: 'cm', distance: 'm' });
  });

  it('round-trips a pin-to-PAP input through centimetres within the rounding of the field', () => {
    for (const inches of [3, 4.125, 4.5, 5.875]) {
      const shown = metric.lengthIn(inches)!;
      expect(Math.abs(shown - inches * CM_PER_IN)).toBeLessThanOrEqual(0.05 + 1e-9);
      expect(Math.abs(metric.lengthOut(shown)! - inches)).toBeLessThanOrEqual(0.05 / CM_PER_IN + 1e-3);
    }
    expect(metric.lengthIn(null)).toBeNull();
    expect(imperial.lengthIn(4.5)).toBe(4.5);
    expect(imperial.lengthOut(4.5)).toBe(4.5);
  });

  it('writes a negative number with a typographic minus and never "−0.0"', () => {
    expect(metric.distanceNumber(-1)).toBe('−0.3');
    expect(metric.distanceNumber(-0.01)).toBe('0.0');
  });
});

describe('texts built with the formatter', () => {
  const at = (board: number, ft: number) => ({ breakpoint: { board, ft } }) as Parameters<typeof breakpointChange>[0];

  it('breakpointChange gives distances in the bowler’s units', () => {
    const imperialText = breakpointChange(at(8, 40), at(9, 42));
    expect(imperialText).toBe('Breakpoint 2.0 ft later and 1.0 boards deeper: board 8.0 at 40.0 ft → board 9.0 at 42.0 ft.');
    const metricText = breakpointChange(at(8, 40), at(9, 42), unitFormatter('metric'));
    expect(metricText).toBe(
      `Breakpoint ${(2 * M_PER_FT).toFixed(1)} m later and 1.0 boards deeper: board 8.0 at ${(40 * M_PER_FT).toFixed(1)} m → board 9.0 at ${(42 * M_PER_FT).toFixed(1)} m.`,
    );
    expect(metricText).not.toMatch(/\bft\b/);
  });

  it('layoutText names the pin-to-PAP in the bowler’s units and keeps the angles', () => {
    const layout = { pinToPapIn: 4.5, drillingAngleDeg: 50, valAngleDeg: 40 };
    expect(layoutText(layout)).toBe('4 1/2 in pin-to-PAP, 50° drilling angle, 40° VAL angle');
    expect(layoutText(layout, unitFormatter('metric'))).toBe(
      `${(4.5 * CM_PER_IN).toFixed(1)} cm pin-to-PAP, 50° drilling angle, 40° VAL angle`,
    );
    expect(layoutText(null, unitFormatter('metric'))).toBe('Not drilled yet');
  });
});
