import type { Page } from '../../../shared/auth';
import {
  BallByHandSchema,
  LayoutSchema,
  PinToPapTextSchema,
  type ArsenalQuery,
  type Ball as BallDto,
  type BallCreate,
  type BallPatch,
  type SurfaceChange,
} from '../../../shared/balls';
import { AppError } from '../../lib/AppError';
import { cell, parseCsvRows } from '../../lib/upload';
import { sequelize } from '../../models/index';
import { decodeImage, storage } from '../../lib/storage';
import { catalogueRepository } from '../catalogue/catalogue.repository';
import { refitBowlerAfterCommit } from '../stats/calibrationJobs';
import { hasReplicas } from '../../db/sequelize';
import { arsenalPages, arsenalRepository, catalogueSpecsOf, handEnteredBall, toBallDto } from './arsenal.repository';

/** A row of the arsenal CSV: a hand-entered ball whose pin-to-PAP may be written as a pro shop writes it ("4 3/8", "4-3/8", "4.375"). */
const ArsenalCsvRowSchema = BallByHandSchema.extend({
  layout: LayoutSchema.extend({ pinToPapIn: PinToPapTextSchema }).nullable().optional(),
});

/** Lanewright's arsenal CSV columns (header row required; order free): one list with the client's template. */
export { ARSENAL_CSV_COLUMNS } from '../../../shared/balls';

const notFound = () => AppError.notFound('Ball');

