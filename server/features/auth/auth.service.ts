import bcrypt from 'bcryptjs';
import crypto from 'node:crypto';
import type { Transaction } from 'sequelize';
import type { AuthResponse, LoginInput, RegisterInput, RegisterResponse, User as UserDto } from '../../../shared/auth';
import { config } from '../../config/index';
import { AppError } from '../../lib/AppError';
import { enqueueMail } from '../../lib/outbox';
import { assertStrongPassword } from '../../lib/passwordPolicy';
import { linkTo } from '../../lib/publicUrl';
import { sequelize } from '../../models/index';
import { signToken } from '../../middleware/auth';
import { toUserDto, userRepository } from './user.repository';

const RESET_TTL_MS = 60 * 60 * 1000;
const VERIFY_TTL_MS = 48 * 60 * 60 * 1000;
/** A hash to compare against when the e-mail is unknown, so both paths take the same time. */
const DUMMY_HASH = bcrypt.hashSync('lanewright-timing-equaliser', config.BCRYPT_COST);

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, config.BCRYPT_COST);
}

function sha256(s: string): string {
  return crypto.createHash('sha256').update(s).digest('hex');
}

const newToken = () => crypto.randomBytes(32).toString('base64url');

/** The one answer to every sign-up (new address or taken): what happens next is in the mail. */
export const REGISTER_ANSWER: RegisterResponse = {
  ok: true,
  message:
    'Thanks. We sent a message to this address: follow its link to confirm it. If the address already has an account, the message says how to sign in or reset the password.',
};

/**
 * Per-account backoff after failed sign-ins, beside the per-address limit (rateLimit.ts): after
 * LOGIN_FAILURES_BEFORE_BACKOFF failures of one e-mail within 15 minutes, from any number of addresses,
 * each further attempt must wait 1 s, 2 s, 4 s … (at most 15 minutes) after the last failure — the right
 * password included (OWASP, "Authentication Cheat Sheet": account lockout / throttling; NIST SP 800-63B
 * §5.2.2 rate limiting). Kept by e-mail, known or not, so the answer says nothing about which accounts exist.
 */
const BACKOFF_WINDOW_MS = 15 * 60 * 1000;
const BACKOFF_MAX_MS = 15 * 60 * 1000;

/** When the next attempt for this e-mail may be made (0: now). Kept in PostgreSQL (login_failures), shared by every process. */
async function backoffUntil(email: string): Promise<number> {
  const f = await userRepository.recentLoginFailures(email, BACKOFF_WINDOW_MS);
  if (!f || f.count < config.LOGIN_FAILURES_BEFORE_BACKOFF) return 0;
  return new Date(f.last_at).getTime() + Math.min(BACKOFF_MAX_MS, 1000 * 2 ** (f.count - config.LOGIN_FAILURES_BEFORE_BACKOFF));
}

/** One more failure within the window (a failure after the window starts a new count). */
const noteFailure = (email: string) => userRepository.noteLoginFailure(email, BACKOFF_WINDOW_MS);
const clearFailures = (email: string) => userRepository.clearLoginFailures(email);

async function enqueueVerification(user: { id: number; email: string; displayName: string }, transaction: Transaction): Promise<void> {
  const token = newToken();
  await userRepository.replaceVerification(user.id, sha256(token), new Date(Date.now() + VERIFY_TTL_MS), transaction);
  const link = linkTo(`/verify-email?token=${token}`);
  await enqueueMail(
    [
      {
        to: user.email,
        kind: 'email_verification',
        ref: String(user.id),
        subject: 'Confirm your e-mail address for Lanewright',
        text: `Hello ${user.displayName},\n\nPlease confirm that this is your address by opening this link within 48 hours:\n\n${link}\n\nUntil then you can use Lanewright, but not accept a coach's invitation.\nIf you did not create a Lanewright account, ignore this message.\n`,
      },
    ],
    transaction,
  );
}

