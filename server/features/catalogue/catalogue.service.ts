import { BallModelInputSchema, type BallModel as BallModelDto, type BallModelInput, type CatalogueQuery } from '../../../shared/balls';
import type { Page } from '../../../shared/auth';
import { AppError } from '../../lib/AppError';
import { audit } from '../../lib/audit';
import { cell, parseCsvRows } from '../../lib/upload';
import { sequelize } from '../../models/index';
import { catalogueRepository, toBallModelDto } from './catalogue.repository';

function isUniqueViolation(err: unknown): boolean {
  return (err as { name?: string })?.name === 'SequelizeUniqueConstraintError';
}
const duplicate = () =>
  new AppError(409, 'duplicate_model', 'The catalogue already has a ball of that maker and name', {
    'body.name': 'Already in the catalogue',
  });

export const catalogueService = {
  async list(q: CatalogueQuery): Promise<Page<BallModelDto>> {
    const { rows, count } = await catalogueRepository.list(q);
    return { items: rows.map(toBallModelDto), total: count, page: q.page, pageSize: q.pageSize };
  },
  async get(id: number): Promise<BallModelDto> {
    const m = await catalogueRepository.findById(id);
    if (!m) throw AppError.notFound('Catalogue ball');
    return toBallModelDto(m);
  },
  async create(actorId: number, input: BallModelInput): Promise<BallModelDto> {
    try {
      return await sequelize.transaction(async (t) => {
        const m = await catalogueRepository.create(input, t);
        await audit({ actorId, action: 'catalogue.created', subjectType: 'ball_model', subjectId: m.id }, t);
        return toBallModelDto(m);
      });
    } catch (err) {
      if (isUniqueViolation(err)) throw duplicate();
      throw err;
    }
  },
  async update(actorId: number, id: number, patch: Partial<BallModelInput> & { version: number }): Promise<BallModelDto> {
    try {
      return await sequelize.transaction(async (t) => {
        const m = await catalogueRepository.findById(id, t);
        if (!m) throw AppError.notFound('Catalogue ball');
        if (m.version !== patch.version) throw AppError.conflict('stale_version', 'Someone else changed this ball; reload and try again');
        const { version: _v, ...fields } = patch;
        m.set(fields);
        await m.save({ transaction: t });
        await audit(
          { actorId, action: 'catalogue.updated', subjectType: 'ball_model', subjectId: m.id, details: { fields: Object.keys(fields) } },
          t,
        );
        return toBallModelDto(m);
      });
    } catch (err) {
      if (isUniqueViolation(err)) throw duplicate();
      throw err;
    }
  },
  /** Imports every row of a CSV or none: per-row errors by line, duplicates included. */
  async importCsv(actorId: number, buf: Buffer): Promise<{ imported: number; items: BallModelDto[] }> {
    const rows = parseCsvRows(buf, BallModelInputSchema, (r) => ({
      maker: cell.str(r.maker),
      name: cell.str(r.name),
      coverType: cell.str(r.coverType),
      coreType: cell.str(r.coreType),
      rg: cell.num(r.rg),
      differential: cell.num(r.differential),
      intermediateDifferential: cell.num(r.intermediateDifferential) ?? 0,
      factoryGrit: cell.num(r.factoryGrit),
      factoryPolished: cell.bool(r.factoryPolished) ?? false,
      hardnessD: cell.num(r.hardnessD) ?? null,
      releaseYear: cell.num(r.releaseYear) ?? null,
    }));
    const seen = new Map<string, number>();
    const fields: Record<string, string> = {};
    rows.forEach((r, i) => {
      const key = `${r.maker.toLowerCase()}|${r.name.toLowerCase()}`;
      if (seen.has(key)) fields[`rows.${i + 2}.name`] = `Same maker and name as line ${seen.get(key)}`;
      else seen.set(key, i + 2);
    });
    if (Object.keys(fields).length) throw new AppError(400, 'csv_invalid_rows', 'Some rows repeat a ball; nothing was imported', fields);
    try {
      return await sequelize.transaction(async (t) => {
        const created = await catalogueRepository.bulkCreate(rows, t);
        await audit(
          { actorId, action: 'catalogue.imported', subjectType: 'ball_model', subjectId: 'csv', details: { rows: created.length } },
          t,
        );
        return { imported: created.length, items: created.map(toBallModelDto) };
      });
    } catch (err) {
      if (isUniqueViolation(err))
        throw new AppError(400, 'csv_invalid_rows', 'A row repeats a ball already in the catalogue; nothing was imported', {
          file: 'Duplicate maker and name',
        });
      throw err;
    }
  },
};
