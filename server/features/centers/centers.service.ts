import esc from 'escape-html';
import crypto from 'node:crypto';
import { holdsRole, type Page } from '../../../shared/auth';
import {
  laneSurfaceText,
  type Center as CenterDto,
  type CenterInput,
  type Condition as ConditionDto,
  type CurrentCondition,
  type FollowedCenter,
  type PublishCondition,
} from '../../../shared/centers';
import { publicUrl } from '../../lib/publicUrl';
import { AppError } from '../../lib/AppError';
import { audit } from '../../lib/audit';
import { enqueueMail } from '../../lib/outbox';
import type { AuthUser } from '../../middleware/auth';
import { sequelize, type Center, type Condition } from '../../models/index';
import { userRepository } from '../auth/user.repository';
import { patternsRepository } from '../patterns/patterns.repository';
import { patternsService } from '../patterns/patterns.service';
import { centersRepository, toCenterDto, toConditionDto } from './centers.repository';
import { datesOverlap, laneRanges } from './lanes';

/** Today's date in UTC (YYYY-MM-DD): conditions are in force by calendar day. */
export function todayUtc(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}

function supersededBy(c: Condition, later: Condition[]): number | null {
  const hit = later.find(
    (l) => l.id !== c.id && l.publishedAt > c.publishedAt && l.lanes.some((n) => c.lanes.includes(n)) && datesOverlap(l, c),
  );
  return hit ? hit.id : null;
}

async function centerOr404(id: number): Promise<Center> {
  const c = await centersRepository.findById(id);
  if (!c) throw AppError.notFound('Center');
  return c;
}

