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
  type LaneGroup,
  type LaneGroups,
  type PublishCondition,
  weekdaysText,
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
import { laneRanges } from './lanes';
import { addDays, laneGroups, localDay, replacedBy, type LaneGroupOf } from './laneGroups';

/** Today's date in UTC (YYYY-MM-DD). A center's own day is `localDay(at, center.timeZone)`. */
export function todayUtc(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}

/** How long an e-mail unsubscribe can be undone from the same link. */
const UNDO_DAYS = 30;

function toLaneGroupDto(g: LaneGroupOf<Condition>): LaneGroup {
  return {
    key: g.key,
    lanes: g.lanes,
    from: g.from,
    to: g.to,
    current: g.current ? toConditionDto(g.current) : null,
    currentUntil: g.currentUntil,
    next: g.next ? { condition: toConditionDto(g.next.publication), from: g.next.from } : null,
  };
}

/** The center's lane groups at an instant, in its time zone, from its publications that may still be in force. */
function groupsOf(center: Center, pubs: Condition[], at: Date): { today: string; groups: LaneGroup[] } {
  const today = localDay(at, center.timeZone);
  return { today, groups: laneGroups(pubs, center.laneCount, today).map(toLaneGroupDto) };
}

/** The newest of the publications in force now, over every lane group (null when none is). */
function newestCurrent(groups: LaneGroup[]): ConditionDto | null {
  let best: ConditionDto | null = null;
  for (const g of groups)
    if (
      g.current &&
      (!best || g.current.publishedAt > best.publishedAt || (g.current.publishedAt === best.publishedAt && g.current.id > best.id))
    )
      best = g.current;
  return best;
}

/** The day before the earliest local day any time zone can be in at `at` (publications ending before it are over everywhere). */
function earliestDay(at: Date): string {
  return addDays(todayUtc(at), -2);
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

  /** Every lane group of the center at an instant (default now), in the center's time zone. */
  async laneGroups(id: number, at = new Date()): Promise<LaneGroups> {
    const center = await centerOr404(id);
    const { today, groups } = groupsOf(center, await centersRepository.scheduledFrom(id, earliestDay(at)), at);
    return { center: toCenterDto(center), timeZone: center.timeZone, today, at: at.toISOString(), groups };
  },

  /**
   * The condition in force at an instant (default now) in the center's time zone: every lane group in `groups`, and
   * the newest publication in force at the top level (404 no_condition when no lane has one).
   */
  async current(id: number, at = new Date()): Promise<CurrentCondition> {
    const center = await centerOr404(id);
    const { today, groups } = groupsOf(center, await centersRepository.scheduledFrom(id, earliestDay(at)), at);
    const dto = newestCurrent(groups);
    if (!dto) throw new AppError(404, 'no_condition', `${center.name} has no condition in force today`);
    return {
      timeZone: center.timeZone,
      today,
      groups,
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
    return { items: rows.map((c) => toConditionDto(c, replacedBy(c, later))), total: count, page, pageSize };
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
          weekdays: input.weekdays?.length ? [...new Set(input.weekdays)].sort((a, b) => a - b) : null,
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
      // The public page has an anchor per lane group; the group of these lanes is `lanes-<first>-<last>`.
      const page = `${base}/centers/${centerId}/condition#lanes-${c.lanes[0]}-${c.lanes.at(-1)}`;
      const days = weekdaysText(c.weekdays);
      await enqueueMail(
        follows.map((f) => {
          const u = f.user;
          const unsubscribe = `${base}/unsubscribe?token=${encodeURIComponent(f.unsubscribeToken)}`;
          const lines = [
            `Hello ${u.displayName},`,
            '',
            `${center.name} has published a new lane condition: ${pattern.name}.`,
            `Lanes ${laneRanges(c.lanes)}, from ${c.validFrom}${c.validTo ? ` to ${c.validTo}` : ''}${days ? `, on ${days}` : ''} (${center.name}'s local days).`,
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
    // One query for every followed center; each center's lane groups are worked out in its own time zone.
    const at = new Date();
    const byCenter = new Map<number, Condition[]>();
    if (centers.length)
      for (const c of await centersRepository.scheduledFrom(
        centers.map((x) => x.id),
        earliestDay(at),
      ))
        byCenter.set(c.centerId, [...(byCenter.get(c.centerId) ?? []), c]);
    return centers.map((center) => {
      const { groups } = groupsOf(center, byCenter.get(center.id) ?? [], at);
      // A publication in force on several groups (lanes with different next changes) is listed once with all its lanes.
      const inForce: FollowedCenter['inForce'] = [];
      for (const g of groups) {
        if (!g.current) continue;
        const same = inForce.find((x) => x.condition.id === g.current!.id);
        if (same) same.lanes = [...same.lanes, ...g.lanes].sort((a, b) => a - b);
        else inForce.push({ condition: g.current, lanes: [...g.lanes] });
      }
      return { center: toCenterDto(center, true), current: newestCurrent(groups), inForce, groups };
    });
  },

  /** What an e-mail link is for: the center, and whether the follow is still on (null: unknown or long-ended link). */
  async unsubscribeInfo(token: string): Promise<{ center: string; subscribed: boolean } | null> {
    const f = await centersRepository.followByToken(token);
    if (!f || (f.deletedAt && !undoable(f.deletedAt))) return null;
    return { center: f.center.name, subscribed: !f.deletedAt };
  },

  /**
   * Ends the follow behind an e-mail's unsubscribe link (no sign-in; a POST, so a mail scanner's GET changes nothing);
   * returns the center's name, or null for an unknown token or one already used. The follow is kept for the undo.
   */
  async unsubscribe(token: string): Promise<string | null> {
    const f = await centersRepository.followByToken(token);
    if (!f || f.deletedAt) return null;
    await f.destroy();
    return f.center.name;
  },

  /** Undoes an e-mail unsubscribe from the same link within UNDO_DAYS; the center's name, or null. */
  async resubscribe(token: string): Promise<string | null> {
    const f = await centersRepository.followByToken(token);
    if (!f) return null;
    if (f.deletedAt) {
      if (!undoable(f.deletedAt)) return null;
      await f.restore();
    }
    return f.center.name;
  },
};

function undoable(deletedAt: Date): boolean {
  return Date.now() - deletedAt.getTime() < UNDO_DAYS * 86_400_000;
}

async function assertProprietor(userId: number): Promise<void> {
  const u = await userRepository.findById(userId);
  if (!u) throw AppError.badRequest('That user does not exist', { 'body.ownerId': 'Unknown user' });
  if (!holdsRole(u, 'proprietor'))
    throw AppError.badRequest('The owner must have the proprietor role', { 'body.ownerId': 'Grant the proprietor role first' });
}
