import esc from 'escape-html';
import { UniqueConstraintError } from 'sequelize';
import type { Page } from '../../../shared/auth';
import type {
  CoachLink as CoachLinkDto,
  Plan as PlanDto,
  PlanCreate,
  PlanReplyCreate,
  StudentDetail,
  StudentSummary,
} from '../../../shared/coaching';
import { config } from '../../config/index';
import { publicUrl } from '../../lib/publicUrl';
import { AppError } from '../../lib/AppError';
import { audit } from '../../lib/audit';
import { enqueueMail } from '../../lib/outbox';
import type { AuthUser } from '../../middleware/auth';
import { sequelize, type CoachLink, type User } from '../../models/index';
import { userRepository } from '../auth/user.repository';
import { arsenalRepository, toBallDto } from '../arsenal/arsenal.repository';
import { profileService } from '../profile/profile.service';
import { isLinkedCoach } from './coaching.access';
import { coachingRepository, toLinkDto, toPlanDto } from './coaching.repository';

function mailBody(lines: string[], link: { href: string; label: string }): { text: string; html: string } {
  return {
    text: [...lines, '', `${link.label}: ${link.href}`].join('\n'),
    html: `<p>${lines.map(esc).join('<br>')}</p><p><a href="${esc(link.href)}">${esc(link.label)}</a></p>`,
  };
}

/** The student of a linked coach (404 when not linked, so the student's existence never leaks). */
async function linkedStudent(coach: AuthUser, studentId: number): Promise<User> {
  if (!(await isLinkedCoach(coach, studentId))) throw AppError.notFound('Student');
  return (await userRepository.findById(studentId))!;
}

const DAY_MS = 24 * 60 * 60 * 1000;

/** The invited user: the one the link is tied to, or (still pending) whoever holds the invited address. */
const isInvitee = (user: AuthUser, l: CoachLink) =>
  l.studentId === user.id || (l.status === 'pending' && l.studentId === null && l.email === user.email.toLowerCase());