export const centersService = {
  async list(user: AuthUser | undefined, page: number, pageSize: number): Promise<Page<CenterDto>> {
    const { rows, count } = await centersRepository.list({ limit: pageSize, offset: (page - 1) * pageSize });
    const followed = user ? await centersRepository.followedIds(user.id) : null;
    return { items: rows.map((c) => toCenterDto(c, followed ? followed.has(c.id) : undefined)), total: count, page, pageSize };
  },

  async get(user: AuthUser | undefined, id: number): Promise<CenterDto> {
    const c = await centerOr404(id);
    const followed = user ? await centersRepository.followedIds(user.id) : null;
    return toCenterDto(c, followed ? followed.has(c.id) : undefined);
  },

  /** A proprietor's own centers (an admin sees all). */
  async mine(user: AuthUser): Promise<CenterDto[]> {
    const { rows } = await centersRepository.list({ ownerId: holdsRole(user, 'admin') ? undefined : user.id, limit: 500, offset: 0 });
    return rows.map((c) => toCenterDto(c));
  },

  async create(actor: AuthUser, input: CenterInput): Promise<CenterDto> {
    return sequelize.transaction(async (transaction) => {
      if (input.ownerId) await assertProprietor(input.ownerId);
      const c = await centersRepository.create(
        {
          name: input.name,
          town: input.town,
          laneCount: input.laneCount,
          ownerId: input.ownerId ?? null,
          timeZone: input.timeZone ?? 'UTC',
        },
        transaction,
      );
      await centersRepository.replaceLanes(c, transaction);
      await audit(
        { actorId: actor.id, action: 'center.created', subjectType: 'center', subjectId: c.id, details: { ownerId: c.ownerId } },
        transaction,
      );
      return toCenterDto(c);
    });
  },

  /** Admin edits anything and assigns the owner; a proprietor edits the name and town of their own center. */
  async update(actor: AuthUser, id: number, patch: Partial<CenterInput>): Promise<CenterDto> {
    return sequelize.transaction(async (transaction) => {
      const c = await centersRepository.findById(id, transaction);
      if (!c) throw AppError.notFound('Center');
      if (!holdsRole(actor, 'admin')) {
        if (c.ownerId !== actor.id) throw AppError.forbidden('Only this center’s proprietor can change it');
        if (patch.ownerId !== undefined || patch.laneCount !== undefined)
          throw AppError.forbidden('Only an admin assigns owners and lane counts');
      }
      if (patch.ownerId) await assertProprietor(patch.ownerId);
      const before = c.ownerId;
      c.set(patch);
      await c.save({ transaction });
      if (patch.laneCount !== undefined) {
        await centersRepository.replaceLanes(c, transaction);
      }
      if (patch.ownerId !== undefined && patch.ownerId !== before)
        await audit(
          {
            actorId: actor.id,
            action: 'center.owner_assigned',
            subjectType: 'center',
            subjectId: c.id,
            details: { from: before, to: patch.ownerId },
          },
          transaction,
        );
      return toCenterDto(c);
    });
  },

  /** The newest publication in force today (404 no_condition when there is none). */
  async current(id: number): Promise<CurrentCondition> {
    const center = await centerOr404(id);
    const [c] = await centersRepository.inForce(id, todayUtc());
    if (!c) throw new AppError(404, 'no_condition', `${center.name} has no condition in force today`);
    const dto = toConditionDto(c);
    return {
      center: toCenterDto(center),
      condition: dto,
      pattern: dto.pattern,
      lanes: dto.lanes,
      validFrom: dto.validFrom,
      validTo: dto.validTo,
      notes: dto.notes,
      lane: dto.lane,
      laneText: dto.laneText,
    };
  },

  async history(id: number, page: number, pageSize: number): Promise<Page<ConditionDto>> {
    await centerOr404(id);
    const { rows, count } = await centersRepository.history(id, pageSize, (page - 1) * pageSize);
    const oldest = rows.at(-1);
    const later = oldest ? await centersRepository.publishedAfter(id, oldest.publishedAt) : [];
    return { items: rows.map((c) => toConditionDto(c, supersededBy(c, later))), total: count, page, pageSize };
  },

  /**
   * Publishes a condition (the center's proprietor only): a snapshot of the pattern, an audit event and
   * one outbox e-mail per follower, all in one transaction; the sender delivers the mail after commit.
   */
  async publish(actor: AuthUser, centerId: number, input: PublishCondition): Promise<ConditionDto> {
    const center = await centerOr404(centerId);
    if (center.ownerId !== actor.id) throw AppError.forbidden('Only this center’s proprietor can publish its condition');
    const bad = input.lanes.filter((n) => n > center.laneCount);
    if (bad.length)
      throw AppError.badRequest('Some lanes do not exist', {
        'body.lanes': `${center.name} has lanes 1–${center.laneCount}; not ${bad.join(', ')}`,
      });
    const pattern = await patternsRepository.findById(input.patternId);
    if (!pattern || !(await patternsService.canSee(actor, pattern)))
      throw AppError.badRequest('That pattern does not exist', { 'body.patternId': 'Unknown pattern' });
    const base = publicUrl();
    return sequelize.transaction(async (transaction) => {
      const c = await centersRepository.createCondition(
        {
          centerId,
          patternId: pattern.id,
          patternName: pattern.name,
          sweeps: pattern.sweeps,
          summary: pattern.summary,
          lanes: [...new Set(input.lanes)].sort((a, b) => a - b),
          validFrom: input.validFrom,
          validTo: input.validTo ?? null,
          notes: input.notes ?? null,
          publishedAt: new Date(),
          publishedBy: actor.id,
          laneKind: input.lane.kind,
          laneFriction: input.lane.friction,
        },
        transaction,
      );
      await audit(
        {
          actorId: actor.id,
          action: 'condition.published',
          subjectType: 'condition',
          subjectId: c.id,
          details: { centerId, patternId: pattern.id, lanes: c.lanes, lane: input.lane },
        },
        transaction,
      );
      const follows = await centersRepository.followersOf(centerId, transaction);
      const s = pattern.summary;
      const page = `${base}/centers/${centerId}/condition`;
      await enqueueMail(
        follows.map((f) => {
          const u = f.user;
          const unsubscribe = `${base}/api/unsubscribe?token=${f.unsubscribeToken}`;
          const lines = [
            `Hello ${u.displayName},`,
            '',
            `${center.name} has published a new lane condition: ${pattern.name}.`,
            `Lanes ${laneRanges(c.lanes)}, from ${c.validFrom}${c.validTo ? ` to ${c.validTo}` : ''}.`,
            `Length ${s.lengthFt} ft, volume ${s.volumeMl.toFixed(1)} mL, ratio ${s.ratio === null ? '—' : `${s.ratio.toFixed(1)}:1`} (${s.lengthClass}, ${s.volumeClass}, ${s.ratioClass}).`,
            `${laneSurfaceText(input.lane)}.`,
            ...(c.notes ? ['', c.notes] : []),
            '',
            `See it and your best-fit balls: ${page}`,
            '',
            `Stop these e-mails from ${center.name}: ${unsubscribe}`,
          ];
          return {
            to: u.email,
            kind: 'condition_published',
            ref: `${c.id}:${f.userId}`,
            subject: `${center.name}: new lane condition — ${pattern.name}`,
            text: lines.join('\n'),
            html: `<p>${lines.map(esc).join('<br>')}</p><p><a href="${esc(page)}">Open the condition</a> · <a href="${esc(unsubscribe)}">Unsubscribe</a></p>`,
          };
        }),
        transaction,
      );
      return toConditionDto(c);
    });
  },

  async follow(user: AuthUser, centerId: number): Promise<void> {
    await centerOr404(centerId);
    await centersRepository.follow(user.id, centerId, crypto.randomBytes(24).toString('base64url'));
  },

  async unfollow(user: AuthUser, centerId: number): Promise<void> {
    await centerOr404(centerId);
    await centersRepository.unfollow(user.id, centerId);
  },

  async follows(user: AuthUser): Promise<FollowedCenter[]> {
    const centers = (await centersRepository.followsOf(user.id)).map((f) => f.center);
    // One query for every followed center, newest publication first: the first row per center is its current
    // condition; each older one still governs the lanes no newer publication has taken.
    const byCenter = new Map<number, Condition[]>();
    if (centers.length)
      for (const c of await centersRepository.inForce(
        centers.map((x) => x.id),
        todayUtc(),
      ))
        byCenter.set(c.centerId, [...(byCenter.get(c.centerId) ?? []), c]);
    return centers.map((center) => {
      const list = byCenter.get(center.id) ?? [];
      const taken = new Set<number>();
      const inForce: FollowedCenter['inForce'] = [];
      for (const c of list) {
        const lanes = c.lanes.filter((n) => !taken.has(n));
        for (const n of c.lanes) taken.add(n);
        if (lanes.length) inForce.push({ condition: toConditionDto(c), lanes });
      }
      return { center: toCenterDto(center, true), current: list[0] ? toConditionDto(list[0]) : null, inForce };
    });
  },

  /** Removes the follow behind an e-mail's unsubscribe link (no sign-in); returns the center's name, or null for an unknown token. */
  async unsubscribe(token: string): Promise<string | null> {
    const f = await centersRepository.followByToken(token);
    if (!f) return null;
    const name = f.center.name;
    await f.destroy();
    return name;
  },
};

async function assertProprietor(userId: number): Promise<void> {
  const u = await userRepository.findById(userId);
  if (!u) throw AppError.badRequest('That user does not exist', { 'body.ownerId': 'Unknown user' });
  if (!holdsRole(u, 'proprietor'))
    throw AppError.badRequest('The owner must have the proprietor role', { 'body.ownerId': 'Grant the proprietor role first' });
}
