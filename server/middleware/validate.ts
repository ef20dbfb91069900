import type { NextFunction, Request, Response } from 'express';
import type { z } from 'zod';
import { AppError } from '../lib/AppError';

type SchemaOrPicker = z.ZodType | ((input: unknown) => z.ZodType);

interface Schemas {
  params?: SchemaOrPicker;
  query?: SchemaOrPicker;
  /** A schema, or a function choosing one from the raw body (for bodies of two kinds). */
  body?: SchemaOrPicker;
}

/** Turns zod issues into `{ "body.email": "message" }`, first message per field. */
export function fieldErrors(part: string, error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = [part, ...issue.path.map(String)].join('.');
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}

/**
 * The one validation middleware: parses params, query and body with their schemas, reports every bad
 * field at once (400, code validation_failed), and replaces each request part with its parsed value.
 */
export function validate(schemas: Schemas) {
  return (req: Request, _res: Response, next: NextFunction): void => {
    const fields: Record<string, string> = {};
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const input: unknown = part === 'body' && req.body === undefined ? {} : req[part];
      const result = (typeof schema === 'function' ? schema(input) : schema).safeParse(input);
      if (result.success) {
        // Express 5 exposes req.query as a getter; define the parsed value in its place.
        Object.defineProperty(req, part, { value: result.data, writable: true, configurable: true, enumerable: true });
      } else {
        Object.assign(fields, fieldErrors(part, result.error));
      }
    }
    if (Object.keys(fields).length > 0) {
      next(AppError.badRequest('Some fields are not valid', fields));
      return;
    }
    next();
  };
}
