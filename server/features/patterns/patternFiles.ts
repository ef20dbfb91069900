import { parse as parseCsv } from 'csv-parse/sync';
import { findNodeAtLocation, parseTree, type ParseError, parse as parseJsonc } from 'jsonc-parser';
import type { Sweep } from '../../../engine/types';
import { PatternInputSchema, SweepSchema, type PatternInput } from '../../../shared/patterns';
import { AppError } from '../../lib/AppError';
import { exceedsJsonDepth, MAX_JSON_DEPTH } from '../../lib/jsonDepth';

/**
 * Lanewright's own pattern files.
 * JSON: { "format": "lanewright-pattern", "version": 1, "name", "description"?, "sweeps": [Sweep…] }.
 * CSV:  "# lanewright-pattern v1", "# name: …", optional "# description: …", then the header
 *       direction,fromBoard,toBoard,startFt,endFt,crossings,microlitersPerBoard and one sweep per line.
 */
export const PATTERN_FORMAT = 'lanewright-pattern';
export const SWEEP_COLUMNS = ['direction', 'fromBoard', 'toBoard', 'startFt', 'endFt', 'crossings', 'microlitersPerBoard'] as const;

export function patternToJson(p: { name: string; description: string | null; sweeps: Sweep[] }): string {
  return `${JSON.stringify({ format: PATTERN_FORMAT, version: 1, name: p.name, ...(p.description ? { description: p.description } : {}), sweeps: p.sweeps }, null, 2)}\n`;
}

/**
 * One CSV cell that a spreadsheet opens as text: a cell starting with = + - @, a tab or a carriage return
 * gets a leading apostrophe so it is never read as a formula (OWASP, "CSV Injection"), and a cell holding
 * a comma, quote or line break is quoted with its quotes doubled (RFC 4180), so no text starts a new cell.
 */
export function csvCell(v: string | number): string {
  if (typeof v === 'number') return String(v);
  const s = /^[=+\-@\t\r]/.test(v) ? `'${v}` : v;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function patternToCsv(p: { name: string; description: string | null; sweeps: Sweep[] }): string {
  const oneLine = (s: string) => s.replace(/[\r\n]+/g, ' ');
  return (
    [
      `# ${PATTERN_FORMAT} v1`,
      // A name is free text: the whole comment line is one cell (quoted when it holds a comma or quote).
      csvCell(`# name: ${oneLine(p.name)}`),
      ...(p.description ? [csvCell(`# description: ${oneLine(p.description)}`)] : []),
      SWEEP_COLUMNS.join(','),
      ...p.sweeps.map((s) => SWEEP_COLUMNS.map((c) => csvCell(s[c])).join(',')),
    ].join('\n') + '\n'
  );
}

function lineOf(text: string, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset && i < text.length; i++) if (text.charCodeAt(i) === 10) line++;
  return line;
}

function fail(fields: Record<string, string>): never {
  const lines = new Set(Object.keys(fields).map((k) => k.split('.')[1]));
  throw new AppError(400, 'invalid_pattern_file', `The file has errors on ${lines.size} line(s); nothing was saved`, fields);
}

function fromJson(text: string): PatternInput {
  // The parser recurses per level: refuse a document nested past any real pattern file before it runs.
  if (exceedsJsonDepth(text)) fail({ 'lines.1.json': `The file nests deeper than ${MAX_JSON_DEPTH} levels; a pattern file needs three` });
  const errors: ParseError[] = [];
  const data: unknown = parseJsonc(text, errors, { allowTrailingComma: false, disallowComments: true });
  if (errors.length)
    fail(Object.fromEntries(errors.slice(0, 20).map((e) => [`lines.${lineOf(text, e.offset)}.json`, 'This is not valid JSON here'])));
  const root = parseTree(text);
  const obj = (data ?? {}) as Record<string, unknown>;
  const fields: Record<string, string> = {};
  if (obj.format !== PATTERN_FORMAT) fields['lines.1.format'] = `The file must say "format": "${PATTERN_FORMAT}"`;
  const parsed = PatternInputSchema.safeParse({ name: obj.name, description: obj.description ?? null, sweeps: obj.sweeps });
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const node = root
        ? (findNodeAtLocation(root, issue.path as (string | number)[]) ??
          findNodeAtLocation(root, issue.path.slice(0, -1) as (string | number)[]))
        : undefined;
      const line = node ? lineOf(text, node.offset) : 1;
      fields[`lines.${line}.${issue.path.join('.') || 'file'}`] ??= issue.message;
    }
  }
  if (Object.keys(fields).length) fail(fields);
  return parsed.data!;
}

