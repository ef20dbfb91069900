/**
 * A price as the proprietor types it ("45", "45.5", "45.00") read into integer cents, or the reason it is refused.
 * Nothing is corrected silently: a negative amount, a third decimal or a value outside the price list's bounds
 * (the server's schema in shared/shop.ts: 0.50 to 5,000.00) is an error message for the field.
 */
export const PRICE_MIN_CENTS = 50;
export const PRICE_MAX_CENTS = 500000;

export type PriceReading = { ok: true; cents: number } | { ok: false; message: string };

export function readPrice(text: string | null | undefined): PriceReading {
  const t = (text ?? '')
    .trim()
    .replace(/^\$/, '')
    .replace(/,(?=\d{3}(\D|$))/g, '');
  if (t === '') return { ok: false, message: 'Enter a price, e.g. 45.00' };
  if (/^-/.test(t)) return { ok: false, message: 'A price cannot be negative' };
  if (/^\d*\.\d{3,}$/.test(t)) return { ok: false, message: 'At most two decimals (whole cents)' };
  if (!/^(\d+(\.\d{0,2})?|\.\d{1,2})$/.test(t)) return { ok: false, message: 'Use digits and a decimal point only, e.g. 45.00' };
  const [whole = '0', frac = ''] = t.split('.');
  const cents = Number(whole || '0') * 100 + Number((frac + '00').slice(0, 2));
  if (cents < PRICE_MIN_CENTS) return { ok: false, message: 'At least 0.50 (the card networks’ usual minimum)' };
  if (cents > PRICE_MAX_CENTS) return { ok: false, message: 'At most 5,000.00' };
  return { ok: true, cents };
}

/** Cents as the price field shows them ("45.00"). */
export function priceText(cents: number): string {
  return (cents / 100).toFixed(2);
}
