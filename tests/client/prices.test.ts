import { describe, expect, it } from 'vitest';
import { priceText, readPrice } from '../../client/src/utils/prices';

describe('reading a typed price', () => {
  it('reads whole amounts, cents and a thousands separator into integer cents', () => {
    expect(readPrice('45')).toEqual({ ok: true, cents: 4500 });
    expect(readPrice(' 45.5 ')).toEqual({ ok: true, cents: 4550 });
    expect(readPrice('$1,250.05')).toEqual({ ok: true, cents: 125005 });
    expect(readPrice('.75')).toEqual({ ok: true, cents: 75 });
    expect(readPrice('0.50')).toEqual({ ok: true, cents: 50 });
    expect(readPrice('5000')).toEqual({ ok: true, cents: 500000 });
  });

  it('refuses instead of correcting: negatives, a third decimal, letters and amounts out of bounds each get a message', () => {
    const message = (t: string) => {
      const r = readPrice(t);
      return r.ok ? null : r.message;
    };
    expect(message('-5')).toBe('A price cannot be negative');
    expect(message('45.555')).toBe('At most two decimals (whole cents)');
    expect(message('4x')).toMatch(/digits/);
    expect(message('')).toMatch(/Enter a price/);
    expect(message('0.49')).toMatch(/At least 0.50/);
    expect(message('5000.01')).toBe('At most 5,000.00');
  });

  it('shows cents with two decimals', () => {
    expect(priceText(4550)).toBe('45.50');
    expect(readPrice(priceText(123456))).toEqual({ ok: true, cents: 123456 });
  });
});
