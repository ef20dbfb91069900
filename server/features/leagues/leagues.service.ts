import { stringify } from 'csv-stringify/sync';
import { buildGame, leagueSeason } from '../../../engine/index';
import type { League as LeagueDto, LeagueCreate, LeaguePatch, LeagueStanding } from '../../../shared/leagues';
import { AppError } from '../../lib/AppError';
import type { AuthUser } from '../../middleware/auth';
import { centersRepository } from '../centers/centers.repository';
import { leaguesRepository, type LeagueRow } from './leagues.repository';

function toDto(r: LeagueRow): LeagueDto {
  return {
    id: r.id,
    userId: r.user_id,
    name: r.name,
    centerId: r.center_id,
    centerName: r.center_name,
    weekday: r.weekday,
    seasonStart: r.season_start,
    seasonEnd: r.season_end,
    gamesPerNight: r.games_per_night,
    handicap:
      r.handicap_basis !== null && r.handicap_percent !== null
        ? { basis: r.handicap_basis, percentage: r.handicap_percent, maxPerGame: r.handicap_max }
        : null,
    enteringAverage: r.entering_average,
    nights: Number(r.nights),
    createdAt: new Date(r.created_at).toISOString(),
  };
}

const notFound = () => AppError.notFound('League');

/** The league row if it is the user's own; 404 otherwise (another bowler's league never shows it exists). */
async function own(user: AuthUser, id: number): Promise<LeagueRow> {
  const row = await leaguesRepository.rowById(id);
  if (!row || row.user_id !== user.id) throw notFound();
  return row;
}

async function checkCenter(centerId: number | null | undefined): Promise<void> {
  if (centerId && !(await centersRepository.findById(centerId)))
    throw AppError.badRequest('That center does not exist', { 'body.centerId': 'Unknown center' });
}

const handicapColumns = (h: LeagueCreate['handicap']) =>
  h === undefined ? {} : { handicapBasis: h?.basis ?? null, handicapPercent: h?.percentage ?? null, handicapMax: h?.maxPerGame ?? null };

export const leaguesService = {
  async list(user: AuthUser): Promise<LeagueDto[]> {
    return (await leaguesRepository.rowsOf(user.id)).map(toDto);
  },

  async create(user: AuthUser, input: LeagueCreate): Promise<LeagueDto> {
    await checkCenter(input.centerId);
    const l = await leaguesRepository.create({
      userId: user.id,
      name: input.name,
      centerId: input.centerId ?? null,
      weekday: input.weekday ?? null,
      seasonStart: input.seasonStart,
      seasonEnd: input.seasonEnd ?? null,
      gamesPerNight: input.gamesPerNight ?? 3,
      handicapBasis: input.handicap?.basis ?? null,
      handicapPercent: input.handicap?.percentage ?? null,
      handicapMax: input.handicap?.maxPerGame ?? null,
      enteringAverage: input.enteringAverage ?? null,
    });
    return toDto((await leaguesRepository.rowById(l.id))!);
  },

  async get(user: AuthUser, id: number): Promise<LeagueDto> {
    return toDto(await own(user, id));
  },

  async update(user: AuthUser, id: number, patch: LeaguePatch): Promise<LeagueDto> {
    const row = await own(user, id);
    await checkCenter(patch.centerId);
    const start = patch.seasonStart ?? row.season_start;
    const end = patch.seasonEnd === undefined ? row.season_end : patch.seasonEnd;
    if (end !== null && end < start)
      throw AppError.badRequest('The season ends before it starts', { 'body.seasonEnd': 'The season ends before it starts' });
    const l = (await leaguesRepository.findById(id))!;
    const { handicap, ...rest } = patch;
    l.set({ ...rest, ...handicapColumns(handicap) });
    await l.save();
    return toDto((await leaguesRepository.rowById(id))!);
  },

  /** Deletes the league; its sessions stay, no longer league nights of it. */
  async remove(user: AuthUser, id: number): Promise<void> {
    await own(user, id);
    await (await leaguesRepository.findById(id))!.destroy();
  },

  /**
   * The season: each night's complete games (a game counts once its tenth frame is done), the average and
   * handicap it was bowled on (the engine's leagueSeason) and the session behind it.
   */
  async standing(user: AuthUser, id: number): Promise<LeagueStanding> {
    const league = toDto(await own(user, id));
    const sessions = await leaguesRepository.nightsOf(id);
    const deliveries = await leaguesRepository.deliveriesOf(sessions.map((s) => s.id));
    const bySessionGame = new Map<string, typeof deliveries>();
    for (const d of deliveries) {
      const k = `${d.session_id}:${d.game_number}`;
      const list = bySessionGame.get(k) ?? [];
      list.push(d);
      bySessionGame.set(k, list);
    }
    const nights = sessions.map((s) => {
      const games = [...bySessionGame.entries()]
        .filter(([k]) => k.startsWith(`${s.id}:`))
        .sort((a, b) => Number(a[0].split(':')[1]) - Number(b[0].split(':')[1]))
        .map(([, list]) => buildGame(list.map((d) => ({ frame: d.frame, delivery: d.delivery, standing: d.standing, foul: d.foul }))));
      return {
        session: s,
        complete: games.filter((g) => g.complete).map((g) => g.total),
        incomplete: games.filter((g) => !g.complete).length,
      };
    });
    const season = leagueSeason({
      nights: nights.map((n) => ({ date: n.session.date, games: n.complete })),
      handicap: league.handicap,
      enteringAverage: league.enteringAverage,
    });
    return {
      league,
      season,
      nights: nights.map((n) => ({
        sessionId: n.session.id,
        date: n.session.date,
        lanePair: n.session.lane_pair,
        incompleteGames: n.incomplete,
      })),
    };
  },

  /** The season as CSV: a row a night (games, series, the average and handicap it was bowled on) and a total row. */
  async seasonCsv(user: AuthUser, id: number): Promise<{ filename: string; body: string }> {
    const { league, season, nights } = await this.standing(user, id);
    const most = Math.max(league.gamesPerNight, ...season.nights.map((n) => n.games.length));
    const gameHeads = Array.from({ length: most }, (_, i) => `Game ${i + 1}`);
    const rows: (string | number | null)[][] = [
      ['Date', 'Lane pair', ...gameHeads, 'Series', 'Average before', 'Handicap per game', 'Handicap series', 'Average after'],
      ...season.nights.map((n, i) => [
        n.date,
        nights[i].lanePair,
        ...Array.from({ length: most }, (_, g) => n.games[g] ?? null),
        n.series,
        n.averageBefore,
        n.handicapPerGame,
        n.handicapSeries,
        n.averageAfter,
      ]),
      ['Season', null, ...gameHeads.map(() => null), season.pins, null, season.handicap, null, season.average],
    ];
    const slug =
      league.name
        .toLowerCase()
        .replace(/[^a-z0-9]+/g, '-')
        .replace(/^-|-$/g, '') || 'league';
    return { filename: `${slug}-${league.seasonStart}.csv`, body: stringify(rows) };
  },
};