export const arsenalService = {
  async list(ownerId: number, q: ArsenalQuery): Promise<Page<BallDto>> {
    const key = JSON.stringify(q);
    let page = arsenalPages.get(ownerId, key);
    if (!page) {
      const ticket = arsenalPages.ticket(ownerId);
      page = await arsenalRepository.list(ownerId, q);
      if (!hasReplicas) arsenalPages.set(ticket, key, page); // a replica's read may lag a change already heard
    }
    const { rows, count } = page;
    return { items: rows.map(toBallDto), total: count, page: q.page, pageSize: q.pageSize };
  },

  async get(ownerId: number, id: number): Promise<BallDto> {
    const b = await arsenalRepository.findOwned(ownerId, id, { withHistory: true });
    if (!b) throw notFound();
    return toBallDto(b);
  },

  /** Adds a ball from the catalogue (its specs copied, factory surface unless given) or from hand-entered specs; the first surface event records the starting surface. */
  async create(ownerId: number, input: BallCreate): Promise<BallDto> {
    return sequelize.transaction(async (transaction) => {
      let data: Parameters<typeof arsenalRepository.create>[0];
      if ('ballModelId' in input) {
        const m = await catalogueRepository.findById(input.ballModelId, transaction);
        if (!m)
          throw new AppError(400, 'validation_failed', 'That catalogue ball does not exist', {
            'body.ballModelId': 'Unknown catalogue ball',
          });
        data = {
          ownerId,
          ...catalogueSpecsOf(m),
          nickname: input.nickname ?? null,
          weightLb: input.weightLb,
          surfaceGrit: input.surfaceGrit ?? m.factoryGrit,
          polished: input.polished ?? m.factoryPolished,
          layout: input.layout ?? null,
          gamesSinceResurface: input.gamesSinceResurface,
          status: input.status,
        };
      } else {
        data = handEnteredBall(ownerId, input);
      }
      return toBallDto(await arsenalRepository.createWithFirstSurface(data, 'Added to the arsenal', transaction));
    });
  },

  /** Edits a ball; `version` must be the one the editor read (else 409 stale_version). */
  async update(ownerId: number, id: number, patch: BallPatch): Promise<BallDto> {
    return sequelize.transaction(async (transaction) => {
      const b = await arsenalRepository.findOwned(ownerId, id, { transaction });
      if (!b) throw notFound();
      if (b.version !== patch.version)
        throw AppError.conflict('stale_version', 'This ball was changed elsewhere; reload it and apply your edit again');
      const { version: _v, ...fields } = patch;
      b.set({ ...fields, layout: fields.layout === undefined ? b.layout : fields.layout });
      await b.save({ transaction });
      refitBowlerAfterCommit(ownerId, transaction); // the fits read the ball's specs
      return toBallDto(b);
    });
  },

  /** Soft delete: the ball leaves the arsenal and can be restored. */
  async remove(ownerId: number, id: number): Promise<void> {
    const b = await arsenalRepository.findOwned(ownerId, id);
    if (!b) throw notFound();
    await b.destroy();
  },

  async restore(ownerId: number, id: number): Promise<BallDto> {
    const b = await arsenalRepository.findOwned(ownerId, id, { paranoid: false });
    if (!b) throw notFound();
    if (b.deletedAt) await b.restore();
    return toBallDto(b);
  },

  /** A new surface (grit and polish): records a surface event and resets games since resurface. */
  async changeSurface(ownerId: number, actorId: number, id: number, change: SurfaceChange): Promise<BallDto> {
    return sequelize.transaction(async (transaction) => {
      const b = await arsenalRepository.findOwned(ownerId, id, { transaction });
      if (!b) throw notFound();
      await arsenalRepository.addSurfaceEvent(
        {
          ballId: b.id,
          fromGrit: b.surfaceGrit,
          fromPolished: b.polished,
          toGrit: change.surfaceGrit,
          toPolished: change.polished,
          at: change.at ? new Date(change.at) : new Date(),
          byUserId: actorId,
          note: change.note ?? null,
        },
        transaction,
      );
      b.set({ surfaceGrit: change.surfaceGrit, polished: change.polished, gamesSinceResurface: 0, resurfaceCountedAt: new Date() });
      await b.save({ transaction });
      refitBowlerAfterCommit(ownerId, transaction); // shots on the earlier surface are read without today's wear
      const withHistory = await arsenalRepository.findOwned(ownerId, id, { withHistory: true, transaction });
      return toBallDto(withHistory!);
    });
  },

  /** Sets the ball's photo: the bytes must decode as a PNG, JPEG or WebP image (storage.decodeImage); the old photo is removed. */
  async setPhoto(ownerId: number, id: number, file: { buffer: Buffer; originalname: string }): Promise<BallDto> {
    const b = await arsenalRepository.findOwned(ownerId, id);
    if (!b) throw notFound();
    const kind = await decodeImage(file.buffer);
    if (!kind)
      throw new AppError(400, 'unsupported_file', 'The file is not a readable PNG, JPEG or WebP image', {
        file: 'Not a readable PNG, JPEG or WebP image (at most 24 megapixels)',
      });
    const key = await storage.put(file.buffer, kind.ext);
    try {
      const old = b.photoUploadId ? await arsenalRepository.upload(b.photoUploadId) : null;
      await sequelize.transaction(async (transaction) => {
        const up = await arsenalRepository.createUpload(
          {
            ownerId,
            storageKey: key,
            contentType: kind.type,
            sizeBytes: file.buffer.length,
            originalName: file.originalname.slice(0, 200),
          },
          transaction,
        );
        b.photoUploadId = up.id;
        await b.save({ transaction });
        if (old) await old.destroy({ transaction });
      });
      if (old) await storage.remove(old.storageKey);
    } catch (err) {
      await storage.remove(key);
      throw err;
    }
    return toBallDto(b);
  },

  async getPhoto(ownerId: number, id: number): Promise<{ bytes: Buffer; type: string }> {
    const b = await arsenalRepository.findOwned(ownerId, id);
    const up = b?.photoUploadId ? await arsenalRepository.upload(b.photoUploadId) : null;
    if (!up) throw AppError.notFound('Photo');
    return { bytes: await storage.get(up.storageKey), type: up.contentType };
  },

  async removePhoto(ownerId: number, id: number): Promise<BallDto> {
    const b = await arsenalRepository.findOwned(ownerId, id);
    if (!b) throw notFound();
    const up = b.photoUploadId ? await arsenalRepository.upload(b.photoUploadId) : null;
    if (up) {
      await sequelize.transaction(async (transaction) => {
        b.photoUploadId = null;
        await b.save({ transaction });
        await up.destroy({ transaction });
      });
      await storage.remove(up.storageKey);
    }
    return toBallDto(b);
  },

  /** Imports hand-entered balls from CSV: all rows or none, errors by line. */
  async importCsv(ownerId: number, buf: Buffer): Promise<{ imported: number; items: BallDto[] }> {
    const rows = parseCsvRows(
      buf,
      ArsenalCsvRowSchema,
      (r) => {
        const pin = cell.str(r.pinToPapIn);
        return {
          name: cell.str(r.name),
          nickname: cell.str(r.nickname) ?? null,
          weightLb: cell.num(r.weightLb),
          coverType: cell.str(r.coverType),
          coreType: cell.str(r.coreType) ?? (Number(r.intermediateDifferential || 0) > 0 ? 'asymmetric' : 'symmetric'),
          rg: cell.num(r.rg),
          differential: cell.num(r.differential),
          intermediateDifferential: cell.num(r.intermediateDifferential) ?? 0,
          hardnessD: cell.num(r.hardnessD) ?? null,
          surfaceGrit: cell.num(r.surfaceGrit),
          polished: cell.bool(r.polished) ?? false,
          layout:
            pin === undefined
              ? null
              : { pinToPapIn: pin, drillingAngleDeg: cell.num(r.drillingAngleDeg) ?? null, valAngleDeg: cell.num(r.valAngleDeg) ?? null },
          gamesSinceResurface: cell.num(r.gamesSinceResurface) ?? 0,
        };
      },
      200,
    );
    return sequelize.transaction(async (transaction) => {
      const items: BallDto[] = [];
      for (const input of rows) {
        items.push(
          toBallDto(await arsenalRepository.createWithFirstSurface(handEnteredBall(ownerId, input), 'Imported from CSV', transaction)),
        );
      }
      return { imported: items.length, items };
    });
  },
};
