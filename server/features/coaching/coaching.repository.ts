import { Op, QueryTypes, type CreationAttributes, type Transaction } from 'sequelize';
import type { CoachLink as CoachLinkDto, Plan as PlanDto, StudentSummary } from '../../../shared/coaching';
import { Ball, CoachLink, Plan, PlanReply, sequelize, User } from '../../models/index';
import { newestFirstPage } from '../../db/paging';

/** Advisory-lock namespace of the invitation counter (any constant unique to this use). */
const INVITE_LOCK_NS = 7141;

type LinkWithPeople = CoachLink & { coach?: User | null; student?: User | null };
type PlanWithRefs = Plan & { coach?: User | null; ball?: Ball | null; replies?: PlanReply[] };

const person = (u: User) => ({ id: u.id, displayName: u.displayName, email: u.email });

/** A link as either side sees it. Until the invitee accepts, nothing about them is shown but the address the coach typed. */
export function toLinkDto(l: LinkWithPeople): CoachLinkDto {
  return {
    id: l.id,
    coach: person(l.coach!),
    student: l.status !== 'pending' && l.student ? person(l.student) : null,
    email: l.email,
    status: l.status,
    createdAt: l.createdAt.toISOString(),
    acceptedAt: l.acceptedAt ? l.acceptedAt.toISOString() : null,
  };
}

export function toPlanDto(p: PlanWithRefs): PlanDto {
  return {
    id: p.id,
    coachId: p.coachId,
    coachName: p.coach?.displayName ?? '',
    studentId: p.studentId,
    title: p.title,
    kind: p.kind,
    body: p.body,
    ballId: p.ballId,
    ballName: p.ball ? p.ball.name : null,
    createdAt: p.createdAt.toISOString(),
    replies: [...(p.replies ?? [])]
      .sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime() || a.id - b.id)
      .map((r) => ({
        id: r.id,
        authorId: r.authorId,
        authorName: r.author?.displayName ?? '',
        text: r.text,
        createdAt: r.createdAt.toISOString(),
      })),
  };
}

const PEOPLE = [
  { model: User, as: 'coach', attributes: ['id', 'displayName', 'email'] },
  { model: User, as: 'student', attributes: ['id', 'displayName', 'email'] },
];
const PLAN_REFS = [
  { model: User, as: 'coach', attributes: ['id', 'displayName'] },
  // A plan keeps naming a ball the student later removed.
  { model: Ball, as: 'ball', attributes: ['id', 'name'], paranoid: false },
  // The answers in a query of their own (separate), so a page of plans stays a page of plans.
  {
    model: PlanReply,
    as: 'replies',
    separate: true,
    order: [['createdAt', 'ASC'] as [string, string]],
    include: [{ model: User, as: 'author', attributes: ['id', 'displayName'] }],
  },
];

