import type { AddressInfo } from 'node:net';
import { afterAll, describe, expect, it, vi } from 'vitest';

// This file's server has a metrics token and a metrics listener on a free loopback port (set before the
// configuration is read). The shared test setup configures neither: tests/api/platform/health.test.ts checks the 404.
const TOKEN = vi.hoisted(() => {
  const token = 'metrics-test-token-0123456789abcdefghij';
  process.env.METRICS_TOKEN = token;
  process.env.METRICS_PORT = '0';
  return token;
});

const { api, errorOf } = await import('../../helpers/api');
const { startMetricsListener } = await import('../../../server/features/health/health.routes');

const listener = startMetricsListener()!;
afterAll(() => new Promise<void>((r) => listener.close(() => r())));

describe('GET /api/health/metrics with METRICS_TOKEN configured', () => {
  it('without a token: 401 in the error shape, and no metric in the body', async () => {
    const res = await api.get('/api/health/metrics');
    expect(res.status).toBe(401);
    expect(errorOf(res.body).code).toBe('unauthorized');
    expect(res.text).not.toContain('lanewright_');
  });

  it('with a wrong token, the right token in another scheme, or a prefix of it: 401 each', async () => {
    for (const authorization of [
      'Bearer not-the-metrics-token-0123456789',
      `Basic ${TOKEN}`,
      `Bearer ${TOKEN.slice(0, -1)}`,
      `Bearer ${TOKEN}x`,
      `bearer${TOKEN}`,
    ]) {
      const res = await api.get('/api/health/metrics').set('Authorization', authorization);
      expect(res.status, authorization).toBe(401);
      expect(errorOf(res.body).code).toBe('unauthorized');
    }
  });

  it('with the token: 200 in the Prometheus text format, with request durations by route, queue depth and process metrics', async () => {
    await api.get('/api/health/live').expect(200);
    const res = await api.get('/api/health/metrics').set('Authorization', `Bearer ${TOKEN}`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/plain; version=0\.0\.4/);
    // The route label is the Express path, never the raw URL.
    expect(res.text).toMatch(
      /lanewright_http_request_duration_seconds_count\{method="GET",route="\/api\/health\/live",status="2xx"\} [1-9]/,
    );
    for (const q of ['mail', 'refund', 'calibration'])
      expect(res.text).toMatch(new RegExp(`lanewright_job_queue_depth\\{queue="${q}"\\} \\d+`));
    expect(res.text).toContain('# TYPE lanewright_job_failures_total counter');
    expect(res.text).toContain('# TYPE lanewright_ranking_seconds histogram');
    expect(res.text).toMatch(/lanewright_process_cpu_seconds_total \d/);
  });
});

describe('the metrics listener (METRICS_PORT)', () => {
  it('serves GET /metrics on loopback without a token, and nothing else', async () => {
    if (!listener.listening) await new Promise((r) => listener.once('listening', r));
    const { address, port } = listener.address() as AddressInfo;
    expect(address).toBe('127.0.0.1');
    const base = `http://127.0.0.1:${port}`;
    const ok = await fetch(`${base}/metrics`);
    expect(ok.status).toBe(200);
    expect(await ok.text()).toContain('lanewright_http_request_duration_seconds');
    expect((await fetch(`${base}/`)).status).toBe(404);
    expect((await fetch(`${base}/api/health`)).status).toBe(404);
    expect((await fetch(`${base}/metrics`, { method: 'POST' })).status).toBe(404);
  });
});
