import { createHash } from 'node:crypto';
import { changedAfterCommit } from '../../lib/changeFeed';
import { UniqueConstraintError, type Transaction } from 'sequelize';
import { buildGame, checkDelivery, isCalibrationShot, moveFollowUp, shotStats, suggestMoves, surfaceWords } from '../../../engine/index';
import type { LoggedDelivery } from '../../../engine/shotlog/types';
import type { Page } from '../../../shared/auth';
import { DEFAULT_LANE_SURFACE } from '../../../shared/centers';
import type { AnnotationCreate, Annotation as AnnotationDto } from '../../../shared/coaching';
import type {
  NumberedGame,
  Session as SessionDto,
  SessionCreate,
  SessionDetail,
  SessionListQuery,
  SessionPatch,
  ShotCreate,
  ShotCreated,
} from '../../../shared/sessions';
import { AppError } from '../../lib/AppError';
import type { AuthUser } from '../../middleware/auth';
import { sequelize, type BowlingSession, type Shot, type User } from '../../models/index';
import { arsenalRepository } from '../arsenal/arsenal.repository';
import { userRepository } from '../auth/user.repository';
import { centersRepository } from '../centers/centers.repository';
import { leaguesRepository } from '../leagues/leagues.repository';
import { patternsRepository } from '../patterns/patterns.repository';
import { isLinkedCoach, readableBowlerId } from '../coaching/coaching.access';
import { profileService } from '../profile/profile.service';
import { requestCalibrationFitsAfterCommit } from '../stats/calibrationJobs';
import { sessionsRepository, toAnnotationDto, toShotDto, toShotRecord, type ShotRow } from './sessions.repository';

const notFound = () => AppError.notFound('Session');

/**
 * The session for a request: its owner reaches it for anything; a linked coach may read it (and annotate);
 * for a coach's write the answer is 403; for anyone else 404.
 */
async function sessionFor(user: AuthUser, id: number, mode: 'read' | 'write'): Promise<BowlingSession> {
  const s = await sessionsRepository.findModel(id);
  if (!s) throw notFound();
  if (s.userId === user.id) return s;
  if (await isLinkedCoach(user, s.userId)) {
    if (mode === 'read') return s;
    throw AppError.forbidden('Only the bowler changes their session');
  }
  throw notFound();
}

/** The semantic content of a shot request: the same shot sent twice hashes the same whatever the key order or omitted defaults. */
function requestHash(b: ShotCreate): string {
  const canonical = {
    gameNumber: b.gameNumber,
    frame: b.frame,
    delivery: b.delivery,
    ballId: b.ballId,
    feetBoard: b.feetBoard ?? null,
    targetBoard: b.targetBoard ?? null,
    breakpointBoard: b.breakpointBoard ?? null,
    standing: [...b.standing].sort((x, y) => x - y),
    foul: b.foul ?? false,
    hit: b.hit ?? null,
    note: b.note ?? '',
  };
  return createHash('sha256').update(JSON.stringify(canonical)).digest('hex');
}

const delivered = (s: Pick<Shot, 'frame' | 'delivery' | 'standing' | 'foul'>): LoggedDelivery => ({
  frame: s.frame,
  delivery: s.delivery,
  standing: s.standing,
  foul: s.foul,
});

function invalidShot(field: string, reason: string): AppError {
  return new AppError(400, 'invalid_shot', reason, { [`body.${field}`]: reason });
}

/** Games of a session from its shots in order: each game's frame sheet (scores from scoreGame / scorePartialGame). */
export function gameViewsOf(shots: ShotRow[]): NumberedGame[] {
  const byGame = new Map<number, ShotRow[]>();
  for (const s of shots) {
    const list = byGame.get(s.game_number) ?? [];
    list.push(s);
    byGame.set(s.game_number, list);
  }
  return [...byGame.entries()].sort((a, b) => a[0] - b[0]).map(([number, list]) => ({ ...buildGame(list.map(delivered)), number }));
}

/** The league (the bowler's own) and lane pair of a session, checked: 400 naming the field otherwise. */
async function leagueAndPair(
  userId: number,
  leagueId: number | null | undefined,
  lanePair: string | null | undefined,
  centerId: number | null,
): Promise<void> {
  if (leagueId) {
    const league = await leaguesRepository.findById(leagueId);
    if (!league || league.userId !== userId)
      throw AppError.badRequest('That league is not one of yours', { 'body.leagueId': 'Choose one of your leagues' });
  }
  if (lanePair && centerId !== null) {
    const center = await centersRepository.findById(centerId);
    const last = Number(lanePair.split('-')[1]);
    if (center && last > center.laneCount)
      throw AppError.badRequest('That center has fewer lanes', {
        'body.lanePair': `${center.name} has lanes 1–${center.laneCount}`,
      });
  }
}

