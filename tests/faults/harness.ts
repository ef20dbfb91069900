import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { freePort, makeTempClusterDir, startCluster, stopCluster } from '../../scripts/lib/pg.mjs';
import { root, runTsx } from '../helpers/database';

/** A PostgreSQL cluster of this test file alone (so it can be stopped and started), with a migrated database. */
export interface OwnCluster {
  url: string;
  port: number;
  stop(): void;
  start(): Promise<void>;
  remove(): void;
  query<T extends pg.QueryResultRow = pg.QueryResultRow>(sql: string, params?: unknown[]): Promise<T[]>;
}

export async function ownCluster(prefix: string): Promise<OwnCluster> {
  const dir = makeTempClusterDir(`lanewright-${prefix}-`);
  const port = await freePort();
  const start = () => startCluster({ dataDir: `${dir}/pg`, port, database: 'lw_fault', log: () => undefined });
  const url = await start();
  runTsx(['server/db/migrate.ts', 'up'], url);
  return {
    url,
    port,
    stop: () => void stopCluster(`${dir}/pg`),
    start: async () => void (await start()),
    remove: () => {
      stopCluster(`${dir}/pg`);
      fs.rmSync(dir, { recursive: true, force: true });
    },
    async query(sql, params) {
      const c = new pg.Client({ connectionString: url });
      await c.connect();
      try {
        return (await c.query(sql, params)).rows;
      } finally {
        await c.end();
      }
    },
  };
}

/** The real server (server/index.ts) as its own process, as `npm start` runs it. */
export interface ServerProcess {
  base: string;
  child: ChildProcess;
  /** Everything the process wrote to stdout (pino's JSON lines). */
  output(): string;
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
  kill(): Promise<void>;
}

export async function startServer(env: Record<string, string>): Promise<ServerProcess> {
  const child = spawn(path.join(root, 'node_modules', '.bin', 'tsx'), ['server/index.ts'], {
    cwd: root,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      PORT: '0',
      LOG_LEVEL: 'warn',
      RATE_LIMIT_AUTH: '1000',
      STRIPE_SECRET_KEY: '',
      STRIPE_WEBHOOK_SECRET: '',
      STRIPE_API_URL: '',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe', 'ipc'],
  });
  let out = '';
  child.stdout!.on('data', (d: Buffer) => (out += d.toString()));
  child.stderr!.on('data', (d: Buffer) => (out += d.toString()));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) =>
    child.once('exit', (code, signal) => resolve({ code, signal })),
  );
  const port = await new Promise<number>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the server did not start within 60 s:\n${out}`)), 60000);
    child.on('message', (m: { type?: string; port?: number }) => {
      if (m?.type === 'listening' && m.port) {
        clearTimeout(timer);
        resolve(m.port);
      }
    });
    void exited.then(({ code }) => reject(new Error(`the server exited early (code ${code}):\n${out}`)));
  });
  return {
    base: `http://127.0.0.1:${port}`,
    child,
    output: () => out,
    exited,
    async kill() {
      if (child.exitCode === null && child.signalCode === null) {
        child.kill('SIGTERM');
        await Promise.race([exited, new Promise((r) => setTimeout(r, 15000))]);
        if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
      }
    },
  };
}

/** JSON over HTTP with fetch; network errors come back as status 0. */
export async function call(
  base: string,
  method: string,
  url: string,
  opts: { token?: string; body?: unknown; headers?: Record<string, string> } = {},
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- answers of many shapes, read field by field in the tests
): Promise<{ status: number; body: any; headers: Headers | null }> {
  try {
    const res = await fetch(`${base}${url}`, {
      method,
      headers: {
        ...(opts.body !== undefined ? { 'content-type': 'application/json' } : {}),
        ...(opts.token ? { authorization: `Bearer ${opts.token}` } : {}),
        ...(opts.headers ?? {}),
      },
      body: opts.body !== undefined ? JSON.stringify(opts.body) : undefined,
      signal: AbortSignal.timeout(15000),
    });
    const text = await res.text();
    let body: unknown = text;
    try {
      body = JSON.parse(text);
    } catch {
      /* not JSON */
    }
    return { status: res.status, body, headers: res.headers };
  } catch {
    return { status: 0, body: null, headers: null };
  }
}

/** Registers a user through the API and gives them a role straight in the database (as an admin would). */
export async function userWithRole(
  server: ServerProcess,
  cluster: OwnCluster,
  role: string,
  tag: string,
): Promise<{ id: number; email: string; token: string }> {
  const email = `${tag}-${process.pid}-${Date.now()}@example.test`;
  const password = 'fault-tests-password';
  const reg = await call(server.base, 'POST', '/api/auth/register', { body: { email, password, displayName: `Fault ${tag}` } });
  if (reg.status !== 201) throw new Error(`register: ${reg.status} ${JSON.stringify(reg.body)}`);
  // Sign-up answers neutrally (no token); the new account signs in with its password.
  // The account is confirmed as an admin would (its sign-up verification mail is withdrawn, so a test counting mails sees only its own).
  const [row] = await cluster.query<{ id: number }>('UPDATE users SET role = $1, email_verified_at = now() WHERE email = $2 RETURNING id', [
    role,
    email,
  ]);
  await cluster.query("DELETE FROM mail_outbox WHERE to_address = $1 AND kind = 'email_verification'", [email]);
  const login = await call(server.base, 'POST', '/api/auth/login', { body: { email, password } });
  if (login.status !== 200) throw new Error(`login: ${login.status} ${JSON.stringify(login.body)}`);
  return { id: row.id, email, token: login.body.token };
}

export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Polls until `ok(value)` or the timeout; returns the last value. */
export async function until<T>(fn: () => Promise<T>, ok: (v: T) => boolean, timeoutMs: number, everyMs = 200): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  let v = await fn();
  while (!ok(v) && Date.now() < deadline) {
    await sleep(everyMs);
    v = await fn();
  }
  return v;
}
