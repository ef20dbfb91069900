import { simpleParser } from 'mailparser';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort } from '../../scripts/lib/pg.mjs';
import { call, ownCluster, sleep, startServer, until, userWithRole, type OwnCluster, type ServerProcess } from './harness';

/**
 * The mail server down while a proprietor publishes: the publication stands (201, in force, audited),
 * its follower e-mail waits in the outbox (health reports mail unreachable and the pending count), and
 * when the mail server is back the sender delivers it — once — over real SMTP to a server this test runs.
 */
interface Received {
  to: string[];
  subject: string;
  text: string;
}
let cluster: OwnCluster;
let server: ServerProcess;
let smtpPort = 0;
let smtp: SMTPServer | null = null;
const inbox: Received[] = [];

async function startSmtp(): Promise<void> {
  const s = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, cb) {
      simpleParser(stream)
        .then((m) => {
          inbox.push({ to: session.envelope.rcptTo.map((r) => r.address), subject: m.subject ?? '', text: m.text ?? '' });
          cb();
        })
        .catch((e: Error) => cb(e));
    },
  });
  await new Promise<void>((resolve, reject) => {
    s.once('error', reject);
    s.listen(smtpPort, '127.0.0.1', () => resolve());
  });
  smtpPort = (s.server.address() as AddressInfo).port;
  smtp = s;
}
async function stopSmtp(): Promise<void> {
  const s = smtp;
  smtp = null;
  if (s) await new Promise<void>((r) => s.close(() => r()));
}

beforeAll(async () => {
  smtpPort = await freePort();
  await startSmtp();
  cluster = await ownCluster('fault-smtp');
  server = await startServer({
    DATABASE_URL: cluster.url,
    SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
    MAIL_FROM: 'Lanewright <no-reply@lanewright.example>',
  });
});
afterAll(async () => {
  await server?.kill();
  await stopSmtp();
  cluster?.remove();
});

describe('SMTP down during publishing', () => {
  it('the publication stands, the mail waits in the outbox and goes out once when SMTP returns', async () => {
    const admin = await userWithRole(server, cluster, 'admin', 'smtp-admin');
    const owner = await userWithRole(server, cluster, 'proprietor', 'smtp-owner');
    const follower = await userWithRole(server, cluster, 'bowler', 'smtp-follower');
    const center = await call(server.base, 'POST', '/api/centers', {
      token: admin.token,
      body: { name: 'Fault Lanes', town: 'Testford', laneCount: 12, ownerId: owner.id },
    });
    expect(center.status).toBe(201);
    const pattern = await call(server.base, 'POST', '/api/patterns', {
      token: owner.token,
      body: {
        name: 'Outage House 41',
        sweeps: [{ direction: 'forward', fromBoard: 2, toBoard: 38, startFt: 0, endFt: 41, crossings: 2, microlitersPerBoard: 60 }],
      },
    });
    expect(pattern.status).toBe(201);
    expect((await call(server.base, 'POST', `/api/centers/${center.body.item.id}/follow`, { token: follower.token })).status).toBe(200);
    expect((await call(server.base, 'GET', '/api/health')).body).toMatchObject({ status: 'ok', db: 'ok', mail: 'ok', mailMode: 'smtp' });

    // The fault.
    await stopSmtp();
    const pub = await call(server.base, 'POST', `/api/centers/${center.body.item.id}/conditions`, {
      token: owner.token,
      body: { patternId: pattern.body.item.id, lanes: [1, 2, 3, 4, 5, 6], validFrom: new Date().toISOString().slice(0, 10) },
    });
    expect(pub.status).toBe(201);

    // The sender tried, failed, and keeps the message for a retry.
    const tried = await until(
      () =>
        cluster.query<{ status: string; attempts: number; last_error: string | null }>(
          `SELECT status, attempts, last_error FROM mail_outbox WHERE to_address = $1`,
          [follower.email],
        ),
      // An attempt counts from its claim ('sending'); wait until it has ended, then it must be pending again.
      (rows) => rows.length === 1 && rows[0].attempts >= 1 && rows[0].status !== 'sending',
      15000,
    );
    expect(tried).toHaveLength(1);
    expect(tried[0]).toMatchObject({ status: 'pending' });
    expect(tried[0].last_error).toBeTruthy();
    const health = await until(
      () => call(server.base, 'GET', '/api/health'),
      (r) => r.body?.mail === 'unreachable',
      10000,
    );
    expect(health.status).toBe(200); // mail down does not make the service unavailable
    expect(health.body).toMatchObject({ status: 'ok', db: 'ok', mail: 'unreachable', outbox: { pending: 1 } });

    // The publication stands meanwhile.
    const current = await call(server.base, 'GET', `/api/centers/${center.body.item.id}/conditions/current`);
    expect(current.status).toBe(200);
    expect(current.body.condition.id).toBe(pub.body.item.id);
    expect(current.body.pattern.name).toBe('Outage House 41');
    expect(inbox.filter((m) => m.to.includes(follower.email) && !/confirm your e-mail/i.test(m.subject))).toHaveLength(0);

    // SMTP returns: the retry delivers it.
    await sleep(500);
    await startSmtp();
    await until(
      async () => inbox.filter((m) => m.to.includes(follower.email) && !/confirm your e-mail/i.test(m.subject)).length,
      (n) => n > 0,
      45000,
      250,
    );
    const mails = inbox.filter((m) => m.to.includes(follower.email) && !/confirm your e-mail/i.test(m.subject));
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toContain('Outage House 41');
    expect(mails[0].text).toContain('Fault Lanes');
    const sent = await until(
      () => cluster.query<{ status: string }>(`SELECT status FROM mail_outbox WHERE to_address = $1`, [follower.email]),
      (rows) => rows[0]?.status === 'sent',
      5000,
    );
    expect(sent).toEqual([{ status: 'sent' }]);
    expect((await call(server.base, 'GET', '/api/health')).body).toMatchObject({ mail: 'ok', outbox: { pending: 0 } });
    await sleep(6000); // one more sender interval: still exactly one message
    expect(inbox.filter((m) => m.to.includes(follower.email) && !/confirm your e-mail/i.test(m.subject))).toHaveLength(1);
  });
});