export const sessionsService = {
  async create(user: AuthUser, input: SessionCreate): Promise<SessionDto> {
    let centerId = input.centerId ?? null;
    let patternId = input.patternId ?? null;
    let patternName: string | null = null;
    const conditionId = input.conditionId ?? null;
    if (conditionId !== null) {
      const c = await centersRepository.findConditionById(conditionId);
      if (!c) throw AppError.badRequest('That condition does not exist', { 'body.conditionId': 'Unknown condition' });
      if (centerId !== null && centerId !== c.centerId)
        throw AppError.badRequest('The condition is not one of that center’s', {
          'body.conditionId': 'This condition was published by another center',
        });
      if (patternId !== null && c.patternId !== patternId)
        throw AppError.badRequest('The condition has another pattern', {
          'body.patternId': 'Leave the pattern out or choose the condition’s own',
        });
      centerId = c.centerId;
      patternId = c.patternId;
      patternName = c.patternName;
    }
    if (centerId !== null && !(await centersRepository.findById(centerId)))
      throw AppError.badRequest('That center does not exist', { 'body.centerId': 'Unknown center' });
    if (patternId !== null && patternName === null) {
      const p = await patternsRepository.findById(patternId);
      if (!p) throw AppError.badRequest('That pattern does not exist', { 'body.patternId': 'Unknown pattern' });
      patternName = p.name;
    }
    await leagueAndPair(user.id, input.leagueId, input.lanePair, centerId);
    const s = await sessionsRepository.create({
      userId: user.id,
      date: input.date,
      kind: input.kind,
      leagueId: input.leagueId ?? null,
      lanePair: input.lanePair ?? null,
      centerId,
      conditionId,
      patternId,
      patternName,
      notes: input.notes ?? '',
    });
    return (await sessionsRepository.findDto(s.id))!;
  },

  async list(user: AuthUser, q: SessionListQuery): Promise<Page<SessionDto>> {
    const bowlerId = await readableBowlerId(user, q.studentId);
    const { rows, count } = await sessionsRepository.list(bowlerId, q);
    return { items: rows, total: count, page: q.page, pageSize: q.pageSize };
  },

  async get(user: AuthUser, id: number): Promise<SessionDetail> {
    const s = await sessionFor(user, id, 'read');
    const [dto, shots, annotations, owner, { profile }] = await Promise.all([
      sessionsRepository.findDto(id),
      sessionsRepository.shotsOf(id),
      sessionsRepository.annotationsOf(id),
      userRepository.findById(s.userId),
      profileService.get(s.userId),
    ]);
    const records = shots.map((r) => toShotRecord(r, s.date));
    return {
      ...dto!,
      shotCount: dto!.shots,
      gameViews: gameViewsOf(shots),
      shots: shots.map(toShotDto),
      stats: shotStats(records),
      moves: suggestMoves({ shots: records, hand: profile.hand }),
      followUps: moveFollowUp({ shots: records, hand: profile.hand }),
      annotations: annotations.map(toAnnotationDto),
      owner: { id: owner!.id, displayName: owner!.displayName },
    };
  },

  async update(user: AuthUser, id: number, patch: SessionPatch): Promise<SessionDto> {
    const s = await sessionFor(user, id, 'write');
    await leagueAndPair(s.userId, patch.leagueId, patch.lanePair, s.centerId);
    if (patch.leagueId && (patch.kind ?? s.kind) !== 'league')
      throw AppError.badRequest('A league night is a league session', { 'body.kind': 'A league night is a league session' });
    s.set({
      ...(patch.leagueId !== undefined ? { leagueId: patch.leagueId } : {}),
      ...(patch.lanePair !== undefined ? { lanePair: patch.lanePair } : {}),
      ...(patch.notes !== undefined ? { notes: patch.notes } : {}),
      ...(patch.kind ? { kind: patch.kind } : {}),
      ...(patch.date ? { date: patch.date } : {}),
    });
    await s.save();
    return (await sessionsRepository.findDto(id))!;
  },

  /** Soft delete: the session and its shots leave lists and statistics, and can be restored. */
  async remove(user: AuthUser, id: number): Promise<void> {
    const s = await sessionFor(user, id, 'write');
    await s.destroy();
  },

  async restore(user: AuthUser, id: number): Promise<SessionDto> {
    const s = await sessionsRepository.findModel(id, { paranoid: false });
    if (!s || s.userId !== user.id) throw notFound();
    if (s.deletedAt) await s.restore();
    return (await sessionsRepository.findDto(id))!;
  },

  /**
   * Logs one delivery. The Idempotency-Key names the shot: a retry with the same key and body answers the
   * first response again (200) and stores nothing; the same key with another body is 409. Appends to one
   * session are serialised by a row lock on the session, and the unique (session, key) and (session, game,
   * frame, delivery) constraints make a second row impossible even without it.
   */
  async addShot(user: AuthUser, sessionId: number, key: string, body: ShotCreate): Promise<{ replayed: boolean; shot: ShotCreated }> {
    await sessionFor(user, sessionId, 'write');
    const hash = requestHash(body);
    const replay = (row: Shot): { replayed: true; shot: ShotCreated } => {
      if (row.requestHash !== hash)
        throw AppError.conflict(
          'idempotency_conflict',
          'This Idempotency-Key was already used for a different shot; send a new key for a new shot',
        );
      return { replayed: true, shot: row.response as unknown as ShotCreated };
    };
    const earlier = await sessionsRepository.findShotByKey(sessionId, key);
    if (earlier) return replay(earlier);
    try {
      return await sequelize.transaction(async (transaction) => {
        const s = await sessionsRepository.findModel(sessionId, { transaction, lock: true });
        if (!s || s.userId !== user.id) throw notFound();
        const raced = await sessionsRepository.findShotByKey(sessionId, key, transaction);
        if (raced) return replay(raced);
        changedAfterCommit('shots', s.userId, transaction); // the bowler's kept statistics
        return { replayed: false, shot: await insertShot(s, key, hash, body, transaction) };
      });
    } catch (err) {
      if (!(err instanceof UniqueConstraintError)) throw err;
      const row = await sessionsRepository.findShotByKey(sessionId, key);
      if (row) return replay(row);
      throw AppError.conflict('delivery_taken', 'That delivery was logged a moment ago by another request; reload the game');
    }
  },

  /** Undo: removes a game's last delivery only (any other would leave an impossible game). */
  async removeShot(user: AuthUser, sessionId: number, shotId: number): Promise<void> {
    await sessionFor(user, sessionId, 'write');
    await sequelize.transaction(async (transaction) => {
      const s = await sessionsRepository.findModel(sessionId, { transaction, lock: true });
      if (!s) throw notFound();
      const shot = await sessionsRepository.findShot(sessionId, shotId, transaction);
      if (!shot) throw AppError.notFound('Shot');
      const game = await sessionsRepository.gameShots(sessionId, shot.gameNumber, transaction);
      if (game.at(-1)!.id !== shot.id)
        throw AppError.conflict('not_last_shot', `Only the last delivery of game ${shot.gameNumber} can be undone`);
      await shot.destroy({ transaction });
      changedAfterCommit('shots', s.userId, transaction); // the bowler's kept statistics
    });
  },

  /** A note on a session, by its bowler or their linked coach. */
  async annotate(user: AuthUser, sessionId: number, input: AnnotationCreate): Promise<AnnotationDto> {
    await sessionFor(user, sessionId, 'read');
    if (input.frame != null && input.gameNumber == null)
      throw AppError.badRequest('Name the game of the frame', { 'body.gameNumber': 'Give the game the frame belongs to' });
    const a = await sessionsRepository.createAnnotation({
      sessionId,
      authorId: user.id,
      gameNumber: input.gameNumber ?? null,
      frame: input.frame ?? null,
      text: input.text,
    });
    return toAnnotationDto(Object.assign(a, { author: { displayName: user.displayName } as User }));
  },
};

