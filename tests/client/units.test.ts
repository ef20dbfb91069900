import { describe, expect, it } from 'vitest';
import { ref } from 'vue';
import { checkLegality, LENGTH_CLASS_FT } from '../../engine/index';
import { roughAsymSolid } from '../engine/fixtures';
import { CM_PER_IN, KG_PER_LB, KMH_PER_MPH, M_PER_FT, inputConverter, unitFormatter } from '../../client/src/utils/units';
import { breakpointChange } from '../../client/src/utils/whatIf';
import { layoutText } from '../../client/src/utils/balls';
import { ballFormSchemas, emptyForm } from '../../client/src/utils/ballForm';
import { formatLength, lengthClassLabel, patternNumberLines } from '../../client/src/utils/patternNumbers';

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

describe('input fields in the bowler’s units (inputConverter)', () => {
  const kg = inputConverter('weight', 'metric');
  const lb = inputConverter('weight', 'imperial');
  const m = inputConverter('distance', 'metric');

  it('shows a stored weight in kg to 10 g and reads it back to the stored pound within that rounding', () => {
    for (const pounds of [6, 10, 12, 14, 15, 16, 18]) {
      const shown = kg.in(pounds)!;
      expect(shown).toBe(Number((pounds * KG_PER_LB).toFixed(2)));
      // 0.005 kg of display rounding is 0.011 lb; the stored value keeps two decimals of a pound.
      expect(Math.abs(kg.out(shown)! - pounds)).toBeLessThanOrEqual(0.005 / KG_PER_LB + 0.005 + 1e-9);
      // Shown again, the stored value gives the same field value: the field never drifts.
      expect(kg.in(kg.out(shown))).toBe(shown);
    }
    expect(kg.unit).toBe('kg');
    expect(kg.in(null)).toBeNull();
    expect(kg.out(null)).toBeNull();
    expect(kg.out(undefined)).toBeNull();
  });

  it('leaves pounds as they are for an imperial bowler', () => {
    expect(lb.unit).toBe('lb');
    expect(lb.in(15)).toBe(15);
    expect(lb.out(15)).toBe(15);
    expect(lb.bounds(6, 18)).toEqual({ min: 6, max: 18 });
  });

  it('turns a stored range into field limits that stay inside it once converted back', () => {
    const { min, max } = kg.bounds(6, 18);
    expect(min).toBe(Math.ceil(6 * KG_PER_LB * 100) / 100);
    expect(max).toBe(Math.floor(18 * KG_PER_LB * 100) / 100);
    expect(kg.out(min)!).toBeGreaterThanOrEqual(6);
    expect(kg.out(max)!).toBeLessThanOrEqual(18);
  });

  it('converts distances down the lane between feet and metres', () => {
    expect(m.unit).toBe('m');
    expect(m.in(41)).toBe(Number((41 * M_PER_FT).toFixed(2)));
    expect(Math.abs(m.out(m.in(41))! - 41)).toBeLessThanOrEqual(0.005 / M_PER_FT + 1e-9);
    expect(unitFormatter('metric').weightInput.unit).toBe('kg');
    expect(inputConverter('distance', 'imperial').in(41)).toBe(41);
  });
});

describe('the ball form’s weight rule speaks the bowler’s unit', () => {
  const form = (weightLb: number) => ({ ...emptyForm(), weightLb });

  it('keeps the stored 6–18 lb rule and words its messages in lb or kg', () => {
    const imperial = ballFormSchemas(ref(null)).CatalogueFormSchema;
    const metric = ballFormSchemas(ref(null), inputConverter('weight', 'metric')).CatalogueFormSchema;
    const message = (schema: typeof imperial, weightLb: number) => {
      const r = schema.safeParse(form(weightLb));
      return r.success ? null : r.error.issues.find((i) => i.path[0] === 'weightLb')?.message;
    };
    expect(message(imperial, 19)).toBe('At most 18 lb');
    expect(message(imperial, 5)).toBe('At least 6 lb');
    expect(message(metric, 19)).toBe(`At most ${Math.floor(18 * KG_PER_LB * 100) / 100} kg`);
    expect(message(metric, 5)).toBe(`At least ${Math.ceil(6 * KG_PER_LB * 100) / 100} kg`);
    expect(message(metric, 15)).toBeNull();
  });
});

