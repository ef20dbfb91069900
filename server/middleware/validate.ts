import type { z } from 'zod';

/**
 * Turns zod issues into `{ "body.email": "message" }`, first message per field. Route input is validated by the
 * route table (`server/http/route.ts`); services that check a stored or received value use this for its fields.
 */
export function fieldErrors(part: string, error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = [part, ...issue.path.map(String)].join('.');
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}
