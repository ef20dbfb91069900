import { Op, QueryTypes, type Transaction, type WhereOptions } from 'sequelize';
import type { Role, User as UserDto, UserListQuery } from '../../../shared/auth';
import { EmailVerification, PasswordReset, sequelize, User } from '../../models/index';

export function toUserDto(u: User): UserDto {
  return {
    id: u.id,
    email: u.email,
    displayName: u.displayName,
    role: u.role,
    roles: u.roles,
    emailVerified: u.emailVerifiedAt != null,
    createdAt: u.createdAt.toISOString(),
  };
}

export const userRepository = {
  /** The failed sign-ins for an e-mail within the last `windowMs` (login_failures, read from the primary), or none. */
  async recentLoginFailures(email: string, windowMs: number): Promise<{ count: number; last_at: Date } | undefined> {
    const [f] = await sequelize.query<{ count: number; last_at: Date }>(
      'SELECT count, last_at FROM login_failures WHERE email = :email AND last_at > now() - make_interval(secs => :window)',
      {
        replacements: { email, window: windowMs / 1000 },
        type: QueryTypes.SELECT,
        useMaster: true,
      },
    );
    return f;
  },
  /** Counts one more failed sign-in for an e-mail (one older than `windowMs` starts the count again). */
  async noteLoginFailure(email: string, windowMs: number): Promise<void> {
    await sequelize.query(
      `INSERT INTO login_failures (email, count, last_at) VALUES (:email, 1, now())
     ON CONFLICT (email) DO UPDATE SET count = CASE WHEN login_failures.last_at <= now() - make_interval(secs => :window) THEN 1 ELSE login_failures.count + 1 END, last_at = now()`,
      { replacements: { email, window: windowMs / 1000 } },
    );
  },
  async clearLoginFailures(email: string, transaction?: Transaction): Promise<void> {
    await sequelize.query('DELETE FROM login_failures WHERE email = :email', { replacements: { email }, transaction });
  },
  findByEmail(email: string, transaction?: Transaction): Promise<User | null> {
    return User.findOne({ where: { email }, transaction });
  },
  findById(id: number, transaction?: Transaction, lock = false): Promise<User | null> {
    return User.findByPk(id, { transaction, ...(lock && transaction ? { lock: transaction.LOCK.UPDATE } : {}) });
  },
  create(data: { email: string; passwordHash: string; displayName: string; role?: Role }, transaction?: Transaction): Promise<User> {
    return User.create(data, { transaction });
  },
  /**
   * Inserts a bowler unless the e-mail is taken, in one statement (INSERT … ON CONFLICT DO NOTHING): a
   * concurrent sign-up of the same address never raises a unique violation. Returns the new id, or null.
   */
  async insertIfNew(data: { email: string; passwordHash: string; displayName: string }, transaction: Transaction): Promise<number | null> {
    const rows = await sequelize.query<{ id: number }>(
      `INSERT INTO users (email, password_hash, display_name, role, token_version, created_at, updated_at)
       VALUES (:email, :passwordHash, :displayName, 'bowler', 0, now(), now())
       ON CONFLICT (email) DO NOTHING RETURNING id`,
      { replacements: data, type: QueryTypes.SELECT, transaction },
    );
    return rows[0]?.id ?? null;
  },
  async list(q: UserListQuery): Promise<{ rows: User[]; count: number }> {
    const where: WhereOptions<User> = {};
    if (q.role) Object.assign(where, { roles: { [Op.contains]: [q.role] } });
    if (q.q) {
      const like = `%${q.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
      Object.assign(where, { [Op.or]: [{ email: { [Op.iLike]: like } }, { displayName: { [Op.iLike]: like } }] });
    }
    return User.findAndCountAll({
      where,
      order: [
        [q.sort, q.order.toUpperCase()],
        ['id', 'ASC'],
      ],
      limit: q.pageSize,
      offset: (q.page - 1) * q.pageSize,
    });
  },
  async setRole(user: User, role: Role, transaction?: Transaction): Promise<User> {
    user.role = role;
    return user.save({ transaction });
  },
  /** Replaces the user's roles (the model's hook sets `role` to the highest). */
  async setRoles(user: User, roles: Role[], transaction?: Transaction): Promise<User> {
    user.roles = roles;
    return user.save({ transaction });
  },
  /** Display names of users by id (for lists that show who did what). */
  async namesByIds(ids: number[]): Promise<Map<number, string>> {
    if (ids.length === 0) return new Map();
    const rows = await User.findAll({ where: { id: ids }, attributes: ['id', 'displayName'] });
    return new Map(rows.map((u) => [u.id, u.displayName]));
  },
  /** Closes every open reset token of the user (a newer one replaces them, or one was used). */
  closeResets(userId: number, transaction: Transaction): Promise<unknown> {
    return PasswordReset.update({ usedAt: new Date() }, { where: { userId, usedAt: null }, transaction });
  },
  /** The user's one open reset token: older open ones are closed in the same transaction (the caller holds the user's row lock). */
  async replaceReset(userId: number, tokenHash: string, expiresAt: Date, transaction: Transaction): Promise<PasswordReset> {
    await this.closeResets(userId, transaction);
    return PasswordReset.create({ userId, tokenHash, expiresAt, usedAt: null }, { transaction });
  },
  findReset(tokenHash: string, transaction?: Transaction): Promise<PasswordReset | null> {
    return PasswordReset.findOne({ where: { tokenHash }, transaction, lock: transaction ? true : undefined });
  },
  /** The user's one open verification token (older open ones closed first). */
  async replaceVerification(userId: number, tokenHash: string, expiresAt: Date, transaction: Transaction): Promise<EmailVerification> {
    await EmailVerification.update({ usedAt: new Date() }, { where: { userId, usedAt: null }, transaction });
    return EmailVerification.create({ userId, tokenHash, expiresAt, usedAt: null }, { transaction });
  },
  findVerification(tokenHash: string, transaction: Transaction): Promise<EmailVerification | null> {
    return EmailVerification.findOne({ where: { tokenHash }, transaction, lock: transaction.LOCK.UPDATE });
  },
};
