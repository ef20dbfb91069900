import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import supertest from 'supertest';
import { app, outboxIdle } from '../../helpers/api';
import { buildFixture, ROLES, TINY_PNG, type Actor, type Fixture } from '../access/fixture';
import { fakeIdle } from '../shop/shopHelpers';
import { MATRIX, type CellRequest } from '../access/matrix';
import { isWrite, tableRoutes, type RouteKey } from '../access/routes';
import { deepJson, MALFORMED_JSON, NASTY_STRINGS, nastyValue } from './arbitraries';
import { changedCounts, changedTables, installWriteCounter, rowWrites, tableChecksums } from './checksum';

/**
 * Property-based fuzzing of every write route (POST, PUT, PATCH, DELETE — discovered from the router, like
 * the access matrix), as an actor the matrix says may use it, starting from the matrix's valid request and
 * breaking it: wrong types, huge strings, unicode, negative and enormous numbers, SQL and script fragments,
 * deep and malformed JSON, wrong content types, bad path ids and queries, and for upload routes CSV and JSON
 * files with broken rows, oversized and mistyped files.
 *
 * Every answer must be a 4xx in the error shape or a 2xx, never a 5xx or a stack trace, and on every 4xx
 * no stored row may change: a row-write counter (a trigger on every table) is read after each request, and
 * a content checksum of every table is compared at the end of each route's run.
 */
/**
 * 6 000 HTTP cases here plus 10 000 engine calls in tests/engine/fuzz: 16 000 malformed inputs per CI run.
 * (A full 10 000-request run of this file also passes: FUZZ_CASES=10000; see README, Reliability.)
 */
const REQUIRED_CASES = 6_000;
/** FUZZ_CASES raises the count for a longer run; a lower value is only for working on the fuzzer itself (the count assertion then fails). */
const TOTAL_CASES = Number(process.env.FUZZ_CASES ?? REQUIRED_CASES);
/** One listening server for the whole run (supertest would otherwise bind a new port for every request). */
const server = app.listen(0, '127.0.0.1');
const http = supertest(server);
/** Routes whose every accepted request is costly (password hashing, rankings) get a smaller share of the cases. */
const SLOW: Record<string, number> = {
  'POST /api/auth/register': 0.3,
  'POST /api/auth/login': 0.3,
  'POST /api/auth/reset': 0.3,
  'POST /api/matchups': 0.3,
};
const PREFERRED: Actor[] = [
  'owner',
  'proprietorThis',
  'admin',
  'coachLinked',
  'otherBowler',
  'coachUnlinked',
  'proprietorOther',
  'anonymous',
];
const STACK = /\n\s+at [^\n]+:\d+:\d+|node_modules|\/work\/|Sequelize\w*Error|TypeError:|ReferenceError:/;

type Case =
  | { kind: 'body'; body: unknown }
  | { kind: 'field'; path: string[]; value: unknown }
  | { kind: 'drop'; path: string[] }
  | { kind: 'extra'; key: string; value: unknown }
  | { kind: 'raw'; text: string; contentType: string }
  | { kind: 'param'; value: string; raw: boolean }
  | { kind: 'query'; query: string }
  | { kind: 'header'; name: string; value: string }
  | { kind: 'file'; buffer: Buffer; filename: string; contentType: string; field: string };

// Role changes last: a fuzzed id may hit a fixture user and change what that actor may do on the routes after it.
// Deletes of patterns and balls just before them: a fuzzed id may hit the fixture's pattern or ball, which the
// fresh sessions of later routes are started on.
const LAST = new Set(['DELETE /api/arsenal/:id', 'DELETE /api/patterns/:id', 'PATCH /api/admin/users/:id/role']);
const routes = tableRoutes()
  .filter(isWrite)
  .sort((a, b) => Number(LAST.has(a.key)) - Number(LAST.has(b.key)));
let f: Fixture;
let sent = 0;
const statuses = new Map<number, number>();
const timings: string[] = [];
let checksumMs = 0;

let removeCounter: () => Promise<void> = async () => undefined;
beforeAll(async () => {
  f = await buildFixture();
  removeCounter = await installWriteCounter();
}, 60000);
afterAll(async () => {
  await removeCounter();
  await f?.close();
});

afterAll(() => {
  server.close();
  if (process.env.FUZZ_TIMINGS) console.log(`${timings.join('\n')}\nchecksums ${checksumMs} ms`);
  console.log(
    `[fuzz] ${sent} malformed requests to ${routes.length} write routes; statuses ${JSON.stringify(Object.fromEntries([...statuses].sort((a, b) => a[0] - b[0])))}`,
  );
});

