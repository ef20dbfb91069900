import { analyzePattern, oilGrid } from '../../../engine/index';
import type { OilPattern } from '../../../engine/types';
import { holdsRole, type Page } from '../../../shared/auth';
import type {
  PatternDetail,
  PatternInput,
  PatternListItem,
  PatternQuery,
  PatternSummary,
  PatternVisibility,
} from '../../../shared/patterns';
import type { AuthUser } from '../../middleware/auth';
import { AppError } from '../../lib/AppError';
import type { Transaction } from 'sequelize';
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
  return holdsRole(user, 'admin') || p.ownerId === user.id;
}

/** Whether the user may see the pattern: published, their own, shared with a center they run, or an admin. */
async function canSee(user: AuthUser | undefined, p: Pattern): Promise<boolean> {
  if (p.visibility === 'published') return true;
  if (!user) return false;
  if (holdsRole(user, 'admin') || p.ownerId === user.id) return true;
  return p.visibility === 'shared' && p.centerId !== null && (await patternsRepository.runsCenter(user.id, p.centerId));
}

/** The pattern if the user may see it; 404 otherwise (a draft's existence never leaks). */
async function visibleOr404(user: AuthUser | undefined, id: number): Promise<Pattern> {
  const p = await patternsRepository.findById(id);
  if (!p || !(await canSee(user, p))) throw AppError.notFound('Pattern');
  return p;
}

const nameTaken = (name: string, field = 'body.name') =>
  new AppError(409, 'name_taken', `You already have a pattern named “${name}”`, {
    [field]: 'You already have a pattern of this name; choose another',
  });

/** Checks a visibility and its center: shared needs a center that exists; the others carry none. */
async function placement(
  visibility: PatternVisibility,
  centerId: number | null | undefined,
  transaction?: Transaction,
): Promise<{ visibility: PatternVisibility; centerId: number | null }> {
  if (visibility !== 'shared') return { visibility, centerId: null };
  if (!centerId) throw AppError.badRequest('Choose the center whose staff may see it', { 'body.centerId': 'Choose a center' });
  if (!(await patternsRepository.centerExists(centerId, transaction)))
    throw AppError.badRequest('That center does not exist', { 'body.centerId': 'Unknown center' });
  return { visibility, centerId };
}

/** A name of the owner's not yet used: "Name", then "Name (2)", "Name (3)" … (at most 80 characters). */
async function freeName(ownerId: number, name: string): Promise<string> {
  const taken = await patternsRepository.namesLike(ownerId, name.slice(0, 70));
  if (!taken.has(name.toLowerCase())) return name;
  for (let n = 2; ; n++) {
    const candidate = `${name.slice(0, 80 - ` (${n})`.length)} (${n})`;
    if (!taken.has(candidate.toLowerCase())) return candidate;
  }
}

