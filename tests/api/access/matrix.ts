import type { Actor, Fixture } from './fixture';
import { TINY_PNG } from './fixture';
import { api } from '../../helpers/api';

/** What one matrix cell sends. */
export interface CellRequest {
  url: string;
  body?: unknown;
  file?: { buffer: Buffer; filename: string; contentType: string };
  headers?: Record<string, string>;
}

/** Expected statuses in the column order of ROLES: anonymous, owner, otherBowler, coachLinked, coachUnlinked, proprietorThis, proprietorOther, admin. */
export type Row = readonly [number, number, number, number, number, number, number, number];

export interface MatrixEntry {
  /** Builds the request for one actor; may create fresh records (routes that delete or consume them). */
  req: (f: Fixture, actor: Actor) => CellRequest | Promise<CellRequest>;
  expect: Row | ((f: Fixture) => Row);
  /** Why the row reads as it does, where it is not obvious. */
  note?: string;
}

// Row shorthands.
const all = (s: number): Row => [s, s, s, s, s, s, s, s];
const signedIn = (s: number): Row => [401, s, s, s, s, s, s, s];
/** The owner's record: everybody else gets 404 (its existence never leaks), admins included. */
const ownOnly = (s: number): Row => [401, s, 404, 404, 404, 404, 404, 404];
const adminOnly = (s: number): Row => [401, 403, 403, 403, 403, 403, 403, s];
/** Coaches, proprietors and admins (pattern editors). */
const editors = (s: number): Row => [401, 403, 403, s, s, s, s, s];
/** A record of proprietorThis that other editors may read but not change (403: it is public, so nothing leaks). */
/** The owner's session: a linked coach reads it (so refusing a change is 403, nothing leaks); everyone else 404. */
const ownerWritesCoachReads = (f: Fixture, s: number): Row => [401, s, 404, f.coachLinked ? 403 : 404, 404, 404, 404, 404];
const ownerOrAdminOfPattern = (s: number): Row => [401, 403, 403, 403, 403, s, 403, s];

const today = () => new Date().toISOString().slice(0, 10);
const uniq = () => `${process.pid}-${Date.now()}-${Math.floor(Math.random() * 1e9)}`;
const csv = (lines: string[]) => Buffer.from(`${lines.join('\n')}\n`);
const SWEEP = { direction: 'forward', fromBoard: 2, toBoard: 38, startFt: 0, endFt: 40, crossings: 2, microlitersPerBoard: 65 };

/**
 * The access matrix: one entry per API route (METHOD + Express path), each with the status every actor gets.
 * A route of the router without an entry fails the test, and so does an entry whose route is gone.
 * Bodies are valid, so an allowed actor gets the success status and a refused one the refusal.
 */