export const coachingService = {
  /**
   * A coach invites a student by e-mail: a pending link, an audit event and an e-mail through the outbox, in one
   * transaction. The answer says nothing about the invitee (not whether the address has an account, nor its id or
   * name) until they accept: the link is tied to the address, and only a user who has verified that address claims
   * it. At most INVITATIONS_PER_DAY invitations per coach per 24 hours (429 past it).
   */
  async invite(coach: AuthUser, email: string): Promise<CoachLinkDto> {
    const address = email.toLowerCase();
    if (address === coach.email.toLowerCase())
      throw AppError.badRequest('You cannot coach yourself', { 'body.email': 'Invite a student’s e-mail, not your own' });
    const base = publicUrl();
    try {
      const id = await sequelize.transaction(async (transaction) => {
        // One coach's invitations are counted one at a time (a transaction-scoped lock per coach).
        await coachingRepository.lockInvitationsOf(coach.id, transaction);
        const recent = await coachingRepository.invitationsSince(coach.id, new Date(Date.now() - DAY_MS), transaction);
        if (recent >= config.INVITATIONS_PER_DAY) {
          throw new AppError(
            429,
            'too_many_invitations',
            `At most ${config.INVITATIONS_PER_DAY} invitations a day; try again tomorrow`,
            undefined,
            60 * 60,
          );
        }
        const live = await coachingRepository.liveLink(coach.id, address, transaction);
        if (live)
          throw AppError.conflict(
            live.status === 'active' ? 'already_linked' : 'already_invited',
            live.status === 'active' ? 'This bowler is already your student' : 'This bowler already has an invitation from you',
          );
        const link = await coachingRepository.createLink(
          { coachId: coach.id, studentId: null, email: address, status: 'pending', acceptedAt: null, revokedAt: null, revokedBy: null },
          transaction,
        );
        await audit(
          { actorId: coach.id, action: 'coach.invited', subjectType: 'coach_link', subjectId: link.id, details: { email: address } },
          transaction,
        );
        const body = mailBody(
          [
            'Hello,',
            '',
            `${coach.displayName} invites you to be their student on Lanewright.`,
            'As your coach they will read your arsenal and session logs, annotate your sessions and send you plans.',
            `Sign in with this address (${address}), or sign up with it, and confirm the address; then accept or decline on your Coach page.`,
            'You can end the link at any time.',
          ],
          { href: `${base}/coach`, label: 'Open the invitation' },
        );
        await enqueueMail(
          [
            {
              to: address,
              kind: 'coach_invitation',
              ref: String(link.id),
              subject: `${coach.displayName} invites you to Lanewright coaching`,
              ...body,
            },
          ],
          transaction,
        );
        return link.id;
      });
      return toLinkDto((await coachingRepository.findLink(id))!);
    } catch (err) {
      // Two invitations at once: the partial unique index keeps one.
      if (err instanceof UniqueConstraintError)
        throw AppError.conflict('already_invited', 'This bowler already has an invitation from you');
      throw err;
    }
  },

  async links(user: AuthUser, page: number, pageSize: number): Promise<Page<CoachLinkDto>> {
    const me = await userRepository.findById(user.id);
    const { rows, count } = await coachingRepository.links({ ...user, emailVerified: Boolean(me?.emailVerifiedAt) }, page, pageSize);
    return { items: rows.map(toLinkDto), total: count, page, pageSize };
  },

  /** The invited student accepts (only they; anyone else gets 404). */
  async accept(user: AuthUser, id: number): Promise<CoachLinkDto> {
    await sequelize.transaction(async (transaction) => {
      const l = await coachingRepository.findLinkPlain(id, transaction);
      if (!l || !isInvitee(user, l) || l.status === 'revoked') throw AppError.notFound('Invitation');
      if (l.status === 'active') return;
      // Holding an account with the invited address is not enough: the address must be proven (the mailed link).
      const me = await userRepository.findById(user.id, transaction);
      if (!me?.emailVerifiedAt)
        throw new AppError(403, 'email_unverified', 'Confirm your e-mail address (the link we mailed you) before accepting an invitation');
      l.set({ status: 'active', studentId: user.id, acceptedAt: new Date() });
      await l.save({ transaction });
      await audit(
        { actorId: user.id, action: 'coach.link_accepted', subjectType: 'coach_link', subjectId: l.id, details: { coachId: l.coachId } },
        transaction,
      );
    });
    return toLinkDto((await coachingRepository.findLink(id))!);
  },

  /** Either side ends the link (or withdraws / declines the invitation); the coach loses access at once. */
  async revoke(user: AuthUser, id: number): Promise<void> {
    await sequelize.transaction(async (transaction) => {
      const l = await coachingRepository.findLinkPlain(id, transaction);
      if (!l || (l.coachId !== user.id && !isInvitee(user, l))) throw AppError.notFound('Link');
      if (l.status === 'revoked') return;
      const was = l.status;
      l.set({ status: 'revoked', revokedAt: new Date(), revokedBy: user.id });
      await l.save({ transaction });
      await audit(
        {
          actorId: user.id,
          action: 'coach.link_revoked',
          subjectType: 'coach_link',
          subjectId: l.id,
          details: { was, coachId: l.coachId, studentId: l.studentId, by: l.coachId === user.id ? 'coach' : 'student' },
        },
        transaction,
      );
    });
  },

  async students(coach: AuthUser, page: number, pageSize: number): Promise<Page<StudentSummary>> {
    const { rows, count } = await coachingRepository.students(coach.id, page, pageSize);
    return { items: rows, total: count, page, pageSize };
  },

  async student(coach: AuthUser, studentId: number): Promise<StudentDetail> {
    const s = await linkedStudent(coach, studentId);
    const [{ profile }, balls] = await Promise.all([profileService.get(s.id), arsenalRepository.findOwnedMany(s.id)]);
    return { student: { id: s.id, displayName: s.displayName, email: s.email }, profile, arsenal: balls.map(toBallDto) };
  },

  /** A plan for a linked student: stored, audited and mailed (through the outbox) in one transaction. */
  async sendPlan(coach: AuthUser, studentId: number, input: PlanCreate): Promise<PlanDto> {
    const s = await linkedStudent(coach, studentId);
    if (input.ballId != null && !(await arsenalRepository.findOwned(s.id, input.ballId)))
      throw AppError.badRequest('That ball is not in the student’s arsenal', { 'body.ballId': 'Choose one of the student’s balls' });
    const base = publicUrl();
    const id = await sequelize.transaction(async (transaction) => {
      const p = await coachingRepository.createPlan(
        { coachId: coach.id, studentId: s.id, title: input.title, kind: input.kind, body: input.body, ballId: input.ballId ?? null },
        transaction,
      );
      await audit(
        {
          actorId: coach.id,
          action: 'coach.plan_sent',
          subjectType: 'plan',
          subjectId: p.id,
          details: { studentId: s.id, kind: p.kind, ballId: p.ballId },
        },
        transaction,
      );
      const ballName = p.ballId ? await coachingRepository.ballName(p.ballId, transaction) : null;
      const body = mailBody(
        [
          `Hello ${s.displayName},`,
          '',
          `${coach.displayName} sent you a ${p.kind} plan${ballName ? ` for ${ballName}` : ''}: ${p.title}.`,
          '',
          ...p.body.split('\n'),
        ],
        { href: `${base}/`, label: 'See it on your Lanewright home' },
      );
      await enqueueMail(
        [
          {
            to: s.email,
            kind: 'coach_plan',
            ref: String(p.id),
            subject: `A plan from ${coach.displayName}: ${p.title}`.slice(0, 200),
            ...body,
          },
        ],
        transaction,
      );
      return p.id;
    });
    return toPlanDto((await coachingRepository.findPlan(id))!);
  },

  async plansForStudent(coach: AuthUser, studentId: number, page: number, pageSize: number): Promise<Page<PlanDto>> {
    await linkedStudent(coach, studentId);
    const { rows, count } = await coachingRepository.plans({ studentId, coachId: coach.id }, page, pageSize);
    return { items: rows.map(toPlanDto), total: count, page, pageSize };
  },

  /** My plans as a student, newest first (also those of a coach whose link has since ended: they are mine). */
  async myPlans(user: AuthUser, page: number, pageSize: number): Promise<Page<PlanDto>> {
    const { rows, count } = await coachingRepository.plans({ studentId: user.id }, page, pageSize);
    return { items: rows.map(toPlanDto), total: count, page, pageSize };
  },

  /**
   * An answer to a plan, by its student or its coach (anyone else 404): stored, audited and mailed to the other side
   * through the outbox, in one transaction.
   */
  async replyToPlan(user: AuthUser, planId: number, input: PlanReplyCreate): Promise<PlanDto> {
    const plan = await coachingRepository.findPlan(planId);
    if (!plan || (plan.studentId !== user.id && plan.coachId !== user.id)) throw AppError.notFound('Plan');
    const otherId = plan.studentId === user.id ? plan.coachId : plan.studentId;
    const other = await userRepository.findById(otherId);
    const base = publicUrl();
    await sequelize.transaction(async (transaction) => {
      const r = await coachingRepository.createReply({ planId: plan.id, authorId: user.id, text: input.text }, transaction);
      await audit(
        { actorId: user.id, action: 'coach.plan_replied', subjectType: 'plan', subjectId: plan.id, details: { replyId: r.id } },
        transaction,
      );
      if (other) {
        const toCoach = other.id === plan.coachId;
        const body = mailBody(
          [`Hello ${other.displayName},`, '', `${user.displayName} answered the plan "${plan.title}":`, '', ...input.text.split('\n')],
          toCoach
            ? { href: `${base}/coach?student=${plan.studentId}`, label: 'See it under Coach' }
            : { href: `${base}/`, label: 'See it on your Lanewright home' },
        );
        await enqueueMail(
          [
            {
              to: other.email,
              kind: 'coach_plan_reply',
              ref: String(r.id),
              subject: `${user.displayName} answered: ${plan.title}`.slice(0, 200),
              ...body,
            },
          ],
          transaction,
        );
      }
    });
    return toPlanDto((await coachingRepository.findPlan(plan.id))!);
  },
};
