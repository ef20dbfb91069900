import type { Currency, Takings, TakingsDay, TakingsQuery } from '../../../shared/shop';
import type { AuthUser } from '../../middleware/auth';
import { ownedCenter } from './shop.common';
import { shopRepository } from './shop.repository';

/** Today's date (YYYY-MM-DD) in an IANA time zone; UTC when the zone is unknown to this runtime. */
export function localToday(timeZone: string, now = new Date()): string {
  const parts = (tz: string) =>
    new Intl.DateTimeFormat('en-CA', { timeZone: tz, year: 'numeric', month: '2-digit', day: '2-digit' }).format(now);
  try {
    return parts(timeZone);
  } catch {
    return parts('UTC');
  }
}

/** The zone's own name when this runtime knows it, else UTC (a center's stored zone is never trusted into SQL unchecked). */
export function knownZone(timeZone: string | null | undefined): string {
  if (!timeZone) return 'UTC';
  try {
    new Intl.DateTimeFormat('en-US', { timeZone });
    return timeZone;
  } catch {
    return 'UTC';
  }
}

/** Every date from `from` to `to` (both included). */
function datesBetween(from: string, to: string): string[] {
  const out: string[] = [];
  for (let t = Date.parse(`${from}T00:00:00Z`), end = Date.parse(`${to}T00:00:00Z`); t <= end; t += 86400000)
    out.push(new Date(t).toISOString().slice(0, 10));
  return out;
}

/** A CSV field: quoted when it holds a comma, quote or line break; a leading formula sign is neutralised. */
function csvField(v: string | number): string {
  let s = String(v);
  if (/^[=+\-@\t\r]/.test(s) && !/^-?\d+(\.\d+)?$/.test(s)) s = `'${s}`;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

const amount = (cents: number) => (cents / 100).toFixed(2);

/** A center's takings, by the local days of the center's time zone. */
export const takingsService = {
  /**
   * The takings of one day or a range of days (the center's local dates; default its today): paid, refunded and
   * net, each day and in total, and by service. A sale made in the evening counts on that evening's local date.
   */
  async takings(actor: AuthUser, centerId: number, query: TakingsQuery = {}): Promise<Takings> {
    const center = await ownedCenter(actor, centerId);
    const timeZone = knownZone(center.timeZone);
    const from = query.from ?? query.date ?? localToday(timeZone);
    const to = query.to ?? from;
    const currency = ((await shopRepository.takingsCurrency(centerId)) ?? 'usd') as Currency;
    const [perDay, byService] = await Promise.all([
      shopRepository.takingsByDay(centerId, timeZone, from, to, currency),
      shopRepository.takingsByService(centerId, timeZone, from, to, currency),
    ]);
    const found = new Map(perDay.map((d) => [d.date, d]));
    const days: TakingsDay[] = datesBetween(from, to).map((date) => {
      const d = found.get(date) ?? { orders: 0, paidCents: 0, refundedCents: 0 };
      return { date, orders: d.orders, paidCents: d.paidCents, refundedCents: d.refundedCents, netCents: d.paidCents - d.refundedCents };
    });
    const sum = (k: 'orders' | 'paidCents' | 'refundedCents') => days.reduce((s, d) => s + d[k], 0);
    const paidCents = sum('paidCents');
    const refundedCents = sum('refundedCents');
    return {
      date: from,
      from,
      to,
      timeZone,
      days,
      currency,
      orders: sum('orders'),
      paidCents,
      refundedCents,
      netCents: paidCents - refundedCents,
      byService: byService.sort((a, b) => b.cents - a.cents || a.serviceId - b.serviceId),
    };
  },

  /** The takings as CSV (one line per day and a total line; amounts in the currency's units) and a file name. */
  async takingsCsv(actor: AuthUser, centerId: number, q: TakingsQuery): Promise<{ filename: string; csv: string }> {
    const t = await this.takings(actor, centerId, q);
    const cur = t.currency.toUpperCase();
    const lines = [
      ['Date', 'Orders paid', `Taken (${cur})`, `Refunded (${cur})`, `Net (${cur})`],
      ...t.days.map((d) => [d.date, d.orders, amount(d.paidCents), amount(d.refundedCents), amount(d.netCents)]),
      ['Total', t.orders, amount(t.paidCents), amount(t.refundedCents), amount(t.netCents)],
      [],
      ['Service', 'Orders paid', `Taken (${cur})`],
      ...t.byService.map((s) => [s.name, s.count, amount(s.cents)]),
      [],
      ['Time zone', t.timeZone],
    ];
    return {
      filename: `takings-center-${centerId}-${t.from}-to-${t.to}.csv`,
      csv: lines.map((l) => l.map(csvField).join(',')).join('\r\n') + '\r\n',
    };
  },
};