export const coachingRepository = {
  findLink(id: number, transaction?: Transaction): Promise<LinkWithPeople | null> {
    return CoachLink.findByPk(id, { include: PEOPLE, transaction }) as Promise<LinkWithPeople | null>;
  },
  findLinkPlain(id: number, transaction: Transaction): Promise<CoachLink | null> {
    return CoachLink.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
  },
  /** Pending and active links where the user is the coach or the student (also invitations to their verified e-mail not yet tied to the account). */
  links(
    user: { id: number; email: string; emailVerified: boolean },
    page: number,
    pageSize: number,
  ): Promise<{ rows: LinkWithPeople[]; count: number }> {
    // Invitations to the user's address show only once the address is verified (until then it is not proven theirs).
    const mine = [
      { coachId: user.id },
      { studentId: user.id },
      ...(user.emailVerified ? [{ email: user.email.toLowerCase(), studentId: null, status: 'pending' }] : []),
    ];
    return CoachLink.findAndCountAll({
      where: { status: { [Op.in]: ['pending', 'active'] }, [Op.or]: mine },
      include: PEOPLE,
      ...newestFirstPage(page, pageSize),
      distinct: true,
    }) as Promise<{ rows: LinkWithPeople[]; count: number }>;
  },
  /** Invitations a coach sent since `since` (withdrawn ones included). */
  /** Holds a coach's invitations for the rest of the transaction (a transaction-scoped advisory lock per coach). */
  async lockInvitationsOf(coachId: number, transaction: Transaction): Promise<void> {
    await sequelize.query('SELECT pg_advisory_xact_lock(:ns, :coachId)', { replacements: { ns: INVITE_LOCK_NS, coachId }, transaction });
  },
  invitationsSince(coachId: number, since: Date, transaction: Transaction): Promise<number> {
    return CoachLink.count({ where: { coachId, createdAt: { [Op.gte]: since } }, transaction });
  },
  liveLink(coachId: number, email: string, transaction?: Transaction): Promise<CoachLink | null> {
    return CoachLink.findOne({ where: { coachId, email, status: { [Op.in]: ['pending', 'active'] } }, transaction });
  },
  activeLink(coachId: number, studentId: number, transaction?: Transaction): Promise<CoachLink | null> {
    return CoachLink.findOne({ where: { coachId, studentId, status: 'active' }, attributes: ['id'], transaction });
  },
  createLink(data: CreationAttributes<CoachLink>, transaction: Transaction): Promise<CoachLink> {
    return CoachLink.create(data, { transaction });
  },
  createPlan(data: CreationAttributes<Plan>, transaction: Transaction): Promise<Plan> {
    return Plan.create(data, { transaction });
  },
  /** A ball's name, a removed ball's too (a plan keeps naming it). */
  async ballName(id: number, transaction?: Transaction): Promise<string | null> {
    return (await Ball.findByPk(id, { attributes: ['name'], paranoid: false, transaction }))?.name ?? null;
  },
  /** A coach's active students with their session count and last session date, in one statement. */
  async students(coachId: number, page: number, pageSize: number): Promise<{ rows: StudentSummary[]; count: number }> {
    const rows = await sequelize.query<{
      link_id: number;
      student_id: number;
      display_name: string;
      email: string;
      since: Date;
      sessions: string;
      last_date: string | null;
      full_count: string;
    }>(
      `SELECT l.id AS link_id, u.id AS student_id, u.display_name, u.email, COALESCE(l.accepted_at, l.created_at) AS since,
              COUNT(s.id) AS sessions, MAX(s.date) AS last_date, COUNT(*) OVER () AS full_count
       FROM coach_links l
       JOIN users u ON u.id = l.student_id
       LEFT JOIN sessions s ON s.user_id = u.id AND s.deleted_at IS NULL
       WHERE l.coach_id = :coachId AND l.status = 'active'
       GROUP BY l.id, u.id
       ORDER BY u.display_name, l.id
       LIMIT :limit OFFSET :offset`,
      { type: QueryTypes.SELECT, replacements: { coachId, limit: pageSize, offset: (page - 1) * pageSize } },
    );
    const count = rows.length ? Number(rows[0].full_count) : await CoachLink.count({ where: { coachId, status: 'active' } });
    return {
      rows: rows.map((r) => ({
        linkId: r.link_id,
        student: { id: r.student_id, displayName: r.display_name, email: r.email },
        since: new Date(r.since).toISOString(),
        sessions: Number(r.sessions),
        lastSessionDate: r.last_date,
      })),
      count,
    };
  },
  plans(where: { studentId: number; coachId?: number }, page: number, pageSize: number): Promise<{ rows: PlanWithRefs[]; count: number }> {
    return Plan.findAndCountAll({
      where,
      include: PLAN_REFS,
      ...newestFirstPage(page, pageSize),
      distinct: true,
    }) as Promise<{
      rows: PlanWithRefs[];
      count: number;
    }>;
  },
  createReply(data: CreationAttributes<PlanReply>, transaction: Transaction): Promise<PlanReply> {
    return PlanReply.create(data, { transaction });
  },
  findPlan(id: number, transaction?: Transaction): Promise<PlanWithRefs | null> {
    return Plan.findByPk(id, { include: PLAN_REFS, transaction }) as Promise<PlanWithRefs | null>;
  },
};