/** Lets background work caused by an accepted request finish (payment-fake webhooks, the mail sender's row updates) before a snapshot. */
async function settle(): Promise<void> {
  await fakeIdle();
  await outboxIdle();
}

/** encodeURIComponent, but a lone surrogate becomes its (invalid) UTF-8 bytes instead of throwing. */
const enc = (s: string): string => {
  try {
    return encodeURIComponent(s);
  } catch {
    return '%ED%A0%80';
  }
};

/** Every key path of a JSON value (objects and arrays), for field-level mutation. */
function keyPaths(v: unknown, prefix: string[] = [], out: string[][] = []): string[][] {
  if (v && typeof v === 'object') {
    for (const [k, child] of Object.entries(v)) {
      out.push([...prefix, k]);
      if (prefix.length < 3) keyPaths(child, [...prefix, k], out);
    }
  }
  return out;
}

function setPath(obj: unknown, path: string[], value: unknown, drop = false): unknown {
  const copy = structuredClone(obj) as Record<string, unknown>;
  let cur = copy as Record<string, unknown>;
  for (const k of path.slice(0, -1)) cur = cur[k] as Record<string, unknown>;
  if (drop) delete cur[path.at(-1)!];
  else cur[path.at(-1)!] = value;
  return copy;
}

const CSV_ROWS = fc.oneof(
  fc.constantFrom(
    '"unterminated,quote',
    'a,b,c,d,e,f,g,h,i,j,k,l,m,n,o,p,q',
    ',,,,',
    '\u0000,\u0000',
    '=cmd|" /C calc"!A0,1,2',
    'x'.repeat(20_000),
    ';;;;',
    '\t\t\t',
    '"a""b",1',
  ),
  fc
    .array(
      fc.oneof(fc.constantFrom(...NASTY_STRINGS.filter((s) => s.length < 200)), fc.string({ maxLength: 12 }), fc.integer().map(String)),
      { minLength: 1, maxLength: 16 },
    )
    .map((cells) => cells.join(',')),
);