export const patternsService = {
  async list(user: AuthUser, q: PatternQuery): Promise<Page<PatternListItem>> {
    const { rows, count } = await patternsRepository.list(q, holdsRole(user, 'admin') ? null : user.id, user.id);
    return { items: rows.map(toPatternListItem), total: count, page: q.page, pageSize: q.pageSize };
  },
  async get(user: AuthUser, id: number): Promise<PatternDetail> {
    return toDetail(await visibleOr404(user, id));
  },
  /** The stored pattern as the engine takes it (404 when unknown, or not visible to `viewer` when one is given). */
  async engineInput(id: number, viewer?: AuthUser): Promise<{ id: number; name: string; pattern: OilPattern; summary: PatternSummary }> {
    const p = await patternsRepository.findById(id);
    if (!p || (viewer && !(await canSee(viewer, p)))) throw AppError.notFound('Pattern');
    return { id: p.id, name: p.name, pattern: { name: p.name, sweeps: p.sweeps }, summary: p.summary };
  },
  /** Whether the user may see a pattern (conditions and sessions refer only to patterns their author sees). */
  canSee,
  async create(user: AuthUser, input: PatternInput): Promise<PatternDetail> {
    return sequelize.transaction(async (transaction) => {
      if (await patternsRepository.findByOwnerAndName(user.id, input.name, undefined, transaction)) throw nameTaken(input.name);
      const p = await patternsRepository.create(
        {
          ownerId: user.id,
          name: input.name,
          description: input.description ?? null,
          sweeps: input.sweeps,
          summary: summarize({ name: input.name, sweeps: input.sweeps }),
          ...(await placement(input.visibility ?? 'draft', input.centerId, transaction)),
        },
        transaction,
      );
      p.owner = { displayName: user.displayName };
      return toDetail(p);
    });
  },
  async update(user: AuthUser, id: number, patch: Partial<PatternInput> & { version: number }): Promise<PatternDetail> {
    return sequelize.transaction(async (transaction) => {
      const p = await patternsRepository.findById(id, transaction);
      if (!p || !(await canSee(user, p))) throw AppError.notFound('Pattern');
      if (!canEdit(user, p)) throw AppError.forbidden('Only the pattern’s owner or an admin can edit it');
      if (p.version !== patch.version)
        throw AppError.conflict('stale_version', 'This pattern was changed elsewhere; reload it and apply your edit again');
      const name = patch.name ?? p.name;
      if (
        patch.name !== undefined &&
        p.ownerId !== null &&
        (await patternsRepository.findByOwnerAndName(p.ownerId, name, p.id, transaction))
      )
        throw nameTaken(name);
      const sweeps = patch.sweeps ?? p.sweeps;
      const place =
        patch.visibility !== undefined || patch.centerId !== undefined
          ? await placement(patch.visibility ?? p.visibility, patch.centerId === undefined ? p.centerId : patch.centerId, transaction)
          : {};
      p.set({
        name,
        description: patch.description === undefined ? p.description : patch.description,
        sweeps,
        summary: summarize({ name, sweeps }),
        ...place,
      });
      await p.save({ transaction });
      return toDetail(p);
    });
  },
  /** A draft copy owned by the caller, named "… (copy)" (then "… (copy) (2)" …). */
  async duplicate(user: AuthUser, id: number): Promise<PatternDetail> {
    const p = await visibleOr404(user, id);
    const name = await freeName(user.id, `${p.name.slice(0, 73)} (copy)`);
    return this.create(user, { name, description: p.description, sweeps: p.sweeps });
  },
  async exportFile(user: AuthUser, id: number, format: 'json' | 'csv'): Promise<{ filename: string; type: string; body: string }> {
    const p = await visibleOr404(user, id);
    const base =
      p.name
        .replace(/[^\w.-]+/g, '-')
        .replace(/^-|-$/g, '')
        .toLowerCase() || 'pattern';
    return format === 'json'
      ? { filename: `${base}.lanewright.json`, type: 'application/json', body: patternToJson(p) }
      : { filename: `${base}.lanewright.csv`, type: 'text/csv', body: patternToCsv(p) };
  },
  /**
   * A pattern from a file, as a draft. When the caller already has a pattern of the file's name the import
   * answers 409 `name_taken` naming a free name, unless `onConflict` says what to do: `rename` imports under that
   * free name, `replace` writes the file's sweeps and description over the existing pattern (its visibility kept).
   */
  async importFile(
    user: AuthUser,
    filename: string,
    buf: Buffer,
    onConflict?: 'rename' | 'replace',
  ): Promise<{ item: PatternDetail; replaced: boolean }> {
    const input = parsePatternFile(filename, buf);
    const existing = await patternsRepository.findByOwnerAndName(user.id, input.name);
    if (!existing) return { item: await this.create(user, input), replaced: false };
    if (onConflict === 'rename')
      return { item: await this.create(user, { ...input, name: await freeName(user.id, input.name) }), replaced: false };
    if (onConflict === 'replace') {
      const patch = { version: existing.version, description: input.description ?? null, sweeps: input.sweeps };
      return { item: await this.update(user, existing.id, patch), replaced: true };
    }
    const suggestion = await freeName(user.id, input.name);
    throw new AppError(
      409,
      'name_taken',
      `You already have a pattern named “${input.name}”: import it as “${suggestion}”, or replace the one you have`,
      { file: `Rename to “${suggestion}” or replace your pattern “${existing.name}”`, suggestedName: suggestion },
    );
  },
  async remove(user: AuthUser, id: number): Promise<void> {
    const p = await patternsRepository.findById(id);
    if (!p || !(await canSee(user, p))) throw AppError.notFound('Pattern');
    if (!canEdit(user, p)) throw AppError.forbidden('Only the pattern’s owner or an admin can delete it');
    await p.destroy();
  },
};