function fromCsv(text: string): PatternInput {
  const lines = text.split(/\r?\n/);
  const fields: Record<string, string> = {};
  let name = '';
  let description: string | null = null;
  let headerIdx = -1;
  for (let i = 0; i < lines.length; i++) {
    let l = lines[i].trim();
    if (l === '') continue;
    // A comment line written as one quoted cell (the export does this when the text holds a comma or quote).
    if (l.startsWith('"#')) {
      try {
        l = String((parseCsv(l, { relax_quotes: true }) as string[][])[0]?.[0] ?? '');
      } catch {
        fail({ [`lines.${i + 1}.csv`]: 'This line is not valid CSV' });
      }
    }
    if (l.startsWith('#')) {
      const m = /^#\s*(name|description)\s*:\s*(.*)$/i.exec(l);
      if (m && m[1].toLowerCase() === 'name') name = m[2].trim();
      else if (m) description = m[2].trim() || null;
      continue;
    }
    headerIdx = i;
    break;
  }
  if (headerIdx < 0) fail({ 'lines.1.header': `Missing the header line ${SWEEP_COLUMNS.join(',')}` });
  const header = lines[headerIdx].split(',').map((h) => h.trim());
  const missing = SWEEP_COLUMNS.filter((c) => !header.includes(c));
  if (missing.length) fail({ [`lines.${headerIdx + 1}.header`]: `Missing column(s): ${missing.join(', ')}` });
  let records: { record: Record<string, string>; info: { lines: number } }[];
  try {
    records = parseCsv(lines.slice(headerIdx).join('\n'), { columns: true, skip_empty_lines: true, trim: true, info: true, comment: '#' });
  } catch (e) {
    fail({ [`lines.${headerIdx + ((e as { lines?: number }).lines ?? 1)}.csv`]: 'This line is not valid CSV' });
  }
  if (!name) fields['lines.1.name'] = 'Add a line "# name: …" before the header';
  const sweeps: Sweep[] = [];
  for (const { record, info } of records) {
    const line = headerIdx + info.lines;
    const num = (v: string | undefined) => (v === undefined || v === '' || !Number.isFinite(Number(v)) ? v : Number(v));
    const r = SweepSchema.safeParse({
      direction: record.direction,
      fromBoard: num(record.fromBoard),
      toBoard: num(record.toBoard),
      startFt: num(record.startFt),
      endFt: num(record.endFt),
      crossings: num(record.crossings),
      microlitersPerBoard: num(record.microlitersPerBoard),
    });
    if (r.success) sweeps.push(r.data);
    else for (const issue of r.error.issues) fields[`lines.${line}.${issue.path.join('.') || 'row'}`] ??= issue.message;
  }
  if (records.length === 0) fields[`lines.${headerIdx + 1}.sweeps`] = 'No sweep lines after the header';
  const whole = PatternInputSchema.safeParse({ name, description, sweeps });
  if (!whole.success && Object.keys(fields).length === 0) fields['lines.1.file'] = whole.error.issues[0].message;
  if (Object.keys(fields).length) fail(fields);
  return whole.data!;
}

/** Reads an uploaded pattern file (.json or .csv); all errors by line number, nothing partial. */
export function parsePatternFile(filename: string, buf: Buffer): PatternInput {
  const text = buf.toString('utf8').replace(/^\uFEFF/, '');
  if (/\.json$/i.test(filename)) return fromJson(text);
  if (/\.csv$/i.test(filename)) return fromCsv(text);
  throw new AppError(400, 'unsupported_file', 'Upload a .json or .csv pattern file', { file: 'Only .json and .csv' });
}