/** The generator of malformed requests for one route, given its valid request. */
function casesFor(base: CellRequest): fc.Arbitrary<Case> {
  const paths = base.body !== undefined ? keyPaths(base.body) : [];
  const options: fc.Arbitrary<Case>[] = [
    fc.record({ kind: fc.constant('body' as const), body: fc.oneof(nastyValue, fc.jsonValue({ maxDepth: 3 })) }),
    fc.record({
      kind: fc.constant('extra' as const),
      key: fc.oneof(
        fc.string({ minLength: 1, maxLength: 12 }),
        fc.constantFrom('__proto__', 'constructor', 'id', 'ownerId', 'userId', 'role', 'amountCents', 'version'),
      ),
      value: nastyValue,
    }),
    fc.record({
      kind: fc.constant('raw' as const),
      text: fc.oneof(
        fc.constantFrom(...MALFORMED_JSON),
        fc.constantFrom(deepJson(64), deepJson(5000), deepJson(20000, '{', '}'), deepJson(30000)),
        fc.string({ maxLength: 80 }),
      ),
      contentType: fc.constantFrom(
        'application/json',
        'application/json; charset=utf-16',
        'text/plain',
        'application/x-www-form-urlencoded',
        'application/xml',
        'multipart/form-data; boundary=x',
      ),
    }),
    fc.record({
      kind: fc.constant('param' as const),
      value: fc.oneof(
        fc.constantFrom(...NASTY_STRINGS),
        fc.integer().map(String),
        fc.constantFrom('0', '-1', '1.5', '2147483648', '99999999999999999999', '1e3', '0x10'),
      ),
      raw: fc.boolean(),
    }),
    fc.record({
      kind: fc.constant('query' as const),
      query: fc.oneof(
        fc.constantFrom(
          'page=-1&pageSize=1e309',
          'page[]=1&page[]=2',
          'format=xml',
          'format[$ne]=json',
          'all=1&all=0',
          'status=%00',
          'date=2026-13-45',
          'studentId=-1',
          'a='.concat('b'.repeat(5000)),
        ),
        fc
          .tuple(
            fc.constantFrom(
              'page',
              'pageSize',
              'q',
              'format',
              'sort',
              'order',
              'status',
              'date',
              'studentId',
              'from',
              'to',
              'ballId',
              'patternId',
              'all',
            ),
            fc.constantFrom(...NASTY_STRINGS),
          )
          .map(([k, v]) => `${k}=${enc(v)}`),
      ),
    }),
  ];
  if (paths.length) {
    options.push(fc.record({ kind: fc.constant('field' as const), path: fc.constantFrom(...paths), value: nastyValue }));
    options.push(fc.record({ kind: fc.constant('drop' as const), path: fc.constantFrom(...paths) }));
  }
  if (base.headers && Object.keys(base.headers).length) {
    options.push(
      fc.record({
        kind: fc.constant('header' as const),
        name: fc.constantFrom(...Object.keys(base.headers)),
        value: fc.oneof(
          fc.constantFrom(...NASTY_STRINGS.filter((s) => !/[\r\n\u0000-\u001f\u007f-\uffff]/.test(s))),
          fc.string({ maxLength: 300 }).filter((s) => !/[\r\n\u0000-\u001f\u007f-\uffff]/.test(s)),
        ),
      }),
    );
  }
  if (base.file) {
    const valid = base.file;
    const brokenText = fc.oneof(
      fc.array(CSV_ROWS, { minLength: 1, maxLength: 5 }).map((rows) => Buffer.concat([valid.buffer, Buffer.from(rows.join('\n'))])),
      fc.array(CSV_ROWS, { minLength: 0, maxLength: 5 }).map((rows) => Buffer.from(rows.join('\n'))),
      fc.jsonValue({ maxDepth: 4 }).map((j) => Buffer.from(JSON.stringify(j))),
      fc
        .record({
          format: fc.oneof(fc.constant('lanewright-pattern'), nastyValue),
          version: fc.oneof(fc.constant(1), nastyValue),
          name: nastyValue,
          sweeps: fc.oneof(
            nastyValue,
            fc.array(
              fc.dictionary(
                fc.constantFrom('direction', 'fromBoard', 'toBoard', 'startFt', 'endFt', 'crossings', 'microlitersPerBoard', 'x'),
                nastyValue,
              ),
              { maxLength: 4 },
            ),
          ),
        })
        .map((j) => Buffer.from(JSON.stringify(j))),
      fc.constantFrom(
        Buffer.from([0xef, 0xbb, 0xbf]),
        Buffer.alloc(0),
        Buffer.from('\u0000'.repeat(64)),
        TINY_PNG,
        Buffer.from('GIF89a'),
        Buffer.from('%PDF-1.4\n'),
      ),
      fc.uint8Array({ maxLength: 512 }).map((a) => Buffer.from(a)),
    );
    const oversized = fc.constantFrom(Buffer.alloc(1024 * 1024 + 10, 0x61), Buffer.concat([TINY_PNG, Buffer.alloc(2 * 1024 * 1024 + 10)]));
    options.push(
      fc.record({
        kind: fc.constant('file' as const),
        buffer: fc.oneof({ weight: 12, arbitrary: brokenText }, { weight: 1, arbitrary: oversized }),
        filename: fc.oneof(
          fc.constant(valid.filename),
          fc.constantFrom(
            'x.exe',
            'a.csv.php',
            '../../etc/passwd.csv',
            '..\\evil.json',
            'noext',
            '.csv',
            'photo.png',
            'p.json',
            'ümlaut 💥.csv',
            'a'.repeat(300) + '.csv',
          ),
        ),
        contentType: fc.oneof(
          fc.constant(valid.contentType),
          fc.constantFrom(
            'text/csv',
            'application/json',
            'image/png',
            'image/jpeg',
            'image/webp',
            'application/octet-stream',
            'text/html',
            'image/svg+xml',
          ),
        ),
        field: fc.oneof({ weight: 6, arbitrary: fc.constant('file') }, { weight: 1, arbitrary: fc.constantFrom('files', 'upload', '') }),
      }),
    );
  }
  return fc.oneof(...options);
}

