import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { Role, User as UserDto, UserListQuery } from '../../../shared/auth';
import { PasswordReset, User } from '../../models/index';

export function toUserDto(u: User): UserDto {
  return { id: u.id, email: u.email, displayName: u.displayName, role: u.role, createdAt: u.createdAt.toISOString() };
}

export const userRepository = {
  findByEmail(email: string): Promise<User | null> {
    return User.findOne({ where: { email } });
  },
  findById(id: number): Promise<User | null> {
    return User.findByPk(id);
  },
  create(data: { email: string; passwordHash: string; displayName: string; role?: Role }, transaction?: Transaction): Promise<User> {
    return User.create(data, { transaction });
  },
  async list(q: UserListQuery): Promise<{ rows: User[]; count: number }> {
    const where: WhereOptions<User> = {};
    if (q.role) Object.assign(where, { role: q.role });
    if (q.q) {
      const like = `%${q.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
      Object.assign(where, { [Op.or]: [{ email: { [Op.iLike]: like } }, { displayName: { [Op.iLike]: like } }] });
    }
    return User.findAndCountAll({
      where,
      order: [[q.sort, q.order.toUpperCase()], ['id', 'ASC']],
      limit: q.pageSize,
      offset: (q.page - 1) * q.pageSize,
    });
  },
  async setRole(user: User, role: Role, transaction?: Transaction): Promise<User> {
    user.role = role;
    return user.save({ transaction });
  },
  createReset(userId: number, tokenHash: string, expiresAt: Date): Promise<PasswordReset> {
    return PasswordReset.create({ userId, tokenHash, expiresAt, usedAt: null });
  },
  findReset(tokenHash: string, transaction?: Transaction): Promise<PasswordReset | null> {
    return PasswordReset.findOne({ where: { tokenHash }, transaction, lock: transaction ? true : undefined });
  },
};