export const MATRIX: Record<string, MatrixEntry> = {
  // ── platform ───────────────────────────────────────────────────────────────────────────────
  'GET /api/health': { req: () => ({ url: '/api/health' }), expect: all(200) },
  'GET /api/health/live': { req: () => ({ url: '/api/health/live' }), expect: all(200) },
  'GET /api/health/ready': { req: () => ({ url: '/api/health/ready' }), expect: all(200) },
  'GET /api/health/metrics': {
    req: () => ({ url: '/api/health/metrics' }),
    expect: all(404),
    note: 'exists only with METRICS_TOKEN, then for that bearer token alone (tests/api/platform/metrics.test.ts); the shared test server configures none',
  },
  'GET /api/docs': { req: () => ({ url: '/api/docs' }), expect: all(200) },
  'GET /api/docs/openapi.json': { req: () => ({ url: '/api/docs/openapi.json' }), expect: all(200) },
  'GET /api/dev/mail': {
    req: () => ({ url: '/api/dev/mail' }),
    expect: adminOnly(200),
    note: 'development and tests only, for the admin (it holds every reset link): imported only while the in-process capture SMTP server is in use, never with NODE_ENV=production or SMTP_URL; see tests/api/access/devTools.test.ts',
  },

  // ── auth ───────────────────────────────────────────────────────────────────────────────────
  'POST /api/auth/register': {
    req: () => ({
      url: '/api/auth/register',
      body: { email: `reg-${uniq()}@example.test`, password: 'a-long-enough-password', displayName: 'Matrix Newcomer' },
    }),
    expect: all(201),
    note: 'the same neutral answer for a new or a taken address',
  },
  'POST /api/auth/login': {
    req: (f) => ({ url: '/api/auth/login', body: { email: f.people.otherBowler.user.email, password: f.people.otherBowler.password } }),
    expect: all(200),
  },
  'GET /api/auth/me': { req: () => ({ url: '/api/auth/me' }), expect: signedIn(200) },
  'POST /api/auth/forgot': { req: () => ({ url: '/api/auth/forgot', body: { email: `nobody-${uniq()}@example.test` } }), expect: all(202) },
  'POST /api/auth/reset': {
    req: () => ({ url: '/api/auth/reset', body: { token: 'x'.repeat(43), password: 'another-long-password' } }),
    expect: all(400),
    note: 'public; a reset needs the mailed token, so every caller without it gets 400 invalid_token (tests/api/auth/reset.test.ts covers the success)',
  },
  'POST /api/auth/verify-email': {
    req: async (f) => ({ url: '/api/auth/verify-email', body: { token: await f.freshVerificationToken() } }),
    expect: all(200),
    note: 'public: the mailed token is the credential (each cell verifies a fresh unverified account; tests/api/auth/verifyEmail.test.ts covers the refusals)',
  },
  'POST /api/auth/verify-email/send': {
    req: () => ({ url: '/api/auth/verify-email/send' }),
    expect: signedIn(202),
    note: 'the caller’s own address only',
  },

  // ── profile ────────────────────────────────────────────────────────────────────────────────
  'GET /api/profile': { req: () => ({ url: '/api/profile' }), expect: signedIn(200) },
  'PUT /api/profile': { req: () => ({ url: '/api/profile', body: { speedMph: 17.5 } }), expect: signedIn(200) },

  // ── admin ──────────────────────────────────────────────────────────────────────────────────
  'GET /api/admin/users': { req: () => ({ url: '/api/admin/users' }), expect: adminOnly(200) },
  'PATCH /api/admin/users/:id/role': {
    req: async (f) => ({ url: `/api/admin/users/${await f.freshUserId()}/role`, body: { role: 'coach' } }),
    expect: adminOnly(200),
  },
  'GET /api/admin/audit': { req: () => ({ url: '/api/admin/audit' }), expect: adminOnly(200) },
  'GET /api/admin/audit/actions': { req: () => ({ url: '/api/admin/audit/actions' }), expect: adminOnly(200) },
  'PUT /api/admin/users/:id/roles': {
    req: async (f) => ({ url: `/api/admin/users/${await f.freshUserId()}/roles`, body: { roles: ['bowler', 'coach'] } }),
    expect: adminOnly(200),
  },

  // ── catalogue ──────────────────────────────────────────────────────────────────────────────
  'GET /api/catalogue': { req: () => ({ url: '/api/catalogue' }), expect: signedIn(200) },
  'GET /api/catalogue/:id': { req: (f) => ({ url: `/api/catalogue/${f.ball.ballModelId}` }), expect: signedIn(200) },
  'POST /api/catalogue': {
    req: () => ({
      url: '/api/catalogue',
      body: {
        maker: 'Matrix Foundry',
        name: `Matrix Sphere ${uniq()}`,
        coverType: 'reactive-solid',
        coreType: 'asymmetric',
        rg: 2.5,
        differential: 0.05,
        intermediateDifferential: 0.015,
        factoryGrit: 2000,
        factoryPolished: false,
        hardnessD: 76,
      },
    }),
    expect: adminOnly(201),
  },
  'PATCH /api/catalogue/:id': {
    req: async (f) => {
      const m = await f.freshModelId();
      return { url: `/api/catalogue/${m.id}`, body: { version: m.version, rg: 2.51 } };
    },
    expect: adminOnly(200),
  },
  'POST /api/catalogue/import': {
    req: () => ({
      url: '/api/catalogue/import',
      file: {
        buffer: csv([
          'maker,name,coverType,coreType,rg,differential,intermediateDifferential,factoryGrit,factoryPolished,hardnessD,releaseYear',
          `Matrix Foundry,Imported ${uniq()},reactive-hybrid,symmetric,2.52,0.04,0,3000,false,77,2026`,
        ]),
        filename: 'catalogue.csv',
        contentType: 'text/csv',
      },
    }),
    expect: adminOnly(201),
  },

  // ── arsenal (the owner's own balls) ────────────────────────────────────────────────────────
  'GET /api/arsenal': { req: () => ({ url: '/api/arsenal' }), expect: signedIn(200), note: 'everyone signed in lists their own arsenal' },
  'POST /api/arsenal': {
    req: (f) => ({ url: '/api/arsenal', body: { ballModelId: f.ball.ballModelId, weightLb: 15 } }),
    expect: signedIn(201),
  },
  'POST /api/arsenal/import': {
    req: () => ({
      url: '/api/arsenal/import',
      file: {
        buffer: csv([
          'name,weightLb,coverType,coreType,rg,differential,surfaceGrit,polished',
          `Hand Entered ${uniq()},15,urethane,symmetric,2.6,0.02,2000,false`,
        ]),
        filename: 'arsenal.csv',
        contentType: 'text/csv',
      },
    }),
    expect: signedIn(201),
  },
  'GET /api/arsenal/:id': { req: (f) => ({ url: `/api/arsenal/${f.ball.id}` }), expect: ownOnly(200) },
  'PATCH /api/arsenal/:id': {
    req: async (f) => {
      const b = await f.freshBall();
      return { url: `/api/arsenal/${b.id}`, body: { version: b.version, nickname: 'Matrix' } };
    },
    expect: ownOnly(200),
  },
  'DELETE /api/arsenal/:id': { req: async (f) => ({ url: `/api/arsenal/${(await f.freshBall()).id}` }), expect: ownOnly(204) },
  'POST /api/arsenal/:id/restore': {
    req: async (f) => ({ url: `/api/arsenal/${(await f.freshBall({ deleted: true })).id}/restore` }),
    expect: ownOnly(200),
  },
  'POST /api/arsenal/:id/surface': {
    req: async (f) => ({ url: `/api/arsenal/${(await f.freshBall()).id}/surface`, body: { surfaceGrit: 1500, polished: false } }),
    expect: ownOnly(200),
  },
  'PUT /api/arsenal/:id/photo': {
    req: async (f) => ({
      url: `/api/arsenal/${(await f.freshBall()).id}/photo`,
      file: { buffer: TINY_PNG, filename: 'ball.png', contentType: 'image/png' },
    }),
    expect: ownOnly(200),
  },
  'GET /api/arsenal/:id/photo': { req: (f) => ({ url: `/api/arsenal/${f.ball.id}/photo` }), expect: ownOnly(200) },
  'DELETE /api/arsenal/:id/photo': {
    req: async (f) => ({ url: `/api/arsenal/${(await f.freshBall({ withPhoto: true })).id}/photo` }),
    expect: ownOnly(200),
  },

  // ── patterns ───────────────────────────────────────────────────────────────────────────────
  'GET /api/patterns': { req: () => ({ url: '/api/patterns' }), expect: signedIn(200) },
  'GET /api/patterns/:id': { req: (f) => ({ url: `/api/patterns/${f.pattern.id}` }), expect: signedIn(200) },
  'GET /api/patterns/:id/export': { req: (f) => ({ url: `/api/patterns/${f.pattern.id}/export?format=csv` }), expect: signedIn(200) },
  'POST /api/patterns': {
    req: () => ({ url: '/api/patterns', body: { name: `Matrix ${uniq()}`, sweeps: [SWEEP] } }),
    expect: editors(201),
  },
  'PATCH /api/patterns/:id': {
    req: async (f) => {
      const p = await f.freshPattern();
      return { url: `/api/patterns/${p.id}`, body: { version: p.version, description: 'edited' } };
    },
    expect: ownerOrAdminOfPattern(200),
  },
  'DELETE /api/patterns/:id': {
    req: async (f) => ({ url: `/api/patterns/${(await f.freshPattern()).id}` }),
    expect: ownerOrAdminOfPattern(204),
  },
  'POST /api/patterns/:id/duplicate': { req: (f) => ({ url: `/api/patterns/${f.pattern.id}/duplicate` }), expect: editors(201) },
  'POST /api/patterns/import': {
    req: () => ({
      url: '/api/patterns/import',
      file: {
        buffer: Buffer.from(JSON.stringify({ format: 'lanewright-pattern', version: 1, name: `Imported ${uniq()}`, sweeps: [SWEEP] })),
        filename: 'p.json',
        contentType: 'application/json',
      },
    }),
    expect: editors(201),
  },

  // ── matchups ───────────────────────────────────────────────────────────────────────────────
  'POST /api/matchups': {
    req: (f) => ({ url: '/api/matchups', body: { patternId: f.pattern.id } }),
    expect: signedIn(200),
    note: 'each caller ranks their own arsenal',
  },

  // ── centers ────────────────────────────────────────────────────────────────────────────────
  'GET /api/centers': { req: () => ({ url: '/api/centers' }), expect: all(200) },
  'GET /api/centers/mine': { req: () => ({ url: '/api/centers/mine' }), expect: [401, 403, 403, 403, 403, 200, 200, 200] },
  'POST /api/centers': {
    req: () => ({ url: '/api/centers', body: { name: `Matrix Lanes ${uniq()}`, town: 'Testford', laneCount: 8 } }),
    expect: adminOnly(201),
  },
  'GET /api/centers/:id': { req: (f) => ({ url: `/api/centers/${f.center.id}` }), expect: all(200) },
  'PATCH /api/centers/:id': {
    req: (f) => ({ url: `/api/centers/${f.center.id}`, body: { town: 'Testford' } }),
    expect: [401, 403, 403, 403, 403, 200, 403, 200],
  },
  'GET /api/centers/:id/conditions/current': { req: (f) => ({ url: `/api/centers/${f.center.id}/conditions/current` }), expect: all(200) },
  'GET /api/centers/:id/conditions/current.pdf': {
    req: (f) => ({ url: `/api/centers/${f.center.id}/conditions/current.pdf` }),
    expect: all(200),
  },
  'GET /api/centers/:id/conditions/lane-groups': {
    req: (f) => ({ url: `/api/centers/${f.center.id}/conditions/lane-groups` }),
    expect: all(200),
  },
  'GET /api/centers/:id/conditions': { req: (f) => ({ url: `/api/centers/${f.center.id}/conditions` }), expect: all(200) },
  'POST /api/centers/:id/conditions': {
    req: (f) => ({ url: `/api/centers/${f.center.id}/conditions`, body: { patternId: f.pattern.id, lanes: [20], validFrom: today() } }),
    expect: [401, 403, 403, 403, 403, 201, 403, 403],
    note: 'only the center’s own proprietor publishes; an admin assigns the proprietor but does not publish for them',
  },
  'POST /api/centers/:id/follow': { req: (f) => ({ url: `/api/centers/${f.otherCenter.id}/follow` }), expect: signedIn(200) },
  'DELETE /api/centers/:id/follow': { req: (f) => ({ url: `/api/centers/${f.otherCenter.id}/follow` }), expect: signedIn(200) },
  'GET /api/follows': { req: () => ({ url: '/api/follows' }), expect: signedIn(200) },
  'GET /api/unsubscribe': {
    req: async (f) => ({ url: `/api/unsubscribe?token=${await f.freshUnsubscribeToken()}` }),
    expect: all(303),
    note: 'the old e-mail link: sends everyone to the page that asks first, and changes nothing',
  },
  'GET /api/unsubscribe/info': {
    req: async (f) => ({ url: `/api/unsubscribe/info?token=${await f.freshUnsubscribeToken()}` }),
    expect: all(200),
    note: 'the token in the e-mail is the credential',
  },
  'POST /api/unsubscribe/undo': {
    req: async (f) => ({ url: '/api/unsubscribe/undo', body: { token: await f.freshUnsubscribeToken() } }),
    expect: all(200),
    note: 'the token in the e-mail is the credential',
  },
  'POST /api/unsubscribe': {
    req: async (f) => ({ url: '/api/unsubscribe', body: { token: await f.freshUnsubscribeToken() } }),
    expect: all(200),
    note: 'the token in the e-mail is the credential',
  },

  // ── sessions, shots, stats (owner's records; a linked coach reads them) ────────────────────
  'GET /api/sessions': { req: () => ({ url: '/api/sessions' }), expect: signedIn(200), note: 'everyone lists their own' },
  'POST /api/sessions': { req: () => ({ url: '/api/sessions', body: { date: today(), kind: 'practice' } }), expect: signedIn(201) },
  'GET /api/sessions/:id': {
    req: (f) => ({ url: `/api/sessions/${f.sessionId}` }),
    expect: (f) => [401, 200, 404, f.coachLinked ? 200 : 404, 404, 404, 404, 404],
    note: 'the owner and a linked coach',
  },
  'PATCH /api/sessions/:id': {
    req: async (f) => ({ url: `/api/sessions/${(await f.freshSession()).id}`, body: { notes: 'matrix' } }),
    expect: (f) => ownerWritesCoachReads(f, 200),
  },
  'DELETE /api/sessions/:id': {
    req: async (f) => ({ url: `/api/sessions/${(await f.freshSession()).id}` }),
    expect: (f) => ownerWritesCoachReads(f, 204),
  },
  'POST /api/sessions/:id/restore': {
    req: async (f) => ({ url: `/api/sessions/${(await f.freshSession({ deleted: true })).id}/restore` }),
    expect: ownOnly(200),
  },
  'POST /api/sessions/:id/shots': {
    req: async (f) => {
      const s = await f.freshSession();
      return {
        url: `/api/sessions/${s.id}/shots`,
        headers: { 'Idempotency-Key': `matrix-${uniq()}` },
        body: { gameNumber: 1, frame: 1, delivery: 1, ballId: s.ballId, standing: [] },
      };
    },
    expect: (f) => ownerWritesCoachReads(f, 201),
    note: 'only the bowler logs their shots (a coach annotates)',
  },
  'DELETE /api/sessions/:id/shots/:shotId': {
    req: async (f) => {
      const s = await f.freshSession({ withShot: true });
      return { url: `/api/sessions/${s.id}/shots/${s.shotId}` };
    },
    expect: (f) => ownerWritesCoachReads(f, 204),
  },
  'POST /api/sessions/:id/annotations': {
    req: (f) => ({ url: `/api/sessions/${f.sessionId}/annotations`, body: { text: 'Matrix note', gameNumber: 1, frame: 1 } }),
    expect: (f) => [401, 201, 404, f.coachLinked ? 201 : 404, 404, 404, 404, 404],
  },
  'GET /api/stats': { req: () => ({ url: '/api/stats' }), expect: signedIn(200) },
  'GET /api/calibration': { req: (f) => ({ url: `/api/calibration?patternId=${f.pattern.id}` }), expect: signedIn(200) },

  // ── coaching ───────────────────────────────────────────────────────────────────────────────
  'POST /api/coach/invitations': {
    req: () => ({ url: '/api/coach/invitations', body: { email: `student-${uniq()}@example.test` } }),
    expect: [401, 403, 403, 201, 201, 403, 403, 403],
  },
  'GET /api/coach/links': { req: () => ({ url: '/api/coach/links' }), expect: signedIn(200) },
  'POST /api/coach/links/:id/accept': {
    req: async (f) => ({ url: `/api/coach/links/${await f.freshLink(false)}/accept` }),
    expect: ownOnly(200),
    note: 'only the invited student accepts',
  },
  'DELETE /api/coach/links/:id': {
    req: async (f) => ({ url: `/api/coach/links/${await f.freshLink(true)}` }),
    expect: ownOnly(204),
    note: 'either side of the link (here the student; the coach side is a new coach outside the columns)',
  },
  'GET /api/coach/students': { req: () => ({ url: '/api/coach/students' }), expect: [401, 403, 403, 200, 200, 403, 403, 403] },
  'GET /api/coach/students/:studentId': {
    req: (f) => ({ url: `/api/coach/students/${f.people.owner.user.id}` }),
    expect: (f) => [401, 404, 404, f.coachLinked ? 200 : 404, 404, 404, 404, 404],
  },
  'GET /api/coach/students/:studentId/plans': {
    req: (f) => ({ url: `/api/coach/students/${f.people.owner.user.id}/plans` }),
    expect: (f) => [401, 404, 404, f.coachLinked ? 200 : 404, 404, 404, 404, 404],
  },
  'POST /api/coach/students/:studentId/plans': {
    req: (f) => ({
      url: `/api/coach/students/${f.people.owner.user.id}/plans`,
      body: { title: 'Matrix plan', kind: 'line', body: 'Move two left with the feet.' },
    }),
    expect: (f) => [401, 404, 404, f.coachLinked ? 201 : 404, 404, 404, 404, 404],
  },
  'GET /api/plans': { req: () => ({ url: '/api/plans' }), expect: signedIn(200) },
  'POST /api/plans/:id/replies': {
    req: async (f) => ({ url: `/api/plans/${await f.freshPlan()}/replies`, body: { text: 'Tried it: lighter hits now.' } }),
    expect: (f) => [401, 201, 404, f.coachLinked ? 201 : 404, 404, 404, 404, 404],
    note: 'the plan of coachLinked for owner: its student and its coach answer; everyone else 404',
  },

  // ── leagues (the bowler's own; anyone else 404) ───────────────────────────────────────────
  'GET /api/leagues': { req: () => ({ url: '/api/leagues' }), expect: signedIn(200) },
  'POST /api/leagues': {
    req: () => ({
      url: '/api/leagues',
      body: { name: 'Matrix league', seasonStart: '2026-09-01', handicap: { basis: 220, percentage: 90 } },
    }),
    expect: signedIn(201),
  },
  'GET /api/leagues/:id': { req: async (f) => ({ url: `/api/leagues/${await f.freshLeague()}` }), expect: ownOnly(200) },
  'PATCH /api/leagues/:id': {
    req: async (f) => ({ url: `/api/leagues/${await f.freshLeague()}`, body: { enteringAverage: 180 } }),
    expect: ownOnly(200),
  },
  'DELETE /api/leagues/:id': { req: async (f) => ({ url: `/api/leagues/${await f.freshLeague()}` }), expect: ownOnly(204) },
  'GET /api/leagues/:id/standing': { req: async (f) => ({ url: `/api/leagues/${await f.freshLeague()}/standing` }), expect: ownOnly(200) },
  'GET /api/leagues/:id/season.csv': {
    req: async (f) => ({ url: `/api/leagues/${await f.freshLeague()}/season.csv` }),
    expect: ownOnly(200),
  },

  // ── ball upkeep (the bowler's own balls) ──────────────────────────────────────────────────
  'GET /api/upkeep': { req: () => ({ url: '/api/upkeep' }), expect: signedIn(200) },
  'PATCH /api/upkeep/:id': { req: (f) => ({ url: `/api/upkeep/${f.ball.id}`, body: { extractionGames: 40 } }), expect: ownOnly(200) },

  // ── decisions: trials (owner's; a linked coach reads), coverage, the layout lab ───────────────
  'GET /api/trials': { req: () => ({ url: '/api/trials' }), expect: signedIn(200) },
  'POST /api/trials': {
    req: async (f, actor) => {
      const b = await f.ballOf(actor);
      return {
        url: '/api/trials',
        body: {
          name: 'Matrix trial',
          arms: [
            { ballId: b, surfaceKey: '2000 grit' },
            { ballId: b, surfaceKey: '4000 grit' },
          ],
        },
      };
    },
    expect: signedIn(201),
    note: 'each caller compares a ball of their own',
  },
  'GET /api/trials/:id': {
    req: async (f) => ({ url: `/api/trials/${await f.freshTrial()}` }),
    expect: (f) => [401, 200, 404, f.coachLinked ? 200 : 404, 404, 404, 404, 404],
  },
  'DELETE /api/trials/:id': {
    req: async (f) => ({ url: `/api/trials/${await f.freshTrial()}` }),
    expect: (f) => ownerWritesCoachReads(f, 204),
  },
  'GET /api/coverage': { req: () => ({ url: '/api/coverage' }), expect: signedIn(200) },
  'POST /api/layout-lab': {
    req: async (f, actor) => ({
      url: '/api/layout-lab',
      body: { ballId: await f.ballOf(actor), patternId: f.pattern.id, layouts: [{ label: 'Pin up', pinToPapIn: '4 3/8' }] },
    }),
    expect: signedIn(200),
    note: 'each caller with a ball of their own',
  },

  // ── pro shop (center = proprietorThis's; orders = owner's) ─────────────────────────────────
  'GET /api/centers/:id/services': { req: (f) => ({ url: `/api/centers/${f.center.id}/services` }), expect: signedIn(200) },
  'POST /api/centers/:id/services': {
    req: (f) => ({ url: `/api/centers/${f.center.id}/services`, body: { kind: 'drill', name: `Drill ${uniq()}`, priceCents: 6000 } }),
    expect: [401, 403, 403, 403, 403, 201, 403, 403],
  },
  'PATCH /api/centers/:id/services/:serviceId': {
    req: async (f) => {
      const s = await f.freshServiceId();
      return { url: `/api/centers/${f.center.id}/services/${s.id}`, body: { version: s.version, priceCents: 2600 } };
    },
    expect: [401, 403, 403, 403, 403, 200, 403, 403],
  },
  'GET /api/centers/:id/orders': {
    req: (f) => ({ url: `/api/centers/${f.center.id}/orders` }),
    expect: [401, 403, 403, 403, 403, 200, 403, 403],
  },
  'GET /api/centers/:id/takings': {
    req: (f) => ({ url: `/api/centers/${f.center.id}/takings` }),
    expect: [401, 403, 403, 403, 403, 200, 403, 403],
  },
  'GET /api/centers/:id/takings.csv': {
    req: (f) => ({ url: `/api/centers/${f.center.id}/takings.csv?from=2026-11-01&to=2026-11-07` }),
    expect: [401, 403, 403, 403, 403, 200, 403, 403],
  },
  'POST /api/centers/:id/orders': {
    req: (f) => ({
      url: `/api/centers/${f.center.id}/orders`,
      body: {
        serviceId: f.serviceId,
        customerName: 'Walk-in Customer',
        customerContact: '555-0100',
        ballDescription: 'Green solid, 14 lb',
      },
    }),
    expect: [401, 403, 403, 403, 403, 201, 403, 403],
    note: 'a walk-in order at the counter: the center’s proprietor only',
  },
  'POST /api/orders/:id/status/undo': {
    req: async (f) => {
      const id = await f.freshOrderId('card');
      const moved = await api.patch(`/api/orders/${id}/status`).set(f.as('proprietorThis')).send({ status: 'in_progress' });
      if (moved.status !== 200) throw new Error(`fixture: move answered ${moved.status}`);
      return { url: `/api/orders/${id}/status/undo` };
    },
    expect: [401, 403, 404, 404, 404, 200, 404, 404],
    note: 'undoes the proprietor’s own move just made',
  },
  'POST /api/orders': {
    req: async (f, actor) => ({ url: '/api/orders', body: { serviceId: f.serviceId, ballId: await f.ballOf(actor) } }),
    expect: signedIn(201),
    note: 'each caller orders for a ball of their own',
  },
  'GET /api/orders': { req: () => ({ url: '/api/orders' }), expect: signedIn(200) },
  'GET /api/orders/:id': {
    req: (f) => ({ url: `/api/orders/${f.orderId}` }),
    expect: [401, 200, 404, 404, 404, 200, 404, 404],
    note: 'the bowler, and the proprietor of the order’s center',
  },
  'POST /api/orders/:id/checkout': {
    req: async (f) => ({ url: `/api/orders/${await f.freshOrderId()}/checkout` }),
    expect: [401, 200, 404, 404, 404, 403, 404, 404],
    note: 'the center’s proprietor sees the order (403, nothing leaks) but only the bowler pays',
  },
  'POST /api/orders/:id/cancel': {
    req: async (f) => ({ url: `/api/orders/${await f.freshOrderId()}/cancel` }),
    expect: [401, 200, 404, 404, 404, 403, 404, 404],
  },
  'PATCH /api/orders/:id/status': {
    req: async (f) => ({ url: `/api/orders/${await f.freshOrderId('card')}/status`, body: { status: 'in_progress' } }),
    expect: [401, 403, 404, 404, 404, 200, 404, 404],
  },
  'POST /api/orders/:id/refund': {
    req: async (f) => ({ url: `/api/orders/${await f.freshOrderId('card')}/refund` }),
    expect: [401, 403, 404, 404, 404, 200, 404, 404],
  },
  'POST /api/payments/webhook': {
    req: (f) => {
      const e = f.signedEvent();
      return {
        url: '/api/payments/webhook',
        headers: { 'Content-Type': 'application/json', 'Stripe-Signature': e.header },
        body: e.payload,
      };
    },
    expect: all(200),
    note: 'public: the signature is the credential (forged and replayed events: tests/api/shop/webhooks.test.ts)',
  },
};