describe('pattern numbers in the bowler’s units', () => {
  const numbers = {
    lengthFt: 41,
    volumeMl: 22.5,
    forwardMl: 15,
    reverseMl: 7.5,
    ratio: 3,
    lengthClass: 'medium',
    volumeClass: 'medium',
    ratioClass: 'challenge',
  } as const;

  it('gives the length and the length class limits in feet or metres, volumes and ratio unchanged', () => {
    const metric = unitFormatter('metric');
    const imperial = unitFormatter('imperial');
    expect(formatLength(41, imperial)).toBe('41.0 ft');
    expect(formatLength(41, metric)).toBe(`${(41 * M_PER_FT).toFixed(1)} m`);
    const { shortBelowFt, longFromFt } = LENGTH_CLASS_FT;
    expect(lengthClassLabel('medium', imperial)).toBe(`Medium (${shortBelowFt} to under ${longFromFt} ft)`);
    expect(lengthClassLabel('short', metric)).toBe(`Short (under ${(shortBelowFt * M_PER_FT).toFixed(1)} m)`);
    expect(lengthClassLabel('medium', metric)).toBe(
      `Medium (${(shortBelowFt * M_PER_FT).toFixed(1)} to under ${(longFromFt * M_PER_FT).toFixed(1)} m)`,
    );
    expect(lengthClassLabel('long', metric)).toBe(`Long (${(longFromFt * M_PER_FT).toFixed(1)} m and more)`);

    const byKey = (units: 'metric' | 'imperial') =>
      Object.fromEntries(patternNumberLines(numbers, unitFormatter(units)).map((l) => [l.key, l.value]));
    const [imperialLines, metricLines] = [byKey('imperial'), byKey('metric')];
    expect(metricLines.length).toBe(`${(41 * M_PER_FT).toFixed(1)} m`);
    expect(metricLines.lengthClass).toBe(lengthClassLabel('medium', metric));
    for (const key of ['volume', 'forward', 'reverse', 'ratio', 'volumeClass', 'ratioClass'])
      expect(metricLines[key]).toBe(imperialLines[key]);
    expect(Object.values(metricLines).join(' ')).not.toMatch(/\bft\b/);
  });
});

describe('the engine’s sentences in the bowler’s units (unitFormatter.text)', () => {
  const metric = unitFormatter('metric');
  const imperial = unitFormatter('imperial');

  it('turns feet, mph and pounds into m, km/h and kg with at least one decimal; inches stay (the trade states RG and pin-to-PAP in inches)', () => {
    const sentence = 'skids to 31.4 ft, about 1 mph more speed (17.5 mph), a 16 lb ball, a pin 4 1/2 in from your PAP, RG 2.480 in';
    expect(metric.text(sentence)).toBe(
      `skids to ${(31.4 * M_PER_FT).toFixed(1)} m, about ${KMH_PER_MPH.toFixed(1)} km/h more speed (${(17.5 * KMH_PER_MPH).toFixed(1)} km/h), ` +
        `a ${(16 * KG_PER_LB).toFixed(1)} kg ball, a pin 4 1/2 in from your PAP, RG 2.480 in`,
    );
    expect(imperial.text(sentence)).toBe(sentence);
  });

  it('converts the limit the engine’s legality check writes for an overweight ball (USBC equipment specifications: 16 lb at most)', () => {
    const result = checkLegality({ ...roughAsymSolid, weightLb: 17 });
    const weight = result.violations.find((v) => v.field === 'weightLb');
    expect(weight?.limit).toMatch(/\blb$/);
    expect(metric.text(weight!.limit)).toBe(`≤ ${(16 * KG_PER_LB).toFixed(1)} kg`);
  });
});
