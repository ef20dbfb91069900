import type { Takings } from '../../../shared/shop';
import type { AuthUser } from '../../middleware/auth';
import type { Order } from '../../models/index';
import { ownedCenter } from './shop.common';
import { shopRepository } from './shop.repository';

const todayUtc = () => new Date().toISOString().slice(0, 10);

/** A center's card takings. */
export const takingsService = {
  /** The day's takings of a center (UTC day): paid, refunded and net, by service. */
  async takings(actor: AuthUser, centerId: number, date = todayUtc()): Promise<Takings> {
    await ownedCenter(actor, centerId);
    const from = new Date(`${date}T00:00:00Z`);
    const to = new Date(from.getTime() + 86400000);
    const [paid, refunded, services] = await Promise.all([
      shopRepository.paidBetween(centerId, from, to),
      shopRepository.refundedBetween(centerId, from, to),
      shopRepository.services(centerId, true),
    ]);
    const currency = paid[0]?.currency ?? refunded[0]?.currency ?? services[0]?.currency ?? 'usd';
    const inCur = (os: Order[]) => os.filter((x) => x.currency === currency);
    const byService = new Map<number, { serviceId: number; name: string; count: number; cents: number }>();
    for (const x of inCur(paid)) {
      const key = x.serviceId ?? 0;
      const row = byService.get(key) ?? { serviceId: key, name: x.serviceName, count: 0, cents: 0 };
      row.count += 1;
      row.cents += x.amountCents;
      byService.set(key, row);
    }
    const paidCents = inCur(paid).reduce((s, x) => s + x.amountCents, 0);
    const refundedCents = inCur(refunded).reduce((s, x) => s + x.amountCents, 0);
    return {
      date,
      currency,
      orders: inCur(paid).length,
      paidCents,
      refundedCents,
      netCents: paidCents - refundedCents,
      byService: [...byService.values()].sort((a, b) => b.cents - a.cents || a.serviceId - b.serviceId),
    };
  },
};
