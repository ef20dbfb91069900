import type { Transaction } from 'sequelize';
import type { ServiceKind } from '../shared/shop';
import { Center, sequelize, ShopService } from '../server/models/index';

/** Copperline Bowl's pro-shop price list (invented prices, integer cents, US dollars). */
export const DEMO_PRICE_LIST: { kind: ServiceKind; name: string; grit: number | null; description: string; priceCents: number }[] = [
  {
    kind: 'resurface',
    name: 'Resurface to 4000 grit',
    grit: 4000,
    description: 'Sanded through the grits to a 4000 finish: less early read, more length on fresh oil.',
    priceCents: 4500,
  },
  {
    kind: 'resurface',
    name: 'Resurface to 2000 grit',
    grit: 2000,
    description: 'Sanded to a 2000 finish: an earlier, smoother read for heavier oil.',
    priceCents: 4000,
  },
  {
    kind: 'resurface',
    name: 'Resurface to 1000 grit',
    grit: 1000,
    description: 'A dull 1000 finish for the heaviest oil and slower speeds.',
    priceCents: 4000,
  },
  {
    kind: 'polish',
    name: 'Polish',
    grit: null,
    description: 'Machine polish over the current surface: more length and a sharper back end.',
    priceCents: 2500,
  },
  {
    kind: 'oil-extraction',
    name: 'Oil extraction',
    grit: null,
    description: 'Gentle heat draws absorbed oil out of the cover; about 24 hours.',
    priceCents: 3000,
  },
  {
    kind: 'plug-redrill',
    name: 'Plug and redrill',
    grit: null,
    description: 'Old holes plugged, a new layout drilled and fitted to your hand.',
    priceCents: 8000,
  },
  {
    kind: 'drill',
    name: 'Drilling with a layout',
    grit: null,
    description: 'A new ball drilled to the layout you choose with the technician, with a fitting.',
    priceCents: 6500,
  },
];

/** Adds the price list to a center (in the caller's transaction). */
export async function seedShop(centerId: number, transaction?: Transaction): Promise<void> {
  await ShopService.bulkCreate(
    DEMO_PRICE_LIST.map((s) => ({ ...s, centerId, currency: 'usd' as const })),
    { transaction },
  );
}

/** For databases seeded before the pro shop existed: adds the list to Copperline Bowl when it has none. */
export async function seedShopIfMissing(): Promise<boolean> {
  return sequelize.transaction(async (transaction) => {
    const center = await Center.findOne({ where: { name: 'Copperline Bowl' }, transaction });
    if (!center || (await ShopService.count({ where: { centerId: center.id }, transaction })) > 0) return false;
    await seedShop(center.id, transaction);
    return true;
  });
}
