import { describe, expect, it } from 'vitest';
import { volumeClass, VOLUME_CLASS_ML } from '../../engine/index';

// Check values: Lanewright's conventions (engine/README.md) — light < 20 mL; medium 20–25 mL;
// heavy > 25 mL (common practice).

describe('volumeClass', () => {
  it('mL: 19.99 is light, 20 is medium', () => {
    expect(volumeClass(19.99)).toBe('light');
    expect(volumeClass(20)).toBe('medium');
  });
  it('mL: 25 is medium, 25.01 is heavy', () => {
    expect(volumeClass(25)).toBe('medium');
    expect(volumeClass(25.01)).toBe('heavy');
  });
  it('thresholds are exported as 20 and 25 mL', () => {
    expect(VOLUME_CLASS_ML).toEqual({ lightBelowMl: 20, heavyAboveMl: 25 });
  });
  it('throws RangeError for NaN', () => {
    expect(() => volumeClass(Number.NaN)).toThrow(/volumeClass: volumeMl must be a finite number, got NaN/);
  });
});
