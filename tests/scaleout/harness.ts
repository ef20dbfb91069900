import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { SMTPServer } from 'smtp-server';
import { freePort, makeTempClusterDir, startCluster, startStandby, stopCluster } from '../../scripts/lib/pg.mjs';
import { startStripeFake, type StripeFake } from '../../server/dev/stripeFake/server';
import { root } from '../helpers/database';

/**
 * A small production deployment on loopback, all real: a PostgreSQL primary and a hot standby streaming from it
 * (pg_basebackup), API processes and job workers started from the production build (`node dist/server/…`),
 * an SMTP server that records every message, and the project's payment fake speaking the payment API.
 */
export interface Deployment {
  primaryUrl: string;
  /** The hot standby's URL, or null for a deployment on the primary alone. */
  standbyUrl: string | null;
  env: Record<string, string>;
  smtp: { messages: { to: string; messageId: string; subject: string }[] };
  fake: StripeFake;
  apis: Proc[];
  /** The job worker process, or null when the API processes work the queue themselves. */
  worker: Proc | null;
  startApi(): Promise<Proc>;
  startWorker(): Promise<Proc>;
  primary<T extends pg.QueryResultRow>(sql: string, params?: unknown[]): Promise<T[]>;
  standby<T extends pg.QueryResultRow>(sql: string, params?: unknown[]): Promise<T[]>;
  stop(): Promise<void>;
}

export interface Proc {
  child: ChildProcess;
  base: string;
  output(): string;
  exited: Promise<unknown>;
  kill(signal?: NodeJS.Signals): Promise<void>;
}

/** Builds the server bundle when it is older than its sources (the same step as `npm run build`). */
export function buildServer(): void {
  const r = spawnSync(process.execPath, ['scripts/build.mjs', '--server', '--if-stale'], { cwd: root, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`build failed:\n${r.stdout}\n${r.stderr}`);
}

async function query<T extends pg.QueryResultRow>(url: string, sql: string, params?: unknown[]): Promise<T[]> {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  try {
    return (await c.query<T>(sql, params)).rows;
  } finally {
    await c.end();
  }
}

function startProc(file: 'index' | 'worker', env: Record<string, string>, ready: string): Promise<Proc> {
  const child = spawn(process.execPath, ['--enable-source-maps', path.join(root, 'dist', 'server', `${file}.js`)], {
    cwd: root,
    env: { ...process.env, ...env },
    stdio: ['ignore', 'pipe', 'pipe', 'ipc'],
  });
  let out = '';
  const keep = (d: Buffer) => {
    out += d.toString();
    if (out.length > 200000) out = out.slice(-100000);
  };
  child.stdout!.on('data', keep);
  child.stderr!.on('data', keep);
  const exited = new Promise((resolve) => child.once('exit', resolve));
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`${file} did not start within 60 s:\n${out}`)), 60000);
    child.on('message', (m: { type?: string; port?: number }) => {
      if (m?.type !== ready) return;
      clearTimeout(timer);
      resolve({
        child,
        base: m.port ? `http://127.0.0.1:${m.port}` : '',
        output: () => out,
        exited,
        async kill(signal: NodeJS.Signals = 'SIGTERM') {
          if (child.exitCode !== null || child.signalCode !== null) return;
          child.kill(signal);
          await Promise.race([exited, new Promise((r) => setTimeout(r, 15000))]);
          if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
        },
      });
    });
    void exited.then(() => reject(new Error(`${file} exited early:\n${out}`)));
  });
}

/**
 * Starts a deployment: `apis` API processes, and by default a separate job worker (`worker: false`: the API
 * processes work the queue, as a single `npm start` process does) and a hot standby for reads (`standby: false`:
 * everything on the primary).
 */
