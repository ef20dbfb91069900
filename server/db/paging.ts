import type { OrderItem } from 'sequelize';

/** Newest first, ties broken by id: the order of every list of records as they were made. */
export const NEWEST_FIRST: OrderItem[] = [
  ['createdAt', 'DESC'],
  ['id', 'DESC'],
];

/** One page of a list newest first (pages count from 1): the order, limit and offset of a find. */
export function newestFirstPage(page: number, pageSize: number): { order: OrderItem[]; limit: number; offset: number } {
  return { order: NEWEST_FIRST, limit: pageSize, offset: (page - 1) * pageSize };
}