export const authService = {
  /**
   * Sign-up. The same work and the same answer whether the address is new or taken (OWASP, "Authentication
   * Cheat Sheet": account enumeration): the password is hashed, one INSERT … ON CONFLICT DO NOTHING runs, and
   * one mail goes out through the outbox — a verification link to a new account, a "you already have an
   * account" note (with the sign-in and reset links) to a taken address.
   */
  async register(input: RegisterInput): Promise<RegisterResponse> {
    assertStrongPassword(input.password, input);
    const passwordHash = await hashPassword(input.password);
    await sequelize.transaction(async (transaction) => {
      const id = await userRepository.insertIfNew({ email: input.email, passwordHash, displayName: input.displayName }, transaction);
      if (id !== null) {
        await enqueueVerification({ id, email: input.email, displayName: input.displayName }, transaction);
        return;
      }
      await enqueueMail(
        [
          {
            to: input.email,
            kind: 'signup_existing',
            ref: null,
            subject: 'You already have a Lanewright account',
            text: `Hello,\n\nSomeone (perhaps you) tried to create a Lanewright account with this address, which already has one.\n\nSign in: ${linkTo('/sign-in')}\nForgot the password? ${linkTo('/reset-password')}\n\nIf it was not you, ignore this message; nothing changed.\n`,
          },
        ],
        transaction,
      );
    });
    return REGISTER_ANSWER;
  },

  async login(input: LoginInput): Promise<AuthResponse> {
    const until = await backoffUntil(input.email);
    if (until > Date.now()) {
      throw new AppError(
        429,
        'too_many_failures',
        'Too many failed sign-ins for this account; wait a moment and try again',
        undefined,
        Math.ceil((until - Date.now()) / 1000),
      );
    }
    const user = await userRepository.findByEmail(input.email);
    const ok = await bcrypt.compare(input.password, user?.passwordHash ?? DUMMY_HASH);
    if (!user || !ok) {
      await noteFailure(input.email);
      throw new AppError(401, 'invalid_credentials', 'E-mail or password is not correct');
    }
    await clearFailures(input.email);
    return { token: signToken(user), user: toUserDto(user) };
  },

  async me(id: number): Promise<UserDto> {
    const user = await userRepository.findById(id);
    if (!user) throw AppError.unauthorized();
    return toUserDto(user);
  },

  /**
   * Mails a one-hour reset link when the account exists. The caller answers before this runs (in the
   * background), so the answer and its timing are the same for every address. Issuing a link closes any
   * older open one: a user has at most one working reset link.
   */
  async sendReset(email: string): Promise<void> {
    await sequelize.transaction(async (transaction) => {
      const found = await userRepository.findByEmail(email, transaction);
      if (!found) return;
      const user = (await userRepository.findById(found.id, transaction, true))!; // row lock: concurrent requests queue here
      const token = newToken();
      await userRepository.replaceReset(user.id, sha256(token), new Date(Date.now() + RESET_TTL_MS), transaction);
      const link = linkTo(`/reset-password?token=${token}`);
      await enqueueMail(
        [
          {
            to: user.email,
            kind: 'password_reset',
            ref: String(user.id),
            subject: 'Reset your Lanewright password',
            text: `Hello ${user.displayName},\n\nSomeone asked to reset the password of your Lanewright account. Open this link within an hour to choose a new one:\n\n${link}\n\nAny earlier reset link no longer works. If it was not you, ignore this message; your password stays as it is.\n`,
          },
        ],
        transaction,
      );
    });
  },

  /** Sets a new password from a valid, unused, unexpired token; every reset link and every older session of the user ends. */
  async reset(token: string, password: string): Promise<void> {
    await sequelize.transaction(async (transaction) => {
      const reset = await userRepository.findReset(sha256(token), transaction);
      if (!reset || reset.usedAt || reset.expiresAt.getTime() < Date.now()) {
        throw new AppError(400, 'invalid_token', 'This reset link is invalid or has expired', { 'body.token': 'Request a new reset link' });
      }
      const user = await userRepository.findById(reset.userId, transaction, true);
      if (!user) throw new AppError(400, 'invalid_token', 'This reset link is invalid or has expired');
      assertStrongPassword(password, user);
      user.passwordHash = await hashPassword(password);
      user.tokenVersion += 1;
      // The link arrived at the address: it is the user's.
      user.emailVerifiedAt ??= new Date();
      await user.save({ transaction });
      await userRepository.closeResets(user.id, transaction);
      await userRepository.clearLoginFailures(user.email, transaction);
    });
  },

  /** Marks the address verified from the mailed token (once; an expired or used token is a 400). */
  async verifyEmail(token: string): Promise<UserDto> {
    return sequelize.transaction(async (transaction) => {
      const v = await userRepository.findVerification(sha256(token), transaction);
      if (!v || v.usedAt || v.expiresAt.getTime() < Date.now()) {
        throw new AppError(400, 'invalid_token', 'This verification link is invalid or has expired', {
          'body.token': 'Sign in and ask for a new verification link',
        });
      }
      const user = (await userRepository.findById(v.userId, transaction, true))!;
      user.emailVerifiedAt ??= new Date();
      await user.save({ transaction });
      v.usedAt = new Date();
      await v.save({ transaction });
      return toUserDto(user);
    });
  },

  /** A new verification link for the signed-in user (the older one stops working); nothing when already verified. */
  async resendVerification(userId: number): Promise<{ ok: true; alreadyVerified: boolean }> {
    return sequelize.transaction(async (transaction) => {
      const user = await userRepository.findById(userId, transaction, true);
      if (!user) throw AppError.unauthorized();
      if (user.emailVerifiedAt) return { ok: true as const, alreadyVerified: true };
      await enqueueVerification(user, transaction);
      return { ok: true as const, alreadyVerified: false };
    });
  },
};