async function insertShot(s: BowlingSession, key: string, hash: string, body: ShotCreate, transaction: Transaction): Promise<ShotCreated> {
  const ball = await arsenalRepository.findOwned(s.userId, body.ballId, { transaction });
  if (!ball) throw invalidShot('ballId', 'This ball is not in your arsenal');
  const last = await sessionsRepository.lastGameNumber(s.id, transaction);
  if (body.gameNumber > last + 1)
    throw invalidShot('gameNumber', `game ${body.gameNumber} cannot start yet: the next new game is game ${last + 1}`);
  const prior = (await sessionsRepository.gameShots(s.id, body.gameNumber, transaction)).map(delivered);
  const next: LoggedDelivery = { frame: body.frame, delivery: body.delivery, standing: body.standing, foul: body.foul ?? false };
  const check = checkDelivery(prior, next);
  if (!check.ok) throw invalidShot(check.field, check.reason);
  const row = await sessionsRepository.createShot(
    {
      sessionId: s.id,
      gameNumber: body.gameNumber,
      frame: body.frame,
      delivery: body.delivery,
      ballId: ball.id,
      surfaceGrit: ball.surfaceGrit,
      surfacePolished: ball.polished,
      surfaceKey: surfaceWords(ball.surfaceGrit, ball.polished),
      feetBoard: body.feetBoard ?? null,
      targetBoard: body.targetBoard ?? null,
      breakpointBoard: body.breakpointBoard ?? null,
      standing: [...body.standing].sort((a, b) => a - b),
      foul: body.foul ?? false,
      hit: body.hit ?? null,
      note: body.note ?? '',
      idempotencyKey: key,
      requestHash: hash,
    },
    transaction,
  );
  // A shot that says something about the ball's motion asks the worker to refit this bowler on this pattern, on the
  // lanes it was bowled on (the session's published condition, else the default surface), once the shot is committed.
  if (s.patternId && isCalibrationShot(body)) {
    const patternId = s.patternId;
    requestCalibrationFitsAfterCommit(transaction, () => [
      s.conditionId ? { bowlerId: s.userId, conditionId: s.conditionId } : { bowlerId: s.userId, patternId, lane: DEFAULT_LANE_SURFACE },
    ]);
  }
  const item = (await sessionsRepository.shotDto(row.id, transaction))!;
  const response: ShotCreated = { item, game: { ...buildGame([...prior, next]), number: body.gameNumber } };
  row.response = response as unknown as Record<string, unknown>;
  await row.save({ transaction });
  return response;
}
