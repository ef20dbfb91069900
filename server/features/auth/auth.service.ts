import bcrypt from 'bcryptjs';
import crypto from 'node:crypto';
import type { AuthResponse, LoginInput, RegisterInput, User as UserDto } from '../../../shared/auth';
import { config } from '../../config/index';
import { AppError } from '../../lib/AppError';
import { enqueueMail } from '../../lib/outbox';
import { sequelize } from '../../models/index';
import { forgetAuthUser, signToken } from '../../middleware/auth';
import { toUserDto, userRepository } from './user.repository';

const RESET_TTL_MS = 60 * 60 * 1000;
/** A hash to compare against when the e-mail is unknown, so both paths take the same time. */
const DUMMY_HASH = bcrypt.hashSync('lanewright-timing-equaliser', config.BCRYPT_COST);

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, config.BCRYPT_COST);
}

function sha256(s: string): string {
  return crypto.createHash('sha256').update(s).digest('hex');
}

function isUniqueViolation(err: unknown): boolean {
  return (err as { name?: string })?.name === 'SequelizeUniqueConstraintError';
}

export const authService = {
  async register(input: RegisterInput): Promise<AuthResponse> {
    const passwordHash = await hashPassword(input.password);
    try {
      const user = await userRepository.create({ email: input.email, passwordHash, displayName: input.displayName });
      return { token: signToken(user), user: toUserDto(user) };
    } catch (err) {
      if (isUniqueViolation(err)) throw new AppError(409, 'email_taken', 'An account with this e-mail already exists', { 'body.email': 'This e-mail is already registered' });
      throw err;
    }
  },

  async login(input: LoginInput): Promise<AuthResponse> {
    const user = await userRepository.findByEmail(input.email);
    const ok = await bcrypt.compare(input.password, user?.passwordHash ?? DUMMY_HASH);
    if (!user || !ok) throw new AppError(401, 'invalid_credentials', 'E-mail or password is not correct');
    return { token: signToken(user), user: toUserDto(user) };
  },

  async me(id: number): Promise<UserDto> {
    const user = await userRepository.findById(id);
    if (!user) throw AppError.unauthorized();
    return toUserDto(user);
  },

  /** Mails a one-hour reset link when the account exists; answers the same either way. */
  async forgot(email: string, origin: string): Promise<void> {
    const user = await userRepository.findByEmail(email);
    if (!user) return;
    const token = crypto.randomBytes(32).toString('base64url');
    await userRepository.createReset(user.id, sha256(token), new Date(Date.now() + RESET_TTL_MS));
    const link = `${config.PUBLIC_URL || origin}/reset-password?token=${token}`;
    await enqueueMail([
      {
        to: user.email,
        kind: 'password_reset',
        ref: String(user.id),
        subject: 'Reset your Lanewright password',
        text: `Hello ${user.displayName},\n\nSomeone asked to reset the password of your Lanewright account. Open this link within an hour to choose a new one:\n\n${link}\n\nIf it was not you, ignore this message; your password stays as it is.\n`,
      },
    ]);
  },

  /** Sets a new password from a valid, unused, unexpired token; every older session ends. */
  async reset(token: string, password: string): Promise<void> {
    const passwordHash = await hashPassword(password);
    await sequelize.transaction(async (transaction) => {
      const reset = await userRepository.findReset(sha256(token), transaction);
      if (!reset || reset.usedAt || reset.expiresAt.getTime() < Date.now()) {
        throw new AppError(400, 'invalid_token', 'This reset link is invalid or has expired', { 'body.token': 'Request a new reset link' });
      }
      const user = await userRepository.findById(reset.userId);
      if (!user) throw new AppError(400, 'invalid_token', 'This reset link is invalid or has expired');
      user.passwordHash = passwordHash;
      user.tokenVersion += 1;
      await user.save({ transaction });
      reset.usedAt = new Date();
      await reset.save({ transaction });
      transaction.afterCommit(() => forgetAuthUser(user.id));
    });
  },
};
