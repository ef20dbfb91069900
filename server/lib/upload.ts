import type { NextFunction, Request, Response } from 'express';
import multer from 'multer';
import { parse } from 'csv-parse/sync';
import type { z } from 'zod';
import { AppError } from './AppError';

const MAX_CSV_BYTES = 1024 * 1024;
const CSV_TYPES = new Set(['text/csv', 'application/csv', 'text/plain', 'application/vnd.ms-excel']);

const csvUpload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_CSV_BYTES, files: 1, fields: 10 },
  fileFilter: (_req, file, cb) => {
    if (!/\.csv$/i.test(file.originalname) || !CSV_TYPES.has(file.mimetype)) {
      cb(new AppError(400, 'unsupported_file', 'Upload a .csv file', { file: 'The file must be a CSV (.csv, text/csv)' }));
      return;
    }
    cb(null, true);
  },
});

const patternUpload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: 256 * 1024, files: 1, fields: 10 },
  fileFilter: (_req, file, cb) => {
    if (!/\.(json|csv)$/i.test(file.originalname) || !(CSV_TYPES.has(file.mimetype) || file.mimetype === 'application/json')) {
      cb(
        new AppError(400, 'unsupported_file', 'Upload a .json or .csv pattern file', {
          file: 'The file must be Lanewright JSON (.json) or CSV (.csv)',
        }),
      );
      return;
    }
    cb(null, true);
  },
});

const imageUpload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: 2 * 1024 * 1024, files: 1, fields: 5 },
  fileFilter: (_req, file, cb) => {
    if (!['image/png', 'image/jpeg', 'image/webp'].includes(file.mimetype)) {
      cb(new AppError(400, 'unsupported_file', 'Upload a PNG, JPEG or WebP photo', { file: 'The photo must be PNG, JPEG or WebP' }));
      return;
    }
    cb(null, true);
  },
});

/** Accepts one multipart field "file" holding a photo (PNG, JPEG or WebP, at most 2 MiB). */
export function imageFile(req: Request, res: Response, next: NextFunction): void {
  singleFile(imageUpload, req, res, next);
}

/** Accepts one multipart field "file" holding a CSV of at most 1 MiB; maps multer's errors onto the error shape. */
export function csvFile(req: Request, res: Response, next: NextFunction): void {
  singleFile(csvUpload, req, res, next);
}

/** Accepts one multipart field "file" holding a pattern file (.json or .csv, at most 256 KiB). */
export function patternFile(req: Request, res: Response, next: NextFunction): void {
  singleFile(patternUpload, req, res, next);
}

function singleFile(upload: multer.Multer, req: Request, res: Response, next: NextFunction): void {
  upload.single('file')(req, res, (err: unknown) => {
    if (!err) {
      if (!req.file) return next(new AppError(400, 'file_required', 'Attach a file in the field "file"', { file: 'A file is required' }));
      return next();
    }
    if (err instanceof AppError) return next(err);
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, 'payload_too_large', 'The file is too large'));
      return next(new AppError(400, 'bad_upload', `The upload could not be read (${err.code})`, { file: err.message }));
    }
    return next(new AppError(400, 'bad_upload', 'The upload could not be read'));
  });
}

export interface RowError {
  line: number;
  field: string;
  message: string;
}

/**
 * Parses a CSV with a header row and validates every row with `rowSchema` (after `coerce`).
 * All or nothing: any bad row → AppError 400 listing each row's errors by line; otherwise the parsed rows.
 */
export function parseCsvRows<T>(
  buf: Buffer,
  rowSchema: z.ZodType<T>,
  coerce: (raw: Record<string, string>) => unknown,
  maxRows = 2000,
): T[] {
  let records: Record<string, string>[];
  try {
    records = parse(buf, {
      columns: (h: string[]) => h.map((x) => x.trim()),
      skip_empty_lines: true,
      trim: true,
      bom: true,
      max_record_size: 10000,
    });
  } catch (e) {
    const line = (e as { lines?: number }).lines;
    throw new AppError(400, 'csv_malformed', `The CSV could not be parsed${line ? ` near line ${line}` : ''}`, {
      file: (e as Error).message,
    });
  }
  if (records.length === 0) throw new AppError(400, 'csv_empty', 'The CSV has no data rows', { file: 'No rows after the header' });
  if (records.length > maxRows)
    throw new AppError(400, 'csv_too_many_rows', `At most ${maxRows} rows per file`, { file: `${records.length} rows` });
  const errors: RowError[] = [];
  const out: T[] = [];
  records.forEach((raw, i) => {
    const line = i + 2; // line 1 is the header
    const r = rowSchema.safeParse(coerce(raw));
    if (r.success) out.push(r.data);
    else for (const issue of r.error.issues) errors.push({ line, field: issue.path.join('.') || '(row)', message: issue.message });
  });
  if (errors.length > 0) {
    const fields: Record<string, string> = {};
    for (const e of errors) fields[`rows.${e.line}.${e.field}`] ??= e.message;
    throw new AppError(
      400,
      'csv_invalid_rows',
      `${new Set(errors.map((e) => e.line)).size} row(s) have errors; nothing was imported`,
      fields,
    );
  }
  return out;
}

/** CSV cell helpers: '' → undefined, numbers and booleans from text. */
export const cell = {
  num(v: string | undefined): number | undefined | string {
    if (v === undefined || v === '') return undefined;
    const n = Number(v);
    return Number.isFinite(n) ? n : v;
  },
  bool(v: string | undefined): boolean | undefined | string {
    if (v === undefined || v === '') return undefined;
    if (/^(true|yes|1|y)$/i.test(v)) return true;
    if (/^(false|no|0|n)$/i.test(v)) return false;
    return v;
  },
  str(v: string | undefined): string | undefined {
    return v === undefined || v === '' ? undefined : v;
  },
};

/** The file the upload middleware accepted (it answers 400 file_required before the handler when there is none). */
export function uploadedFile(req: Request): Express.Multer.File {
  if (!req.file) throw new AppError(400, 'file_required', 'Attach a file in the field "file"', { file: 'A file is required' });
  return req.file;
}
