import { z } from 'zod';

/** A page of a list: `{ items, total, page, pageSize }`. */
export const pageOf = <T extends z.ZodType>(item: T) =>
  z.object({ items: z.array(item), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() });
/** A single record: `{ item }`. */
export const itemOf = <T extends z.ZodType>(item: T) => z.object({ item });
/** A list without paging: `{ items }`. */
export const itemsOf = <T extends z.ZodType>(item: T) => z.object({ items: z.array(item) });

/**
 * A value the engine computes and the API passes through as it is (its TypeScript type lives in engine/): typed
 * for server and client, documented as an object with a description.
 */
export const engineValue = <T>(description: string) => z.custom<T>(() => true).meta({ type: 'object', description });

export const OkSchema = z.object({ ok: z.literal(true) });
export type Ok = z.infer<typeof OkSchema>;
