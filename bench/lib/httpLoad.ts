/** The measuring tools of bench/http.ts: autocannon with a p95, the bare-Express floor, the client's initial JS size. */
import autocannon from 'autocannon';
import express from 'express';
import fs from 'node:fs';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import zlib from 'node:zlib';

export type Loaded = autocannon.Result & { p95: number };

/** autocannon, with the 95th percentile computed from every response's latency (autocannon itself reports p97.5). */
export async function load(opts: autocannon.Options): Promise<Loaded> {
  const latencies: number[] = [];
  const result = await new Promise<autocannon.Result>((resolve, reject) => {
    const inst = autocannon(opts, (err, res) => (err ? reject(err) : resolve(res)));
    inst.on('response', (_c: unknown, _status: number, _bytes: number, ms: number) => latencies.push(ms));
  });
  latencies.sort((a, b) => a - b);
  const p95 = latencies.length ? latencies[Math.min(latencies.length - 1, Math.ceil(0.95 * latencies.length) - 1)] : NaN;
  return Object.assign(result, { p95 });
}

/** Bare Express answering `body` (the same JSON the route under test answers): this machine's floor, now. */
export async function bareFloor(body: unknown): Promise<{ rps: number; p95: number }> {
  const app = express();
  app.get('/x', (_req, res) => {
    res.json(body);
  });
  const server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const { port } = server.address() as AddressInfo;
  const r = await load({ url: `http://127.0.0.1:${port}/x`, connections: 10, duration: 5 });
  server.close();
  return { rps: r.requests.average, p95: r.p95 };
}

export function clientInitialJsGzipKb(distDir: string): number {
  const html = fs.readFileSync(path.join(distDir, 'index.html'), 'utf8');
  const srcs = [...html.matchAll(/(?:src|href)="(\/assets\/[^"]+\.js)"/g)].map((m) => m[1]);
  let bytes = 0;
  for (const s of new Set(srcs)) bytes += zlib.gzipSync(fs.readFileSync(path.join(distDir, s))).length;
  return bytes / 1024;
}
