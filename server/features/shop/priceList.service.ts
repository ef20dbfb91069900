import { audit } from '../../lib/audit';
import { AppError } from '../../lib/AppError';
import type { ServiceInput, ServicePatch, ShopService as ShopServiceDto } from '../../../shared/shop';
import type { AuthUser } from '../../middleware/auth';
import { sequelize } from '../../models/index';
import { centerOr404, ownedCenter } from './shop.common';
import { shopRepository, toServiceDto } from './shop.repository';

/** A center's pro-shop price list: everybody signed in reads the active entries, its proprietor edits. */
export const priceListService = {
  async services(user: AuthUser, centerId: number, all: boolean): Promise<ShopServiceDto[]> {
    const c = await centerOr404(centerId);
    return (await shopRepository.services(centerId, all && c.ownerId === user.id)).map(toServiceDto);
  },

  async createService(actor: AuthUser, centerId: number, input: ServiceInput): Promise<ShopServiceDto> {
    await ownedCenter(actor, centerId);
    return sequelize.transaction(async (transaction) => {
      const s = await shopRepository.createService(
        {
          centerId,
          kind: input.kind,
          name: input.name,
          grit: input.kind === 'resurface' ? (input.grit ?? null) : null,
          description: input.description ?? null,
          priceCents: input.priceCents,
          currency: input.currency ?? 'usd',
        },
        transaction,
      );
      await audit(
        {
          actorId: actor.id,
          action: 'shop_service.created',
          subjectType: 'shop_service',
          subjectId: s.id,
          details: { centerId, kind: s.kind, priceCents: s.priceCents, currency: s.currency },
        },
        transaction,
      );
      return toServiceDto(s);
    });
  },

  async updateService(actor: AuthUser, centerId: number, serviceId: number, patch: ServicePatch): Promise<ShopServiceDto> {
    await ownedCenter(actor, centerId);
    return sequelize.transaction(async (transaction) => {
      const s = await shopRepository.lockService(centerId, serviceId, transaction);
      if (!s) throw AppError.notFound('Service');
      if (s.version !== patch.version)
        throw AppError.conflict('stale_version', 'This price-list entry was changed elsewhere; reload it and apply your edit again');
      const { version: _v, ...fields } = patch;
      const before = { priceCents: s.priceCents, currency: s.currency, active: s.active };
      s.set(Object.fromEntries(Object.entries(fields).filter(([, v]) => v !== undefined)));
      if (s.kind !== 'resurface') s.grit = null;
      if (s.kind === 'resurface' && !s.grit)
        throw AppError.badRequest('A resurface needs its target grit', { 'body.grit': 'A resurface needs its target grit' });
      await s.save({ transaction });
      await audit(
        {
          actorId: actor.id,
          action: 'shop_service.updated',
          subjectType: 'shop_service',
          subjectId: s.id,
          details: { before, after: { priceCents: s.priceCents, currency: s.currency, active: s.active } },
        },
        transaction,
      );
      return toServiceDto(s);
    });
  },
};