async function sendCase(route: RouteKey, actor: Actor, base: CellRequest, c: Case, ip: string) {
  const m = route.method.toLowerCase() as 'post' | 'put' | 'patch' | 'delete';
  let url = base.url;
  if (c.kind === 'param') {
    const v = c.raw ? c.value.replace(/[/?#\s]/g, '') || '%' : enc(c.value);
    url = /\/\d+(?=\/|\?|$)/.test(url) ? url.replace(/\/\d+(?=\/|\?|$)/, `/${v}`) : `${url}/${v}`;
  }
  if (c.kind === 'query') url += `${url.includes('?') ? '&' : '?'}${c.query}`;
  // A different client address per request: rate limits count per address, so the fuzz reaches the handlers.
  let req = http[m](url).set(f.as(actor)).set('X-Forwarded-For', ip);
  const headers = { ...(base.headers ?? {}) };
  if (c.kind === 'header') headers[c.name] = c.value;
  req = req.set(headers);
  if (c.kind === 'file') return req.attach(c.field, c.buffer, { filename: c.filename, contentType: c.contentType });
  if (c.kind === 'raw') return req.set('Content-Type', c.contentType).send(c.text);
  if (base.file && (c.kind === 'param' || c.kind === 'query' || c.kind === 'header'))
    return req.attach('file', base.file.buffer, { filename: base.file.filename, contentType: base.file.contentType });
  let body: unknown = base.body;
  if (c.kind === 'body') body = c.body;
  if (c.kind === 'field') body = setPath(base.body, c.path, c.value);
  if (c.kind === 'drop') body = setPath(base.body, c.path, undefined, true);
  if (c.kind === 'extra') body = { ...(typeof base.body === 'object' && base.body ? base.body : {}), [c.key]: c.value };
  if (body === undefined) return req;
  return req.set('Content-Type', 'application/json').send(JSON.stringify(body) ?? 'null');
}

describe('fuzzed write routes', () => {
  it('discovers the write routes from the router, each with a matrix entry to start from', () => {
    expect(routes.length).toBeGreaterThan(25);
    expect(routes.filter((r) => !MATRIX[r.key]).map((r) => r.key)).toEqual([]);
  });

  it(`${REQUIRED_CASES}+ malformed requests: never a 5xx or a stack trace; 4xx in the error shape with no stored row changed`, async () => {
    const covered = routes.filter((r) => MATRIX[r.key]); // a route without an entry fails the test above
    const weight = (r: RouteKey) => SLOW[r.key] ?? 1;
    const totalWeight = covered.reduce((a, r) => a + weight(r), 0);
    let n = 0;
    let before: Record<string, string> = {};
    for (const route of covered) {
      const entry = MATRIX[route.key];
      const row = typeof entry.expect === 'function' ? entry.expect(f) : entry.expect;
      const actor = PREFERRED.find((a) => row[ROLES.indexOf(a)] < 300) ?? 'admin';
      const t0 = Date.now();
      const base = await entry.req(f, actor); // may create the records it needs: snapshot after it
      await settle();
      before = await tableChecksums();
      let writes = await rowWrites();
      await fc.assert(
        fc.asyncProperty(casesFor(base), async (c) => {
          n += 1;
          const res = await sendCase(route, actor, base, c, `10.${(n >> 16) & 255}.${(n >> 8) & 255}.${n & 255}`);
          sent += 1;
          statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
          const where = `${route.key} as ${actor}, case ${JSON.stringify(c, (_k, v: unknown) => (typeof v === 'string' && v.length > 120 ? `${v.slice(0, 60)}…(${v.length})` : v)).slice(0, 400)}`;
          expect(res.status, `${where} → ${res.status} ${res.text?.slice(0, 300)}`).toBeLessThan(500);
          expect(STACK.test(res.text ?? ''), `${where}: stack trace or internals in the answer`).toBe(false);
          if (res.status >= 400) {
            expect(res.body?.error?.code, `${where}: not the error shape: ${res.text?.slice(0, 200)}`).toEqual(expect.any(String));
            expect(res.body.error.message).toEqual(expect.any(String));
            const c0 = Date.now();
            const now = await rowWrites();
            checksumMs += Date.now() - c0;
            expect(changedCounts(writes, now), `${where} → ${res.status} yet rows were written`).toEqual([]);
          } else {
            await settle(); // mail queued by an accepted request is delivered before the next snapshot
            before = await tableChecksums();
            writes = await rowWrites();
          }
        }),
        { numRuns: Math.ceil((TOTAL_CASES * weight(route)) / totalWeight), endOnFailure: true },
      );
      // And by content: every table as it was after the last accepted request of this route.
      expect(changedTables(before, await tableChecksums()), `${route.key}: rows changed by refused requests`).toEqual([]);
      timings.push(`${route.key} ${Date.now() - t0} ms`);
    }
    expect(n).toBeGreaterThanOrEqual(REQUIRED_CASES);
    expect(sent).toBe(n);
  }, 600000);
});
