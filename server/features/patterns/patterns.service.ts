import { analyzePattern, oilGrid } from '../../../engine/index';
import type { OilPattern } from '../../../engine/types';
import type { Page } from '../../../shared/auth';
import type { PatternDetail, PatternInput, PatternListItem, PatternQuery, PatternSummary } from '../../../shared/patterns';
import type { AuthUser } from '../../middleware/auth';
import { AppError } from '../../lib/AppError';
import { sequelize } from '../../models/index';
import type { Pattern } from '../../models/Pattern';
import { patternToCsv, patternToJson, parsePatternFile } from './patternFiles';
import { patternsRepository, toPatternListItem } from './patterns.repository';

/** The engine's summary of a pattern, JSON-safe (an unbounded ratio becomes null). */
export function summarize(p: OilPattern): PatternSummary {
  let a: ReturnType<typeof analyzePattern>;
  try {
    a = analyzePattern(p);
  } catch (err) {
    // The engine names the function and the bad value; anything zod let through is still the caller's input.
    if (err instanceof RangeError || err instanceof TypeError)
      throw new AppError(400, 'validation_failed', err.message, { 'body.sweeps': err.message });
    throw err;
  }
  return { ...a, ratio: Number.isFinite(a.ratio) ? a.ratio : null };
}

/** Oil grid for charts: every board, every foot to the pattern's end plus 5 ft of dry lane. */
export function gridOf(p: OilPattern, lengthFt: number): PatternDetail['grid'] {
  return oilGrid(p, { boardStep: 1, ftStep: 1, maxFt: Math.min(60, Math.max(10, Math.ceil(lengthFt) + 5)) });
}

function toDetail(p: Pattern): PatternDetail {
  return { ...toPatternListItem(p), sweeps: p.sweeps, grid: gridOf({ name: p.name, sweeps: p.sweeps }, p.summary.lengthFt) };
}

function canEdit(user: AuthUser, p: Pattern): boolean {
  return user.role === 'admin' || p.ownerId === user.id;
}

export const patternsService = {
  async list(q: PatternQuery): Promise<Page<PatternListItem>> {
    const { rows, count } = await patternsRepository.list(q);
    return { items: rows.map(toPatternListItem), total: count, page: q.page, pageSize: q.pageSize };
  },
  async get(id: number): Promise<PatternDetail> {
    const p = await patternsRepository.findById(id);
    if (!p) throw AppError.notFound('Pattern');
    return toDetail(p);
  },
  /** The stored pattern as the engine takes it (404 when unknown). */
  async engineInput(id: number): Promise<{ id: number; name: string; pattern: OilPattern; summary: PatternSummary }> {
    const p = await patternsRepository.findById(id);
    if (!p) throw AppError.notFound('Pattern');
    return { id: p.id, name: p.name, pattern: { name: p.name, sweeps: p.sweeps }, summary: p.summary };
  },
  async create(user: AuthUser, input: PatternInput): Promise<PatternDetail> {
    const p = await patternsRepository.create({
      ownerId: user.id,
      name: input.name,
      description: input.description ?? null,
      sweeps: input.sweeps,
      summary: summarize({ name: input.name, sweeps: input.sweeps }),
    });
    return toDetail(p);
  },
  async update(user: AuthUser, id: number, patch: Partial<PatternInput> & { version: number }): Promise<PatternDetail> {
    return sequelize.transaction(async (transaction) => {
      const p = await patternsRepository.findById(id, transaction);
      if (!p) throw AppError.notFound('Pattern');
      if (!canEdit(user, p)) throw AppError.forbidden('Only the pattern’s owner or an admin can edit it');
      if (p.version !== patch.version)
        throw AppError.conflict('stale_version', 'This pattern was changed elsewhere; reload it and apply your edit again');
      const name = patch.name ?? p.name;
      const sweeps = patch.sweeps ?? p.sweeps;
      p.set({
        name,
        description: patch.description === undefined ? p.description : patch.description,
        sweeps,
        summary: summarize({ name, sweeps }),
      });
      await p.save({ transaction });
      return toDetail(p);
    });
  },
  /** A copy owned by the caller, named "… (copy)". */
  async duplicate(user: AuthUser, id: number): Promise<PatternDetail> {
    const p = await patternsRepository.findById(id);
    if (!p) throw AppError.notFound('Pattern');
    return this.create(user, { name: `${p.name} (copy)`.slice(0, 80), description: p.description, sweeps: p.sweeps });
  },
  async exportFile(id: number, format: 'json' | 'csv'): Promise<{ filename: string; type: string; body: string }> {
    const p = await patternsRepository.findById(id);
    if (!p) throw AppError.notFound('Pattern');
    const base =
      p.name
        .replace(/[^\w.-]+/g, '-')
        .replace(/^-|-$/g, '')
        .toLowerCase() || 'pattern';
    return format === 'json'
      ? { filename: `${base}.lanewright.json`, type: 'application/json', body: patternToJson(p) }
      : { filename: `${base}.lanewright.csv`, type: 'text/csv', body: patternToCsv(p) };
  },
  async importFile(user: AuthUser, filename: string, buf: Buffer): Promise<PatternDetail> {
    return this.create(user, parsePatternFile(filename, buf));
  },
  async remove(user: AuthUser, id: number): Promise<void> {
    const p = await patternsRepository.findById(id);
    if (!p) throw AppError.notFound('Pattern');
    if (!canEdit(user, p)) throw AppError.forbidden('Only the pattern’s owner or an admin can delete it');
    await p.destroy();
  },
};