export async function deploy(opts: {
  apis: number;
  worker?: boolean;
  standby?: boolean;
  extraEnv?: Record<string, string>;
}): Promise<Deployment> {
  const withWorker = opts.worker ?? true;
  const withStandby = opts.standby ?? true;
  buildServer();
  const dir = makeTempClusterDir('lanewright-scaleout-');
  const primaryPort = await freePort();
  const standbyPort = await freePort();
  // pg_stat_statements on both servers: the standby's own counters show which reads it served.
  const stats = '-c shared_preload_libraries=pg_stat_statements -c pg_stat_statements.track=all -c max_connections=200';
  const primaryUrl = await startCluster({
    dataDir: `${dir}/primary`,
    port: primaryPort,
    database: 'lw_scale',
    log: () => undefined,
    extraOptions: `-c wal_level=replica -c max_wal_senders=5 ${stats}`,
  });
  await query(primaryUrl, 'CREATE EXTENSION IF NOT EXISTS pg_stat_statements');

  // SMTP: every message with its Message-ID (a message sent twice after a crash shows as a repeated id).
  const messages: Deployment['smtp']['messages'] = [];
  const smtpServer = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, cb) {
      let raw = '';
      stream.on('data', (d: Buffer) => (raw += d.toString()));
      stream.on('end', () => {
        const head = raw.split(/\r?\n\r?\n/)[0];
        const messageId = /^message-id:\s*(.+)$/im.exec(head)?.[1]?.trim() ?? '';
        const subject = /^subject:\s*(.+)$/im.exec(head)?.[1]?.trim() ?? '';
        for (const r of session.envelope.rcptTo) messages.push({ to: r.address, messageId, subject });
        cb();
      });
    },
  });
  const smtpPort = await freePort();
  await new Promise<void>((r) => smtpServer.listen(smtpPort, '127.0.0.1', r));

  const webhookSecret = `whsec_${crypto.randomBytes(24).toString('base64url')}`;
  const apiKey = `sk_test_${crypto.randomBytes(16).toString('hex')}`;
  const fake = await startStripeFake({ port: 0, apiKey, webhookSecret, webhookUrl: null, retryDelaysMs: [500, 1000, 2000, 4000, 8000] });

  const env: Record<string, string> = {
    NODE_ENV: 'production',
    PORT: '0',
    LOG_LEVEL: 'warn',
    JWT_SECRET: crypto.randomBytes(32).toString('base64url'),
    PUBLIC_URL: 'http://lanes.example.test',
    DATABASE_URL: primaryUrl,
    SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
    STRIPE_SECRET_KEY: apiKey,
    STRIPE_WEBHOOK_SECRET: webhookSecret,
    STRIPE_API_URL: fake.url,
    TRUST_PROXY: 'loopback',
    JOBS_IN_PROCESS: withWorker ? 'false' : 'true',
    JOBS_EXPIRE_SECONDS: '5',
    JOBS_MAINTENANCE_SECONDS: '2',
    JOBS_POLL_SECONDS: '0.5',
    DB_POOL_MAX: '10',
    ...(opts.extraEnv ?? {}),
  };
  // Migrations as their own step, from the build, with the production configuration; then the standby copies the result.
  const migrate = spawnSync(process.execPath, [path.join(root, 'dist', 'server', 'migrate.js'), 'up'], {
    cwd: root,
    env: { ...process.env, ...env, DATABASE_REPLICA_URLS: '' },
    encoding: 'utf8',
  });
  if (migrate.status !== 0) throw new Error(`migrate failed:\n${migrate.stdout}\n${migrate.stderr}`);
  const standbyUrl = withStandby
    ? await startStandby({ dataDir: `${dir}/standby`, primaryPort, port: standbyPort, database: 'lw_scale', extraOptions: stats })
    : null;
  if (standbyUrl) env.DATABASE_REPLICA_URLS = standbyUrl;
  const d: Deployment = {
    primaryUrl,
    standbyUrl,
    env,
    smtp: { messages },
    fake,
    apis: [],
    worker: null,
    startApi: () => startProc('index', env, 'listening'),
    startWorker: () => startProc('worker', env, 'worker-ready'),
    primary: (sql, params) => query(primaryUrl, sql, params),
    standby: (sql, params) => {
      if (!standbyUrl) throw new Error('this deployment has no standby');
      return query(standbyUrl, sql, params);
    },
    async stop() {
      await Promise.allSettled([...d.apis.map((a) => a.kill()), d.worker?.kill()]);
      await fake.close().catch(() => undefined);
      await new Promise<void>((r) => smtpServer.close(() => r()));
      if (standbyUrl) stopCluster(`${dir}/standby`);
      stopCluster(`${dir}/primary`);
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
  for (let i = 0; i < opts.apis; i++) d.apis.push(await d.startApi());
  if (withWorker) d.worker = await d.startWorker();
  // Webhooks go to the last API process (the one a test keeps alive).
  fake.setWebhookUrl(`${d.apis[d.apis.length - 1].base}/api/payments/webhook`);
  return d;
}
